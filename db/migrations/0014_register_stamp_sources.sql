-- The register's pages carry more than the members' own columns: the zone's name, the scheme's
-- reference, the type's name and kind, and how many photos are ready. A change to any of those
-- gives the sites it shows on a new member stamp too (members_stamp_bump, 0010), so a page or
-- count kept under the old stamp (db/queries/member-list.ts) is never served after it.
CREATE CONSTRAINT TRIGGER zones_stamp_at_commit AFTER INSERT OR UPDATE OR DELETE ON zones
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION members_stamp_changed();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER schemes_stamp_at_commit AFTER INSERT OR UPDATE OR DELETE ON schemes
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION members_stamp_changed();
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER photos_stamp_at_commit AFTER INSERT OR UPDATE OR DELETE ON photos
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION members_stamp_changed();
--> statement-breakpoint
-- A member type belongs to the organisation: every one of its sites may show it.
CREATE OR REPLACE FUNCTION register_stamp_type_changed() RETURNS trigger AS $$
DECLARE
  s uuid;
BEGIN
  FOR s IN SELECT id FROM sites WHERE organisation_id = CASE WHEN TG_OP = 'DELETE' THEN OLD.organisation_id ELSE NEW.organisation_id END ORDER BY id LOOP
    PERFORM members_stamp_bump(s);
  END LOOP;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER member_types_stamp_at_commit AFTER UPDATE OR DELETE ON member_types
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION register_stamp_type_changed();

-- Any change to a site's members gives that site a new stamp, in the same transaction: the
-- register keeps a filter's count only while the stamp it was counted under is still the one it
-- reads (db/queries/member-list.ts).
--
-- The stamp is written when the transaction commits (a deferred constraint trigger), once per site
-- and transaction: by then the transaction holds every member row it will lock, so waiting for
-- another writer's stamp row can never close a circle with it, and an import of thousands of rows
-- writes the stamp once. Stamps come from a sequence, which a rolled-back transaction does not
-- give back, so no stamp is ever used for two different states of a site.
CREATE SEQUENCE site_member_stamp_seq;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION members_stamp_bump(site uuid) RETURNS void AS $$
DECLARE
  done_key text := 'strutwise.member_stamp_' || replace(site::text, '-', '');
BEGIN
  IF current_setting(done_key, true) = '1' THEN
    RETURN;
  END IF;
  INSERT INTO site_member_stamps AS s (site_id, stamp) VALUES (site, nextval('site_member_stamp_seq'))
    ON CONFLICT (site_id) DO UPDATE SET stamp = excluded.stamp;
  PERFORM set_config(done_key, '1', true);
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION members_stamp_changed() RETURNS trigger AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    PERFORM members_stamp_bump(NEW.site_id);
  ELSIF TG_OP = 'DELETE' THEN
    PERFORM members_stamp_bump(OLD.site_id);
  ELSE
    PERFORM members_stamp_bump(NEW.site_id);
    IF OLD.site_id <> NEW.site_id THEN
      PERFORM members_stamp_bump(OLD.site_id);
    END IF;
  END IF;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE CONSTRAINT TRIGGER members_stamp_at_commit AFTER INSERT OR UPDATE OR DELETE ON members
  DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION members_stamp_changed();
--> statement-breakpoint
CREATE OR REPLACE FUNCTION members_stamp_truncated() RETURNS trigger AS $$
BEGIN
  INSERT INTO site_member_stamps AS s (site_id, stamp)
    SELECT id, nextval('site_member_stamp_seq') FROM sites ORDER BY id
    ON CONFLICT (site_id) DO UPDATE SET stamp = excluded.stamp;
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER members_stamp_after_truncate AFTER TRUNCATE ON members
  FOR EACH STATEMENT EXECUTE FUNCTION members_stamp_truncated();
--> statement-breakpoint
-- Sites that already have members start with a stamp of their own.
INSERT INTO site_member_stamps (site_id, stamp) SELECT id, nextval('site_member_stamp_seq') FROM sites ON CONFLICT DO NOTHING;

-- Tell every app process when something that decides access has changed, so the sign-in answers
-- it keeps in memory (db/access-cache.ts) are dropped: people, organisations, sites, roles and
-- signed-out sessions. NOTIFY is delivered when the writing transaction commits (and not at all if
-- it rolls back); one per statement, so an import or a seed sends a handful, not one per row.
CREATE OR REPLACE FUNCTION strutwise_access_changed() RETURNS trigger AS $$
BEGIN
  PERFORM pg_notify('strutwise_access', TG_TABLE_NAME);
  RETURN NULL;
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER users_access_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON users
  FOR EACH STATEMENT EXECUTE FUNCTION strutwise_access_changed();
--> statement-breakpoint
CREATE TRIGGER organisations_access_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON organisations
  FOR EACH STATEMENT EXECUTE FUNCTION strutwise_access_changed();
--> statement-breakpoint
CREATE TRIGGER sites_access_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON sites
  FOR EACH STATEMENT EXECUTE FUNCTION strutwise_access_changed();
--> statement-breakpoint
CREATE TRIGGER memberships_access_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON memberships
  FOR EACH STATEMENT EXECUTE FUNCTION strutwise_access_changed();
--> statement-breakpoint
CREATE TRIGGER revoked_sessions_access_changed AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON revoked_sessions
  FOR EACH STATEMENT EXECUTE FUNCTION strutwise_access_changed();

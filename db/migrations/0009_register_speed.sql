CREATE TABLE "site_member_stamps" (
	"site_id" uuid PRIMARY KEY NOT NULL,
	"stamp" bigint DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE INDEX "members_site_failing_tag" ON "members" USING btree ("site_id","tag") WHERE "members"."check_pass" is not true;--> statement-breakpoint
CREATE INDEX "members_site_failing_ext_tag" ON "members" USING btree ("site_id","extension_mm","tag") WHERE "members"."check_pass" is not true;--> statement-breakpoint
CREATE INDEX "members_site_failing_updated_tag" ON "members" USING btree ("site_id","updated_at","tag") WHERE "members"."check_pass" is not true;--> statement-breakpoint
CREATE INDEX "members_site_failing_status_tag" ON "members" USING btree ("site_id","status","tag") WHERE "members"."check_pass" is not true;--> statement-breakpoint
CREATE INDEX "members_site_failing_util_tag" ON "members" USING btree ("site_id",coalesce("utilisation", 'Infinity'::float8),"tag") WHERE "members"."check_pass" is not true;
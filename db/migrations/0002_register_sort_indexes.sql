CREATE INDEX "members_site_ext_tag" ON "members" USING btree ("site_id","extension_mm","tag");--> statement-breakpoint
CREATE INDEX "members_site_updated_tag" ON "members" USING btree ("site_id","updated_at","tag");--> statement-breakpoint
CREATE INDEX "members_site_util_tag" ON "members" USING btree ("site_id",coalesce("utilisation", 'Infinity'::float8),"tag");
ALTER TABLE "inspections" ADD COLUMN "client_id" uuid;--> statement-breakpoint
ALTER TABLE "members" ADD COLUMN "client_id" uuid;--> statement-breakpoint
ALTER TABLE "members" ADD COLUMN "version" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "photos" ADD COLUMN "client_id" uuid;--> statement-breakpoint
CREATE UNIQUE INDEX "inspections_member_client" ON "inspections" USING btree ("member_id","client_id");--> statement-breakpoint
CREATE UNIQUE INDEX "members_site_client" ON "members" USING btree ("site_id","client_id");--> statement-breakpoint
CREATE UNIQUE INDEX "photos_site_client" ON "photos" USING btree ("site_id","client_id");
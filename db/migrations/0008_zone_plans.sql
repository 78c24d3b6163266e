ALTER TABLE "members" ADD COLUMN "plan_x" double precision;--> statement-breakpoint
ALTER TABLE "members" ADD COLUMN "plan_y" double precision;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_source_key" text;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_source_type" text;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_width" integer;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_height" integer;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_scale" jsonb;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_uploaded_by" uuid;--> statement-breakpoint
ALTER TABLE "zones" ADD COLUMN "plan_uploaded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "zones" ADD CONSTRAINT "zones_plan_uploaded_by_users_id_fk" FOREIGN KEY ("plan_uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "members" ADD CONSTRAINT "members_plan_position" CHECK (("members"."plan_x" is null and "members"."plan_y" is null) or ("members"."plan_x" between 0 and 1 and "members"."plan_y" between 0 and 1));
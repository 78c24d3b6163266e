ALTER TABLE "inspections" ADD COLUMN "plumb_deg" double precision;--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "plumb_offset_mm" double precision;--> statement-breakpoint
ALTER TABLE "inspections" ADD COLUMN "plumb_over_mm" double precision;--> statement-breakpoint
ALTER TABLE "members" ADD COLUMN "out_of_plumb_deg" double precision;--> statement-breakpoint
ALTER TABLE "members" ADD COLUMN "base" jsonb;
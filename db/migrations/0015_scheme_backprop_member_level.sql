ALTER TYPE "public"."load_source" ADD VALUE 'backprop';--> statement-breakpoint
ALTER TABLE "members" ADD COLUMN "level" integer;--> statement-breakpoint
ALTER TABLE "schemes" ADD COLUMN "backprop" jsonb;
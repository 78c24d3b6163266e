-- Each permit request gets its own number on its site ("Request 14"). Existing requests are
-- numbered in the order they were made (requested_at, then created_at and id for ties), and each
-- site's counter starts after its highest number, so a number is never given twice.
ALTER TABLE "permits" ADD COLUMN "request_number" integer;--> statement-breakpoint
UPDATE "permits" p SET "request_number" = n.rn FROM (
  SELECT "id", row_number() OVER (PARTITION BY "site_id" ORDER BY "requested_at", "created_at", "id") AS rn FROM "permits"
) n WHERE n."id" = p."id";--> statement-breakpoint
ALTER TABLE "permits" ALTER COLUMN "request_number" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "sites" ADD COLUMN "request_counter" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
UPDATE "sites" s SET "request_counter" = m.n FROM (
  SELECT "site_id", max("request_number") AS n FROM "permits" GROUP BY "site_id"
) m WHERE m."site_id" = s."id";--> statement-breakpoint
CREATE UNIQUE INDEX "permits_site_request_number" ON "permits" USING btree ("site_id","request_number");

-- Register search by tag ("contains", case-insensitive) stays an index lookup on 20,000 members.
-- pg_trgm ships with PostgreSQL (contrib) and is a trusted extension (PG 13+), available on managed services.
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "members_tag_trgm" ON "members" USING gin (lower("tag") gin_trgm_ops);

CREATE TYPE "public"."scheme_document_kind" AS ENUM('drawing', 'certificate');--> statement-breakpoint
CREATE TABLE "scheme_documents" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"scheme_id" uuid NOT NULL,
	"kind" "scheme_document_kind" NOT NULL,
	"object_key" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"drawing_number" text,
	"revision" text,
	"checker_name" text,
	"check_category" integer,
	"document_date" text,
	"signed_image_confirmed" boolean DEFAULT false NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "permits" ADD COLUMN "evidence_history" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "scheme_documents" ADD CONSTRAINT "scheme_documents_scheme_id_schemes_id_fk" FOREIGN KEY ("scheme_id") REFERENCES "public"."schemes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scheme_documents" ADD CONSTRAINT "scheme_documents_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "scheme_documents_scheme" ON "scheme_documents" USING btree ("scheme_id","kind","created_at");
CREATE TYPE "public"."review_verdict" AS ENUM('reviewed', 'approved');--> statement-breakpoint
CREATE TABLE "revision" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sheet_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"state" "bytea" NOT NULL,
	"document" jsonb NOT NULL,
	"input_hash" text NOT NULL,
	"solver_version" text NOT NULL,
	"results" jsonb NOT NULL,
	"cases" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"issued_by" text,
	"issued_by_name" text DEFAULT '' NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "revision_review" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"revision_id" uuid NOT NULL,
	"reviewer_id" text,
	"reviewer_name" text NOT NULL,
	"verdict" "review_verdict" NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"via_link" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "revision" ADD CONSTRAINT "revision_sheet_id_sheet_id_fk" FOREIGN KEY ("sheet_id") REFERENCES "public"."sheet"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision" ADD CONSTRAINT "revision_issued_by_user_id_fk" FOREIGN KEY ("issued_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_review" ADD CONSTRAINT "revision_review_revision_id_revision_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revision"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_review" ADD CONSTRAINT "revision_review_reviewer_id_user_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "revision_sheet_number_idx" ON "revision" USING btree ("sheet_id","number");--> statement-breakpoint
CREATE INDEX "revision_review_revision_idx" ON "revision_review" USING btree ("revision_id","created_at");
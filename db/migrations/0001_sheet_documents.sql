CREATE TABLE "sheet_snapshot" (
	"sheet_id" uuid PRIMARY KEY NOT NULL,
	"state" "bytea" NOT NULL,
	"through_seq" bigint NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sheet_update" (
	"seq" bigserial PRIMARY KEY NOT NULL,
	"sheet_id" uuid NOT NULL,
	"update" "bytea" NOT NULL,
	"user_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "sheet_snapshot" ADD CONSTRAINT "sheet_snapshot_sheet_id_sheet_id_fk" FOREIGN KEY ("sheet_id") REFERENCES "public"."sheet"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sheet_update" ADD CONSTRAINT "sheet_update_sheet_id_sheet_id_fk" FOREIGN KEY ("sheet_id") REFERENCES "public"."sheet"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sheet_update_sheet_seq_idx" ON "sheet_update" USING btree ("sheet_id","seq");
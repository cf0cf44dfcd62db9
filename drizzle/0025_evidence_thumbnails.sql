CREATE TABLE "evidence_thumbnails" (
	"evidence_id" uuid PRIMARY KEY NOT NULL,
	"state" text NOT NULL,
	"object_key" text,
	"content_type" text,
	"width_px" integer,
	"height_px" integer,
	"size_bytes" integer,
	"message" text,
	"made_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "evidence_thumbnails_state_valid" CHECK ("evidence_thumbnails"."state" in ('done', 'failed')),
	CONSTRAINT "evidence_thumbnails_done_complete" CHECK ("evidence_thumbnails"."state" <> 'done' or ("evidence_thumbnails"."object_key" is not null and "evidence_thumbnails"."content_type" is not null and "evidence_thumbnails"."width_px" > 0 and "evidence_thumbnails"."height_px" > 0 and "evidence_thumbnails"."size_bytes" > 0)),
	CONSTRAINT "evidence_thumbnails_failed_has_message" CHECK ("evidence_thumbnails"."state" <> 'failed' or "evidence_thumbnails"."message" is not null)
);
--> statement-breakpoint
ALTER TABLE "evidence_thumbnails" ADD CONSTRAINT "evidence_thumbnails_evidence_id_evidence_files_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence_files"("id") ON DELETE no action ON UPDATE no action;
CREATE TABLE "evidence_analyses" (
	"evidence_id" uuid PRIMARY KEY NOT NULL,
	"state" text NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"message" text,
	"library_version" text,
	"summary" jsonb,
	"display_trace" jsonb,
	"spectrogram" jsonb,
	"queued_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "evidence_analyses_state_valid" CHECK ("evidence_analyses"."state" in ('none', 'queued', 'running', 'done', 'failed')),
	CONSTRAINT "evidence_analyses_progress_range" CHECK ("evidence_analyses"."progress" >= 0 and "evidence_analyses"."progress" <= 1),
	CONSTRAINT "evidence_analyses_failed_has_message" CHECK ("evidence_analyses"."state" <> 'failed' or "evidence_analyses"."message" is not null)
);
--> statement-breakpoint
ALTER TABLE "evidence_analyses" ADD CONSTRAINT "evidence_analyses_evidence_id_evidence_files_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence_files"("id") ON DELETE no action ON UPDATE no action;
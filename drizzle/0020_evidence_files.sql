CREATE TABLE "evidence_custody" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"evidence_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_user_id" uuid,
	"actor_label" text NOT NULL,
	"action" text NOT NULL,
	"client_address" text,
	"detail" text,
	CONSTRAINT "evidence_custody_action_valid" CHECK ("evidence_custody"."action" in ('uploaded', 'downloaded', 'verified', 'verification_failed', 'removed', 'bundled'))
);
--> statement-breakpoint
CREATE TABLE "evidence_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"stored_file_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"uploader_role" text NOT NULL,
	"uploader_user_id" uuid,
	"display_name" text NOT NULL,
	"submitted_name_json" text NOT NULL,
	"shared_with_complainant" boolean DEFAULT false NOT NULL,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_at" timestamp with time zone,
	"removed_by" uuid,
	"removed_reason" text,
	"verified_at" timestamp with time zone,
	"verified_by" uuid,
	"verification_outcome" text,
	"processing" jsonb DEFAULT '{"state":"none","progress":0}'::jsonb NOT NULL,
	CONSTRAINT "evidence_files_stored_file_id_unique" UNIQUE("stored_file_id"),
	CONSTRAINT "evidence_files_kind_valid" CHECK ("evidence_files"."kind" in ('spectrum_capture', 'iq_recording', 'photo', 'document', 'audio', 'other')),
	CONSTRAINT "evidence_files_uploader_role_valid" CHECK ("evidence_files"."uploader_role" in ('staff', 'complainant')),
	CONSTRAINT "evidence_files_staff_has_user" CHECK ("evidence_files"."uploader_role" = 'complainant' or "evidence_files"."uploader_user_id" is not null),
	CONSTRAINT "evidence_files_removed_complete" CHECK (("evidence_files"."removed_at" is null) = ("evidence_files"."removed_by" is null) and ("evidence_files"."removed_at" is null) = ("evidence_files"."removed_reason" is null)),
	CONSTRAINT "evidence_files_verification_complete" CHECK (("evidence_files"."verified_at" is null) = ("evidence_files"."verification_outcome" is null) and ("evidence_files"."verification_outcome" is null or "evidence_files"."verification_outcome" in ('verified', 'failed'))),
	CONSTRAINT "evidence_files_processing_object" CHECK (jsonb_typeof("evidence_files"."processing") = 'object')
);
--> statement-breakpoint
ALTER TABLE "stored_files" DROP CONSTRAINT "stored_files_purpose_valid";--> statement-breakpoint
ALTER TABLE "stored_files" ALTER COLUMN "uploaded_by" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "evidence_custody" ADD CONSTRAINT "evidence_custody_evidence_id_evidence_files_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_custody" ADD CONSTRAINT "evidence_custody_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_files" ADD CONSTRAINT "evidence_files_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_files" ADD CONSTRAINT "evidence_files_stored_file_id_stored_files_id_fk" FOREIGN KEY ("stored_file_id") REFERENCES "public"."stored_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_files" ADD CONSTRAINT "evidence_files_uploader_user_id_users_id_fk" FOREIGN KEY ("uploader_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_files" ADD CONSTRAINT "evidence_files_removed_by_users_id_fk" FOREIGN KEY ("removed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_files" ADD CONSTRAINT "evidence_files_verified_by_users_id_fk" FOREIGN KEY ("verified_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "evidence_custody_evidence_idx" ON "evidence_custody" USING btree ("evidence_id","at");--> statement-breakpoint
CREATE INDEX "evidence_files_case_idx" ON "evidence_files" USING btree ("case_id","uploaded_at");--> statement-breakpoint
ALTER TABLE "stored_files" ADD CONSTRAINT "stored_files_purpose_valid" CHECK ("stored_files"."purpose" in ('station_register_import', 'evidence'));--> statement-breakpoint
SELECT make_append_only('evidence_custody', 'at');
--> statement-breakpoint
-- evidence is removed by marking the row (removed_at/by/reason); the application never deletes a row
REVOKE DELETE, TRUNCATE ON "evidence_files" FROM quietband_app;

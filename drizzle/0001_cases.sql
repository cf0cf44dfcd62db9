-- Trigram index support for the case list's text search (a trusted extension: the database owner may create it).
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE SEQUENCE "public"."case_reference_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1;--> statement-breakpoint
CREATE TABLE "case_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"case_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_user_id" uuid,
	"actor_label" text NOT NULL,
	"kind" text NOT NULL,
	"from_state" text,
	"to_state" text,
	"body" text,
	"visibility" text NOT NULL,
	"data" text,
	CONSTRAINT "case_events_visibility_valid" CHECK ("case_events"."visibility" in ('internal','complainant'))
);
--> statement-breakpoint
CREATE TABLE "case_tracking_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "case_tracking_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "cases" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"reference" text NOT NULL,
	"office_id" uuid NOT NULL,
	"status" text DEFAULT 'received' NOT NULL,
	"priority" integer NOT NULL,
	"suggested_priority" integer NOT NULL,
	"service" text NOT NULL,
	"licence_ref" text,
	"freq_low_hz" double precision NOT NULL,
	"freq_high_hz" double precision NOT NULL,
	"address" text NOT NULL,
	"lat_deg" double precision NOT NULL,
	"lon_deg" double precision NOT NULL,
	"since_date" date NOT NULL,
	"pattern" text NOT NULL,
	"pattern_detail" text,
	"experience" text NOT NULL,
	"description" text NOT NULL,
	"complainant_name" text NOT NULL,
	"complainant_email" text NOT NULL,
	"complainant_phone" text,
	"complainant_organisation" text,
	"complainant_user_id" uuid,
	"investigator_id" uuid,
	"merged_into_case_id" uuid,
	"resolution" text,
	"closing_summary" text,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"closed_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"search_text" text GENERATED ALWAYS AS (lower(reference || ' ' || address || ' ' || complainant_name || ' ' || coalesce(complainant_organisation, '') || ' ' || coalesce(licence_ref, '') || ' ' || description)) STORED,
	CONSTRAINT "cases_reference_unique" UNIQUE("reference"),
	CONSTRAINT "cases_status_valid" CHECK ("cases"."status" in ('received','triaged','assigned','field_work','finding_proposed','returned','closed')),
	CONSTRAINT "cases_priority_valid" CHECK ("cases"."priority" between 1 and 4 and "cases"."suggested_priority" between 1 and 4),
	CONSTRAINT "cases_freq_valid" CHECK ("cases"."freq_low_hz" > 0 and "cases"."freq_high_hz" >= "cases"."freq_low_hz"),
	CONSTRAINT "cases_lat_valid" CHECK ("cases"."lat_deg" between -90 and 90 and "cases"."lon_deg" between -180 and 180),
	CONSTRAINT "cases_resolution_valid" CHECK ("cases"."resolution" is null or "cases"."resolution" in ('source_corrected','enforcement_action','no_interference_found','referred','withdrawn','duplicate')),
	CONSTRAINT "cases_closed_has_resolution" CHECK (("cases"."status" = 'closed') = ("cases"."resolution" is not null and "cases"."closed_at" is not null))
);
--> statement-breakpoint
ALTER TABLE "case_events" ADD CONSTRAINT "case_events_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_events" ADD CONSTRAINT "case_events_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_tracking_tokens" ADD CONSTRAINT "case_tracking_tokens_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_complainant_user_id_users_id_fk" FOREIGN KEY ("complainant_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_investigator_id_users_id_fk" FOREIGN KEY ("investigator_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_merged_into_case_id_cases_id_fk" FOREIGN KEY ("merged_into_case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "case_events_case_idx" ON "case_events" USING btree ("case_id","id");--> statement-breakpoint
CREATE INDEX "case_tracking_tokens_case_idx" ON "case_tracking_tokens" USING btree ("case_id");--> statement-breakpoint
CREATE INDEX "cases_office_status_idx" ON "cases" USING btree ("office_id","status");--> statement-breakpoint
CREATE INDEX "cases_office_received_idx" ON "cases" USING btree ("office_id","received_at");--> statement-breakpoint
CREATE INDEX "cases_office_due_idx" ON "cases" USING btree ("office_id","due_at");--> statement-breakpoint
CREATE INDEX "cases_office_priority_received_idx" ON "cases" USING btree ("office_id","priority","received_at");--> statement-breakpoint
CREATE INDEX "cases_investigator_idx" ON "cases" USING btree ("investigator_id","status");--> statement-breakpoint
CREATE INDEX "cases_received_idx" ON "cases" USING btree ("received_at");--> statement-breakpoint
CREATE INDEX "cases_due_open_idx" ON "cases" USING btree ("due_at") WHERE "cases"."status" <> 'closed';--> statement-breakpoint
CREATE INDEX "cases_freq_idx" ON "cases" USING btree ("freq_low_hz","freq_high_hz");--> statement-breakpoint
CREATE INDEX "cases_complainant_user_idx" ON "cases" USING btree ("complainant_user_id");--> statement-breakpoint
CREATE INDEX "cases_complainant_email_idx" ON "cases" USING btree ("complainant_email");--> statement-breakpoint
CREATE INDEX "cases_search_trgm_idx" ON "cases" USING gin ("search_text" gin_trgm_ops);--> statement-breakpoint
-- The timeline is append-only: it is the record a closed case stands on as evidence.
CREATE FUNCTION case_events_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'case_events is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;--> statement-breakpoint
CREATE TRIGGER case_events_append_only BEFORE UPDATE OR DELETE ON case_events
  FOR EACH ROW EXECUTE FUNCTION case_events_refuse_change();--> statement-breakpoint
CREATE TRIGGER case_events_no_truncate BEFORE TRUNCATE ON case_events
  FOR EACH STATEMENT EXECUTE FUNCTION case_events_refuse_change();

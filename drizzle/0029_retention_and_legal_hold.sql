CREATE TABLE "legal_hold_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"case_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"action" text NOT NULL,
	"actor_user_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"until_date" date,
	CONSTRAINT "legal_hold_events_action_valid" CHECK ("legal_hold_events"."action" in ('set', 'lifted')),
	CONSTRAINT "legal_hold_events_until_on_set" CHECK ("legal_hold_events"."action" = 'set' or "legal_hold_events"."until_date" is null)
);
--> statement-breakpoint
CREATE TABLE "retention_actions" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"case_id" uuid NOT NULL,
	"action" text NOT NULL,
	"fields" jsonb,
	"redacted_event_ids" jsonb,
	"evidence_id" uuid,
	"object_key" text,
	"sha256" text,
	CONSTRAINT "retention_actions_action_valid" CHECK ("retention_actions"."action" in ('personal_data_erased', 'evidence_disposed')),
	CONSTRAINT "retention_actions_complete" CHECK (("retention_actions"."action" = 'personal_data_erased' and "retention_actions"."fields" is not null and "retention_actions"."evidence_id" is null) or ("retention_actions"."action" = 'evidence_disposed' and "retention_actions"."evidence_id" is not null and "retention_actions"."object_key" is not null and "retention_actions"."sha256" ~ '^[0-9a-f]{64}$'))
);
--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "retention_months" integer DEFAULT 24 NOT NULL;--> statement-breakpoint
ALTER TABLE "case_events" ADD COLUMN "redacted_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "personal_data_erased_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "evidence_files" ADD COLUMN "disposed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "legal_hold_events" ADD CONSTRAINT "legal_hold_events_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legal_hold_events" ADD CONSTRAINT "legal_hold_events_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "retention_actions" ADD CONSTRAINT "retention_actions_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "retention_actions" ADD CONSTRAINT "retention_actions_evidence_id_evidence_files_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "legal_hold_events_case_idx" ON "legal_hold_events" USING btree ("case_id","id");--> statement-breakpoint
CREATE INDEX "retention_actions_case_idx" ON "retention_actions" USING btree ("case_id","id");--> statement-breakpoint
ALTER TABLE "offices" ADD CONSTRAINT "offices_retention_months_range" CHECK ("offices"."retention_months" between 1 and 1200);--> statement-breakpoint
SELECT make_append_only('legal_hold_events', 'at');--> statement-breakpoint
SELECT make_append_only('retention_actions', 'at');--> statement-breakpoint
-- The timeline stays append-only with one exception: the retention run replaces an entry's body
-- by a redacted copy, once, setting redacted_at. The app role still has no UPDATE on the table;
-- it calls quietband_redact_case_event (SECURITY DEFINER), which turns the transaction-local
-- flag quietband.retention_erasure on around its one UPDATE. The trigger lets an UPDATE through
-- only with that flag on, only the first time, and only when no column but body and
-- redacted_at changes; DELETE and TRUNCATE stay refused for everyone.
CREATE FUNCTION quietband_case_event_redaction() RETURNS trigger LANGUAGE plpgsql
SET search_path = pg_catalog, pg_temp AS $$
BEGIN
  IF TG_OP = 'UPDATE'
     AND current_setting('quietband.retention_erasure', true) = 'on'
     AND OLD.redacted_at IS NULL AND NEW.redacted_at IS NOT NULL
     AND (to_jsonb(NEW) - 'body' - 'redacted_at') = (to_jsonb(OLD) - 'body' - 'redacted_at') THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;--> statement-breakpoint
CREATE OR REPLACE TRIGGER case_events_append_only BEFORE UPDATE OR DELETE ON case_events FOR EACH ROW EXECUTE FUNCTION quietband_case_event_redaction();--> statement-breakpoint
CREATE FUNCTION quietband_redact_case_event(event_id bigint, redacted_body text) RETURNS boolean LANGUAGE plpgsql SECURITY DEFINER
SET search_path = pg_catalog, public, pg_temp AS $$
DECLARE
  changed boolean;
BEGIN
  PERFORM set_config('quietband.retention_erasure', 'on', true);
  UPDATE case_events SET body = redacted_body, redacted_at = now() WHERE id = event_id AND redacted_at IS NULL;
  changed := FOUND;
  PERFORM set_config('quietband.retention_erasure', 'off', true);
  RETURN changed;
END
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION quietband_redact_case_event(bigint, text) FROM PUBLIC;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION quietband_redact_case_event(bigint, text) TO quietband_app;

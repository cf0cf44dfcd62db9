ALTER TABLE "retention_actions" DROP CONSTRAINT "retention_actions_action_valid";--> statement-breakpoint
ALTER TABLE "retention_actions" DROP CONSTRAINT "retention_actions_complete";--> statement-breakpoint
ALTER TABLE "stored_files" ADD COLUMN "name_erased_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "retention_actions" ADD COLUMN "stage" text;--> statement-breakpoint
ALTER TABLE "retention_actions" ADD COLUMN "details" jsonb;--> statement-breakpoint
CREATE INDEX "retention_actions_object_idx" ON "retention_actions" USING btree ("object_key");--> statement-breakpoint
ALTER TABLE "retention_actions" ADD CONSTRAINT "retention_actions_stage_valid" CHECK ("retention_actions"."stage" is null or ("retention_actions"."stage" in ('pending', 'done') and "retention_actions"."action" in ('evidence_disposed', 'thumbnail_disposed')));--> statement-breakpoint
ALTER TABLE "retention_actions" ADD CONSTRAINT "retention_actions_action_valid" CHECK ("retention_actions"."action" in ('personal_data_erased', 'evidence_disposed', 'thumbnail_disposed', 'merge_entries_redacted', 'location_coarsened', 'file_names_erased', 'queued_mail_cancelled', 'account_deactivated'));--> statement-breakpoint
ALTER TABLE "retention_actions" ADD CONSTRAINT "retention_actions_complete" CHECK (("retention_actions"."action" = 'personal_data_erased' and "retention_actions"."fields" is not null and "retention_actions"."evidence_id" is null)
        or ("retention_actions"."action" = 'evidence_disposed' and "retention_actions"."evidence_id" is not null and "retention_actions"."object_key" is not null and "retention_actions"."sha256" ~ '^[0-9a-f]{64}$')
        or ("retention_actions"."action" = 'thumbnail_disposed' and "retention_actions"."evidence_id" is not null and "retention_actions"."object_key" is not null and "retention_actions"."stage" is not null)
        or ("retention_actions"."action" = 'merge_entries_redacted' and "retention_actions"."redacted_event_ids" is not null)
        or ("retention_actions"."action" in ('location_coarsened', 'file_names_erased', 'queued_mail_cancelled', 'account_deactivated') and "retention_actions"."details" is not null));--> statement-breakpoint
-- stored_files stays append-only with one exception: the retention run replaces an evidence
-- file's original name (it can name a person) by 'erased-<first 12 hex digits of its SHA-256>'
-- and an optional known extension, once, setting name_erased_at. The app role still has no
-- UPDATE on the table; it calls quietband_erase_stored_file_name (SECURITY DEFINER), which turns
-- the transaction-local flag quietband.file_name_erasure on around its one UPDATE. The trigger
-- lets an UPDATE through only with that flag on, only the first time, and only when no column
-- but original_name and name_erased_at changes; DELETE and TRUNCATE stay refused for everyone.
-- Calling make_append_only on stored_files again would drop this exception.
CREATE FUNCTION quietband_stored_file_name_erasure() RETURNS trigger LANGUAGE plpgsql
SET search_path = pg_catalog, pg_temp AS $$
BEGIN
  IF TG_OP = 'UPDATE'
     AND current_setting('quietband.file_name_erasure', true) = 'on'
     AND OLD.name_erased_at IS NULL AND NEW.name_erased_at IS NOT NULL
     AND (to_jsonb(NEW) - 'original_name' - 'name_erased_at') = (to_jsonb(OLD) - 'original_name' - 'name_erased_at') THEN
    RETURN NEW;
  END IF;
  RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$;--> statement-breakpoint
CREATE OR REPLACE TRIGGER stored_files_append_only BEFORE UPDATE OR DELETE ON stored_files FOR EACH ROW EXECUTE FUNCTION quietband_stored_file_name_erasure();--> statement-breakpoint
CREATE FUNCTION quietband_erase_stored_file_name(file_id uuid, erased_name text) RETURNS boolean LANGUAGE plpgsql SECURITY DEFINER
SET search_path = pg_catalog, public, pg_temp AS $$
DECLARE
  changed boolean;
BEGIN
  PERFORM set_config('quietband.file_name_erasure', 'on', true);
  UPDATE stored_files SET original_name = erased_name, name_erased_at = now()
   WHERE id = file_id AND name_erased_at IS NULL AND purpose = 'evidence'
     AND erased_name ~ ('^erased-' || left(sha256, 12) || '(\.[a-z0-9-]{1,12})?$');
  changed := FOUND;
  PERFORM set_config('quietband.file_name_erasure', 'off', true);
  RETURN changed;
END
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION quietband_erase_stored_file_name(uuid, text) FROM PUBLIC;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION quietband_erase_stored_file_name(uuid, text) TO quietband_app;

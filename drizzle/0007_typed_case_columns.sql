ALTER TABLE "case_events" DROP CONSTRAINT "case_events_visibility_valid";--> statement-breakpoint
ALTER TABLE "cases" DROP CONSTRAINT "cases_status_valid";--> statement-breakpoint
ALTER TABLE "cases" DROP CONSTRAINT "cases_priority_valid";--> statement-breakpoint
ALTER TABLE "cases" DROP CONSTRAINT "cases_resolution_valid";--> statement-breakpoint
DROP INDEX "cases_due_open_idx";--> statement-breakpoint
-- the timeline held its JSON as text; every value was written by JSON.stringify, so the cast reads them all.
-- ALTER TABLE rewrites the table without firing its row triggers: the append-only triggers stay and hold.
ALTER TABLE "case_events" ALTER COLUMN "data" SET DATA TYPE jsonb USING "data"::jsonb;--> statement-breakpoint
CREATE INDEX "cases_due_open_idx" ON "cases" USING btree ("due_at") WHERE "cases"."status" not in ('closed');--> statement-breakpoint
ALTER TABLE "case_events" ADD CONSTRAINT "case_events_states_valid" CHECK (("case_events"."from_state" is null or "case_events"."from_state" in ('received', 'triaged', 'assigned', 'field_work', 'finding_proposed', 'returned', 'closed')) and ("case_events"."to_state" is null or "case_events"."to_state" in ('received', 'triaged', 'assigned', 'field_work', 'finding_proposed', 'returned', 'closed')));--> statement-breakpoint
ALTER TABLE "case_events" ADD CONSTRAINT "case_events_visibility_valid" CHECK ("case_events"."visibility" in ('internal', 'complainant'));--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_service_valid" CHECK ("cases"."service" in ('aeronautical', 'maritime', 'radionavigation', 'ppdr', 'broadcasting', 'mobile_network', 'fixed_link', 'satellite_earth_station', 'amateur', 'licence_exempt', 'other'));--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_pattern_valid" CHECK ("cases"."pattern" in ('continuous', 'intermittent', 'certain_hours'));--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_experience_valid" CHECK ("cases"."experience" in ('outage', 'degradation', 'nuisance'));--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_status_valid" CHECK ("cases"."status" in ('received', 'triaged', 'assigned', 'field_work', 'finding_proposed', 'returned', 'closed'));--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_priority_valid" CHECK ("cases"."priority" in (1, 2, 3, 4) and "cases"."suggested_priority" in (1, 2, 3, 4));--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_resolution_valid" CHECK ("cases"."resolution" is null or "cases"."resolution" in ('source_corrected', 'enforcement_action', 'no_interference_found', 'referred', 'withdrawn', 'duplicate'));
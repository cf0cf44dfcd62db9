ALTER TABLE "offices" ADD COLUMN "first_response_p1_hours" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "first_response_p2_hours" integer DEFAULT 8 NOT NULL;--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "first_response_p3_hours" integer DEFAULT 24 NOT NULL;--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "first_response_p4_hours" integer DEFAULT 72 NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "first_response_due_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "first_responded_at" timestamp with time zone;--> statement-breakpoint
-- Existing cases (hand-written): the first response is the first triage or staff message to the
-- complainant on the timeline; its due time is receipt plus the office's new first-response hours.
UPDATE "cases" c SET
  "first_response_due_at" = c."received_at" + make_interval(hours => CASE c."priority" WHEN 1 THEN o."first_response_p1_hours" WHEN 2 THEN o."first_response_p2_hours" WHEN 3 THEN o."first_response_p3_hours" ELSE o."first_response_p4_hours" END),
  "first_responded_at" = (SELECT min(e."at") FROM "case_events" e WHERE e."case_id" = c."id" AND e."kind" IN ('triage', 'message', 'information_requested'))
FROM "offices" o WHERE o."id" = c."office_id";--> statement-breakpoint
ALTER TABLE "cases" ALTER COLUMN "first_response_due_at" SET NOT NULL;--> statement-breakpoint
CREATE INDEX "cases_first_response_open_idx" ON "cases" USING btree ("first_response_due_at","office_id") WHERE "cases"."status" not in ('closed') and "cases"."first_responded_at" is null;--> statement-breakpoint
CREATE INDEX "cases_office_closed_idx" ON "cases" USING btree ("office_id","closed_at") WHERE "cases"."closed_at" is not null;--> statement-breakpoint
CREATE INDEX "cases_office_responded_idx" ON "cases" USING btree ("office_id","first_responded_at") WHERE "cases"."first_responded_at" is not null;--> statement-breakpoint
ALTER TABLE "offices" ADD CONSTRAINT "offices_first_response_targets_positive" CHECK (least("offices"."first_response_p1_hours", "offices"."first_response_p2_hours", "offices"."first_response_p3_hours", "offices"."first_response_p4_hours") > 0);
DROP INDEX "cases_office_closed_idx";--> statement-breakpoint
DROP INDEX "cases_office_responded_idx";--> statement-breakpoint
CREATE INDEX "cases_closed_window_idx" ON "cases" USING btree ("closed_at","office_id") WHERE "cases"."closed_at" is not null;--> statement-breakpoint
CREATE INDEX "cases_responded_window_idx" ON "cases" USING btree ("first_responded_at","office_id") WHERE "cases"."first_responded_at" is not null;
DROP INDEX "cases_due_open_idx";--> statement-breakpoint
CREATE INDEX "cases_due_open_idx" ON "cases" USING btree ("due_at","office_id") WHERE "cases"."status" not in ('closed');
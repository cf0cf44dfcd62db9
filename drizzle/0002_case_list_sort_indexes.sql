CREATE INDEX "cases_list_reference_idx" ON "cases" USING btree ("reference","id","office_id");--> statement-breakpoint
CREATE INDEX "cases_list_received_idx" ON "cases" USING btree ("received_at","id","office_id");--> statement-breakpoint
CREATE INDEX "cases_list_priority_idx" ON "cases" USING btree ("priority","received_at","id","office_id");--> statement-breakpoint
CREATE INDEX "cases_list_due_idx" ON "cases" USING btree ("due_at","id","status","office_id");--> statement-breakpoint
CREATE INDEX "cases_list_status_idx" ON "cases" USING btree ("status","received_at","id","office_id");--> statement-breakpoint
CREATE INDEX "cases_list_service_idx" ON "cases" USING btree ("service","received_at","id","office_id");--> statement-breakpoint
CREATE INDEX "cases_list_freq_idx" ON "cases" USING btree ("freq_low_hz","freq_high_hz","id","office_id");
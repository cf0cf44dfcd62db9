CREATE TABLE "audit_log" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_user_id" uuid,
	"action" text NOT NULL,
	"target_type" text NOT NULL,
	"target_id" text,
	"office_id" uuid,
	"details" jsonb DEFAULT '{}'::jsonb NOT NULL,
	CONSTRAINT "audit_log_action_known" CHECK ("audit_log"."action" in ('user.invited', 'user.deactivated', 'user.reactivated', 'user.role_changed', 'user.office_changed', 'office.created', 'office.updated', 'office.area_changed', 'office.response_targets_changed', 'office.first_response_targets_changed', 'office.time_zone_changed', 'band_limit.edited', 'station_register.imported', 'equipment.changed', 'cases.exported_csv', 'evidence.bundle_exported', 'case_file.issued', 'tracking_links.revoked', 'complainant_details.viewed', 'legal_hold.set', 'legal_hold.lifted', 'retention.changed', 'retention.run', 'audit.exported_csv')),
	CONSTRAINT "audit_log_details_object" CHECK (jsonb_typeof("audit_log"."details") = 'object')
);
--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_log_at_idx" ON "audit_log" USING btree ("at");--> statement-breakpoint
CREATE INDEX "audit_log_action_at_idx" ON "audit_log" USING btree ("action","at");--> statement-breakpoint
CREATE INDEX "audit_log_actor_at_idx" ON "audit_log" USING btree ("actor_user_id","at");--> statement-breakpoint
CREATE INDEX "audit_log_office_at_idx" ON "audit_log" USING btree ("office_id","at");--> statement-breakpoint
CREATE INDEX "audit_log_target_at_idx" ON "audit_log" USING btree ("target_type","target_id","at");--> statement-breakpoint
-- the audit log is a record: no UPDATE, DELETE or TRUNCATE, time from the database
SELECT make_append_only('audit_log', 'at');

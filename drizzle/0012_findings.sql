CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"author_user_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"source_description" text NOT NULL,
	"source_lat_deg" double precision,
	"source_lon_deg" double precision,
	"operator" text,
	"authorised_station_id" uuid,
	"calculation_ids" jsonb NOT NULL,
	"evidence_ids" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"recommended_action" text NOT NULL,
	"compliance_deadline" date,
	"summary" text NOT NULL,
	CONSTRAINT "findings_recommended_action_valid" CHECK ("findings"."recommended_action" in ('no_action', 'advise_operator', 'formal_warning', 'stop_transmitting', 'refer_to_licensing')),
	CONSTRAINT "findings_source_position" CHECK (("findings"."source_lat_deg" is null and "findings"."source_lon_deg" is null) or ("findings"."source_lat_deg" between -90 and 90 and "findings"."source_lon_deg" between -180 and 180)),
	CONSTRAINT "findings_lists_arrays" CHECK (jsonb_typeof("findings"."calculation_ids") = 'array' and jsonb_typeof("findings"."evidence_ids") = 'array')
);
--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_author_user_id_users_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "findings_case_idx" ON "findings" USING btree ("case_id","at");--> statement-breakpoint
-- Findings are records: each proposal is a new row; no UPDATE, DELETE or TRUNCATE for any role,
-- the database's time in "at", and only SELECT and INSERT for the application (the helper of 0004).
SELECT make_append_only('findings', 'at');

CREATE TABLE "calculations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"inputs" jsonb NOT NULL,
	"outputs" jsonb NOT NULL,
	"warnings" jsonb NOT NULL,
	"methods" jsonb NOT NULL,
	"library_version" text NOT NULL,
	"author_user_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"reference_copies" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"measurement_ids" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"evidence_ids" jsonb DEFAULT '[]'::jsonb NOT NULL,
	CONSTRAINT "calculations_kind_valid" CHECK ("calculations"."kind" in ('eirp_single_point', 'compliance_verdict')),
	CONSTRAINT "calculations_inputs_object" CHECK (jsonb_typeof("calculations"."inputs") = 'object' and jsonb_typeof("calculations"."outputs") = 'object' and jsonb_typeof("calculations"."reference_copies") = 'object'),
	CONSTRAINT "calculations_lists_arrays" CHECK (jsonb_typeof("calculations"."warnings") = 'array' and jsonb_typeof("calculations"."methods") = 'array' and jsonb_typeof("calculations"."measurement_ids") = 'array' and jsonb_typeof("calculations"."evidence_ids") = 'array'),
	CONSTRAINT "calculations_library_version_semver" CHECK ("calculations"."library_version" ~ '^[0-9]+\.[0-9]+\.[0-9]+$')
);
--> statement-breakpoint
ALTER TABLE "calculations" ADD CONSTRAINT "calculations_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calculations" ADD CONSTRAINT "calculations_author_user_id_users_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "calculations_case_idx" ON "calculations" USING btree ("case_id","at");--> statement-breakpoint
-- Calculations are records: no UPDATE, DELETE or TRUNCATE for any role, the database's time in
-- "at", and only SELECT and INSERT for the application (the helper of 0004).
SELECT make_append_only('calculations', 'at');

CREATE TABLE "equipment" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"name" text NOT NULL,
	"type" text NOT NULL,
	"manufacturer" text,
	"model" text,
	"serial" text,
	"antenna_gain_dbi" double precision,
	"antenna_factor_table" jsonb,
	"default_cable_loss_db" double precision,
	"default_preamp_gain_db" double precision,
	"min_freq_hz" double precision,
	"max_freq_hz" double precision,
	"max_input_dbm" double precision,
	"calibration_due_on" date,
	"notes" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	CONSTRAINT "equipment_type_valid" CHECK ("equipment"."type" in ('antenna', 'analyser', 'receiver', 'cable', 'preamplifier', 'attenuator', 'other')),
	CONSTRAINT "equipment_antenna_one_description" CHECK ("equipment"."antenna_gain_dbi" is null or "equipment"."antenna_factor_table" is null),
	CONSTRAINT "equipment_af_table_array" CHECK ("equipment"."antenna_factor_table" is null or (jsonb_typeof("equipment"."antenna_factor_table") = 'array' and jsonb_array_length("equipment"."antenna_factor_table") >= 2)),
	CONSTRAINT "equipment_losses_positive" CHECK (("equipment"."default_cable_loss_db" is null or "equipment"."default_cable_loss_db" >= 0) and ("equipment"."default_preamp_gain_db" is null or "equipment"."default_preamp_gain_db" >= 0)),
	CONSTRAINT "equipment_freq_range" CHECK (("equipment"."min_freq_hz" is null or "equipment"."min_freq_hz" > 0) and ("equipment"."max_freq_hz" is null or "equipment"."min_freq_hz" is null or "equipment"."max_freq_hz" > "equipment"."min_freq_hz")),
	CONSTRAINT "equipment_version_positive" CHECK ("equipment"."version" >= 1)
);
--> statement-breakpoint
CREATE TABLE "equipment_changes" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"equipment_id" uuid NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"changed_by" uuid NOT NULL,
	"reason" text,
	"version" integer NOT NULL,
	"before" jsonb NOT NULL,
	"after" jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "measurements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"office_id" uuid NOT NULL,
	"author_user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"taken_at" timestamp with time zone NOT NULL,
	"lat_deg" double precision NOT NULL,
	"lon_deg" double precision NOT NULL,
	"height_m" double precision,
	"freq_hz" double precision NOT NULL,
	"measurement_bandwidth_hz" double precision,
	"rbw_hz" double precision,
	"detector" text,
	"reading_value" double precision NOT NULL,
	"reading_unit" text NOT NULL,
	"antenna_id" uuid,
	"antenna_gain_dbi" double precision,
	"antenna_factor_db_per_m" double precision,
	"instrument_id" uuid,
	"cable_loss_db" double precision,
	"preamp_gain_db" double precision,
	"polarisation" text,
	"bearing_deg" double precision,
	"bearing_sigma_deg" double precision,
	"notes" text,
	"evidence_file_id" uuid,
	"derived" jsonb NOT NULL,
	"methods" jsonb NOT NULL,
	"warnings" jsonb NOT NULL,
	"equipment_copies" jsonb NOT NULL,
	"library_version" text NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"supersedes_id" uuid,
	CONSTRAINT "measurements_detector_valid" CHECK ("measurements"."detector" is null or "measurements"."detector" in ('peak', 'rms', 'average', 'quasi_peak')),
	CONSTRAINT "measurements_polarisation_valid" CHECK ("measurements"."polarisation" is null or "measurements"."polarisation" in ('vertical', 'horizontal', 'other')),
	CONSTRAINT "measurements_reading_unit_valid" CHECK ("measurements"."reading_unit" in ('dBm', 'dBµV', 'dBµV/m', 'dBW/m²')),
	CONSTRAINT "measurements_position_valid" CHECK ("measurements"."lat_deg" between -90 and 90 and "measurements"."lon_deg" between -180 and 180 and ("measurements"."height_m" is null or "measurements"."height_m" >= 0)),
	CONSTRAINT "measurements_freq_positive" CHECK ("measurements"."freq_hz" > 0 and ("measurements"."measurement_bandwidth_hz" is null or "measurements"."measurement_bandwidth_hz" > 0) and ("measurements"."rbw_hz" is null or "measurements"."rbw_hz" > 0)),
	CONSTRAINT "measurements_antenna_one_description" CHECK (num_nonnulls("measurements"."antenna_id", "measurements"."antenna_gain_dbi", "measurements"."antenna_factor_db_per_m") <= 1),
	CONSTRAINT "measurements_losses_positive" CHECK (("measurements"."cable_loss_db" is null or "measurements"."cable_loss_db" >= 0) and ("measurements"."preamp_gain_db" is null or "measurements"."preamp_gain_db" >= 0)),
	CONSTRAINT "measurements_bearing_valid" CHECK (("measurements"."bearing_deg" is null or ("measurements"."bearing_deg" >= 0 and "measurements"."bearing_deg" < 360)) and ("measurements"."bearing_sigma_deg" is null or "measurements"."bearing_sigma_deg" > 0)),
	CONSTRAINT "measurements_lists" CHECK (jsonb_typeof("measurements"."derived") = 'object' and jsonb_typeof("measurements"."methods") = 'object' and jsonb_typeof("measurements"."warnings") = 'array' and jsonb_typeof("measurements"."equipment_copies") = 'array'),
	CONSTRAINT "measurements_version_positive" CHECK ("measurements"."version" >= 1),
	CONSTRAINT "measurements_not_self_superseding" CHECK ("measurements"."supersedes_id" is null or "measurements"."supersedes_id" <> "measurements"."id")
);
--> statement-breakpoint
ALTER TABLE "equipment" ADD CONSTRAINT "equipment_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "equipment" ADD CONSTRAINT "equipment_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "equipment_changes" ADD CONSTRAINT "equipment_changes_equipment_id_equipment_id_fk" FOREIGN KEY ("equipment_id") REFERENCES "public"."equipment"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "equipment_changes" ADD CONSTRAINT "equipment_changes_changed_by_users_id_fk" FOREIGN KEY ("changed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_author_user_id_users_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_antenna_id_equipment_id_fk" FOREIGN KEY ("antenna_id") REFERENCES "public"."equipment"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_instrument_id_equipment_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."equipment"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurements" ADD CONSTRAINT "measurements_supersedes_id_measurements_id_fk" FOREIGN KEY ("supersedes_id") REFERENCES "public"."measurements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "equipment_office_idx" ON "equipment" USING btree ("office_id","name");--> statement-breakpoint
CREATE INDEX "equipment_changes_item_idx" ON "equipment_changes" USING btree ("equipment_id","changed_at");--> statement-breakpoint
CREATE INDEX "measurements_case_idx" ON "measurements" USING btree ("case_id","taken_at");--> statement-breakpoint
CREATE UNIQUE INDEX "measurements_supersedes_once" ON "measurements" USING btree ("supersedes_id");--> statement-breakpoint
-- the history of the equipment register is a record: no UPDATE, DELETE or TRUNCATE, time from the database
SELECT make_append_only('equipment_changes', 'changed_at');

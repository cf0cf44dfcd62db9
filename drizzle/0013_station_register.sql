CREATE TABLE "stored_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"object_key" text NOT NULL,
	"original_name" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"sha256" text NOT NULL,
	"content_type" text NOT NULL,
	"content_type_source" text NOT NULL,
	"purpose" text NOT NULL,
	"uploaded_by" uuid NOT NULL,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stored_files_object_key_unique" UNIQUE("object_key"),
	CONSTRAINT "stored_files_sha256_hex" CHECK ("stored_files"."sha256" ~ '^[0-9a-f]{64}$'),
	CONSTRAINT "stored_files_size_nonnegative" CHECK ("stored_files"."size_bytes" >= 0),
	CONSTRAINT "stored_files_purpose_valid" CHECK ("stored_files"."purpose" in ('station_register_import')),
	CONSTRAINT "stored_files_content_type_source_valid" CHECK ("stored_files"."content_type_source" in ('declared', 'sniffed'))
);
--> statement-breakpoint
CREATE TABLE "authorised_stations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"register_version" integer NOT NULL,
	"line" integer NOT NULL,
	"station_code" text NOT NULL,
	"licensee" text NOT NULL,
	"service" text NOT NULL,
	"latitude_deg" double precision NOT NULL,
	"longitude_deg" double precision NOT NULL,
	"antenna_height_m" double precision,
	"low_freq_hz" double precision NOT NULL,
	"high_freq_hz" double precision NOT NULL,
	"limit" jsonb NOT NULL,
	"authorised_eirp_dbm" double precision NOT NULL,
	"valid_from" date,
	"valid_until" date,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "authorised_stations_code_per_version" UNIQUE("register_version","station_code"),
	CONSTRAINT "authorised_stations_frequencies" CHECK ("authorised_stations"."low_freq_hz" > 0 and "authorised_stations"."high_freq_hz" > "authorised_stations"."low_freq_hz"),
	CONSTRAINT "authorised_stations_position" CHECK ("authorised_stations"."latitude_deg" between -90 and 90 and "authorised_stations"."longitude_deg" between -180 and 180),
	CONSTRAINT "authorised_stations_height" CHECK ("authorised_stations"."antenna_height_m" is null or "authorised_stations"."antenna_height_m" >= 0),
	CONSTRAINT "authorised_stations_limit_kind" CHECK (jsonb_typeof("authorised_stations"."limit") = 'object' and "authorised_stations"."limit" ? 'kind'),
	CONSTRAINT "authorised_stations_validity" CHECK ("authorised_stations"."valid_from" is null or "authorised_stations"."valid_until" is null or "authorised_stations"."valid_until" >= "authorised_stations"."valid_from")
);
--> statement-breakpoint
CREATE TABLE "station_register_versions" (
	"version" integer PRIMARY KEY NOT NULL,
	"imported_at" timestamp with time zone DEFAULT now() NOT NULL,
	"imported_by" uuid NOT NULL,
	"stored_file_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"sha256" text NOT NULL,
	"delimiter" text NOT NULL,
	"accepted_count" integer NOT NULL,
	"rejected_count" integer NOT NULL,
	"column_mapping" jsonb NOT NULL,
	"rejected_rows" jsonb NOT NULL,
	CONSTRAINT "station_register_versions_positive" CHECK ("station_register_versions"."version" >= 1),
	CONSTRAINT "station_register_versions_counts" CHECK ("station_register_versions"."accepted_count" >= 1 and "station_register_versions"."rejected_count" >= 0),
	CONSTRAINT "station_register_versions_delimiter_valid" CHECK ("station_register_versions"."delimiter" in ('comma', 'semicolon', 'tab', 'bar')),
	CONSTRAINT "station_register_versions_rejected_array" CHECK (jsonb_typeof("station_register_versions"."rejected_rows") = 'array')
);
--> statement-breakpoint
ALTER TABLE "stored_files" ADD CONSTRAINT "stored_files_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "authorised_stations" ADD CONSTRAINT "authorised_stations_register_version_station_register_versions_version_fk" FOREIGN KEY ("register_version") REFERENCES "public"."station_register_versions"("version") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "station_register_versions" ADD CONSTRAINT "station_register_versions_imported_by_users_id_fk" FOREIGN KEY ("imported_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "station_register_versions" ADD CONSTRAINT "station_register_versions_stored_file_id_stored_files_id_fk" FOREIGN KEY ("stored_file_id") REFERENCES "public"."stored_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "stored_files_purpose_idx" ON "stored_files" USING btree ("purpose","uploaded_at");--> statement-breakpoint
CREATE INDEX "authorised_stations_version_freq_idx" ON "authorised_stations" USING btree ("register_version","high_freq_hz","low_freq_hz");--> statement-breakpoint
CREATE INDEX "authorised_stations_version_licensee_idx" ON "authorised_stations" USING btree ("register_version","licensee");--> statement-breakpoint
-- stored files, register versions and the stations of each version are records: no UPDATE, DELETE or TRUNCATE, time from the database
SELECT make_append_only('stored_files', 'uploaded_at');--> statement-breakpoint
SELECT make_append_only('station_register_versions', 'imported_at');--> statement-breakpoint
SELECT make_append_only('authorised_stations', 'created_at');

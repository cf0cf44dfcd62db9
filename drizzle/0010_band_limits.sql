CREATE TABLE "band_limit_changes" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"band_limit_id" uuid NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"changed_by" uuid NOT NULL,
	"reason" text NOT NULL,
	"version" integer NOT NULL,
	"before" jsonb NOT NULL,
	"after" jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "band_limits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"key" text NOT NULL,
	"title" text NOT NULL,
	"bands_hz" jsonb NOT NULL,
	"spec" jsonb NOT NULL,
	"citation" text NOT NULL,
	"verified" boolean NOT NULL,
	"status_note" text NOT NULL,
	"conditions" text,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	CONSTRAINT "band_limits_key_unique" UNIQUE("key"),
	CONSTRAINT "band_limits_bands_listed" CHECK (jsonb_typeof("band_limits"."bands_hz") = 'array' and jsonb_array_length("band_limits"."bands_hz") > 0),
	CONSTRAINT "band_limits_spec_kind" CHECK (jsonb_typeof("band_limits"."spec") = 'object' and "band_limits"."spec" ? 'kind'),
	CONSTRAINT "band_limits_version_positive" CHECK ("band_limits"."version" >= 1)
);
--> statement-breakpoint
ALTER TABLE "band_limit_changes" ADD CONSTRAINT "band_limit_changes_band_limit_id_band_limits_id_fk" FOREIGN KEY ("band_limit_id") REFERENCES "public"."band_limits"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "band_limit_changes" ADD CONSTRAINT "band_limit_changes_changed_by_users_id_fk" FOREIGN KEY ("changed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "band_limits" ADD CONSTRAINT "band_limits_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "band_limit_changes_limit_idx" ON "band_limit_changes" USING btree ("band_limit_id","changed_at");--> statement-breakpoint
-- the history of band-limit edits is a record: no UPDATE, DELETE or TRUNCATE, time from the database
SELECT make_append_only('band_limit_changes', 'changed_at');

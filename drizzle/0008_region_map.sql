CREATE TABLE "region" (
	"id" smallint PRIMARY KEY DEFAULT 1 NOT NULL,
	"name" text NOT NULL,
	"outline" jsonb NOT NULL,
	"coast" jsonb NOT NULL,
	"places" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "region_single_row" CHECK ("region"."id" = 1),
	CONSTRAINT "region_outline_area" CHECK ("region"."outline"->>'type' in ('Polygon', 'MultiPolygon')),
	CONSTRAINT "region_coast_area" CHECK ("region"."coast"->>'type' in ('Polygon', 'MultiPolygon')),
	CONSTRAINT "region_places_array" CHECK (jsonb_typeof("region"."places") = 'array')
);
--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "area" jsonb;--> statement-breakpoint
ALTER TABLE "offices" ADD CONSTRAINT "offices_area_polygon" CHECK ("offices"."area" is null or "offices"."area"->>'type' in ('Polygon', 'MultiPolygon'));
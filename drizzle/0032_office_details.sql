ALTER TABLE "offices" ADD COLUMN "address" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "version" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "updated_at" timestamp with time zone DEFAULT now() NOT NULL;
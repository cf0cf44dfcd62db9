CREATE TABLE "offices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"region_name" text NOT NULL,
	"centre_lat_deg" double precision NOT NULL,
	"centre_lon_deg" double precision NOT NULL,
	"target_p1_hours" integer DEFAULT 4 NOT NULL,
	"target_p2_hours" integer DEFAULT 24 NOT NULL,
	"target_p3_hours" integer DEFAULT 72 NOT NULL,
	"target_p4_hours" integer DEFAULT 240 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "offices_name_unique" UNIQUE("name"),
	CONSTRAINT "offices_lat_range" CHECK ("offices"."centre_lat_deg" between -90 and 90),
	CONSTRAINT "offices_lon_range" CHECK ("offices"."centre_lon_deg" between -180 and 180),
	CONSTRAINT "offices_targets_positive" CHECK (least("offices"."target_p1_hours", "offices"."target_p2_hours", "offices"."target_p3_hours", "offices"."target_p4_hours") > 0)
);
--> statement-breakpoint
CREATE TABLE "password_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"purpose" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "password_tokens_token_hash_unique" UNIQUE("token_hash"),
	CONSTRAINT "password_tokens_purpose_valid" CHECK ("password_tokens"."purpose" in ('reset', 'invite'))
);
--> statement-breakpoint
CREATE TABLE "sign_in_attempts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"ip" text NOT NULL,
	"succeeded" boolean NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" text NOT NULL,
	"office_id" uuid,
	"password_hash" text,
	"active" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_unique" UNIQUE("email"),
	CONSTRAINT "users_role_valid" CHECK ("users"."role" in ('complainant', 'investigator', 'supervisor', 'admin')),
	CONSTRAINT "users_staff_have_office" CHECK ("users"."role" not in ('investigator', 'supervisor') or "users"."office_id" is not null),
	CONSTRAINT "users_email_lowercase" CHECK ("users"."email" = lower("users"."email"))
);
--> statement-breakpoint
CREATE TABLE "session" (
	"sid" varchar PRIMARY KEY NOT NULL,
	"sess" json NOT NULL,
	"expire" timestamp (6) NOT NULL
);
--> statement-breakpoint
ALTER TABLE "password_tokens" ADD CONSTRAINT "password_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sign_in_attempts_email_at_idx" ON "sign_in_attempts" USING btree ("email","at");--> statement-breakpoint
CREATE INDEX "sign_in_attempts_ip_at_idx" ON "sign_in_attempts" USING btree ("ip","at");--> statement-breakpoint
CREATE INDEX "users_office_idx" ON "users" USING btree ("office_id");--> statement-breakpoint
CREATE INDEX "IDX_session_expire" ON "session" USING btree ("expire");
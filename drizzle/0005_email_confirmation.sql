CREATE TABLE "account_mails" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"kind" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "account_mails_kind_valid" CHECK ("account_mails"."kind" in ('register', 'reset'))
);
--> statement-breakpoint
ALTER TABLE "password_tokens" DROP CONSTRAINT "password_tokens_purpose_valid";--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "email_confirmed_at" timestamp with time zone DEFAULT now();--> statement-breakpoint
CREATE INDEX "account_mails_email_at_idx" ON "account_mails" USING btree ("email","at");--> statement-breakpoint
ALTER TABLE "password_tokens" ADD CONSTRAINT "password_tokens_purpose_valid" CHECK ("password_tokens"."purpose" in ('reset', 'invite', 'confirm'));
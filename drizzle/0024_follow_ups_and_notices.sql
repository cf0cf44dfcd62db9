CREATE TABLE "digest_sends" (
	"office_id" uuid NOT NULL,
	"local_day" date NOT NULL,
	"recipients" integer NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "digest_sends_office_id_local_day_pk" PRIMARY KEY("office_id","local_day")
);
--> statement-breakpoint
CREATE TABLE "follow_ups" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"due_on" date NOT NULL,
	"expected" text NOT NULL,
	"source" text NOT NULL,
	"finding_id" uuid,
	"state" text DEFAULT 'open' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" uuid,
	"last_note" text,
	"changed_at" timestamp with time zone,
	CONSTRAINT "follow_ups_finding_once" UNIQUE("finding_id"),
	CONSTRAINT "follow_ups_state_valid" CHECK ("follow_ups"."state" in ('open', 'complied', 'escalated')),
	CONSTRAINT "follow_ups_source_valid" CHECK ("follow_ups"."source" in ('finding', 'staff')),
	CONSTRAINT "follow_ups_finding_source" CHECK (("follow_ups"."source" = 'finding') = ("follow_ups"."finding_id" is not null))
);
--> statement-breakpoint
CREATE TABLE "party_notices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"served_on" date NOT NULL,
	"method" text NOT NULL,
	"method_other" text,
	"served_by" text NOT NULL,
	"reference" text,
	"summary" text NOT NULL,
	"evidence_id" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"recorded_by" uuid NOT NULL,
	CONSTRAINT "party_notices_method_valid" CHECK ("party_notices"."method" in ('in_person', 'registered_post', 'email', 'other')),
	CONSTRAINT "party_notices_other_described" CHECK (("party_notices"."method" = 'other') = ("party_notices"."method_other" is not null))
);
--> statement-breakpoint
CREATE TABLE "party_replies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"notice_id" uuid,
	"received_on" date NOT NULL,
	"summary" text NOT NULL,
	"evidence_id" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"recorded_by" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "responsible_parties" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"name" text NOT NULL,
	"address" text,
	"email" text,
	"phone" text,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"recorded_by" uuid NOT NULL,
	CONSTRAINT "responsible_parties_case_version" UNIQUE("case_id","version"),
	CONSTRAINT "responsible_parties_version_positive" CHECK ("responsible_parties"."version" > 0)
);
--> statement-breakpoint
ALTER TABLE "digest_sends" ADD CONSTRAINT "digest_sends_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "follow_ups" ADD CONSTRAINT "follow_ups_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "follow_ups" ADD CONSTRAINT "follow_ups_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "follow_ups" ADD CONSTRAINT "follow_ups_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_notices" ADD CONSTRAINT "party_notices_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_notices" ADD CONSTRAINT "party_notices_evidence_id_evidence_files_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_notices" ADD CONSTRAINT "party_notices_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_replies" ADD CONSTRAINT "party_replies_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_replies" ADD CONSTRAINT "party_replies_notice_id_party_notices_id_fk" FOREIGN KEY ("notice_id") REFERENCES "public"."party_notices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_replies" ADD CONSTRAINT "party_replies_evidence_id_evidence_files_id_fk" FOREIGN KEY ("evidence_id") REFERENCES "public"."evidence_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "party_replies" ADD CONSTRAINT "party_replies_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "responsible_parties" ADD CONSTRAINT "responsible_parties_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "responsible_parties" ADD CONSTRAINT "responsible_parties_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "follow_ups_open_due_idx" ON "follow_ups" USING btree ("due_on") WHERE "follow_ups"."state" = 'open';--> statement-breakpoint
CREATE INDEX "follow_ups_case_idx" ON "follow_ups" USING btree ("case_id");--> statement-breakpoint
CREATE INDEX "party_notices_case_idx" ON "party_notices" USING btree ("case_id","recorded_at");--> statement-breakpoint
CREATE INDEX "party_replies_case_idx" ON "party_replies" USING btree ("case_id","recorded_at");--> statement-breakpoint
SELECT make_append_only('responsible_parties', 'recorded_at');--> statement-breakpoint
SELECT make_append_only('party_notices', 'recorded_at');--> statement-breakpoint
SELECT make_append_only('party_replies', 'recorded_at');--> statement-breakpoint
SELECT make_append_only('digest_sends', 'sent_at');--> statement-breakpoint
-- a follow-up changes state through its moves; the application never deletes one
REVOKE DELETE, TRUNCATE ON "follow_ups" FROM quietband_app;

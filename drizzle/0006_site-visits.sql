CREATE TYPE "public"."finding_severity" AS ENUM('minor', 'major', 'critical');--> statement-breakpoint
CREATE TYPE "public"."finding_state" AS ENUM('open', 'answered', 'closed');--> statement-breakpoint
CREATE TYPE "public"."site_visit_state" AS ENUM('draft', 'submitted', 'signed');--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"site_visit_id" uuid NOT NULL,
	"placement_id" uuid,
	"description" text NOT NULL,
	"location" varchar(200) DEFAULT '' NOT NULL,
	"severity" "finding_severity" NOT NULL,
	"requirement" varchar(300) DEFAULT '' NOT NULL,
	"action_required" text DEFAULT '' NOT NULL,
	"due_date" date,
	"state" "finding_state" DEFAULT 'open' NOT NULL,
	"response" text,
	"answered_at" timestamp with time zone,
	"answered_by" uuid,
	"closed_at" timestamp with time zone,
	"closed_by" uuid,
	"close_note" text,
	"reopened_at" timestamp with time zone,
	"reopened_by" uuid,
	"reopen_reason" text
);
--> statement-breakpoint
CREATE TABLE "site_visits" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"visit_date" date NOT NULL,
	"arrived_at" timestamp with time zone,
	"left_at" timestamp with time zone,
	"areas_inspected" text DEFAULT '' NOT NULL,
	"elements_inspected" text DEFAULT '' NOT NULL,
	"tests_witnessed" text DEFAULT '' NOT NULL,
	"weather" varchar(300) DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"placement_ids" uuid[] DEFAULT '{}' NOT NULL,
	"state" "site_visit_state" DEFAULT 'draft' NOT NULL,
	"submitted_at" timestamp with time zone,
	"signed_at" timestamp with time zone,
	"signed_by" uuid
);
--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_site_visit_id_site_visits_id_fk" FOREIGN KEY ("site_visit_id") REFERENCES "public"."site_visits"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_answered_by_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_closed_by_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_reopened_by_fk" FOREIGN KEY ("reopened_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_visits" ADD CONSTRAINT "site_visits_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_visits" ADD CONSTRAINT "site_visits_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "site_visits" ADD CONSTRAINT "site_visits_signed_by_fk" FOREIGN KEY ("signed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "findings_project_seq_idx" ON "findings" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "findings_visit_idx" ON "findings" USING btree ("site_visit_id");--> statement-breakpoint
CREATE INDEX "findings_placement_idx" ON "findings" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "site_visits_project_seq_idx" ON "site_visits" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "site_visits_project_date_idx" ON "site_visits" USING btree ("project_id","visit_date");
CREATE TYPE "public"."digest_recipient_source" AS ENUM('member', 'added');--> statement-breakpoint
CREATE TYPE "public"."sent_digest_status" AS ENUM('sending', 'sent');--> statement-breakpoint
CREATE TABLE "digest_recipients" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"email" varchar(320) NOT NULL,
	"user_id" uuid,
	"source" "digest_recipient_source" NOT NULL,
	"hour_override" integer,
	"send_empty_days" boolean DEFAULT true NOT NULL,
	"unsubscribed_at" timestamp with time zone,
	"added_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "digest_recipients_email_lower" CHECK ("digest_recipients"."email" = lower("digest_recipients"."email")),
	CONSTRAINT "digest_recipients_hour_range" CHECK ("digest_recipients"."hour_override" between 0 and 23)
);
--> statement-breakpoint
CREATE TABLE "sent_digests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"date" date NOT NULL,
	"recipient_email" varchar(320) NOT NULL,
	"status" "sent_digest_status" DEFAULT 'sending' NOT NULL,
	"claimed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	"message_id" text,
	"sent_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "digest_recipients" ADD CONSTRAINT "digest_recipients_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "digest_recipients" ADD CONSTRAINT "digest_recipients_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "digest_recipients" ADD CONSTRAINT "digest_recipients_added_by_users_id_fk" FOREIGN KEY ("added_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sent_digests" ADD CONSTRAINT "sent_digests_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sent_digests" ADD CONSTRAINT "sent_digests_sent_by_users_id_fk" FOREIGN KEY ("sent_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "digest_recipients_project_email_idx" ON "digest_recipients" USING btree ("project_id","email");--> statement-breakpoint
CREATE UNIQUE INDEX "sent_digests_project_date_recipient_idx" ON "sent_digests" USING btree ("project_id","date","recipient_email");
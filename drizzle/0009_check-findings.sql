CREATE TABLE "check_findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"placement_id" uuid,
	"local_date" date NOT NULL,
	"rule" varchar(40) NOT NULL,
	"severity" varchar(16) NOT NULL,
	"subject_type" varchar(20) NOT NULL,
	"subject_id" varchar(80) NOT NULL,
	"title" text NOT NULL,
	"message" text NOT NULL,
	"applied_value" double precision,
	"applied_limit" double precision,
	"applied_unit" varchar(20) NOT NULL,
	"source" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "check_findings" ADD CONSTRAINT "check_findings_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "check_findings" ADD CONSTRAINT "check_findings_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "check_findings_project_date_idx" ON "check_findings" USING btree ("project_id","local_date");--> statement-breakpoint
CREATE INDEX "check_findings_placement_idx" ON "check_findings" USING btree ("placement_id");
CREATE TYPE "public"."slump_type" AS ENUM('target', 'maximum');--> statement-breakpoint
CREATE TYPE "public"."element_type" AS ENUM('footing', 'wall', 'column', 'beam', 'slab-on-ground', 'elevated-slab', 'other');--> statement-breakpoint
CREATE TYPE "public"."placement_state" AS ENUM('planned', 'ready', 'cleared', 'placing', 'placed', 'signed', 'held');--> statement-breakpoint
CREATE TYPE "public"."delivery_status" AS ENUM('accepted', 'rejected');--> statement-breakpoint
CREATE TYPE "public"."sun_exposure" AS ENUM('sun', 'shade', 'overcast');--> statement-breakpoint
CREATE TYPE "public"."checklist_answer" AS ENUM('yes', 'no', 'na');--> statement-breakpoint
CREATE TYPE "public"."checklist_kind" AS ENUM('readiness', 'hot-weather', 'cold-weather');--> statement-breakpoint
CREATE TABLE "mix_designs" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"code" varchar(32) NOT NULL,
	"supplier" varchar(120) DEFAULT '' NOT NULL,
	"fc_mpa" double precision NOT NULL,
	"fc_age_days" integer DEFAULT 28 NOT NULL,
	"max_wcm" double precision,
	"slump_target_mm" double precision,
	"slump_type" "slump_type" DEFAULT 'target' NOT NULL,
	"slump_tolerance_mm" double precision,
	"air_target_pct" double precision,
	"air_tolerance_pct" double precision,
	"max_concrete_temp_c" double precision,
	"cement_type" varchar(60) DEFAULT '' NOT NULL,
	"scms" text DEFAULT '' NOT NULL,
	"site_water_allowed_l_per_m3" double precision DEFAULT 0 NOT NULL,
	"low_bleed" boolean DEFAULT false NOT NULL
);
--> statement-breakpoint
CREATE TABLE "placements" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"element" varchar(120) NOT NULL,
	"level" varchar(60) DEFAULT '' NOT NULL,
	"grid" varchar(60) DEFAULT '' NOT NULL,
	"element_type" "element_type" NOT NULL,
	"least_dimension_mm" double precision,
	"planned_volume_m3" double precision,
	"mix_id" uuid,
	"planned_start" timestamp with time zone NOT NULL,
	"state" "placement_state" DEFAULT 'planned' NOT NULL,
	"hold_reason" text,
	"signed_at" timestamp with time zone,
	"signed_by" uuid
);
--> statement-breakpoint
CREATE TABLE "deliveries" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid NOT NULL,
	"ticket_number" varchar(40) NOT NULL,
	"truck" varchar(40) DEFAULT '' NOT NULL,
	"volume_m3" double precision NOT NULL,
	"batched_at" timestamp with time zone NOT NULL,
	"arrived_at" timestamp with time zone NOT NULL,
	"discharge_started_at" timestamp with time zone,
	"discharge_finished_at" timestamp with time zone,
	"revolutions" integer,
	"water_added_l" double precision,
	"water_first_at" timestamp with time zone,
	"water_last_at" timestamp with time zone,
	"water_added_by" varchar(120),
	"water_authorised_by" varchar(120),
	"admixture_note" text,
	"status" "delivery_status" DEFAULT 'accepted' NOT NULL,
	"reject_reason" text
);
--> statement-breakpoint
CREATE TABLE "field_tests" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid NOT NULL,
	"delivery_id" uuid,
	"sampled_at" timestamp with time zone NOT NULL,
	"slump_mm" double precision,
	"slump_flow_mm" double precision,
	"air_pct" double precision,
	"concrete_temp_c" double precision,
	"air_temp_c" double precision,
	"density_kg_m3" double precision,
	"notes" text
);
--> statement-breakpoint
CREATE TABLE "breaks" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"specimen_set_id" uuid NOT NULL,
	"tested_at" timestamp with time zone NOT NULL,
	"age_days" integer NOT NULL,
	"load_kn" double precision NOT NULL,
	"diameter_mm" double precision NOT NULL,
	"length_mm" double precision,
	"fracture_type" integer,
	"strength_mpa" double precision NOT NULL
);
--> statement-breakpoint
CREATE TABLE "specimen_sets" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid NOT NULL,
	"delivery_id" uuid,
	"set_code" varchar(40) NOT NULL,
	"cylinder_diameter_mm" integer NOT NULL,
	"cylinder_length_mm" double precision NOT NULL,
	"count" integer NOT NULL,
	"cast_at" timestamp with time zone NOT NULL,
	"initial_curing_min_c" double precision,
	"initial_curing_max_c" double precision,
	"test_ages_days" integer[] NOT NULL
);
--> statement-breakpoint
CREATE TABLE "weather_observations" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid,
	"observed_at" timestamp with time zone NOT NULL,
	"air_temp_c" double precision NOT NULL,
	"relative_humidity_pct" double precision NOT NULL,
	"wind_kmh" double precision NOT NULL,
	"concrete_temp_c" double precision,
	"sun" "sun_exposure",
	"evaporation_kg_m2_h" double precision
);
--> statement-breakpoint
CREATE TABLE "checklist_items" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"checklist_id" uuid NOT NULL,
	"item_key" varchar(60) NOT NULL,
	"label" varchar(200) NOT NULL,
	"answer" "checklist_answer",
	"note" text
);
--> statement-breakpoint
CREATE TABLE "checklists" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid NOT NULL,
	"kind" "checklist_kind" NOT NULL
);
--> statement-breakpoint
CREATE TABLE "curing_readings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid NOT NULL,
	"method" varchar(80) NOT NULL,
	"read_at" timestamp with time zone NOT NULL,
	"temp_c" double precision NOT NULL,
	"location" varchar(120) DEFAULT '' NOT NULL,
	"note" text
);
--> statement-breakpoint
CREATE TABLE "diary_crew" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"diary_entry_id" uuid NOT NULL,
	"trade" varchar(80) NOT NULL,
	"count" integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE "diary_delays" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"diary_entry_id" uuid NOT NULL,
	"cause" varchar(80) NOT NULL,
	"minutes" integer NOT NULL,
	"description" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "diary_entries" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"date" date NOT NULL,
	"weather_summary" text DEFAULT '' NOT NULL,
	"work_done" text DEFAULT '' NOT NULL,
	"safety_notes" text DEFAULT '' NOT NULL,
	"submitted_at" timestamp with time zone,
	"submitted_by" uuid
);
--> statement-breakpoint
CREATE TABLE "diary_equipment" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"diary_entry_id" uuid NOT NULL,
	"name" varchar(80) NOT NULL,
	"count" integer,
	"hours" double precision
);
--> statement-breakpoint
CREATE TABLE "diary_visitors" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"diary_entry_id" uuid NOT NULL,
	"name" varchar(120) NOT NULL,
	"company" varchar(120) DEFAULT '' NOT NULL,
	"purpose" varchar(300) DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"record_type" varchar(48) NOT NULL,
	"record_id" uuid NOT NULL,
	"caption" text DEFAULT '' NOT NULL,
	"taken_at" timestamp with time zone,
	"sha256" varchar(64) NOT NULL,
	"size_bytes" bigint NOT NULL,
	"content_type" varchar(100) NOT NULL,
	"storage_key" text,
	"stored_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "amendments" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"record_type" varchar(48) NOT NULL,
	"record_id" uuid NOT NULL,
	"what" text NOT NULL,
	"why" text NOT NULL,
	"author_id" uuid NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_offs" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"record_type" varchar(48) NOT NULL,
	"record_id" uuid NOT NULL,
	"signer_id" uuid NOT NULL,
	"role" "project_role" NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	"typed_name" varchar(120) NOT NULL,
	"signature_image" text,
	"content_hash" varchar(64) NOT NULL
);
--> statement-breakpoint
CREATE TABLE "conflicts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"record_type" varchar(48) NOT NULL,
	"record_id" uuid NOT NULL,
	"base_version" integer,
	"server_version" integer,
	"client_payload" jsonb NOT NULL,
	"server_payload" jsonb,
	"reason" text NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"resolved_at" timestamp with time zone,
	"resolved_by" uuid,
	"resolution" jsonb
);
--> statement-breakpoint
CREATE TABLE "project_change_counters" (
	"project_id" uuid PRIMARY KEY NOT NULL,
	"last_seq" bigint DEFAULT 0 NOT NULL
);
--> statement-breakpoint
ALTER TABLE "mix_designs" ADD CONSTRAINT "mix_designs_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mix_designs" ADD CONSTRAINT "mix_designs_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "placements" ADD CONSTRAINT "placements_mix_id_mix_designs_id_fk" FOREIGN KEY ("mix_id") REFERENCES "public"."mix_designs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "placements" ADD CONSTRAINT "placements_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "placements" ADD CONSTRAINT "placements_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "placements" ADD CONSTRAINT "placements_signed_by_fk" FOREIGN KEY ("signed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deliveries" ADD CONSTRAINT "deliveries_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_tests" ADD CONSTRAINT "field_tests_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_tests" ADD CONSTRAINT "field_tests_delivery_id_deliveries_id_fk" FOREIGN KEY ("delivery_id") REFERENCES "public"."deliveries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_tests" ADD CONSTRAINT "field_tests_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_tests" ADD CONSTRAINT "field_tests_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "breaks" ADD CONSTRAINT "breaks_specimen_set_id_specimen_sets_id_fk" FOREIGN KEY ("specimen_set_id") REFERENCES "public"."specimen_sets"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "breaks" ADD CONSTRAINT "breaks_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "breaks" ADD CONSTRAINT "breaks_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "specimen_sets" ADD CONSTRAINT "specimen_sets_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "specimen_sets" ADD CONSTRAINT "specimen_sets_delivery_id_deliveries_id_fk" FOREIGN KEY ("delivery_id") REFERENCES "public"."deliveries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "specimen_sets" ADD CONSTRAINT "specimen_sets_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "specimen_sets" ADD CONSTRAINT "specimen_sets_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_observations" ADD CONSTRAINT "weather_observations_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_observations" ADD CONSTRAINT "weather_observations_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_observations" ADD CONSTRAINT "weather_observations_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklist_items" ADD CONSTRAINT "checklist_items_checklist_id_checklists_id_fk" FOREIGN KEY ("checklist_id") REFERENCES "public"."checklists"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklist_items" ADD CONSTRAINT "checklist_items_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklist_items" ADD CONSTRAINT "checklist_items_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklists" ADD CONSTRAINT "checklists_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklists" ADD CONSTRAINT "checklists_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "checklists" ADD CONSTRAINT "checklists_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curing_readings" ADD CONSTRAINT "curing_readings_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curing_readings" ADD CONSTRAINT "curing_readings_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "curing_readings" ADD CONSTRAINT "curing_readings_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_crew" ADD CONSTRAINT "diary_crew_diary_entry_id_diary_entries_id_fk" FOREIGN KEY ("diary_entry_id") REFERENCES "public"."diary_entries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_crew" ADD CONSTRAINT "diary_crew_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_crew" ADD CONSTRAINT "diary_crew_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_delays" ADD CONSTRAINT "diary_delays_diary_entry_id_diary_entries_id_fk" FOREIGN KEY ("diary_entry_id") REFERENCES "public"."diary_entries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_delays" ADD CONSTRAINT "diary_delays_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_delays" ADD CONSTRAINT "diary_delays_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_entries" ADD CONSTRAINT "diary_entries_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_entries" ADD CONSTRAINT "diary_entries_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_entries" ADD CONSTRAINT "diary_entries_submitted_by_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_equipment" ADD CONSTRAINT "diary_equipment_diary_entry_id_diary_entries_id_fk" FOREIGN KEY ("diary_entry_id") REFERENCES "public"."diary_entries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_equipment" ADD CONSTRAINT "diary_equipment_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_equipment" ADD CONSTRAINT "diary_equipment_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_visitors" ADD CONSTRAINT "diary_visitors_diary_entry_id_diary_entries_id_fk" FOREIGN KEY ("diary_entry_id") REFERENCES "public"."diary_entries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_visitors" ADD CONSTRAINT "diary_visitors_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "diary_visitors" ADD CONSTRAINT "diary_visitors_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "amendments" ADD CONSTRAINT "amendments_author_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sign_offs" ADD CONSTRAINT "sign_offs_signer_fk" FOREIGN KEY ("signer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "conflicts" ADD CONSTRAINT "conflicts_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "conflicts" ADD CONSTRAINT "conflicts_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "conflicts" ADD CONSTRAINT "conflicts_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_change_counters" ADD CONSTRAINT "project_change_counters_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "mix_designs_project_seq_idx" ON "mix_designs" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE UNIQUE INDEX "mix_designs_project_code_idx" ON "mix_designs" USING btree ("project_id","code") WHERE "mix_designs"."deleted_at" is null;--> statement-breakpoint
CREATE INDEX "placements_project_seq_idx" ON "placements" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "placements_project_start_idx" ON "placements" USING btree ("project_id","planned_start");--> statement-breakpoint
CREATE INDEX "deliveries_project_seq_idx" ON "deliveries" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "deliveries_placement_idx" ON "deliveries" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "field_tests_project_seq_idx" ON "field_tests" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "field_tests_placement_idx" ON "field_tests" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "breaks_project_seq_idx" ON "breaks" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "breaks_set_idx" ON "breaks" USING btree ("specimen_set_id");--> statement-breakpoint
CREATE INDEX "specimen_sets_project_seq_idx" ON "specimen_sets" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "specimen_sets_placement_idx" ON "specimen_sets" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "weather_observations_project_seq_idx" ON "weather_observations" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "weather_observations_placement_idx" ON "weather_observations" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "checklist_items_project_seq_idx" ON "checklist_items" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "checklist_items_checklist_idx" ON "checklist_items" USING btree ("checklist_id");--> statement-breakpoint
CREATE INDEX "checklists_project_seq_idx" ON "checklists" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "checklists_placement_idx" ON "checklists" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "curing_readings_project_seq_idx" ON "curing_readings" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "curing_readings_placement_idx" ON "curing_readings" USING btree ("placement_id");--> statement-breakpoint
CREATE INDEX "diary_crew_project_seq_idx" ON "diary_crew" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "diary_crew_entry_idx" ON "diary_crew" USING btree ("diary_entry_id");--> statement-breakpoint
CREATE INDEX "diary_delays_project_seq_idx" ON "diary_delays" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "diary_delays_entry_idx" ON "diary_delays" USING btree ("diary_entry_id");--> statement-breakpoint
CREATE INDEX "diary_entries_project_seq_idx" ON "diary_entries" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE UNIQUE INDEX "diary_entries_project_date_idx" ON "diary_entries" USING btree ("project_id","date") WHERE "diary_entries"."deleted_at" is null;--> statement-breakpoint
CREATE INDEX "diary_equipment_project_seq_idx" ON "diary_equipment" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "diary_equipment_entry_idx" ON "diary_equipment" USING btree ("diary_entry_id");--> statement-breakpoint
CREATE INDEX "diary_visitors_project_seq_idx" ON "diary_visitors" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "diary_visitors_entry_idx" ON "diary_visitors" USING btree ("diary_entry_id");--> statement-breakpoint
CREATE INDEX "photos_project_seq_idx" ON "photos" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "photos_record_idx" ON "photos" USING btree ("record_type","record_id");--> statement-breakpoint
CREATE INDEX "amendments_project_seq_idx" ON "amendments" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "amendments_record_idx" ON "amendments" USING btree ("record_type","record_id");--> statement-breakpoint
CREATE INDEX "sign_offs_project_seq_idx" ON "sign_offs" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "sign_offs_record_idx" ON "sign_offs" USING btree ("record_type","record_id");--> statement-breakpoint
CREATE INDEX "conflicts_project_open_idx" ON "conflicts" USING btree ("project_id","resolved_at");--> statement-breakpoint
CREATE INDEX "conflicts_record_idx" ON "conflicts" USING btree ("record_type","record_id");
CREATE TYPE "public"."maturity_method" AS ENUM('nurse-saul', 'equivalent-age');--> statement-breakpoint
CREATE TYPE "public"."reading_source" AS ENUM('manual', 'import');--> statement-breakpoint
CREATE TABLE "sensor_readings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"sensor_id" uuid NOT NULL,
	"source" "reading_source" NOT NULL,
	"readings" jsonb NOT NULL,
	"first_at" timestamp with time zone NOT NULL,
	"last_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "temperature_sensors" (
	"id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"change_seq" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone,
	"placement_id" uuid NOT NULL,
	"name" varchar(80) NOT NULL,
	"location" varchar(160) DEFAULT '' NOT NULL,
	"logging_interval_minutes" integer,
	"ended_at" timestamp with time zone,
	"note" text
);
--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "maturity_method" "maturity_method" DEFAULT 'nurse-saul' NOT NULL;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "maturity_datum_c" double precision DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "maturity_activation_energy_j_per_mol" double precision DEFAULT 41570 NOT NULL;--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "maturity_target_mpa" double precision;--> statement-breakpoint
ALTER TABLE "sensor_readings" ADD CONSTRAINT "sensor_readings_sensor_id_temperature_sensors_id_fk" FOREIGN KEY ("sensor_id") REFERENCES "public"."temperature_sensors"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sensor_readings" ADD CONSTRAINT "sensor_readings_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sensor_readings" ADD CONSTRAINT "sensor_readings_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "temperature_sensors" ADD CONSTRAINT "temperature_sensors_placement_id_placements_id_fk" FOREIGN KEY ("placement_id") REFERENCES "public"."placements"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "temperature_sensors" ADD CONSTRAINT "temperature_sensors_project_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "temperature_sensors" ADD CONSTRAINT "temperature_sensors_updated_by_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sensor_readings_project_seq_idx" ON "sensor_readings" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "sensor_readings_sensor_idx" ON "sensor_readings" USING btree ("sensor_id");--> statement-breakpoint
CREATE INDEX "temperature_sensors_project_seq_idx" ON "temperature_sensors" USING btree ("project_id","change_seq");--> statement-breakpoint
CREATE INDEX "temperature_sensors_placement_idx" ON "temperature_sensors" USING btree ("placement_id");
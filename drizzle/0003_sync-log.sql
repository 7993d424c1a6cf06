CREATE TABLE "sync_clients" (
	"id" uuid PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"last_mutation_id" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_seen_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sync_mutations" (
	"client_id" uuid NOT NULL,
	"mutation_id" integer NOT NULL,
	"name" varchar(24) NOT NULL,
	"record_type" varchar(48) NOT NULL,
	"project_id" uuid NOT NULL,
	"record_id" uuid NOT NULL,
	"args" jsonb NOT NULL,
	"base_version" integer,
	"result" varchar(16) NOT NULL,
	"reason" varchar(48),
	"message" text,
	"version" integer,
	"conflict_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sync_mutations_client_id_mutation_id_pk" PRIMARY KEY("client_id","mutation_id")
);
--> statement-breakpoint
ALTER TABLE "sync_clients" ADD CONSTRAINT "sync_clients_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sync_mutations" ADD CONSTRAINT "sync_mutations_client_id_sync_clients_id_fk" FOREIGN KEY ("client_id") REFERENCES "public"."sync_clients"("id") ON DELETE cascade ON UPDATE no action;
CREATE TYPE "public"."review_list" AS ENUM('placements', 'diaries');--> statement-breakpoint
CREATE TABLE "review_views" (
	"user_id" uuid NOT NULL,
	"list" "review_list" NOT NULL,
	"settings" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "review_views_user_id_list_pk" PRIMARY KEY("user_id","list")
);
--> statement-breakpoint
ALTER TABLE "review_views" ADD CONSTRAINT "review_views_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;
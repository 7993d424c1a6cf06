ALTER TABLE "deliveries" ADD COLUMN "mix_code" varchar(40);--> statement-breakpoint
ALTER TABLE "deliveries" ADD COLUMN "not_cleared_reason" text;--> statement-breakpoint
ALTER TABLE "field_tests" ADD COLUMN "tested_by" varchar(120);
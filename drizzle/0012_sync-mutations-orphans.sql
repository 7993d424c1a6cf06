-- Before sync_mutations.project_id gets its foreign key: a change that named a project that does
-- not exist was refused and kept only its answer; drop its project so the key can be added.
ALTER TABLE "sync_mutations" ALTER COLUMN "project_id" DROP NOT NULL;--> statement-breakpoint
UPDATE "sync_mutations" SET "project_id" = NULL, "args" = '{}'::jsonb
WHERE "project_id" IS NOT NULL AND NOT EXISTS (SELECT 1 FROM "projects" p WHERE p."id" = "sync_mutations"."project_id");

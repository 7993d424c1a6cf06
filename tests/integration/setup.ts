// Integration tests run against the real PostgreSQL of the test command (DATABASE_URL).
import { afterAll } from "vitest";
import { closeDb } from "@/db";

process.env.NEXTAUTH_SECRET ??= "test-secret-not-for-production-0123456789";
process.env.NEXTAUTH_URL ??= "http://localhost:3100";

afterAll(async () => {
  await closeDb();
});

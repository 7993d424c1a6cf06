import { randomUUID } from "node:crypto";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { sql } from "drizzle-orm";
import { Client } from "pg";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { DEMO_USERS, seedDemo } from "@/db/seed";

async function tableCounts(): Promise<Record<string, number>> {
  const tables = await db.execute(sql`select tablename from pg_tables where schemaname = 'public' order by tablename`);
  const counts: Record<string, number> = {};
  for (const { tablename } of tables.rows as { tablename: string }[]) {
    if (tablename === "rate_limits") continue; // written by sign-in attempts, not by the seed
    const r = await db.execute(sql.raw(`select count(*)::int as n from "${tablename}"`));
    counts[tablename] = (r.rows[0] as { n: number }).n;
  }
  return counts;
}

describe("migrations and demo seed", () => {
  it("the committed migrations apply to an empty database", async () => {
    const url = new URL(process.env.DATABASE_URL!);
    const name = `pw_migrate_${randomUUID().slice(0, 8)}`;
    const admin = new Client({ connectionString: url.toString() });
    await admin.connect();
    await admin.query(`create database ${name}`);
    try {
      url.pathname = `/${name}`;
      const client = new Client({ connectionString: url.toString() });
      await client.connect();
      try {
        await migrate(drizzle(client), { migrationsFolder: "drizzle" });
        const { rows } = await client.query("select tablename from pg_tables where schemaname = 'public'");
        const tables = rows.map((r) => r.tablename);
        for (const t of ["users", "projects", "memberships", "invitations", "sign_in_tokens", "audit_entries", "rate_limits"]) {
          expect(tables).toContain(t);
        }
      } finally {
        await client.end();
      }
    } finally {
      await admin.query(`drop database ${name} with (force)`);
      await admin.end();
    }
  });

  it("seeding twice leaves the same rows", async () => {
    await seedDemo(db);
    const first = await tableCounts();
    await seedDemo(db);
    const second = await tableCounts();
    expect(second).toEqual(first);
    const emails = await db.execute(sql`select email from users where email like '%@example.test' and email not like 'user-%'`);
    for (const u of DEMO_USERS) expect((emails.rows as { email: string }[]).map((r) => r.email)).toContain(u.email);
  });
});

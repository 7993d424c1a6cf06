import { randomUUID } from "node:crypto";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { sql } from "drizzle-orm";
import { Client } from "pg";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { DEMO_USERS } from "@/scripts/seed/ids";
import { seedDemo } from "@/scripts/seed/demo";

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

describe("demo records", () => {
  it("hold the scenario: every placement state, a late truck with water at the chute, the hot afternoon, the cold night, a low 28-day test", async () => {
    await seedDemo(db);
    const larkspur = "6f1c3e20-8d44-4b7e-b1a2-00000000000a";
    const states = await db.execute(sql`select distinct state from placements where project_id in (${larkspur}, '6f1c3e20-8d44-4b7e-b1a2-00000000000b')`);
    expect((states.rows as { state: string }[]).map((r) => r.state).sort()).toEqual(
      ["cleared", "held", "placed", "placing", "planned", "ready", "signed"],
    );
    const late = await db.execute(
      sql`select ticket_number from deliveries where project_id = ${larkspur}
          and discharge_finished_at > batched_at + interval '90 minutes' and water_added_l > 0`,
    );
    expect(late.rows).toHaveLength(1);
    const hot = await db.execute(sql`select max(evaporation_kg_m2_h) as e from weather_observations where project_id = ${larkspur}`);
    expect(Number((hot.rows[0] as { e: number }).e)).toBeGreaterThan(1.0); // above the ACI 305R threshold
    const cold = await db.execute(sql`select min(air_temp_c) as t from weather_observations`);
    expect(Number((cold.rows[0] as { t: number }).t)).toBeLessThanOrEqual(-6);
    const low = await db.execute(
      sql`select avg(b.strength_mpa) as avg, max(m.fc_mpa) as fc from breaks b
          join specimen_sets s on s.id = b.specimen_set_id join placements p on p.id = s.placement_id
          join mix_designs m on m.id = p.mix_id where b.age_days = 28 group by s.id`,
    );
    expect((low.rows as { avg: number; fc: number }[]).some((r) => Number(r.avg) < Number(r.fc) - 3.45)).toBe(true);
    // Change numbers are per project, unique, and the counter is at the highest one.
    const seqs = await db.execute(sql`
      select count(*)::int as n, count(distinct change_seq)::int as d, max(change_seq) as top,
             (select last_seq from project_change_counters where project_id = ${larkspur}) as last
      from (select change_seq from placements where project_id = ${larkspur} union all select change_seq from deliveries where project_id = ${larkspur}
            union all select change_seq from mix_designs where project_id = ${larkspur}) x`);
    const row = seqs.rows[0] as { n: number; d: number; top: string; last: string };
    expect(row.d).toBe(row.n);
    expect(Number(row.last)).toBeGreaterThanOrEqual(Number(row.top));
  });
});

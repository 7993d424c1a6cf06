// The office review lists (GET /api/review/placements, /api/review/diaries): server-side filters,
// sorting and pages over 5,000 placements in a constant number of SQL statements, figures that
// agree with the rulebook (lib/checks over the day's records, lib/findings), role checks, bad
// parameters, and the CSV export parsed back with papaparse.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, expect } from "vitest";
import { db } from "@/db";
import * as placementsRoute from "@/app/api/review/placements/route";
import { refreshProject } from "@/lib/findings/store";
import { addMembership, callRoute, createProject, createUser, type TestUser } from "../helpers";
import { countStatements } from "../statement-count";

export const BULK = 5000;
export let office: TestUser;
export let outsider: TestUser;
export let owner: TestUser;
export let bulkProject: { id: string; name: string };
export let otherProject: { id: string; name: string };
export const bulk: { id: string; n: number; plannedStart: string; date: string; state: string; warned: boolean; testsOut: number; lateTrucks: number }[] = [];

const STATES = ["planned", "ready", "cleared", "placing", "placed", "held"] as const;
// n → date: 2026-01-01 + (n % 365) days, 14:00 UTC (08:00 in Chicago, same calendar day).
export const dayOf = (n: number) => new Date(Date.UTC(2026, 0, 1 + (n % 365), 14)).toISOString();
export const isLate = (n: number) => n % 7 === 0;
const isOut = (n: number) => n % 11 === 0;

let seq = 1_000_000;
export const nextSeq = () => seq++;

export async function insertMix(projectId: string, values: Record<string, unknown>): Promise<string> {
  const id = randomUUID();
  const cols = { id, project_id: projectId, change_seq: nextSeq(), code: `M-${id.slice(0, 6)}`, fc_mpa: 32, ...values };
  const keys = Object.keys(cols);
  await db.execute(sql.raw(`insert into mix_designs (${keys.join(",")}) values (${keys.map((k) => literal(cols[k as keyof typeof cols])).join(",")})`));
  return id;
}

function literal(v: unknown): string {
  if (v === null || v === undefined) return "null";
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  return `'${String(v).replace(/'/g, "''")}'`;
}

export async function insertRow(table: string, values: Record<string, unknown>) {
  const keys = Object.keys(values);
  await db.execute(sql.raw(`insert into ${table} (${keys.join(",")}) values (${keys.map((k) => literal(values[k])).join(",")})`));
}

/** Counts the statements sent to PostgreSQL while `fn` runs, on every pool. */
export async function countQueries<T>(fn: () => Promise<T>): Promise<{ result: T; queries: number; texts: string[] }> {
  const { value, statements, texts } = await countStatements(fn);
  return { result: value, queries: statements, texts };
}

export const list = (user: TestUser | null, query: Record<string, string>) =>
  callRoute(placementsRoute.GET, { user, url: `/api/review/placements?${new URLSearchParams(query)}` });
/**
 * The review lists' data: three people, two projects and 5,000 placements, made before the calling
 * file's tests and removed after. Files whose tests use projects of their own skip the 5,000 rows
 * (`{ bulk: false }`): the bulk insert and the rulebook's pass over it take most of a file's time.
 */
export function setUpReviewData({ bulk: withBulk = true } = {}) {
  beforeAll(async () => {
    office = await createUser({ name: "Review office" });
    outsider = await createUser({ name: "Review outsider" });
    owner = await createUser({ name: "Review owner" });
    const a = await createProject();
    const b = await createProject();
    bulkProject = a;
    otherProject = b;
    await addMembership(office.id, a.id, "office");
    await addMembership(office.id, b.id, "office");
    await addMembership(owner.id, a.id, "owner");
    await addMembership(outsider.id, b.id, "superintendent");

    if (!withBulk) return;
    // 5,000 placements in one statement; a late truck on every 7th, a slump out of tolerance on every 11th.
    const mix = await insertMix(a.id, { slump_target_mm: 100, slump_type: "target" });
    const states = `{${STATES.join(",")}}`;
    const rows = await db.execute(sql`
      insert into placements (id, project_id, change_seq, element, element_type, planned_start, state, planned_volume_m3, mix_id)
      select gen_random_uuid(), ${a.id}::uuid, 2000000 + g, 'Bulk ' || lpad(g::text, 5, '0'), 'slab-on-ground',
        timestamptz '2026-01-01 14:00Z' + (g % 365) * interval '1 day', (${states}::placement_state[])[1 + g % 6], 10 + g % 30, ${mix}::uuid
      from generate_series(1, ${BULK}) g
      returning id, element, planned_start, state`);
    await db.execute(sql`
      insert into deliveries (id, project_id, change_seq, placement_id, ticket_number, volume_m3, batched_at, arrived_at, discharge_finished_at)
      select gen_random_uuid(), p.project_id, 3000000 + n, p.id, 'T' || n, 8, p.planned_start, p.planned_start + interval '30 min',
        p.planned_start + case when n % 7 = 0 then interval '120 min' else interval '60 min' end
      from (select *, substr(element, 6)::int as n from placements where project_id = ${a.id}::uuid) p where n % 7 = 0 or n % 5 = 0`);
    await db.execute(sql`
      insert into field_tests (id, project_id, change_seq, placement_id, sampled_at, slump_mm)
      select gen_random_uuid(), p.project_id, 4000000 + n, p.id, p.planned_start + interval '40 min', case when n % 11 = 0 then 160 else 100 end
      from (select *, substr(element, 6)::int as n from placements where project_id = ${a.id}::uuid) p where n % 11 = 0 or n % 3 = 0`);
    // Cylinders made on every placement that took concrete, so "no cylinders made" (lib/checks/sampling.ts) raises nothing here.
    await db.execute(sql`
      insert into specimen_sets (id, project_id, change_seq, placement_id, set_code, cylinder_diameter_mm, cylinder_length_mm, count, cast_at, test_ages_days)
      select gen_random_uuid(), p.project_id, 5000000 + n, p.id, 'S' || n, 150, 300, 2, p.planned_start + interval '45 min', '{28}'
      from (select *, substr(element, 6)::int as n from placements where project_id = ${a.id}::uuid) p where n % 7 = 0 or n % 5 = 0`);
    for (const r of rows.rows as { id: string; element: string; planned_start: Date | string; state: string }[]) {
      const n = Number(r.element.slice(5));
      bulk.push({
        id: r.id,
        n,
        plannedStart: new Date(r.planned_start).toISOString(),
        date: dayOf(n).slice(0, 10),
        state: r.state,
        warned: isLate(n) || isOut(n),
        testsOut: isOut(n) ? 1 : 0,
        lateTrucks: isLate(n) ? 1 : 0,
      });
    }
    expect(bulk).toHaveLength(BULK);
    expect(bulk.every((p) => p.plannedStart === dayOf(p.n))).toBe(true);
    // The rows went in below the write path: have the rulebook judge them once, as the seed does.
    await refreshProject(db, a.id);
  }, 180_000);

  afterAll(async () => {
    for (const p of [bulkProject, otherProject]) if (p) await db.execute(sql`delete from projects where id = ${p.id}::uuid`);
  });
}

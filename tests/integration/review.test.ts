// The office review lists (GET /api/review/placements, /api/review/diaries): server-side filters,
// sorting and pages over 5,000 placements in a constant number of SQL statements, figures that
// agree with the rulebook (lib/checks over the day's records, lib/findings), role checks, bad
// parameters, and the CSV export parsed back with papaparse.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, getPool } from "@/db";
import * as placementsRoute from "@/app/api/review/placements/route";
import * as diariesRoute from "@/app/api/review/diaries/route";
import * as viewsRoute from "@/app/api/review/views/route";
import { attention } from "@/lib/checks";
import { dayFindings, loadCheckDay, loadProject } from "@/lib/findings/load";
import { refreshProject } from "@/lib/findings/store";
import { PLACEMENT_COLUMNS } from "@/lib/review/columns";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { addMembership, callRoute, countRows, createProject, createUser, sessionCookie, type TestUser } from "./helpers";
import { NextRequest } from "next/server";

const BULK = 5000;
let office: TestUser;
let outsider: TestUser;
let owner: TestUser;
let bulkProject: { id: string; name: string };
let otherProject: { id: string; name: string };
const bulk: { id: string; n: number; plannedStart: string; date: string; state: string; warned: boolean; testsOut: number; lateTrucks: number }[] = [];

const STATES = ["planned", "ready", "cleared", "placing", "placed", "held"] as const;
// n → date: 2026-01-01 + (n % 365) days, 14:00 UTC (08:00 in Chicago, same calendar day).
const dayOf = (n: number) => new Date(Date.UTC(2026, 0, 1 + (n % 365), 14)).toISOString();
const isLate = (n: number) => n % 7 === 0;
const isOut = (n: number) => n % 11 === 0;

let seq = 1_000_000;
const nextSeq = () => seq++;

async function insertMix(projectId: string, values: Record<string, unknown>): Promise<string> {
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

async function insertRow(table: string, values: Record<string, unknown>) {
  const keys = Object.keys(values);
  await db.execute(sql.raw(`insert into ${table} (${keys.join(",")}) values (${keys.map((k) => literal(values[k])).join(",")})`));
}

/** Counts the statements sent through the pool while `fn` runs. */
async function countQueries<T>(fn: () => Promise<T>): Promise<{ result: T; queries: number; texts: string[] }> {
  const pool = getPool();
  const original = pool.query;
  let queries = 0;
  const texts: string[] = [];
  pool.query = function (this: unknown, ...args: unknown[]) {
    queries += 1;
    const first = args[0] as string | { text?: string };
    texts.push(typeof first === "string" ? first : (first?.text ?? ""));
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof pool.query;
  try {
    return { result: await fn(), queries, texts };
  } finally {
    pool.query = original;
  }
}

const list = (user: TestUser | null, query: Record<string, string>) =>
  callRoute(placementsRoute.GET, { user, url: `/api/review/placements?${new URLSearchParams(query)}` });

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

describe("placements list over 5,000 rows", () => {
  const filters = { projects: "", from: "2026-03-01", to: "2026-08-31", state: "placed,held", hasWarnings: "1" };
  const matching = () =>
    bulk.filter((p) => p.date >= filters.from && p.date <= filters.to && ["placed", "held"].includes(p.state) && p.warned);

  it("returns only the matching rows, in order, with the total", async () => {
    const query = { ...filters, projects: bulkProject.id, sort: "date", dir: "asc", page: "2", pageSize: "25" };
    const res = await list(office, query);
    expect(res.status).toBe(200);
    // Expected order: planned start ascending, then id (the API's documented tie-break).
    const expected = matching().sort((x, y) => (x.plannedStart < y.plannedStart ? -1 : x.plannedStart > y.plannedStart ? 1 : x.id < y.id ? -1 : 1));
    expect(expected.length).toBeGreaterThan(50);
    expect(res.json.total).toBe(expected.length);
    expect(res.json.rows.map((r: PlacementReviewRow) => r.id)).toEqual(expected.slice(25, 50).map((p) => p.id));
    for (const row of res.json.rows as PlacementReviewRow[]) {
      const p = bulk.find((b) => b.id === row.id)!;
      expect(row.hasWarnings).toBe(true);
      expect(row.lateTrucks).toBe(p.lateTrucks);
      expect(row.testsOut).toBe(p.testsOut);
      expect(["placed", "held"]).toContain(row.state);
    }
  });

  it("sorts on a computed column (late trucks, descending) and pages past the end", async () => {
    const query = { projects: bulkProject.id, sort: "lateTrucks", dir: "desc", pageSize: "200" };
    const first = await list(office, query);
    expect(first.json.total).toBe(BULK);
    const lates = bulk.filter((p) => p.lateTrucks).length;
    const rows = first.json.rows as PlacementReviewRow[];
    expect(rows.every((r) => r.lateTrucks === 1)).toBe(true);
    // Within equal keys: planned start, then id, both descending.
    const sorted = [...rows].sort((x, y) => (x.plannedStart > y.plannedStart ? -1 : x.plannedStart < y.plannedStart ? 1 : x.id > y.id ? -1 : 1));
    expect(rows.map((r) => r.id)).toEqual(sorted.map((r) => r.id));
    const boundary = await list(office, { ...query, page: String(Math.floor(lates / 200) + 1) });
    const b = boundary.json.rows as PlacementReviewRow[];
    expect(b.filter((r) => r.lateTrucks === 1)).toHaveLength(lates % 200);
    const beyond = await list(office, { ...query, page: "999" });
    expect(beyond.json).toMatchObject({ rows: [], total: BULK });
  });

  it("answers a page in a fixed number of statements, whatever the page or filter", async () => {
    const counts: number[] = [];
    let last: string[] = [];
    const queries: Record<string, string>[] = [
      { projects: bulkProject.id, pageSize: "25" },
      { ...filters, projects: bulkProject.id, page: "3", pageSize: "200", sort: "testsOut" },
      { pageSize: "200", page: "20", sort: "evaporationRisk", dir: "asc" },
      { hasWarnings: "0", pageSize: "100", sort: "project" },
    ];
    for (const query of queries) {
      const { result, queries, texts } = await countQueries(() => list(office, query));
      expect(result.status).toBe(200);
      counts.push(queries);
      last = texts;
    }
    // The session's re-read of the user row, one read of the memberships (for can()), and one
    // statement for the page and its count.
    expect(counts).toEqual([3, 3, 3, 3]);
    expect(last[0]).toMatch(/from "users"/);
    expect(last[1]).toMatch(/from "memberships"/);
    expect(last[2]).toMatch(/^\s*with f as/);
  });
});

describe("figures agree with the digest's rules", () => {
  // One placement per day, so the digest's warnings for that day are the placement's own.
  type Case = { placementId: string; date: string; projectId: string };
  const cases: Case[] = [];
  let si: { id: string };
  let ip: { id: string };

  beforeAll(async () => {
    si = await createProject({ unitSystem: "SI" });
    ip = await createProject({ unitSystem: "IP" });
    await db.execute(sql`update projects set revolution_limit = 300 where id = ${si.id}::uuid`);
    await db.execute(sql`update projects set evaporation_high_kg_m2_h = 0.8 where id = ${ip.id}::uuid`);
    await addMembership(office.id, si.id, "office");
    await addMembership(office.id, ip.id, "office");
    let rnd = 12345;
    const rand = () => ((rnd = (rnd * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const pickOne = <T,>(xs: readonly T[]) => xs[Math.floor(rand() * xs.length)];
    for (const [k, project] of [si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip, si, ip].entries()) {
      const target = pickOne([40, 50, 75, 100, 101.6, 125, 150, 200]);
      const mix = await insertMix(project.id, {
        slump_target_mm: pickOne([target, target, null]),
        slump_type: pickOne(["target", "maximum"]),
        slump_tolerance_mm: pickOne([null, null, 20]),
        air_target_pct: pickOne([null, 6, 5.5]),
        air_tolerance_pct: pickOne([null, null, 1]),
        max_concrete_temp_c: pickOne([null, 32]),
        low_bleed: rand() < 0.3,
      });
      const date = new Date(Date.UTC(2027, 2, 1 + k)).toISOString().slice(0, 10);
      const start = Date.parse(`${date}T10:00:00-06:00`);
      const at = (min: number) => new Date(start + min * 60_000).toISOString();
      const placementId = randomUUID();
      await insertRow("placements", { id: placementId, project_id: project.id, change_seq: nextSeq(), element: `Case ${k}`, element_type: "wall", planned_start: at(0), mix_id: mix, state: "placing" });
      for (let t = 0; t < 4; t++) {
        const deliveryId = randomUUID();
        const finish = pickOne([null, 60, 90, 90.5, 120, -5]);
        await insertRow("deliveries", {
          id: deliveryId, project_id: project.id, change_seq: nextSeq(), placement_id: placementId, ticket_number: `${k}-${t}`, volume_m3: 7,
          batched_at: at(t * 20), arrived_at: at(t * 20 + 25), discharge_finished_at: finish === null ? null : at(t * 20 + finish),
          revolutions: pickOne([null, 250, 300, 301]), water_added_l: pickOne([null, 0, 20, 60]), status: rand() < 0.2 ? "rejected" : "accepted",
        });
        const slumpBase = target;
        await insertRow("field_tests", {
          id: randomUUID(), project_id: project.id, change_seq: nextSeq(), placement_id: placementId, delivery_id: deliveryId, sampled_at: at(t * 20 + 30),
          slump_mm: pickOne([null, slumpBase, slumpBase + pickOne([-66, -65, -41, -40, -25.4, -25, -15.1, -15, -12.7, 12.7, 15, 15.1, 25, 25.4, 26, 38.1, 40, 41])]),
          air_pct: pickOne([null, 4, 4.5, 7.5, 7.6, 6]),
          concrete_temp_c: pickOne([null, 30, 32, 32.5, 35, 35.5]),
        });
        await insertRow("weather_observations", {
          id: randomUUID(), project_id: project.id, change_seq: nextSeq(), placement_id: placementId, observed_at: at(t * 20 + 5),
          air_temp_c: 25, relative_humidity_pct: pickOne([20, 45, 60, 75, 90]), wind_kmh: pickOne([5, 10, 20]), concrete_temp_c: pickOne([null, 22, 28]),
        });
      }
      cases.push({ placementId, date, projectId: project.id });
    }
    await refreshProject(db, si.id);
    await refreshProject(db, ip.id);
  }, 120_000);

  it("late trucks, revolutions, water, tests out of tolerance, evaporation and 'has warnings' are the rulebook's", async () => {
    const res = await list(office, { projects: `${si.id},${ip.id}`, pageSize: "200" });
    expect(res.status).toBe(200);
    const rows = new Map((res.json.rows as PlacementReviewRow[]).map((r) => [r.id, r]));
    expect(rows.size).toBe(cases.length);
    let warned = 0;
    const risks = new Set<string | null>();
    for (const c of cases) {
      const input = await loadCheckDay(db, await loadProject(db, c.projectId), c.date);
      const all = dayFindings(input, c.date);
      const w = attention(all).filter((f) => f.placementId === c.placementId || f.subject.type === "day");
      const subjects = (pick: (f: (typeof w)[number]) => boolean) => new Set(w.filter(pick).map((f) => f.subject.id)).size;
      const row = rows.get(c.placementId)!;
      const label = `${row.element} (${row.unitSystem})`;
      expect(row.lateTrucks, label).toBe(subjects((f) => f.rule === "discharge-time"));
      expect(row.revolutionsOver, label).toBe(subjects((f) => f.rule === "revolutions"));
      expect(row.waterLoads, label).toBe(subjects((f) => f.rule === "site-water"));
      expect(row.testsOut, label).toBe(subjects((f) => f.subject.type === "field-test"));
      const evaporation = all.filter((f) => f.rule === "evaporation" && f.placementId === c.placementId).map((f) => f.severity);
      const worst = evaporation.includes("warning") ? "high" : evaporation.includes("caution") ? "caution" : "low";
      expect(row.evaporationRisk, label).toBe(worst);
      risks.add(row.evaporationRisk);
      expect(row.hasWarnings, label).toBe(w.length > 0);
      if (row.hasWarnings) warned++;
      const day = { deliveries: input.deliveries.filter((d) => d.placementId === c.placementId) };
      const accepted = day.deliveries.filter((d) => d.status === "accepted");
      expect(row.placedM3).toBeCloseTo(accepted.reduce((s, d) => s + d.volumeM3, 0), 9);
      expect(row.trucks).toBe(day.deliveries.length);
    }
    // The random cases cover both outcomes and every evaporation level.
    expect(warned).toBeGreaterThan(0);
    expect([...risks].sort()).toEqual(["caution", "high", "low"]);
    const outs = [...rows.values()].map((r) => r.testsOut);
    expect(new Set(outs).size).toBeGreaterThan(1);
  });

  afterAll(async () => {
    for (const p of [si, ip]) if (p) await db.execute(sql`delete from projects where id = ${p.id}::uuid`);
  });
});

describe("who sees what", () => {
  it("a user sees only the projects they belong to", async () => {
    const res = await list(outsider, { pageSize: "200" });
    expect(res.status).toBe(200);
    expect(res.json.total).toBe(0);
    const mine = await list(owner, { pageSize: "10" });
    expect(mine.json.total).toBe(BULK);
    expect((mine.json.rows as PlacementReviewRow[]).every((r) => r.projectId === bulkProject.id)).toBe(true);
  });

  it("asking for a project the user is not a member of is refused", async () => {
    const res = await list(outsider, { projects: bulkProject.id });
    expect(res.status).toBe(403);
    expect(res.json.error.code).toBe("forbidden");
  });

  it("anonymous requests are refused", async () => {
    expect((await list(null, {})).status).toBe(401);
  });

  it("bad parameters answer 400 with a specific message and change nothing", async () => {
    const before = await countRows("placements");
    const cases: [Record<string, string>, string, RegExp][] = [
      [{ sort: "password" }, "sort", /Sort must be one of/],
      [{ pageSize: "5000" }, "pageSize", /between 1 and 200/],
      [{ page: "0" }, "page", /1 or more/],
      [{ from: "2026-13-01" }, "from", /date like 2026-11-09/],
      [{ from: "2026-05-01", to: "2026-04-01" }, "from", /must not be after/],
      [{ state: "poured" }, "state", /State must be one or more of/],
      [{ projects: "not-a-uuid" }, "projects", /project ids/],
      [{ hasWarnings: "maybe" }, "hasWarnings", /1 or 0/],
      [{ colour: "red" }, "_", /./],
    ];
    for (const [query, field, message] of cases) {
      const res = await list(office, query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(res.json.error.code).toBe("invalid_input");
      expect(res.json.error.fields[field] ?? res.json.error.message, JSON.stringify(query)).toMatch(message);
    }
    expect(await countRows("placements")).toBe(before);
  });
});

describe("diaries list", () => {
  it("has a row per work day with missing diaries, and filters by state", async () => {
    const project = await createProject();
    await addMembership(office.id, project.id, "office");
    // Monday 2026-11-16 … Sunday 2026-11-22: a diary on Tuesday (draft) and Wednesday (submitted), a Saturday placement.
    await db.execute(sql`update projects set created_at = '2026-11-01T12:00Z' where id = ${project.id}::uuid`);
    await insertRow("diary_entries", { id: randomUUID(), project_id: project.id, change_seq: nextSeq(), date: "2026-11-17" });
    await insertRow("diary_entries", { id: randomUUID(), project_id: project.id, change_seq: nextSeq(), date: "2026-11-18", submitted_at: "2026-11-18T23:00:00Z", submitted_by: office.id });
    await insertRow("placements", { id: randomUUID(), project_id: project.id, change_seq: nextSeq(), element: "Saturday slab", element_type: "slab-on-ground", planned_start: "2026-11-21T14:00:00Z" });
    const get = (query: Record<string, string>) =>
      callRoute(diariesRoute.GET, { user: office, url: `/api/review/diaries?${new URLSearchParams({ projects: project.id, from: "2026-11-16", to: "2026-11-22", ...query })}` });
    const all = await get({ sort: "date", dir: "asc" });
    expect(all.status).toBe(200);
    // Weekdays Mon–Fri plus the Saturday with a placement; Sunday is not a work day [our rule, lib/review/diaries.ts].
    expect(all.json.rows.map((r: { date: string; state: string }) => `${r.date} ${r.state}`)).toEqual([
      "2026-11-16 missing",
      "2026-11-17 draft",
      "2026-11-18 submitted",
      "2026-11-19 missing",
      "2026-11-20 missing",
      "2026-11-21 missing",
    ]);
    expect(all.json.rows[5].placements).toBe(1);
    expect(all.json.rows[2].submittedBy).toBe(office.name);
    const missing = await get({ state: "missing", pageSize: "2", page: "2", sort: "date", dir: "asc" });
    expect(missing.json.total).toBe(4);
    expect(missing.json.rows.map((r: { date: string }) => r.date)).toEqual(["2026-11-20", "2026-11-21"]);
    const { queries } = await countQueries(() => get({ pageSize: "2" }));
    expect(queries).toBe(3);
    const bad = await get({ from: "2020-01-01", to: "2026-01-01" });
    expect(bad.status).toBe(400);
    expect(bad.json.error.fields.to).toMatch(/at most 366 days/);
    await db.execute(sql`delete from projects where id = ${project.id}::uuid`);
  });
});

describe("CSV export", () => {
  it("parses back (papaparse) to the rows of the API page, with the chosen columns", async () => {
    const query = { projects: bulkProject.id, from: "2026-02-01", to: "2026-02-28", hasWarnings: "1", sort: "element", dir: "asc", pageSize: "200" };
    const page = await list(office, query);
    const req = new NextRequest(new URL(`/api/review/placements?${new URLSearchParams({ ...query, format: "csv", columns: "date,element,lateTrucks,testsOut,state" })}`, "http://localhost:3100"), {
      headers: { cookie: await sessionCookie(office) },
    });
    const res = await placementsRoute.GET(req, { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const label = (key: string) => PLACEMENT_COLUMNS.find((c) => c.key === key)!.label;
    expect(parsed.meta.fields).toEqual(["date", "element", "lateTrucks", "testsOut", "state"].map(label));
    expect(parsed.data).toEqual(
      (page.json.rows as PlacementReviewRow[]).map((r) => ({
        [label("date")]: r.date,
        [label("element")]: r.element,
        [label("lateTrucks")]: String(r.lateTrucks),
        [label("testsOut")]: String(r.testsOut),
        [label("state")]: r.state,
      })),
    );
    expect(parsed.data.length).toBe(page.json.total);
  });

  it("refuses an unknown column", async () => {
    const res = await list(office, { format: "csv", columns: "date,secret" });
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/Unknown column: secret/);
  });
});

describe("saved default view", () => {
  const view = {
    list: "placements",
    columns: ["date", "project", "element", "lateTrucks", "testsOut"],
    sort: "lateTrucks",
    dir: "desc",
    pageSize: 100,
    filters: { hasWarnings: true, state: ["placed", "held"], from: "2026-03-01" },
  };

  it("is stored per user and list, replaced on save and removed on delete", async () => {
    const empty = await callRoute(viewsRoute.GET, { user: office });
    expect(empty.json).toEqual({ placements: null, diaries: null });
    const saved = await callRoute(viewsRoute.PUT, { user: office, method: "PUT", body: view });
    expect(saved.status).toBe(200);
    expect(saved.json.placements).toEqual(view);
    const changed = { ...view, pageSize: 25, columns: ["element", "date"] };
    await callRoute(viewsRoute.PUT, { user: office, method: "PUT", body: changed });
    const diary = { list: "diaries", columns: ["date", "state"], sort: "date", dir: "asc", pageSize: 50, filters: { state: ["missing"] } };
    await callRoute(viewsRoute.PUT, { user: office, method: "PUT", body: diary });
    const read = await callRoute(viewsRoute.GET, { user: office });
    expect(read.json).toEqual({ placements: changed, diaries: diary });
    // Another user's views are their own.
    expect((await callRoute(viewsRoute.GET, { user: owner })).json).toEqual({ placements: null, diaries: null });
    const removed = await callRoute(viewsRoute.DELETE, { user: office, method: "DELETE", body: { list: "placements" } });
    expect(removed.json).toEqual({ placements: null, diaries: diary });
  });

  it("refuses a bad view with a specific message and keeps the saved one", async () => {
    await callRoute(viewsRoute.PUT, { user: owner, method: "PUT", body: view });
    const before = await countRows("review_views");
    const bad: [unknown, string, RegExp][] = [
      [{ ...view, columns: ["date", "password"] }, "columns.1", /Columns must be among/],
      [{ ...view, columns: [] }, "columns", /at least one column/],
      [{ ...view, pageSize: 33 }, "pageSize", /one of 25, 50, 100, 200/],
      [{ ...view, sort: "crew" }, "sort", /Sort must be one of/],
      [{ ...view, filters: { from: "2026-05-01", to: "2026-04-01" } }, "filters.from", /must not be after/],
      [{ ...view, list: "trucks" }, "list", /placements or diaries/],
    ];
    for (const [body, field, message] of bad) {
      const res = await callRoute(viewsRoute.PUT, { user: owner, method: "PUT", body });
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.json.error.fields[field], JSON.stringify(res.json.error)).toMatch(message);
    }
    expect(await countRows("review_views")).toBe(before);
    expect((await callRoute(viewsRoute.GET, { user: owner })).json.placements).toEqual(view);
    expect((await callRoute(viewsRoute.PUT, { user: null, method: "PUT", body: view })).status).toBe(401);
  });
});

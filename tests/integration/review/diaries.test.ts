// GET /api/review/diaries: a row per work day, missing diaries included.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import * as diariesRoute from "@/app/api/review/diaries/route";
import { addMembership, callRoute, createProject } from "../helpers";
import { office, nextSeq, insertRow, countQueries, setUpReviewData } from "./fixtures";

setUpReviewData({ bulk: false });

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

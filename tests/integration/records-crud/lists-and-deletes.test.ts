// Record lists (filters, cursor pages), deleting with tombstones, and change numbers across types.
import { and, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { DELETE } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { GET as list } from "@/app/api/projects/[projectId]/records/[type]/route";
import { db } from "@/db";
import { auditEntries } from "@/db/schema";
import { deleteRecord } from "@/lib/records/write";
import { callRoute, projectWithTeam } from "../helpers";
import { makeRecord } from "../record-fixtures";
import { auditOf, s, team, setUpProjectWithTeam } from "./helpers";

setUpProjectWithTeam();

describe("record rules", () => {
  it("filters placements by state and by date in the project's time zone, and pages with a cursor", async () => {
    const p = await projectWithTeam();
    const days = ["2026-11-09T07:00:00-06:00", "2026-11-09T23:30:00-06:00", "2026-11-10T00:30:00-06:00", "2026-11-11T09:00:00-06:00", "2026-11-12T09:00:00-06:00"];
    const made = [];
    for (const plannedStart of days) made.push(await makeRecord("placements", p.project.id, p.team, { plannedStart }));
    await db.execute(sql`update placements set state = 'held', hold_reason = 'test' where id = ${made[4].id}`);
    const params = { projectId: p.project.id, type: "placements" };
    const nov9 = await callRoute(list, { user: p.team.owner, params, url: "/x?from=2026-11-09&to=2026-11-09" });
    expect(nov9.json.items.map((r: { id: string }) => r.id)).toEqual([made[0].id, made[1].id]);
    const held = await callRoute(list, { user: p.team.owner, params, url: "/x?state=held,placed" });
    expect(held.json.items.map((r: { id: string }) => r.id)).toEqual([made[4].id]);
    const planned = await callRoute(list, { user: p.team.owner, params, url: "/x?state=planned" });
    expect(planned.json.items).toHaveLength(4);

    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const page: { json: { items: { id: string }[]; nextCursor: string | null } } = await callRoute(list, { user: p.team.owner, params, url: `/x?limit=2${cursor ? `&cursor=${cursor}` : ""}` });
      seen.push(...page.json.items.map((r) => r.id));
      cursor = page.json.nextCursor;
    } while (cursor);
    expect(seen).toEqual(made.map((m) => m.id));

    const bad = await callRoute(list, { user: p.team.owner, params, url: "/x?limit=500&state=poured" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields).sort()).toEqual(["limit", "state"]);
    const badCursor = await callRoute(list, { user: p.team.owner, params, url: "/x?cursor=bm9wZQ" });
    expect(badCursor.status).toBe(400);
  });

  it("pages records dated by their creation time without repeating or skipping any", async () => {
    const placement = await makeRecord("placements", s.project.id, team);
    const checklist = await makeRecord("checklists", s.project.id, team, { placementId: placement.id });
    const items = [];
    for (let i = 0; i < 5; i++) items.push(await makeRecord("checklist-items", s.project.id, team, { checklistId: checklist.id }));
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const page: { json: { items: { id: string }[]; nextCursor: string | null } } = await callRoute(list, {
        user: team.owner,
        params: { projectId: s.project.id, type: "checklist-items" },
        url: `/x?limit=2&checklistId=${checklist.id}${cursor ? `&cursor=${cursor}` : ""}`,
      });
      seen.push(...page.json.items.map((r) => r.id));
      cursor = page.json.nextCursor;
    } while (cursor);
    expect(seen.sort()).toEqual(items.map((i) => i.id).sort());
  });

  it("deleting a placement tombstones its records (each with a change number and an audit entry)", async () => {
    const placement = await makeRecord("placements", s.project.id, team);
    const checklist = await makeRecord("checklists", s.project.id, team, { placementId: placement.id });
    const item = await makeRecord("checklist-items", s.project.id, team, { checklistId: checklist.id });
    const truck = await makeRecord("deliveries", s.project.id, team, { placementId: placement.id });
    const deleted = await deleteRecord({ user: team.superintendent }, "placements", s.project.id, placement.id, { baseVersion: 1 });
    for (const [table, id] of [["checklists", checklist.id], ["checklist_items", item.id], ["deliveries", truck.id]] as const) {
      const [row] = (await db.execute(sql.raw(`select deleted_at, version, change_seq from ${table} where id = '${id}'`))).rows as { deleted_at: Date | null; version: number; change_seq: string }[];
      expect(row.deleted_at).not.toBeNull();
      expect(row.version).toBe(2);
      expect(Number(row.change_seq)).toBeGreaterThan(deleted.changeSeq);
      expect((await auditOf(id)).map((e) => e.action)).toEqual(["create", "delete"]);
    }
  });

  it("a placement with concrete in it cannot be deleted", async () => {
    const placement = await makeRecord("placements", s.project.id, team);
    await db.execute(sql`update placements set state = 'placing' where id = ${placement.id}`);
    const res = await callRoute(DELETE, { user: team.superintendent, method: "DELETE", params: { projectId: s.project.id, type: "placements", id: placement.id }, url: "/x?baseVersion=1" });
    expect(res.status).toBe(409);
    expect(res.json.error.message).toMatch(/cannot be deleted/);
  });

  it("change numbers grow across the project's record types", async () => {
    const a = await makeRecord("mix-designs", s.project.id, team);
    const b = await makeRecord("diary-entries", s.project.id, team);
    expect(b.changeSeq).toBeGreaterThan(a.changeSeq);
    const rows = await db.execute(sql`select last_seq from project_change_counters where project_id = ${s.project.id}`);
    expect(Number((rows.rows[0] as { last_seq: string }).last_seq)).toBe(b.changeSeq);
    const scoped = await db.select().from(auditEntries).where(and(eq(auditEntries.projectId, s.project.id), eq(auditEntries.recordId, b.id)));
    expect(scoped).toHaveLength(1);
  });
});

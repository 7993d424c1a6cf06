// Signed is signed: the write path answers 409, and the database itself refuses the change.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE, PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { db } from "@/db";
import { markPlacementSigned } from "@/lib/placements/mark-signed";
import { transitionPlacement } from "@/lib/placements/transition";
import { SIGNED_MESSAGE } from "@/lib/records/db-errors";
import type { RecordType } from "@/lib/records/registry";
import type { RecordRow } from "@/lib/records/types";
import { createRecord, updateRecord } from "@/lib/records/write";
import { callRoute, projectWithTeam } from "./helpers";
import { makeRecord, PATCHES, validBody, type Team } from "./record-fixtures";

async function pgErrorOf(statement: ReturnType<typeof sql>): Promise<{ code?: string; message?: string }> {
  try {
    await db.execute(statement);
  } catch (error) {
    const cause = (error as { cause?: { code?: string; message?: string } }).cause ?? (error as { code?: string });
    return cause;
  }
  return {};
}

describe("a signed placement and its records are frozen", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  let team: Team;
  let placement: RecordRow;
  const children: Record<string, RecordRow> = {};

  beforeAll(async () => {
    s = await projectWithTeam();
    team = s.team;
    placement = await makeRecord("placements", s.project.id, team);
    const pid = { placementId: placement.id };
    children.deliveries = await makeRecord("deliveries", s.project.id, team, pid);
    children["field-tests"] = await makeRecord("field-tests", s.project.id, team, { ...pid, deliveryId: children.deliveries.id });
    children["specimen-sets"] = await makeRecord("specimen-sets", s.project.id, team, pid);
    children["weather-observations"] = await makeRecord("weather-observations", s.project.id, team, pid);
    children.checklists = await makeRecord("checklists", s.project.id, team, pid);
    children["checklist-items"] = await makeRecord("checklist-items", s.project.id, team, { checklistId: children.checklists.id });
    children["curing-readings"] = await makeRecord("curing-readings", s.project.id, team, pid);
    children.breaks = await makeRecord("breaks", s.project.id, team, { specimenSetId: children["specimen-sets"].id });
    let version = 1;
    for (const [role, to] of [["superintendent", "ready"], ["inspector", "cleared"], ["superintendent", "placing"], ["superintendent", "placed"]] as const) {
      await transitionPlacement({ user: team[role] }, s.project.id, placement.id, { to, baseVersion: version++ });
    }
    placement = await markPlacementSigned({ user: team.inspector }, s.project.id, placement.id, { baseVersion: version });
  });

  it("update and delete through lib are 409 for the placement and every record under it", async () => {
    const params = (type: string, id: string) => ({ projectId: s.project.id, type, id });
    const p = await callRoute(PATCH, { user: team.office, method: "PATCH", params: params("placements", placement.id), body: { baseVersion: placement.version, patch: { grid: "Z" } } });
    expect(p.status).toBe(409);
    expect(p.json.error.message).toBe(SIGNED_MESSAGE);
    for (const [type, row] of Object.entries(children)) {
      if (type === "breaks") continue;
      const writer = type === "field-tests" || type === "specimen-sets" ? team.inspector : team.office;
      const upd = await callRoute(PATCH, { user: writer, method: "PATCH", params: params(type, row.id), body: { baseVersion: row.version, patch: PATCHES[type as RecordType] } });
      expect(upd.status, `${type} update`).toBe(409);
      expect(upd.json.error.message).toBe(SIGNED_MESSAGE);
      const del = await callRoute(DELETE, { user: writer, method: "DELETE", params: params(type, row.id), body: { baseVersion: row.version } });
      expect(del.status, `${type} delete`).toBe(409);
      expect(del.json.error.message).toBe(SIGNED_MESSAGE);
    }
    const truck = await callRoute(PATCH, { user: team.office, method: "PATCH", params: params("deliveries", children.deliveries.id), body: { baseVersion: 1, patch: { volumeM3: 9 } } });
    expect(truck.status).toBe(409);
    expect(truck.json.error.message).toBe(SIGNED_MESSAGE);
    expect(truck.json.error.reason).toBe("signed");
  });

  it("no new record can be added under a signed placement", async () => {
    const res = await callRoute(POST, { user: team.superintendent, params: { projectId: s.project.id, type: "deliveries" }, body: validBody("deliveries", placement.id) });
    expect(res.status).toBe(409);
    const item = await callRoute(POST, { user: team.inspector, params: { projectId: s.project.id, type: "checklist-items" }, body: validBody("checklist-items", children.checklists.id) });
    expect(item.status).toBe(409);
  });

  it("breaks still arrive after the sign-off (the lab breaks cylinders weeks later)", async () => {
    const { record } = await createRecord({ user: team.office }, "breaks", s.project.id, validBody("breaks", children["specimen-sets"].id));
    expect(record.strengthMPa).toBeGreaterThan(0);
    const updated = await updateRecord({ user: team.office }, "breaks", s.project.id, children.breaks.id, { baseVersion: 1, patch: { fractureType: 3 } });
    expect(updated.version).toBe(2);
  });

  it("the database refuses raw SQL changes to the placement and its records (SQLSTATE PW409)", async () => {
    const refusals = [
      sql`update deliveries set volume_m3 = 99 where id = ${children.deliveries.id}`,
      sql`delete from deliveries where id = ${children.deliveries.id}`,
      sql`update placements set grid = 'Z' where id = ${placement.id}`,
      sql`update placements set state = 'placed' where id = ${placement.id}`,
      sql`delete from placements where id = ${placement.id}`,
      sql`update field_tests set slump_mm = 10 where id = ${children["field-tests"].id}`,
      sql`update specimen_sets set count = 1 where id = ${children["specimen-sets"].id}`,
      sql`update weather_observations set wind_kmh = 0 where id = ${children["weather-observations"].id}`,
      sql`update checklists set kind = 'cold-weather' where id = ${children.checklists.id}`,
      sql`update checklist_items set answer = 'no' where id = ${children["checklist-items"].id}`,
      sql`update curing_readings set temp_c = 30 where id = ${children["curing-readings"].id}`,
      sql`insert into curing_readings (id, project_id, change_seq, placement_id, method, read_at, temp_c)
          values (${randomUUID()}, ${s.project.id}, 1, ${placement.id}, 'Blankets', now(), 10)`,
      sql`insert into photos (id, project_id, change_seq, record_type, record_id, sha256, size_bytes, content_type)
          values (${randomUUID()}, ${s.project.id}, 1, 'deliveries', ${children.deliveries.id}, ${"a".repeat(64)}, 10, 'image/jpeg')`,
    ];
    for (const statement of refusals) {
      const error = await pgErrorOf(statement);
      expect(error.code).toBe("PW409");
    }
    const [row] = (await db.execute(sql`select volume_m3, deleted_at from deliveries where id = ${children.deliveries.id}`)).rows;
    expect(row).toEqual({ volume_m3: 8, deleted_at: null });
  });

  it("an unsigned placement's records can still be changed in SQL (the trigger is specific)", async () => {
    const open = await makeRecord("deliveries", s.project.id, team);
    const error = await pgErrorOf(sql`update deliveries set volume_m3 = 7 where id = ${open.id}`);
    expect(error.code).toBeUndefined();
  });
});

// Every record type through its routes: create, read, update, delete, list with filters; versions,
// change numbers and the audit entry of every accepted write (in the same transaction).
import { and, asc, eq, getTableName, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getOne, PATCH, DELETE } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { GET as list, POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { db } from "@/db";
import { auditEntries } from "@/db/schema";
import { cToF, cylinderStrengthMPa, evaporationRateIP, evaporationRateSI, kmhToMph, lbFt2hToKgM2h } from "@/lib/concrete";
import { getRecordDef } from "@/lib/records/registry";
import { createRecord, deleteRecord, updateRecord } from "@/lib/records/write";
import { addMembership, callRoute, countRows, createProject, projectWithTeam } from "./helpers";
import { at, bodyWithParents, makeRecord, PATCHES, RECORD_TYPES, type Team, validBody, WRITER } from "./record-fixtures";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;

async function auditOf(recordId: string) {
  return db.select().from(auditEntries).where(eq(auditEntries.recordId, recordId)).orderBy(asc(auditEntries.id));
}

describe.each(RECORD_TYPES.map((type) => [type]))("%s", (type) => {
  let s: Setup;
  beforeAll(async () => {
    s = await projectWithTeam();
  });

  it("creates, reads, updates (version +1), deletes (tombstone) and lists, with an audit entry per write", async () => {
    const user = s.team[WRITER[type]];
    const params = { projectId: s.project.id, type };
    const body = await bodyWithParents(type, s.project.id, s.team);
    const id = body.id as string;

    const created = await callRoute(POST, { user, params, body });
    expect(created.status, JSON.stringify(created.json)).toBe(201);
    expect(created.json).toMatchObject({ id, projectId: s.project.id, version: 1, deletedAt: null, updatedBy: user.id });
    expect(created.json.changeSeq).toBeGreaterThan(0);

    // The same create again (a retry) returns the stored row; other values under the same id: 409.
    const again = await callRoute(POST, { user, params, body });
    expect(again.status).toBe(200);
    expect(again.json.version).toBe(1);
    expect(again.json.changeSeq).toBe(created.json.changeSeq);
    const clash = await callRoute(POST, { user, params, body: { ...body, ...PATCHES[type] } });
    expect(clash.status).toBe(409);

    const read = await callRoute(getOne, { user: s.team.owner, params: { ...params, id } });
    expect(read.status).toBe(200);
    expect(read.json).toEqual(created.json);

    const patch = PATCHES[type];
    const updated = await callRoute(PATCH, { user, method: "PATCH", params: { ...params, id }, body: { baseVersion: 1, patch } });
    expect(updated.status, JSON.stringify(updated.json)).toBe(200);
    expect(updated.json.version).toBe(2);
    expect(updated.json.changeSeq).toBeGreaterThan(created.json.changeSeq);
    for (const [key, value] of Object.entries(patch)) {
      expect(updated.json[key]).toEqual(typeof value === "string" && /T\d\d:/.test(value) ? new Date(value).toISOString() : value);
    }

    const stale = await callRoute(PATCH, { user, method: "PATCH", params: { ...params, id }, body: { baseVersion: 1, patch } });
    expect(stale.status).toBe(409);
    expect(stale.json.error.currentVersion).toBe(2);

    // Listing: in the date range, the record is there; outside it, not.
    const inRange = await callRoute(list, { user: s.team.owner, params, url: `/x?from=2000-01-01&to=2099-12-31&limit=200` });
    expect(inRange.status).toBe(200);
    expect(inRange.json.items.map((r: { id: string }) => r.id)).toContain(id);
    const outOfRange = await callRoute(list, { user: s.team.owner, params, url: `/x?from=2099-01-01` });
    expect(outOfRange.json.items.map((r: { id: string }) => r.id)).not.toContain(id);

    const deleted = await callRoute(DELETE, { user, method: "DELETE", params: { ...params, id }, body: { baseVersion: 2 } });
    expect(deleted.status, JSON.stringify(deleted.json)).toBe(200);
    expect(deleted.json.version).toBe(3);
    expect(deleted.json.deletedAt).not.toBeNull();
    expect(await countRows(tableName(type))).toBeGreaterThan(0); // never hard-deleted

    expect((await callRoute(getOne, { user, params: { ...params, id } })).status).toBe(404);
    const tombstone = await callRoute(getOne, { user, params: { ...params, id }, url: "/x?includeDeleted=1" });
    expect(tombstone.status).toBe(200);
    const after = await callRoute(list, { user, params, url: "/x?limit=200" });
    expect(after.json.items.map((r: { id: string }) => r.id)).not.toContain(id);
    const withDeleted = await callRoute(list, { user, params, url: "/x?limit=200&includeDeleted=1" });
    expect(withDeleted.json.items.map((r: { id: string }) => r.id)).toContain(id);

    // One audit entry per accepted write, with who, before and after.
    const entries = await auditOf(id);
    expect(entries.map((e) => e.action)).toEqual(["create", "update", "delete"]);
    expect(entries.every((e) => e.userId === user.id && e.projectId === s.project.id && e.recordType === type)).toBe(true);
    expect(entries[0].before).toBeNull();
    expect((entries[1].before as { version: number }).version).toBe(1);
    expect((entries[1].after as { version: number }).version).toBe(2);
  });

  it("writes nothing, not even the audit entry, when the surrounding transaction fails", async () => {
    const existing = await makeRecord(type, s.project.id, s.team);
    const body = await bodyWithParents(type, s.project.id, s.team);
    const auditBefore = await countRows("audit_entries");
    const user = s.team[WRITER[type]];
    await expect(
      db.transaction(async (tx) => {
        await createRecord({ user, tx, deviceId: "tablet-7" }, type, s.project.id, body);
        await updateRecord({ user, tx }, type, s.project.id, existing.id, { baseVersion: 1, patch: PATCHES[type] });
        await deleteRecord({ user, tx }, type, s.project.id, existing.id, { baseVersion: 2 });
        throw new Error("failure after the writes");
      }),
    ).rejects.toThrow("failure after the writes");
    expect(await countRows("audit_entries")).toBe(auditBefore);
    expect(await auditOf(body.id as string)).toEqual([]);
    const [row] = (await db.execute(sql.raw(`select version, deleted_at from "${tableName(type)}" where id = '${existing.id}'`))).rows;
    expect(row).toEqual({ version: 1, deleted_at: null });
    const none = await db.execute(sql.raw(`select 1 from "${tableName(type)}" where id = '${body.id}'`));
    expect(none.rows).toHaveLength(0);
  });
});

const tableName = (type: string) => getTableName(getRecordDef(type).table);

describe("record rules", () => {
  let s: Setup;
  let team: Team;
  beforeAll(async () => {
    s = await projectWithTeam();
    team = s.team;
  });

  it("records the device of a write in the audit entry", async () => {
    const body = validBody("mix-designs");
    await createRecord({ user: team.office, deviceId: "office-laptop-3" }, "mix-designs", s.project.id, body);
    const [entry] = await auditOf(body.id as string);
    expect(entry.deviceId).toBe("office-laptop-3");
  });

  it("computes a break's strength on the server and ignores one sent by the client", async () => {
    const set = await makeRecord("specimen-sets", s.project.id, team);
    const body = { ...validBody("breaks", set.id), strengthMPa: 99 };
    const res = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "breaks" }, body });
    expect(res.status).toBe(201);
    expect(res.json.strengthMPa).toBeCloseTo(cylinderStrengthMPa({ maxLoadKN: 180, diameterMm: 100, lengthMm: 200 }), 9);
    const patched = await updateRecord({ user: team.office }, "breaks", s.project.id, res.json.id, { baseVersion: 1, patch: { loadKN: 200, strengthMPa: 1 } });
    expect(patched.strengthMPa).toBeCloseTo((200_000 / (Math.PI * 100 * 100)) * 4, 6);
  });

  it("a short cylinder that cannot be corrected is a 400 naming the length", async () => {
    const set = await makeRecord("specimen-sets", s.project.id, team);
    const res = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "breaks" }, body: { ...validBody("breaks", set.id), lengthMm: 80 } });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.lengthMm).toBeDefined();
  });

  it("computes the evaporation rate in the project's unit system form (SI and inch-pound)", async () => {
    const obs = await makeRecord("weather-observations", s.project.id, team, { placementId: null, airTempC: 25, relativeHumidityPct: 50, windKmh: 20, concreteTempC: 30 });
    expect(obs.evaporationKgM2H).toBeCloseTo(evaporationRateSI({ concreteTempC: 30, airTempC: 25, relativeHumidityPct: 50, windKmh: 20 }), 9);
    expect(obs.evaporationKgM2H).toBeCloseTo(1.188, 3); // DOMAIN.md check value

    const ipProject = await createProject({ unitSystem: "IP" });
    await addMembership(team.superintendent.id, ipProject.id, "superintendent");
    const { record } = await createRecord({ user: team.superintendent }, "weather-observations", ipProject.id, {
      ...validBody("weather-observations"),
      airTempC: 35,
      relativeHumidityPct: 30,
      windKmh: 29,
      concreteTempC: 33.3,
    });
    const ip = evaporationRateIP({ concreteTempF: cToF(33.3), airTempF: cToF(35), relativeHumidityPct: 30, windMph: kmhToMph(29) });
    expect(record.evaporationKgM2H).toBeCloseTo(lbFt2hToKgM2h(ip), 9);

    // No concrete temperature: one behaviour everywhere, an estimate with the air temperature standing
    // in for it (lib/checks evaporationOf), labelled as estimated wherever it is shown.
    const noConcrete = await makeRecord("weather-observations", s.project.id, team, { placementId: null, concreteTempC: null });
    expect(noConcrete.concreteTempC).toBeNull();
    expect(noConcrete.evaporationKgM2H).toBeCloseTo(
      evaporationRateSI({ concreteTempC: noConcrete.airTempC as number, airTempC: noConcrete.airTempC as number, relativeHumidityPct: noConcrete.relativeHumidityPct as number, windKmh: noConcrete.windKmh as number }),
      9,
    );
  });

  it("a duplicate mix code or diary date is a 409 naming the field; after deleting, the code is free again", async () => {
    const mix = await makeRecord("mix-designs", s.project.id, team, { code: "LC-DUP" });
    const dup = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "mix-designs" }, body: { ...validBody("mix-designs"), code: "LC-DUP" } });
    expect(dup.status).toBe(409);
    expect(dup.json.error.fields.code).toMatch(/already has a mix/);
    await deleteRecord({ user: team.office }, "mix-designs", s.project.id, mix.id, { baseVersion: 1 });
    const reuse = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "mix-designs" }, body: { ...validBody("mix-designs"), code: "LC-DUP" } });
    expect(reuse.status).toBe(201);

    const entry = await makeRecord("diary-entries", s.project.id, team, { date: "2026-11-20" });
    const sameDay = await callRoute(POST, { user: team.superintendent, params: { projectId: s.project.id, type: "diary-entries" }, body: { ...validBody("diary-entries"), date: "2026-11-20" } });
    expect(sameDay.status).toBe(409);
    expect(sameDay.json.error.fields.date).toBeDefined();
    expect(entry.date).toBe("2026-11-20");
  });

  it("sync may apply a stale patch of mergeable fields only (mergeStale); free text stays a conflict", async () => {
    const reading = await makeRecord("field-tests", s.project.id, team);
    await updateRecord({ user: team.inspector }, "field-tests", s.project.id, reading.id, { baseVersion: 1, patch: { airPct: 6 } });
    const merged = await updateRecord({ user: team.inspector }, "field-tests", s.project.id, reading.id, { baseVersion: 1, patch: { slumpMm: 95 } }, { mergeStale: true });
    expect(merged).toMatchObject({ version: 3, slumpMm: 95, airPct: 6 });
    await expect(
      updateRecord({ user: team.inspector }, "field-tests", s.project.id, reading.id, { baseVersion: 1, patch: { notes: "late edit" } }, { mergeStale: true }),
    ).rejects.toMatchObject({ code: "conflict", details: { reason: "stale", currentVersion: 3 } });
  });

  it("the generic update never changes a placement's state", async () => {
    const placement = await makeRecord("placements", s.project.id, team);
    const res = await callRoute(PATCH, { user: team.superintendent, method: "PATCH", params: { projectId: s.project.id, type: "placements", id: placement.id }, body: { baseVersion: 1, patch: { state: "placed" } } });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.state).toMatch(/transition/);
  });

  it("checks the whole record after a patch: discharge cannot end before it started", async () => {
    const delivery = await makeRecord("deliveries", s.project.id, team);
    const res = await callRoute(PATCH, { user: team.superintendent, method: "PATCH", params: { projectId: s.project.id, type: "deliveries", id: delivery.id }, body: { baseVersion: 1, patch: { dischargeFinishedAt: at(20) } } });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.dischargeFinishedAt).toBe("Discharge must finish after it started");
  });

  it("links must stay inside the project and the placement", async () => {
    const other = await projectWithTeam();
    const foreignPlacement = await makeRecord("placements", other.project.id, other.team);
    const res = await callRoute(POST, { user: team.superintendent, params: { projectId: s.project.id, type: "deliveries" }, body: validBody("deliveries", foreignPlacement.id) });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.placementId).toMatch(/no placement/i);

    const p1 = await makeRecord("placements", s.project.id, team);
    const p2 = await makeRecord("placements", s.project.id, team);
    const truck = await makeRecord("deliveries", s.project.id, team, { placementId: p1.id });
    const test = await callRoute(POST, { user: team.inspector, params: { projectId: s.project.id, type: "field-tests" }, body: { ...validBody("field-tests", p2.id), deliveryId: truck.id } });
    expect(test.status).toBe(400);
    expect(test.json.error.fields.deliveryId).toMatch(/another placement/);
  });

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

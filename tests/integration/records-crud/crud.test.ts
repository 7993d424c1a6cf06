// Every record type through its routes: create, read, update, delete, list; the audit entry of every write.
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getOne, PATCH, DELETE } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { GET as list, POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { db } from "@/db";
import { createRecord, deleteRecord, updateRecord } from "@/lib/records/write";
import { callRoute, countRows, projectWithTeam } from "../helpers";
import { bodyWithParents, makeRecord, PATCHES, RECORD_TYPES, WRITER } from "../record-fixtures";
import { type Setup, auditOf, tableName } from "./helpers";

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

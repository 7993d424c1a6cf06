import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import { applyPull } from "@/lib/sync/client/apply-pull";
import { getMeta, type SyncDb } from "@/lib/sync/client/db";
import { createLocal, updateLocal } from "@/lib/sync/client/mutate";
import { getRecord, listByProject } from "@/lib/sync/client/queries";
import type { ConflictSummary, PullResponse, SyncedRecord } from "@/lib/sync/protocol";
import { cleanupDbs, freshDb, placementValues, project, PROJECT_ID } from "./helpers";

afterEach(cleanupDbs);

const pull = (overrides: Partial<PullResponse> = {}): PullResponse => ({
  reset: false,
  cursor: { [PROJECT_ID]: 10 },
  hasMore: false,
  changes: [],
  projects: [project()],
  conflicts: [],
  lastMutationId: 0,
  ...overrides,
});

const serverPlacement = (id: string, version: number, values: Record<string, unknown> = {}): SyncedRecord => ({
  id,
  projectId: PROJECT_ID,
  version,
  changeSeq: version + 100,
  deletedAt: null,
  ...placementValues(),
  plannedStart: "2026-11-09T13:00:00.000Z",
  level: "",
  grid: "",
  state: "planned",
  createdAt: "2026-11-01T10:00:00.000Z",
  updatedAt: "2026-11-01T10:00:00.000Z",
  updatedBy: null,
  ...values,
});

async function seedServerRow(db: SyncDb, row: SyncedRecord) {
  await applyPull(db, pull({ changes: [{ recordType: "placements", record: row }] }));
}

describe("pull application", () => {
  it("stores rows, projects and the cursor; rows without waiting changes are not pending", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    const result = await applyPull(db, pull({ changes: [{ recordType: "placements", record: serverPlacement(id, 2) }] }));
    expect(result).toMatchObject({ applied: 1, acknowledged: 0, reset: false, hasMore: false });
    expect(await db.records("placements").get(id)).toMatchObject({ version: 2, pending: 0, element: "Level 3 slab, pour 2" });
    expect(await db.projects.toArray()).toEqual([project()]);
    expect(await getMeta(db, "cursor")).toEqual({ [PROJECT_ID]: 10 });
  });

  it("drops acknowledged entries and re-applies the pending ones on top of the server rows", async () => {
    const db = await freshDb();
    const a = await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "Wall A" }));
    const b = await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "Wall B" }));
    // The server applied mutation 1 (and someone changed Wall A's grid since); mutation 2 still waits.
    await applyPull(
      db,
      pull({
        lastMutationId: 1,
        changes: [{ recordType: "placements", record: serverPlacement(a.id, 2, { element: "Wall A", grid: "F/9" }) }],
      }),
    );
    expect((await db.outbox.toArray()).map((e) => e.mutationId)).toEqual([2]);
    expect(await db.records("placements").get(a.id)).toMatchObject({ element: "Wall A", grid: "F/9", version: 2, pending: 0 });
    // Wall B exists only on the device: rebuilt from its create, still pending.
    expect(await db.records("placements").get(b.id)).toMatchObject({ element: "Wall B", pending: 1, version: 0 });
  });

  it("a pending local edit survives a pull of an older server copy of the row", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    await seedServerRow(db, serverPlacement(id, 3));
    await updateLocal(db, "placements", id, { element: "Level 3 slab, pour 2 (revised)" });
    // A pull brings the row again (another field changed on the server), older than the local edit.
    await applyPull(db, pull({ changes: [{ recordType: "placements", record: serverPlacement(id, 4, { grid: "A-C/1-3" }) }] }));
    const row = await db.records("placements").get(id);
    expect(row).toMatchObject({ element: "Level 3 slab, pour 2 (revised)", grid: "A-C/1-3", version: 4, pending: 1 });
    expect(row?.serverCopy).toMatchObject({ element: "Level 3 slab, pour 2", version: 4 });
    expect(await db.outbox.count()).toBe(1);
  });

  it("clears the pending flag when the last entry of a row is acknowledged", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    await seedServerRow(db, serverPlacement(id, 3));
    await updateLocal(db, "placements", id, { level: "L3" });
    expect((await db.records("placements").get(id))?.pending).toBe(1);
    await applyPull(db, pull({ lastMutationId: 1, changes: [{ recordType: "placements", record: serverPlacement(id, 4, { level: "L3" }) }] }));
    expect(await db.records("placements").get(id)).toMatchObject({ level: "L3", version: 4, pending: 0 });
    expect(await db.outbox.count()).toBe(0);
  });

  it("a reset clears the synced tables but keeps the outbox and what it carries", async () => {
    const db = await freshDb();
    const gone = crypto.randomUUID();
    const kept = crypto.randomUUID();
    await seedServerRow(db, serverPlacement(gone, 1, { element: "Removed from my projects" }));
    await seedServerRow(db, serverPlacement(kept, 5));
    const local = await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "Made offline" }));
    await updateLocal(db, "placements", kept, { grid: "Z/9" });

    await applyPull(db, pull({ reset: true, changes: [{ recordType: "placements", record: serverPlacement(kept, 5) }] }));

    expect(await db.records("placements").get(gone)).toBeUndefined();
    expect(await db.outbox.count()).toBe(2);
    expect(await db.records("placements").get(local.id)).toMatchObject({ element: "Made offline", pending: 1 });
    expect(await db.records("placements").get(kept)).toMatchObject({ grid: "Z/9", version: 5, pending: 1 });
  });

  it("a tombstone from the server hides the record", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    await seedServerRow(db, serverPlacement(id, 1));
    await applyPull(db, pull({ changes: [{ recordType: "placements", record: serverPlacement(id, 2, { deletedAt: "2026-11-09T15:00:00.000Z" }) }] }));
    expect(await getRecord(db, "placements", id)).toBeUndefined();
    expect(await listByProject(db, "placements", PROJECT_ID)).toEqual([]);
  });

  it("replaces the open conflicts with the server's list and keeps refused changes", async () => {
    const db = await freshDb();
    const conflict = (id: string): ConflictSummary => ({
      id,
      projectId: PROJECT_ID,
      recordType: "placements",
      recordId: crypto.randomUUID(),
      baseVersion: 1,
      serverVersion: 2,
      clientPayload: {},
      serverPayload: {},
      reason: "stale",
      createdAt: "2026-11-09T15:00:00.000Z",
    });
    const c1 = conflict(crypto.randomUUID());
    const c2 = conflict(crypto.randomUUID());
    await db.conflicts.put({ ...conflict("rejected-1"), kind: "rejected", source: "push", reason: "signed" });
    await applyPull(db, pull({ conflicts: [c1, c2] }));
    expect(await db.conflicts.where("kind").equals("conflict").count()).toBe(2);
    await applyPull(db, pull({ conflicts: [c2] }));
    expect((await db.conflicts.where("kind").equals("conflict").toArray()).map((c) => c.id)).toEqual([c2.id]);
    expect(await db.conflicts.get("rejected-1")).toMatchObject({ kind: "rejected" });
  });

  it("never lets the next mutation id fall to or below the server's watermark", async () => {
    const db = await freshDb();
    await applyPull(db, pull({ lastMutationId: 7 }));
    expect(await getMeta(db, "nextMutationId")).toBe(8);
    const { mutationId } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    expect(mutationId).toBe(8);
  });

  it("applies a page in one transaction: a failure leaves the previous state untouched", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    await seedServerRow(db, serverPlacement(id, 1));
    await createLocal(db, "placements", PROJECT_ID, placementValues());
    const bad = pull({
      lastMutationId: 1,
      changes: [
        { recordType: "placements", record: serverPlacement(id, 2, { element: "changed" }) },
        // An id IndexedDB cannot store as a key makes the page fail half-way.
        { recordType: "placements", record: { ...serverPlacement(id, 3), id: undefined as unknown as string } },
      ],
    });
    await expect(applyPull(db, bad)).rejects.toThrow();
    expect(await db.records("placements").get(id)).toMatchObject({ version: 1, element: "Level 3 slab, pour 2" });
    expect(await db.outbox.count()).toBe(1);
    expect(await getMeta(db, "cursor")).toEqual({ [PROJECT_ID]: 10 });
  });
});

import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import { RECORD_TYPES } from "@/lib/records/registry";
import { getMeta } from "@/lib/sync/client/db";
import { LocalValidationError, LocalWriteError } from "@/lib/sync/client/errors";
import { createLocal, deleteLocal, transitionLocal, updateLocal } from "@/lib/sync/client/mutate";
import { getRecord, listByParent, listByProject } from "@/lib/sync/client/queries";
import { LOCAL_RECORD_TYPES, tableNameOf } from "@/lib/sync/client/record-types";
import { cleanupDbs, freshDb, placementValues, project, PROJECT_ID } from "./helpers";

afterEach(cleanupDbs);

describe("record types", () => {
  it("has one local table per registry record type, named in camelCase", () => {
    expect(LOCAL_RECORD_TYPES).toEqual([...RECORD_TYPES]);
    expect(tableNameOf("field-tests")).toBe("fieldTests");
    expect(tableNameOf("diary-crew")).toBe("diaryCrew");
    expect(tableNameOf("weather-observations")).toBe("weatherObservations");
  });
});

describe("write rule: the row and its outbox entry in one transaction", () => {
  it("a create writes the optimistic row and its outbox entry", async () => {
    const db = await freshDb();
    const { id, mutationId } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    const row = await db.records("placements").get(id);
    const outbox = await db.outbox.toArray();
    expect(mutationId).toBe(1);
    expect(row).toMatchObject({ id, projectId: PROJECT_ID, element: "Level 3 slab, pour 2", state: "planned", level: "", pending: 1, version: 0 });
    // Dates are stored as the wire (ISO) form, like the rows a pull brings.
    expect(row?.plannedStart).toBe("2026-11-09T13:00:00.000Z");
    expect(outbox).toHaveLength(1);
    expect(outbox[0]).toMatchObject({
      mutationId: 1,
      name: "create",
      recordType: "placements",
      projectId: PROJECT_ID,
      recordId: id,
      state: "pending",
      attempts: 0,
      lastError: null,
    });
    expect(outbox[0].baseVersion).toBeUndefined();
    expect(outbox[0].args).toMatchObject({ id, element: "Level 3 slab, pour 2", plannedStart: "2026-11-09T13:00:00.000Z" });
    expect(await getMeta(db, "nextMutationId")).toBe(2);
  });

  it("every kind of write leaves an outbox entry carrying it", async () => {
    const db = await freshDb();
    const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    await db.outbox.toCollection().modify({ attempts: 1, state: "pending" }); // sent once: never merged into again
    await updateLocal(db, "placements", id, { grid: "C-D/4-7" });
    await transitionLocal(db, id, "ready");
    const names = (await db.outbox.orderBy("seq").toArray()).map((e) => [e.mutationId, e.name]);
    expect(names).toEqual([
      [1, "create"],
      [2, "update"],
      [3, "transition"],
    ]);
    const entryId = crypto.randomUUID();
    await createLocal(db, "diary-entries", PROJECT_ID, { id: entryId, date: "2026-11-09" });
    await db.outbox.toCollection().modify({ attempts: 1 });
    await deleteLocal(db, "diary-entries", entryId);
    const last = await db.outbox.orderBy("seq").last();
    expect(last).toMatchObject({ name: "delete", recordId: entryId, mutationId: 5 });
  });

  it("an invalid write throws field messages and writes neither row nor entry", async () => {
    const db = await freshDb();
    const error = await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "", plannedVolumeM3: -3 })).catch((e) => e);
    expect(error).toBeInstanceOf(LocalValidationError);
    expect(error.fields).toMatchObject({ element: "Enter the element", plannedVolumeM3: "Planned volume cannot be negative" });
    expect(await db.records("placements").count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    expect(await getMeta(db, "nextMutationId")).toBe(1);
  });

  it("an update that breaks the whole record (discharge before arrival) writes nothing", async () => {
    const db = await freshDb();
    const { id: placementId } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    const { id } = await createLocal(db, "deliveries", PROJECT_ID, {
      placementId,
      ticketNumber: "T-1",
      volumeM3: 8,
      batchedAt: "2026-11-09T07:00:00Z",
      arrivedAt: "2026-11-09T07:30:00Z",
    });
    const before = await db.outbox.toArray();
    const error = await updateLocal(db, "deliveries", id, { dischargeStartedAt: "2026-11-09T07:10:00Z" }).catch((e) => e);
    expect(error).toBeInstanceOf(LocalValidationError);
    expect(error.fields.dischargeStartedAt).toBe("Discharge must start after the truck arrived");
    expect(await db.outbox.toArray()).toEqual(before);
    expect((await db.records("deliveries").get(id))?.dischargeStartedAt).toBeUndefined();
  });

  it("an update of a create not yet sent is merged into the create (no new mutation id)", async () => {
    const db = await freshDb();
    const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    const result = await updateLocal(db, "placements", id, { element: "Level 3 slab, pour 2B" });
    expect(result).toMatchObject({ mutationId: 1, merged: true });
    const outbox = await db.outbox.toArray();
    expect(outbox).toHaveLength(1);
    expect(outbox[0].args.element).toBe("Level 3 slab, pour 2B");
    expect((await db.records("placements").get(id))?.element).toBe("Level 3 slab, pour 2B");
  });

  it("an update after the create was sent is queued without a base version (filled in from the create's answer)", async () => {
    const db = await freshDb();
    const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    await db.outbox.toCollection().modify({ state: "sending", attempts: 1 });
    const result = await updateLocal(db, "placements", id, { grid: "A/1" });
    expect(result).toMatchObject({ mutationId: 2, merged: false });
    const update = await db.outbox.where("mutationId").equals(2).first();
    expect(update?.baseVersion).toBeUndefined();
  });

  it("an update of an acknowledged record carries the acknowledged version; later ones merge into it", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    const server = { id, projectId: PROJECT_ID, version: 4, changeSeq: 9, deletedAt: null, ...placementValues(), plannedStart: "2026-11-09T13:00:00.000Z", state: "planned", level: "", grid: "" };
    await db.records("placements").put({ ...server, pending: 0, serverCopy: server });
    await updateLocal(db, "placements", id, { level: "L3" });
    await updateLocal(db, "placements", id, { grid: "B/2" });
    const outbox = await db.outbox.toArray();
    expect(outbox).toHaveLength(1);
    expect(outbox[0]).toMatchObject({ name: "update", baseVersion: 4, args: { patch: { level: "L3", grid: "B/2" } } });
    const row = await db.records("placements").get(id);
    expect(row).toMatchObject({ level: "L3", grid: "B/2", version: 4, pending: 1 });
    expect(row?.serverCopy).toEqual(server);
  });

  it("mutation ids increase by one with no gaps across concurrent writes", async () => {
    const db = await freshDb();
    const results = await Promise.all(
      Array.from({ length: 40 }, (_, i) => createLocal(db, "placements", PROJECT_ID, placementValues({ element: `Wall ${i}` }))),
    );
    const ids = results.map((r) => r.mutationId).sort((a, b) => a - b);
    expect(ids).toEqual(Array.from({ length: 40 }, (_, i) => i + 1));
    const outboxIds = (await db.outbox.orderBy("seq").toArray()).map((e) => e.mutationId);
    expect(outboxIds).toEqual(ids);
    expect(await getMeta(db, "nextMutationId")).toBe(41);
  });

  it("a failed write in the middle does not use up a mutation id", async () => {
    const db = await freshDb();
    await createLocal(db, "placements", PROJECT_ID, placementValues());
    await expect(createLocal(db, "placements", PROJECT_ID, placementValues({ elementType: "dome" }))).rejects.toBeInstanceOf(LocalValidationError);
    const { mutationId } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    expect(mutationId).toBe(2);
  });
});

describe("deletes, transitions and signed records", () => {
  it("a delete keeps a tombstone that the queries never show", async () => {
    const db = await freshDb();
    const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    await deleteLocal(db, "placements", id);
    expect((await db.records("placements").get(id))?.deletedAt).toEqual(expect.any(String));
    expect(await getRecord(db, "placements", id)).toBeUndefined();
    expect(await listByProject(db, "placements", PROJECT_ID)).toEqual([]);
    await expect(updateLocal(db, "placements", id, { grid: "x" })).rejects.toMatchObject({ code: "deleted" });
  });

  it("a transition follows the workflow and the person's role", async () => {
    const db = await freshDb();
    await db.projects.put(project(PROJECT_ID, "superintendent"));
    const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    await expect(transitionLocal(db, id, "placed")).rejects.toMatchObject({ code: "state" });
    await transitionLocal(db, id, "ready");
    expect((await db.records("placements").get(id))?.state).toBe("ready");
    // Clearing belongs to the inspector.
    await expect(transitionLocal(db, id, "cleared")).rejects.toMatchObject({ code: "forbidden", message: "Only the inspector can move a placement from “Ready for inspection” to “Cleared to place”." });
    await db.projects.put(project(PROJECT_ID, "inspector"));
    await expect(transitionLocal(db, id, "held")).rejects.toBeInstanceOf(LocalValidationError);
    await transitionLocal(db, id, "held", "Rebar cover short at grid C");
    expect(await db.records("placements").get(id)).toMatchObject({ state: "held", holdReason: "Rebar cover short at grid C" });
    const last = await db.outbox.orderBy("seq").last();
    expect(last).toMatchObject({ name: "transition", args: { to: "held", reason: "Rebar cover short at grid C" } });
  });

  it("records of a signed placement cannot be written on the device", async () => {
    const db = await freshDb();
    const id = crypto.randomUUID();
    const server = { id, projectId: PROJECT_ID, version: 7, changeSeq: 3, deletedAt: null, ...placementValues(), state: "signed" };
    await db.records("placements").put({ ...server, pending: 0, serverCopy: server });
    await expect(updateLocal(db, "placements", id, { grid: "x" })).rejects.toMatchObject({ code: "signed" });
    await expect(
      createLocal(db, "curing-readings", PROJECT_ID, { placementId: id, method: "Blankets", readAt: "2026-11-10T07:00:00Z", tempC: 12 }),
    ).rejects.toBeInstanceOf(LocalWriteError);
    expect(await db.outbox.count()).toBe(0);
  });

  it("children are listed by their parent", async () => {
    const db = await freshDb();
    const { id: entryId } = await createLocal(db, "diary-entries", PROJECT_ID, { date: "2026-11-09" });
    await createLocal(db, "diary-crew", PROJECT_ID, { diaryEntryId: entryId, trade: "Carpenters", count: 4 });
    const { id: gone } = await createLocal(db, "diary-crew", PROJECT_ID, { diaryEntryId: entryId, trade: "Labourers", count: 2 });
    await deleteLocal(db, "diary-crew", gone);
    const crew = await listByParent(db, "diary-crew", "diaryEntryId", entryId);
    expect(crew.map((c) => c.trade)).toEqual(["Carpenters"]);
  });
});

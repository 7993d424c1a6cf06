import "fake-indexeddb/auto";
import { afterEach, describe, expect, it, vi } from "vitest";
import { applyPull } from "@/lib/sync/client/apply-pull";
import { getMeta, type SyncDb } from "@/lib/sync/client/db";
import { createLocal, resolveConflictLocal, updateLocal } from "@/lib/sync/client/mutate";
import { pullAll } from "@/lib/sync/client/pull";
import { MESSAGES, pushAll, pushOnce, type FetchLike } from "@/lib/sync/client/push";
import { MAX_MUTATIONS_PER_PUSH, type PushRequest, type PushResponse } from "@/lib/sync/protocol";
import { FakeServer, json } from "./fake-server";
import { cleanupDbs, crewValues, freshDb, placementValues, project, PROJECT_ID } from "./helpers";

afterEach(cleanupDbs);

/** A fetch that records the push bodies and answers with `answer(body)`. */
function scriptedFetch(answer: (body: PushRequest, call: number) => Response | Promise<Response>) {
  const bodies: PushRequest[] = [];
  const fetch: FetchLike = vi.fn(async (_url: string, init?: RequestInit) => {
    const body = JSON.parse(String(init?.body)) as PushRequest;
    bodies.push(body);
    return answer(body, bodies.length);
  });
  return { fetch, bodies };
}

const applyAll = (body: PushRequest, from = 1): PushResponse => ({
  lastMutationId: body.mutations.at(-1)?.id ?? from - 1,
  results: body.mutations.map((m) => ({ id: m.id, result: "applied", version: (m.baseVersion ?? 0) + 1 })),
});

async function twoPlacements(db: SyncDb) {
  const a = await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "Wall A" }));
  const b = await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "Wall B" }));
  return { a, b };
}

describe("push", () => {
  it("sends the waiting entries in order with the client id, and removes the applied ones", async () => {
    const db = await freshDb();
    const { a, b } = await twoPlacements(db);
    const { fetch, bodies } = scriptedFetch((body) => json(applyAll(body)));
    const outcome = await pushOnce(db, { fetch });
    expect(outcome).toEqual({ kind: "ok", sent: 2, applied: 2, conflicts: 0, rejected: 0, more: false });
    expect(bodies[0].clientId).toBe(await getMeta(db, "clientId"));
    expect(bodies[0].mutations.map((m) => [m.id, m.name, m.recordId])).toEqual([
      [1, "create", a.id],
      [2, "create", b.id],
    ]);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.records("placements").get(a.id)).toMatchObject({ version: 1, pending: 0, element: "Wall A" });
    expect(await getMeta(db, "lastMutationId")).toBe(2);
  });

  it("sends at most MAX_MUTATIONS_PER_PUSH at a time", async () => {
    const db = await freshDb();
    for (let i = 0; i < MAX_MUTATIONS_PER_PUSH + 5; i += 1) {
      await createLocal(db, "placements", PROJECT_ID, placementValues({ element: `Column ${i}` }));
    }
    const { fetch, bodies } = scriptedFetch((body) => json(applyAll(body)));
    const outcome = await pushAll(db, { fetch });
    expect(bodies.map((b) => b.mutations.length)).toEqual([MAX_MUTATIONS_PER_PUSH, 5]);
    expect(outcome).toMatchObject({ kind: "ok", sent: MAX_MUTATIONS_PER_PUSH + 5, more: false });
  });

  it("a conflict leaves the outbox once the server has stored it; the device keeps a copy and shows the server row", async () => {
    const db = await freshDb();
    const server = new FakeServer([project()]);
    const id = crypto.randomUUID();
    server.serverWrite("placements", PROJECT_ID, id, { ...placementValues(), plannedStart: "2026-11-09T13:00:00.000Z", state: "planned" });
    await pullAll(db, { fetch: server.fetch });
    await updateLocal(db, "placements", id, { element: "Edited on the device" });
    server.serverWrite("placements", PROJECT_ID, id, { element: "Edited in the office" });

    const outcome = await pushOnce(db, { fetch: server.fetch });
    expect(outcome).toMatchObject({ kind: "ok", conflicts: 1 });
    expect(await db.outbox.count()).toBe(0);
    const [conflict] = await db.conflicts.toArray();
    expect(conflict).toMatchObject({ kind: "conflict", recordId: id, reason: "stale", clientPayload: { name: "update", args: { patch: { element: "Edited on the device" } } } });
    expect(conflict.id).toBe(server.conflicts[0].id);
    // The visible row goes back to the server's copy; the pull brings the office's edit.
    expect((await db.records("placements").get(id))?.element).toBe("Level 3 slab, pour 2");
    await pullAll(db, { fetch: server.fetch });
    expect(await db.records("placements").get(id)).toMatchObject({ element: "Edited in the office", pending: 0 });
    expect(await db.conflicts.count()).toBe(1);
  });

  it("a rejected create is kept as a refusal and its row leaves the device", async () => {
    const db = await freshDb();
    const server = new FakeServer([project()]);
    const { id: entryId } = await createLocal(db, "diary-entries", PROJECT_ID, { date: "2026-11-09" });
    const { id } = await createLocal(db, "diary-crew", PROJECT_ID, crewValues(entryId, { count: 450 }));
    const outcome = await pushOnce(db, { fetch: server.fetch });
    expect(outcome).toMatchObject({ kind: "ok", applied: 1, rejected: 1 });
    expect(await db.outbox.count()).toBe(0);
    expect(await db.records("diary-crew").get(id)).toBeUndefined();
    expect(await db.conflicts.toArray()).toEqual([
      expect.objectContaining({ kind: "rejected", reason: "invalid", recordId: id, message: "Crew count must be at most 400 here." }),
    ]);
  });

  it("a 409 gap drops nothing: the entries are renumbered from the expected id and sent again in order", async () => {
    const db = await freshDb();
    await twoPlacements(db);
    await createLocal(db, "placements", PROJECT_ID, placementValues({ element: "Wall C" }));
    // Simulate the client bug: mutation 2 vanished from the outbox.
    await db.outbox.where("mutationId").equals(2).delete();
    const server = new FakeServer([project()]);
    const spy = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const first = await pushOnce(db, { fetch: server.fetch });
    expect(first).toEqual({ kind: "gap", expectedId: 2, message: MESSAGES.gap });
    expect(spy).toHaveBeenCalled();
    spy.mockRestore();
    expect((await db.outbox.orderBy("seq").toArray()).map((e) => e.mutationId)).toEqual([1, 2]);
    expect(await getMeta(db, "nextMutationId")).toBe(3);
    const second = await pushAll(db, { fetch: server.fetch });
    expect(second).toMatchObject({ kind: "ok", applied: 2 });
    expect(server.pushes[1].mutations.map((m) => m.id)).toEqual([1, 2]);
    expect(server.live("placements").map((r) => r.element).sort()).toEqual(["Wall A", "Wall C"]);
    const { mutationId } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    expect(mutationId).toBe(3);
  });

  it.each([
    ["503", async () => json({ error: { code: "unavailable", message: "busy" } }, 503), "transient", MESSAGES.busy],
    [
      "a network error",
      async () => {
        throw new TypeError("Failed to fetch");
      },
      "transient",
      MESSAGES.offline,
    ],
    ["401", async () => json({ error: { code: "unauthenticated", message: "Sign in" } }, 401), "unauthenticated", MESSAGES.signIn],
  ] as const)("%s keeps every entry to send again", async (_label, answer, kind, message) => {
    const db = await freshDb();
    await twoPlacements(db);
    const outcome = await pushOnce(db, { fetch: answer });
    expect(outcome).toMatchObject({ kind, message });
    const outbox = await db.outbox.orderBy("seq").toArray();
    expect(outbox.map((e) => [e.mutationId, e.state, e.attempts, e.lastError])).toEqual([
      [1, "pending", 1, message],
      [2, "pending", 1, message],
    ]);
    expect(await db.records("placements").where("pending").equals(1).count()).toBe(2);
  });

  it("another error marks the entries failed in the server's words and keeps them", async () => {
    const db = await freshDb();
    await twoPlacements(db);
    const fetch = async () => json({ error: { code: "forbidden", message: "This device id belongs to another user." } }, 403);
    const outcome = await pushOnce(db, { fetch });
    expect(outcome).toMatchObject({ kind: "failed", status: 403 });
    expect(await db.outbox.where("state").equals("failed").count()).toBe(2);
    expect((await db.outbox.toArray())[0].lastError).toContain("belongs to another user");
  });

  it("a change made while the batch was in flight waits for its answer and takes the version it produced", async () => {
    const db = await freshDb();
    const server = new FakeServer([project()]);
    const { id } = await createLocal(db, "placements", PROJECT_ID, placementValues());
    // The create is on its way when the person edits the record again.
    let edited = false;
    const fetch: FetchLike = async (url, init) => {
      if (!edited) {
        edited = true;
        await updateLocal(db, "placements", id, { grid: "B/4" });
      }
      return server.fetch(url, init);
    };
    await pushOnce(db, { fetch });
    const update = await db.outbox.toArray();
    expect(update).toEqual([expect.objectContaining({ name: "update", baseVersion: 1 })]);
    await pushOnce(db, { fetch });
    expect(server.pushes[1].mutations).toEqual([expect.objectContaining({ name: "update", baseVersion: 1, args: { patch: { grid: "B/4" } } })]);
    expect(server.live("placements")[0]).toMatchObject({ grid: "B/4", version: 2 });
  });

  it("two changes to one record never share a batch; an edit built on a conflicting edit conflicts too", async () => {
    const db = await freshDb();
    const server = new FakeServer([project()]);
    const id = crypto.randomUUID();
    server.serverWrite("placements", PROJECT_ID, id, { ...placementValues(), state: "planned" });
    await pullAll(db, { fetch: server.fetch });
    await updateLocal(db, "placements", id, { element: "First edit" });
    await db.outbox.toCollection().modify({ attempts: 1 }); // sent once and lost: not merged into
    await updateLocal(db, "placements", id, { grid: "Second edit" });
    server.serverWrite("placements", PROJECT_ID, id, { element: "Office edit" }); // version 2

    await pushOnce(db, { fetch: server.fetch });
    expect(server.pushes[0].mutations).toHaveLength(1);
    await pushOnce(db, { fetch: server.fetch });
    // The second edit went with the first one's base (1), not the server's newer version (2).
    expect(server.pushes[1].mutations[0]).toMatchObject({ baseVersion: 1 });
    expect(server.conflicts.map((c) => c.reason)).toEqual(["stale", "stale"]);
    expect(server.live("placements")[0].element).toBe("Office edit");
  });

  it("a change left 'sending' by a closed tab is sent again", async () => {
    const db = await freshDb();
    await twoPlacements(db);
    await db.outbox.toCollection().modify({ state: "sending", attempts: 1, lastAttemptAt: new Date().toISOString() });
    const { fetch, bodies } = scriptedFetch((body) => json(applyAll(body)));
    // Without the lock, a recent "sending" entry may belong to another tab: wait.
    expect(await pushOnce(db, { fetch, recoverSendingAfterMs: 60_000 })).toEqual({ kind: "idle" });
    // The leading tab knows no other tab sends.
    expect(await pushOnce(db, { fetch, recoverSendingAfterMs: 0 })).toMatchObject({ kind: "ok", sent: 2 });
    expect(bodies).toHaveLength(1);
  });

  it("a resolved conflict is sent as a resolve and does not come back with a pull while it waits", async () => {
    const db = await freshDb();
    const server = new FakeServer([project()]);
    const id = crypto.randomUUID();
    server.serverWrite("placements", PROJECT_ID, id, { ...placementValues(), state: "planned" });
    await pullAll(db, { fetch: server.fetch });
    await updateLocal(db, "placements", id, { element: "Device" });
    server.serverWrite("placements", PROJECT_ID, id, { element: "Office" });
    await pushOnce(db, { fetch: server.fetch });
    await pullAll(db, { fetch: server.fetch });
    const [conflict] = await db.conflicts.toArray();
    await resolveConflictLocal(db, conflict.id, { element: "Device" });
    expect(await db.conflicts.count()).toBe(0);
    await applyPull(db, server.pull({ clientId: (await getMeta(db, "clientId"))!, schemaVersion: 1, cursor: null }));
    expect(await db.conflicts.count()).toBe(0);
    expect((await db.records("placements").get(id))?.element).toBe("Device");
    await pushAll(db, { fetch: server.fetch });
    await pullAll(db, { fetch: server.fetch });
    expect(server.live("placements")[0]).toMatchObject({ element: "Device", version: 3 });
    expect(await db.conflicts.count()).toBe(0);
    expect(await db.records("placements").get(id)).toMatchObject({ element: "Device", version: 3, pending: 0 });
  });

  it("a replayed batch (answer lost) changes nothing on the server", async () => {
    const db = await freshDb();
    const server = new FakeServer([project()]);
    await twoPlacements(db);
    // The server applies the batch but the answer never arrives.
    const lost: FetchLike = async (url, init) => {
      await server.fetch(url, init);
      throw new TypeError("connection reset");
    };
    expect(await pushOnce(db, { fetch: lost })).toMatchObject({ kind: "transient" });
    expect(await db.outbox.count()).toBe(2);
    expect(await pushOnce(db, { fetch: server.fetch })).toMatchObject({ kind: "ok", applied: 2 });
    expect(server.live("placements")).toHaveLength(2);
    expect(await db.outbox.count()).toBe(0);
  });
});

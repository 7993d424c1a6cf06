import "fake-indexeddb/auto";
import fc from "fast-check";
import { afterEach, describe, expect, it } from "vitest";
import { getMeta, type OutboxEntry, type SyncDb } from "@/lib/sync/client/db";
import { createLocal, deleteLocal, transitionLocal, updateLocal } from "@/lib/sync/client/mutate";
import { pullAll } from "@/lib/sync/client/pull";
import { pushAll, type FetchLike } from "@/lib/sync/client/push";
import type { RecordType } from "@/lib/sync/client/record-types";
import { applyEntry } from "@/lib/sync/client/replay";
import type { SyncedRecord } from "@/lib/sync/protocol";
import { FakeServer } from "./fake-server";
import { cleanupDbs, freshDb, project, PROJECT_ID } from "./helpers";

afterEach(cleanupDbs);

// Two record types with different shapes; SLOTS records at most of each.
const SLOTS = 2;
const FIELDS: Record<"placements" | "weather-observations", readonly string[]> = {
  placements: ["element", "level", "plannedVolumeM3", "state"],
  "weather-observations": ["airTempC", "relativeHumidityPct", "windKmh"],
};
type Kind = keyof typeof FIELDS;

const kind = fc.constantFrom<Kind>("placements", "weather-observations");
const slot = fc.integer({ min: 0, max: SLOTS - 1 });
const placementPatch = fc.record(
  { element: fc.constantFrom("Wall W1", "Slab S2", "Column C3", "Footing F4"), level: fc.constantFrom("", "L1", "L2"), plannedVolumeM3: fc.integer({ min: 0, max: 200 }) },
  { requiredKeys: [] },
);
const weatherPatch = fc.record(
  { airTempC: fc.integer({ min: -10, max: 40 }), relativeHumidityPct: fc.integer({ min: 0, max: 100 }), windKmh: fc.integer({ min: 0, max: 60 }) },
  { requiredKeys: [] },
);

type Command =
  | { op: "create"; kind: Kind; slot: number; values: Record<string, unknown> }
  | { op: "update"; kind: Kind; slot: number; patch: Record<string, unknown> }
  | { op: "delete"; kind: Kind; slot: number }
  | { op: "ready"; slot: number }
  | { op: "push"; failure: "none" | "network" | "busy" | "lost" }
  | { op: "pull" }
  | { op: "office"; kind: Kind; slot: number; patch: Record<string, unknown> };

const localCommand: fc.Arbitrary<Command> = fc.oneof(
  { weight: 3, arbitrary: fc.record({ op: fc.constant("create" as const), kind: fc.constant<Kind>("placements"), slot, values: placementPatch }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("create" as const), kind: fc.constant<Kind>("weather-observations"), slot, values: weatherPatch }) },
  { weight: 3, arbitrary: fc.record({ op: fc.constant("update" as const), kind: fc.constant<Kind>("placements"), slot, patch: placementPatch }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("update" as const), kind: fc.constant<Kind>("weather-observations"), slot, patch: weatherPatch }) },
  { weight: 1, arbitrary: fc.record({ op: fc.constant("delete" as const), kind, slot }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("ready" as const), slot }) },
);
const syncCommand: fc.Arbitrary<Command> = fc.oneof(
  fc.record({ op: fc.constant("push" as const), failure: fc.constantFrom("none", "none", "network", "busy", "lost") }),
  fc.record({ op: fc.constant("pull" as const) }),
);
const officeCommand: fc.Arbitrary<Command> = fc.oneof(
  fc.record({ op: fc.constant("office" as const), kind: fc.constant<Kind>("placements"), slot, patch: placementPatch }),
  fc.record({ op: fc.constant("office" as const), kind: fc.constant<Kind>("weather-observations"), slot, patch: weatherPatch }),
);

/** The device's state as the person sees it: live rows by id (fields only), and deleted ids. */
type Snapshot = { live: Record<string, Record<string, unknown>>; deleted: string[] };

function snapshot(rows: readonly (SyncedRecord | undefined)[], kindOf: (row: SyncedRecord) => Kind): Snapshot {
  const live: Snapshot["live"] = {};
  const deleted: string[] = [];
  for (const row of rows) {
    if (!row) continue;
    if (row.deletedAt) deleted.push(row.id);
    else live[row.id] = Object.fromEntries(FIELDS[kindOf(row)].map((f) => [f, row[f] ?? null]));
  }
  return { live, deleted: deleted.sort() };
}

async function deviceSnapshot(db: SyncDb): Promise<Snapshot> {
  const rows: [SyncedRecord, Kind][] = [];
  for (const k of Object.keys(FIELDS) as Kind[]) for (const row of await db.records(k).toArray()) rows.push([row, k]);
  const kinds = new Map(rows.map(([row, k]) => [row.id, k]));
  return snapshot(rows.map(([row]) => row), (row) => kinds.get(row.id)!);
}

/** The independent model: what the commands say the records are. */
class Model {
  ids = new Map<string, string>(); // `${kind}:${slot}` → id
  rows = new Map<string, { kind: Kind; fields: Record<string, unknown>; deleted: boolean }>();
  key = (k: Kind, s: number) => `${k}:${s}`;
  snapshot(): Snapshot {
    const live: Snapshot["live"] = {};
    const deleted: string[] = [];
    for (const [id, row] of this.rows) {
      if (row.deleted) deleted.push(id);
      else live[id] = Object.fromEntries(FIELDS[row.kind].map((f) => [f, row.fields[f] ?? null]));
    }
    return { live, deleted: deleted.sort() };
  }
}

const fullValues = (k: Kind, values: Record<string, unknown>) =>
  k === "placements"
    ? { element: "Wall W0", elementType: "wall", plannedStart: "2026-11-09T13:00:00.000Z", level: "", state: "planned", ...values }
    : { observedAt: "2026-11-09T15:00:00.000Z", airTempC: 20, relativeHumidityPct: 50, windKmh: 10, ...values };

/** Runs a local command on the device and the model (skipping those the model says are invalid). */
async function runLocal(db: SyncDb, model: Model, c: Command) {
  if (c.op === "create") {
    if (model.ids.has(model.key(c.kind, c.slot))) return;
    const values = fullValues(c.kind, c.values);
    const input = c.kind === "placements" ? { ...values, state: undefined } : values;
    const { id } = await createLocal(db, c.kind, PROJECT_ID, input);
    model.ids.set(model.key(c.kind, c.slot), id);
    model.rows.set(id, { kind: c.kind, fields: values, deleted: false });
  } else if (c.op === "update" || c.op === "delete" || c.op === "ready") {
    const k: Kind = c.op === "ready" ? "placements" : c.kind;
    const id = model.ids.get(model.key(k, c.slot));
    const row = id ? model.rows.get(id) : undefined;
    if (!id || !row || row.deleted) return;
    if (c.op === "update") {
      if (Object.keys(c.patch).length === 0) return;
      await updateLocal(db, k, id, c.patch);
      Object.assign(row.fields, c.patch);
    } else if (c.op === "delete") {
      await deleteLocal(db, k, id);
      row.deleted = true;
    } else {
      if (row.fields.state !== "planned") return;
      await transitionLocal(db, id, "ready");
      row.fields.state = "ready";
    }
  }
}

/** Ids of the outbox are consecutive and end at nextMutationId − 1. */
async function expectConsecutiveIds(db: SyncDb) {
  const ids = (await db.outbox.orderBy("seq").toArray()).map((e) => e.mutationId);
  const next = (await getMeta(db, "nextMutationId"))!;
  expect(ids).toEqual(Array.from({ length: ids.length }, (_, i) => next - ids.length + i));
}

describe("outbox properties (fast-check)", () => {
  it("local writes: mutation ids are consecutive and replaying the outbox onto an empty copy gives the local state", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(localCommand, { minLength: 1, maxLength: 30, size: "max" }), async (commands) => {
        const db = await freshDb("prop");
        const model = new Model();
        for (const c of commands) await runLocal(db, model, c);

        await expectConsecutiveIds(db);
        const outbox = await db.outbox.orderBy("seq").toArray();
        if (outbox.length > 0) expect(outbox[0].mutationId).toBe(1);

        // Replay every entry, in order, onto an empty copy.
        const copy = new Map<string, { row: SyncedRecord | undefined; kind: RecordType }>();
        for (const entry of outbox as OutboxEntry[]) {
          const current = copy.get(entry.recordId);
          copy.set(entry.recordId, { row: applyEntry(current?.row, entry, db.userId), kind: entry.recordType });
        }
        const replayed = snapshot(
          [...copy.values()].map((v) => v.row),
          (row) => copy.get(row.id)!.kind as Kind,
        );
        const local = await deviceSnapshot(db);
        expect(replayed).toEqual(local);
        expect(local).toEqual(model.snapshot());
        await cleanupDbs();
      }),
      { numRuns: 40 },
    );
  }, 120_000);

  it("with syncs, failures and lost answers in between: at quiescence the device equals the server, nothing is doubled or lost", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.boolean(),
        fc.array(fc.oneof({ weight: 3, arbitrary: localCommand }, { weight: 2, arbitrary: syncCommand }, { weight: 1, arbitrary: officeCommand }), {
          minLength: 1,
          maxLength: 40,
          size: "max",
        }),
        async (withOffice, commands) => {
          const db = await freshDb("prop-sync");
          const server = new FakeServer([project()]);
          const model = new Model();
          let loseNext = false;
          const fetch: FetchLike = async (url, init) => {
            const res = await server.fetch(url, init);
            if (loseNext) {
              loseNext = false;
              throw new TypeError("connection reset after the server answered");
            }
            return res;
          };
          for (const c of commands) {
            if (c.op === "push") {
              if (c.failure === "network") server.failNext.push("network");
              if (c.failure === "busy") server.failNext.push(503);
              if (c.failure === "lost") loseNext = true;
              await pushAll(db, { fetch });
              server.failNext = [];
              loseNext = false;
            } else if (c.op === "pull") {
              await pullAll(db, { fetch });
            } else if (c.op === "office") {
              if (!withOffice) continue;
              const id = model.ids.get(model.key(c.kind, c.slot));
              const existing = [...server.records.values()].find((r) => r.row.id === id);
              if (!id || !existing || existing.row.deletedAt || Object.keys(c.patch).length === 0) continue;
              server.serverWrite(c.kind, PROJECT_ID, id, c.patch);
            } else {
              await runLocal(db, model, c);
            }
            await expectConsecutiveIds(db);
            // Without other editors the person always sees exactly what they entered.
            if (!withOffice) expect(await deviceSnapshot(db)).toEqual(model.snapshot());
          }

          // Quiescence: everything sent and pulled.
          expect(await pushAll(db, { fetch })).not.toMatchObject({ kind: "failed" });
          expect(await pullAll(db, { fetch })).toMatchObject({ kind: "ok" });
          expect(await db.outbox.count()).toBe(0);
          expect(await db.records("placements").where("pending").equals(1).count()).toBe(0);

          // Every mutation id was answered exactly once by the server, none skipped.
          const clientId = (await getMeta(db, "clientId"))!;
          const client = server.clients.get(clientId);
          const next = (await getMeta(db, "nextMutationId"))!;
          expect(client?.lastMutationId ?? 0).toBe(next - 1);
          expect([...(client?.results.keys() ?? [])].sort((a, b) => a - b)).toEqual(Array.from({ length: next - 1 }, (_, i) => i + 1));
          // Conflicting payloads are kept on the server.
          for (const result of client?.results.values() ?? []) {
            if (result.result === "conflict") expect(server.conflicts.some((c) => c.id === result.conflictId)).toBe(true);
          }

          const serverRows = [...server.records.values()];
          const kinds = new Map(serverRows.map((r) => [r.row.id, r.type as Kind]));
          const serverSnapshot = snapshot(serverRows.map((r) => r.row), (row) => kinds.get(row.id)!);
          const device = await deviceSnapshot(db);
          expect(device).toEqual(serverSnapshot);
          if (!withOffice) {
            expect(server.conflicts).toEqual([]);
            expect(device).toEqual(model.snapshot());
          }
          await cleanupDbs();
        },
      ),
      { numRuns: 60 },
    );
  }, 180_000);
});

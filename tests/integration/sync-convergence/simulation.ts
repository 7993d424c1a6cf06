// The simulated devices of the sync convergence property: the fields they edit, the random steps,
// a device's local store and outbox, and the ledger of what was sent and answered.
import { randomUUID } from "node:crypto";
import fc from "fast-check";
import { expect } from "vitest";
import { type ConflictSummary, type Cursor, type Mutation, type MutationResult, type SyncedRecord } from "@/lib/sync/protocol";
import { type TestUser } from "../helpers";

export const MAX_STEPS = 25;

// ---------------------------------------------------------------------------------------------
// The fields the devices edit: measured values the server may merge onto a newer version
// (registry `mergeable`) and free text it never merges.

export type SimType = "placements" | "deliveries";
type FieldDef = { name: string; value: (n: number) => string | number };

const GRIDS = ["A-D/1-4", "B-C/2-3", "C-F/3-6", "A/1", "D-E/5-7"];
export const FIELDS: Record<SimType, readonly FieldDef[]> = {
  placements: [
    { name: "plannedVolumeM3", value: (n) => 5 + (n % 200) * 0.5 }, // mergeable
    { name: "leastDimensionMm", value: (n) => 100 + (n % 50) * 10 }, // mergeable
    { name: "grid", value: (n) => GRIDS[n % GRIDS.length] }, // free text
    { name: "element", value: (n) => `Wall W${n % 7}` }, // free text
  ],
  deliveries: [
    { name: "revolutions", value: (n) => n % 300 }, // mergeable
    { name: "ticketNumber", value: (n) => `T-${1000 + (n % 9)}` }, // free text
    { name: "truck", value: (n) => `B-${n % 5}` }, // free text
  ],
};
/** What a copy is compared on (besides version and the tombstone). */
export const COMPARED: Record<SimType, readonly string[]> = {
  placements: ["element", "level", "grid", "elementType", "plannedVolumeM3", "leastDimensionMm"],
  deliveries: ["placementId", "ticketNumber", "truck", "volumeM3", "revolutions"],
};

// ---------------------------------------------------------------------------------------------
// Steps

export type Fault = "none" | "lostAnswer" | "transient";
export type Step =
  | { op: "createPlacement"; dev: number; n: number }
  | { op: "createDelivery"; dev: number; pick: number; n: number }
  | { op: "update"; dev: number; pick: number; field: number; n: number; second: number | null }
  | { op: "delete"; dev: number; pick: number }
  | { op: "resolve"; dev: number; pick: number; keepMine: boolean }
  | { op: "offline"; dev: number }
  | { op: "online"; dev: number }
  | { op: "sync"; dev: number; fault: Fault; at: number }
  | { op: "syncAll" };

const dev = fc.nat(2);
const pick = fc.nat(20);
const n = fc.nat(1_000);
export const stepArb: fc.Arbitrary<Step> = fc.oneof(
  { weight: 3, arbitrary: fc.record({ op: fc.constant("createPlacement" as const), dev, n }) },
  { weight: 3, arbitrary: fc.record({ op: fc.constant("createDelivery" as const), dev, pick, n }) },
  {
    weight: 6,
    arbitrary: fc.record({
      op: fc.constant("update" as const),
      dev,
      pick,
      field: fc.nat(3),
      n,
      second: fc.option(fc.nat(3), { freq: 4 }),
    }),
  },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("delete" as const), dev, pick }) },
  { weight: 3, arbitrary: fc.record({ op: fc.constant("resolve" as const), dev, pick, keepMine: fc.boolean() }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("offline" as const), dev }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("online" as const), dev }) },
  {
    weight: 4,
    arbitrary: fc.record({
      op: fc.constant("sync" as const),
      dev,
      fault: fc.constantFrom<Fault>("none", "none", "none", "lostAnswer", "transient"),
      at: fc.nat(3),
    }),
  },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("syncAll" as const) }) },
);
export const scenarioArb = fc.record({
  devices: fc.integer({ min: 2, max: 3 }),
  // Small pages make the pull page (hasMore) within one sync.
  pullLimit: fc.constantFrom(2, 5, 500),
  steps: fc.array(stepArb, { minLength: 12, maxLength: MAX_STEPS, size: "max" }),
});
export type Scenario = { devices: number; pullLimit: number; steps: Step[] };

// ---------------------------------------------------------------------------------------------
// A device: its own user and client id, a local store (server copy per record, the visible row is
// the copy with the waiting outbox entries re-applied), an outbox with consecutive ids, a cursor.

export type LocalRow = { type: SimType; serverCopy: SyncedRecord | null };

/** How one waiting change shows on the device (mirrors lib/sync/client/replay applyEntry). */
export function applyLocal(row: SyncedRecord | undefined, m: Mutation): SyncedRecord | undefined {
  switch (m.name) {
    case "create": {
      const values = { ...m.args };
      delete values.id;
      if (row) return { ...row, ...values };
      return { ...values, id: m.recordId, projectId: m.projectId, version: 0, changeSeq: 0, deletedAt: null };
    }
    case "update":
      return row && { ...row, ...(m.args.patch as Record<string, unknown>) };
    case "resolve":
      return row && { ...row, ...((m.args.patch ?? {}) as Record<string, unknown>) };
    case "delete":
      return row && { ...row, deletedAt: row.deletedAt ?? "deleted on the device" };
    default:
      return row;
  }
}

export class Device {
  readonly clientId = randomUUID();
  online = true;
  nextMutationId = 1;
  outbox: Mutation[] = [];
  cursor: Cursor | null = null;
  rows = new Map<string, LocalRow>();
  openConflicts: ConflictSummary[] = [];

  constructor(
    readonly index: number,
    readonly user: TestUser,
    readonly projectId: string,
    readonly pullLimit: number,
  ) {}

  waiting(id: string) {
    return this.outbox.filter((m) => m.recordId === id);
  }

  visible(id: string): SyncedRecord | undefined {
    let row = this.rows.get(id)?.serverCopy ?? undefined;
    for (const m of this.waiting(id)) row = applyLocal(row, m);
    return row;
  }

  /** Visible, not deleted records (of one type), in the order the run created them. */
  live(labels: Map<string, number>, type?: SimType) {
    const out: { id: string; type: SimType; row: SyncedRecord }[] = [];
    for (const [id, local] of this.rows) {
      if (type && local.type !== type) continue;
      const row = this.visible(id);
      if (row && !row.deletedAt) out.push({ id, type: local.type, row });
    }
    return out.sort((a, b) => (labels.get(a.id) ?? 0) - (labels.get(b.id) ?? 0));
  }

  /** The base version of a new change: none while another change to the record waits (mutate.ts). */
  baseVersionFor(id: string): number | undefined {
    if (this.waiting(id).length > 0) return undefined;
    const version = this.rows.get(id)?.serverCopy?.version ?? 0;
    return version >= 1 ? version : undefined;
  }

  enqueue(type: SimType, m: Omit<Mutation, "id" | "projectId" | "recordType">) {
    if (!this.rows.has(m.recordId)) this.rows.set(m.recordId, { type, serverCopy: null });
    const mutation: Mutation = { ...m, id: this.nextMutationId++, recordType: type, projectId: this.projectId };
    if (mutation.baseVersion === undefined) delete mutation.baseVersion;
    this.outbox.push(mutation);
  }

  /** Rows that exist neither on the server copy nor in a waiting change are gone. */
  collect() {
    for (const [id, local] of this.rows) if (!local.serverCopy && this.waiting(id).length === 0) this.rows.delete(id);
  }
}

// ---------------------------------------------------------------------------------------------
// What was sent and answered, across devices, for the checks at quiescence.

export type Stats = {
  runs: number;
  steps: number;
  mutations: number;
  applied: number;
  conflicts: number;
  rejected: number;
  lostAnswers: number;
  transient: number;
  resent: number;
  resolves: number;
};
export const stats: Stats = {
  runs: 0,
  steps: 0,
  mutations: 0,
  applied: 0,
  conflicts: 0,
  rejected: 0,
  lostAnswers: 0,
  transient: 0,
  resent: 0,
  resolves: 0,
};

export class Ledger {
  readonly sent = new Map<string, { clientId: string; mutation: Mutation }>();
  readonly answers = new Map<string, MutationResult>();

  recordSent(clientId: string, m: Mutation) {
    const key = `${clientId}/${m.id}`;
    const before = this.sent.get(key);
    // A change is sent again unchanged (after a lost answer or a 503): same id, same payload.
    if (before) {
      stats.resent++;
      expect(m, `mutation ${key} was sent again with another payload`).toEqual(before.mutation);
    } else this.sent.set(key, { clientId, mutation: structuredClone(m) });
  }

  recordAnswer(clientId: string, result: MutationResult) {
    const key = `${clientId}/${result.id}`;
    const before = this.answers.get(key);
    // Promise 2: a replayed mutation is answered with its stored result.
    if (before) {
      expect(result, `mutation ${key} was answered differently on replay`).toEqual(before);
    } else this.answers.set(key, result);
  }
}

// SYNC.md promises 1, 2 and 4 as a property (fast-check): two or three simulated devices edit one
// project offline and online in random interleavings, and sync through the real push and pull
// (lib/sync/server) against the real database. At quiescence:
//   (a) every device's copy equals the server's rows of the project (version, fields, tombstone);
//   (b) every mutation ever sent has exactly one stored row in sync_mutations, with the payload sent,
//       and its outcome is kept: applied (and the server row shows it, or a later applied change of
//       the same field), a conflict (the conflicts row holds the client payload), or rejected with a
//       message (a signed refusal also keeps the payload as a conflict);
//   (c) nothing is doubled: the project's rows are exactly the records whose create was applied.
// Reproduce a failure with the seed (and path) it reports: SYNC_PROPERTY_SEED=… SYNC_PROPERTY_PATH=…
import { randomUUID } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { conflicts, deliveries, placements, syncMutations } from "@/db/schema";
import {
  MAX_MUTATIONS_PER_PUSH,
  SYNC_SCHEMA_VERSION,
  type ConflictSummary,
  type Cursor,
  type Mutation,
  type MutationResult,
  type PullResponse,
  type PushResponse,
  type SyncedRecord,
} from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";
import { isTransient, pushMutations, type PushHooks } from "@/lib/sync/server/push";
import { addMembership, createProject, createUser, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";

const SEED = Number(process.env.SYNC_PROPERTY_SEED ?? 1);
const PATH = process.env.SYNC_PROPERTY_PATH || undefined;
const NUM_RUNS = Number(process.env.SYNC_PROPERTY_RUNS ?? 20);
const MAX_STEPS = 25;

// ---------------------------------------------------------------------------------------------
// The fields the devices edit: measured values the server may merge onto a newer version
// (registry `mergeable`) and free text it never merges.

type SimType = "placements" | "deliveries";
type FieldDef = { name: string; value: (n: number) => string | number };

const GRIDS = ["A-D/1-4", "B-C/2-3", "C-F/3-6", "A/1", "D-E/5-7"];
const FIELDS: Record<SimType, readonly FieldDef[]> = {
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
const COMPARED: Record<SimType, readonly string[]> = {
  placements: ["element", "level", "grid", "elementType", "plannedVolumeM3", "leastDimensionMm"],
  deliveries: ["placementId", "ticketNumber", "truck", "volumeM3", "revolutions"],
};

// ---------------------------------------------------------------------------------------------
// Steps

type Fault = "none" | "lostAnswer" | "transient";
type Step =
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
const stepArb: fc.Arbitrary<Step> = fc.oneof(
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
const scenarioArb = fc.record({
  devices: fc.integer({ min: 2, max: 3 }),
  // Small pages make the pull page (hasMore) within one sync.
  pullLimit: fc.constantFrom(2, 5, 500),
  steps: fc.array(stepArb, { minLength: 12, maxLength: MAX_STEPS, size: "max" }),
});
type Scenario = { devices: number; pullLimit: number; steps: Step[] };

// ---------------------------------------------------------------------------------------------
// A device: its own user and client id, a local store (server copy per record, the visible row is
// the copy with the waiting outbox entries re-applied), an outbox with consecutive ids, a cursor.

type LocalRow = { type: SimType; serverCopy: SyncedRecord | null };

/** How one waiting change shows on the device (mirrors lib/sync/client/replay applyEntry). */
function applyLocal(row: SyncedRecord | undefined, m: Mutation): SyncedRecord | undefined {
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

class Device {
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

type Stats = {
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
const stats: Stats = {
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

class Ledger {
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

type Run = { devices: Device[]; ledger: Ledger; labels: Map<string, number>; projectId: string };

const serializationFailure = () => Object.assign(new Error("could not serialize access (injected)"), { code: "40001" });

/** The next batch, as lib/sync/client/push takeBatch: at most one change per record. */
function takeBatch(device: Device): Mutation[] {
  const batch: Mutation[] = [];
  const seen = new Set<string>();
  for (const m of device.outbox) {
    if (batch.length >= MAX_MUTATIONS_PER_PUSH || seen.has(m.recordId)) break;
    if (m.name !== "create" && m.baseVersion === undefined) {
      // Its predecessor was acknowledged by a pull: the version the device has now.
      const version = device.rows.get(m.recordId)?.serverCopy?.version ?? 0;
      m.baseVersion = version >= 1 ? version : 1;
    }
    seen.add(m.recordId);
    batch.push(m);
  }
  return batch;
}

function handleResult(device: Device, run: Run, result: MutationResult) {
  run.ledger.recordAnswer(device.clientId, result);
  const index = device.outbox.findIndex((m) => m.id === result.id);
  if (index < 0) return; // already acknowledged by a pull
  const [m] = device.outbox.splice(index, 1);
  let successorBase: number;
  const local = device.rows.get(m.recordId)!;
  if (result.result === "applied") {
    successorBase = result.version ?? (m.baseVersion !== undefined ? m.baseVersion + 1 : 1);
    const copy = applyLocal(local.serverCopy ?? undefined, m);
    if (copy) local.serverCopy = { ...copy, version: successorBase };
  } else {
    successorBase = m.baseVersion ?? 1;
  }
  const next = device.waiting(m.recordId)[0];
  if (next && next.name !== "create" && next.baseVersion === undefined) next.baseVersion = successorBase;
  device.collect();
}

/** Sends the whole outbox; false when the push did not complete (lost answer, 503). */
async function push(device: Device, run: Run, fault: Fault, at: number): Promise<boolean> {
  for (;;) {
    const batch = takeBatch(device);
    if (batch.length === 0) return true;
    for (const m of batch) run.ledger.recordSent(device.clientId, m);
    let applied = 0;
    const hooks: PushHooks =
      fault === "transient"
        ? {
            afterApply: async () => {
              if (applied++ === at) throw serializationFailure();
            },
          }
        : {};
    let response: PushResponse;
    try {
      response = await pushMutations(
        device.user,
        { clientId: device.clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: structuredClone(batch) },
        hooks,
      );
    } catch (error) {
      // 503: the device keeps every entry and tries again later (deadlocks between devices land here too).
      if (isTransient(error)) {
        stats.transient++;
        return false;
      }
      throw error;
    }
    if (fault === "lostAnswer") {
      stats.lostAnswers++;
      return false;
    }
    expect(response.results.map((r) => r.id)).toEqual(batch.map((m) => m.id));
    for (const result of response.results) handleResult(device, run, result);
  }
}

/** Pulls until !hasMore, applying each page as lib/sync/client/apply-pull does. */
async function pull(device: Device) {
  for (let page = 0; page < 1_000; page++) {
    // Through JSON, as the device receives it (dates as strings).
    const response = JSON.parse(
      JSON.stringify(
        await pullChanges(device.user, {
          clientId: device.clientId,
          schemaVersion: SYNC_SCHEMA_VERSION,
          cursor: device.cursor,
          limit: device.pullLimit,
        }),
      ),
    ) as PullResponse;
    if (response.reset) for (const local of device.rows.values()) local.serverCopy = null;
    device.outbox = device.outbox.filter((m) => m.id > response.lastMutationId);
    for (const change of response.changes) {
      expect(["placements", "deliveries"]).toContain(change.recordType);
      device.rows.set(change.record.id, { type: change.recordType as SimType, serverCopy: change.record });
    }
    device.openConflicts = response.conflicts;
    device.cursor = response.cursor;
    device.collect();
    if (!response.hasMore) return;
  }
  throw new Error("the pull never ended");
}

async function sync(device: Device, run: Run, fault: Fault = "none", at = 0) {
  if (!device.online) return;
  // After a failed push the device backs off; it pulls only after a push that completed.
  if (await push(device, run, fault, at)) await pull(device);
}

function step(run: Run, s: Step): Promise<void> | void {
  if (s.op === "syncAll") {
    // Every online device at once: pushes and pulls interleave in the database.
    return Promise.all(run.devices.map((d) => sync(d, run))).then(() => undefined);
  }
  const device = run.devices[s.dev % run.devices.length];
  // A local edit goes to the first device, from the one named, that has something to edit.
  const editor = (type?: SimType) => {
    for (let i = 0; i < run.devices.length; i++) {
      const d = run.devices[(s.dev + i) % run.devices.length];
      const records = d.live(run.labels, type);
      if (records.length > 0) return { device: d, records };
    }
    return null;
  };
  switch (s.op) {
    case "offline":
      device.online = false;
      return;
    case "online":
      device.online = true;
      return;
    case "sync":
      return sync(device, run, s.fault, s.at);
    case "createPlacement": {
      const body = validBody("placements");
      const [volume, , grid, element] = FIELDS.placements;
      const args = { ...body, plannedVolumeM3: volume.value(s.n), grid: grid.value(s.n), element: element.value(s.n) };
      run.labels.set(body.id as string, run.labels.size);
      device.enqueue("placements", { name: "create", recordId: body.id as string, args });
      return;
    }
    case "createDelivery": {
      const found = editor("placements");
      if (!found) return;
      const parent = found.records[s.pick % found.records.length];
      const body = validBody("deliveries", parent.id);
      const args = { ...body, revolutions: FIELDS.deliveries[0].value(s.n), ticketNumber: FIELDS.deliveries[1].value(s.n) };
      run.labels.set(body.id as string, run.labels.size);
      found.device.enqueue("deliveries", { name: "create", recordId: body.id as string, args });
      return;
    }
    case "update": {
      const found = editor();
      if (!found) return;
      const { id, type } = found.records[s.pick % found.records.length];
      const fields = FIELDS[type];
      const patch: Record<string, unknown> = {};
      const first = fields[s.field % fields.length];
      patch[first.name] = first.value(s.n);
      if (s.second !== null) {
        const second = fields[s.second % fields.length];
        patch[second.name] = second.value(s.n + 1);
      }
      found.device.enqueue(type, { name: "update", recordId: id, args: { patch }, baseVersion: found.device.baseVersionFor(id) });
      return;
    }
    case "delete": {
      const found = editor();
      if (!found) return;
      const { id, type } = found.records[s.pick % found.records.length];
      found.device.enqueue(type, { name: "delete", recordId: id, args: {}, baseVersion: found.device.baseVersionFor(id) });
      return;
    }
    case "resolve": {
      // A person answers one of the conflicts the last pull showed: keep the device's values
      // (when it was an edit) or keep the server's (an empty patch).
      const unanswered = (d: Device) => {
        const answered = new Set(d.outbox.filter((m) => m.name === "resolve").map((m) => m.args.conflictId));
        return d.openConflicts.filter((c) => !answered.has(c.id) && d.rows.get(c.recordId)?.serverCopy);
      };
      const resolver = run.devices.map((_, i) => run.devices[(s.dev + i) % run.devices.length]).find((d) => unanswered(d).length > 0);
      if (!resolver) return;
      const open = unanswered(resolver);
      const c = open[s.pick % open.length];
      const payload = c.clientPayload as { name: string; args: { patch?: Record<string, unknown> } };
      const patch = s.keepMine && payload.name === "update" ? (payload.args.patch ?? {}) : {};
      stats.resolves++;
      resolver.enqueue(c.recordType as SimType, {
        name: "resolve",
        recordId: c.recordId,
        args: { conflictId: c.id, patch },
        baseVersion: resolver.baseVersionFor(c.recordId),
      });
      return;
    }
  }
}

// ---------------------------------------------------------------------------------------------
// The checks at quiescence.

type Projection = Record<string, unknown>;
function project(type: SimType, row: Record<string, unknown>): Projection {
  const out: Projection = { type, version: row.version, deleted: row.deletedAt != null };
  for (const field of COMPARED[type]) out[field] = row[field] ?? null;
  return out;
}

async function serverRows(projectId: string): Promise<Map<string, Projection>> {
  const wire = (rows: unknown[]) => JSON.parse(JSON.stringify(rows)) as Record<string, unknown>[];
  const out = new Map<string, Projection>();
  for (const row of wire(await db.select().from(placements).where(eq(placements.projectId, projectId)))) {
    out.set(row.id as string, project("placements", row));
  }
  for (const row of wire(await db.select().from(deliveries).where(eq(deliveries.projectId, projectId)))) {
    out.set(row.id as string, project("deliveries", row));
  }
  return out;
}

async function checkQuiescence(run: Run) {
  for (const device of run.devices) {
    expect(device.outbox, `device ${device.index} still has waiting changes`).toEqual([]);
  }
  const server = await serverRows(run.projectId);

  // (a) Convergence: every copy equals the server's rows.
  for (const device of run.devices) {
    const local = new Map<string, Projection>();
    for (const [id, row] of device.rows) local.set(id, project(row.type, device.visible(id)!));
    expect(Object.fromEntries(local), `device ${device.index}'s copy differs from the server`).toEqual(Object.fromEntries(server));
  }

  // (b) Every payload survives: one stored row per mutation sent, with its payload and outcome.
  const clientIds = run.devices.map((d) => d.clientId);
  const stored = await db.select().from(syncMutations).where(inArray(syncMutations.clientId, clientIds));
  expect(stored.length, "sync_mutations rows vs mutations sent").toBe(run.ledger.sent.size);
  const storedConflicts = new Map((await db.select().from(conflicts).where(eq(conflicts.projectId, run.projectId))).map((c) => [c.id, c]));
  const usedConflicts = new Set<string>();
  const appliedCreates = new Set<string>();
  // Per record and field: the applied change with the highest version that set it.
  const lastWrite = new Map<string, Map<string, { version: number; value: unknown; by: string }>>();
  const versionsSeen = new Map<string, Set<number>>();

  for (const row of stored) {
    const key = `${row.clientId}/${row.mutationId}`;
    const sent = run.ledger.sent.get(key);
    expect(sent, `stored mutation ${key} was never sent`).toBeDefined();
    const m = sent!.mutation;
    expect({ name: row.name, recordType: row.recordType, projectId: row.projectId, recordId: row.recordId, args: row.args, baseVersion: row.baseVersion }).toEqual({
      name: m.name,
      recordType: m.recordType,
      projectId: m.projectId,
      recordId: m.recordId,
      args: m.args,
      baseVersion: m.baseVersion ?? null,
    });
    const answer = run.ledger.answers.get(key);
    if (answer) {
      expect({ result: row.result, version: row.version ?? undefined, conflictId: row.conflictId ?? undefined, reason: row.reason ?? undefined }).toEqual({
        result: answer.result,
        version: answer.version,
        conflictId: answer.conflictId,
        reason: answer.reason,
      });
    }

    if (m.name === "resolve" && Object.keys((m.args.patch ?? {}) as object).length === 0) {
      // Keeping the server's values needs nothing from the record, so it always closes the conflict.
      expect({ key, result: row.result, reason: row.reason, message: row.message }).toMatchObject({ result: "applied" });
    }
    if (row.result === "applied") {
      stats.applied++;
      if (m.name === "resolve") {
        const closed = storedConflicts.get(m.args.conflictId as string);
        expect(closed?.resolvedAt, `applied resolve ${key} left its conflict open`).toBeTruthy();
      }
      expect(row.version, `applied ${key} has no version`).toBeGreaterThanOrEqual(1);
      const target = server.get(m.recordId);
      expect(target, `applied ${key} (${m.name}) has no server row`).toBeDefined();
      expect(target!.version as number).toBeGreaterThanOrEqual(row.version!);
      const values =
        m.name === "create"
          ? m.args
          : m.name === "update" || m.name === "resolve"
            ? ((m.args.patch ?? {}) as Record<string, unknown>)
            : {};
      if (m.name === "create") appliedCreates.add(m.recordId);
      if (m.name === "delete") expect(target!.deleted, `applied delete ${key} left the record alive`).toBe(true);
      if (Object.keys(values).length > 0) {
        // Each value-setting change makes its own version (a repeated delete may return the same one).
        const seen = versionsSeen.get(m.recordId) ?? new Set<number>();
        expect(seen.has(row.version!), `two applied changes of ${m.recordId} share version ${row.version}`).toBe(false);
        seen.add(row.version!);
        versionsSeen.set(m.recordId, seen);
        const fields = lastWrite.get(m.recordId) ?? new Map();
        for (const [field, value] of Object.entries(values)) {
          if (!COMPARED[m.recordType as SimType].includes(field)) continue;
          const before = fields.get(field);
          if (!before || before.version < row.version!) fields.set(field, { version: row.version!, value, by: key });
        }
        lastWrite.set(m.recordId, fields);
      }
    } else if (row.result === "conflict" || row.reason === "signed") {
      if (row.result === "conflict") stats.conflicts++;
      else stats.rejected++;
      expect(row.conflictId, `${row.result} ${key} kept no conflict`).toBeTruthy();
      const c = storedConflicts.get(row.conflictId!);
      expect(c, `conflict of ${key} is missing`).toBeDefined();
      expect(c).toMatchObject({ recordId: m.recordId, recordType: m.recordType, clientPayload: { name: m.name, args: m.args }, reason: row.reason });
      usedConflicts.add(row.conflictId!);
    } else {
      stats.rejected++;
      expect(row.result).toBe("rejected");
      expect(row.message, `rejected ${key} stored no message`).toBeTruthy();
    }
  }
  // Every conflict of the project belongs to exactly one mutation.
  expect([...storedConflicts.keys()].sort()).toEqual([...usedConflicts].sort());
  // Applied values are on the server unless a later applied change set the same field.
  for (const [recordId, fields] of lastWrite) {
    const row = server.get(recordId)!;
    for (const [field, { value, by }] of fields) {
      expect(row[field], `${field} of ${recordId}: the last applied change (${by}) is not on the server`).toEqual(value);
    }
  }

  // (c) No duplicates: the project's rows are exactly the records whose create was applied.
  expect([...server.keys()].sort()).toEqual([...appliedCreates].sort());
}

// ---------------------------------------------------------------------------------------------

async function newRun(scenario: Scenario): Promise<Run> {
  const project = await createProject();
  const roles = ["superintendent", "office", "superintendent"] as const;
  const devices: Device[] = [];
  for (let i = 0; i < scenario.devices; i++) {
    const user = await createUser({ name: `device ${i + 1} (${roles[i]}) ${project.code}` });
    await addMembership(user.id, project.id, roles[i]);
    devices.push(new Device(i + 1, user, project.id, scenario.pullLimit));
  }
  return { devices, ledger: new Ledger(), labels: new Map(), projectId: project.id };
}

async function runScenario(scenario: Scenario) {
  stats.runs++;
  const run = await newRun(scenario);
  // A shared start: the first device records a placement with a truck, and everyone syncs.
  const start: Step[] = [
    { op: "createPlacement", dev: 0, n: 0 },
    { op: "createDelivery", dev: 0, pick: 0, n: 0 },
    { op: "syncAll" },
  ];
  for (const s of [...start, ...scenario.steps]) {
    stats.steps++;
    await step(run, s);
  }
  // Quiescence: everyone online, each device syncs twice (one after another).
  for (const device of run.devices) device.online = true;
  for (let round = 0; round < 2; round++) for (const device of run.devices) await sync(device, run);
  stats.mutations += run.ledger.sent.size;
  await checkQuiescence(run);
}

describe("sync convergence: cases the property found", () => {
  it("keeping the server's values closes a conflict on a record deleted meanwhile", async () => {
    // Found by the property (seeds 1 and 4, 60 runs, before the fix): the office deletes a placement while the field, offline, edits its
    // grid; the edit is kept as a conflict (reason "deleted"). Answering it with "keep the server's
    // version" (an empty patch) must close it, or it shows on every pull for ever.
    const project = await createProject();
    const field = await createUser({ name: `field ${project.code}` });
    const office = await createUser({ name: `office ${project.code}` });
    await addMembership(field.id, project.id, "superintendent");
    await addMembership(office.id, project.id, "office");
    const [fieldDevice, officeDevice] = [randomUUID(), randomUUID()];
    const send = (user: TestUser, clientId: string, mutations: Mutation[]) =>
      pushMutations(user, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations });
    const body = validBody("placements");
    const base = { recordType: "placements" as const, projectId: project.id, recordId: body.id as string };

    await send(field, fieldDevice, [{ ...base, id: 1, name: "create", args: body }]);
    await send(office, officeDevice, [{ ...base, id: 1, name: "delete", args: {}, baseVersion: 1 }]);
    const edit = await send(field, fieldDevice, [{ ...base, id: 2, name: "update", args: { patch: { grid: "B-C/2-3" } }, baseVersion: 1 }]);
    expect(edit.results[0]).toMatchObject({ result: "conflict", reason: "deleted" });
    const conflictId = edit.results[0].conflictId!;
    const shown = await pullChanges(field, { clientId: fieldDevice, schemaVersion: SYNC_SCHEMA_VERSION, cursor: null });
    expect(shown.conflicts.map((c) => c.id)).toEqual([conflictId]);

    const answer = await send(field, fieldDevice, [{ ...base, id: 3, name: "resolve", args: { conflictId, patch: {} }, baseVersion: 2 }]);
    expect(answer.results[0]).toMatchObject({ result: "applied", version: 2 });
    const [closed] = await db.select().from(conflicts).where(eq(conflicts.id, conflictId));
    expect(closed.resolvedAt).not.toBeNull();
    const after = await pullChanges(field, { clientId: fieldDevice, schemaVersion: SYNC_SCHEMA_VERSION, cursor: shown.cursor });
    expect(after.conflicts).toEqual([]);
  });
});

describe("sync convergence (property)", () => {
  it(`random offline/online edits on 2–3 devices converge and keep every payload (seed ${SEED})`, async () => {
    const started = Date.now();
    try {
      await fc.assert(fc.asyncProperty(scenarioArb, runScenario), {
        seed: SEED,
        path: PATH,
        numRuns: NUM_RUNS,
        // Shrinking re-runs scenarios against the database: bounded, then the smallest case so far is reported.
        interruptAfterTimeLimit: 90_000,
        markInterruptAsFailure: false,
      });
    } catch (error) {
      throw new Error(
        `sync convergence failed; reproduce with SYNC_PROPERTY_SEED=${SEED} (and SYNC_PROPERTY_PATH from the report)\n${(error as Error).message}`,
        { cause: error },
      );
    } finally {
      console.log(
        `sync convergence: seed ${SEED}, ${stats.runs} runs, ${stats.steps} steps, ${stats.mutations} mutations ` +
          `(${stats.applied} applied, ${stats.conflicts} conflicts, ${stats.rejected} rejected; ${stats.resolves} resolves), ` +
          `${stats.lostAnswers} lost answers, ${stats.transient} transient failures, ${stats.resent} mutations sent again, ` +
          `${((Date.now() - started) / 1000).toFixed(1)} s`,
      );
    }
  }, 150_000);
});

// One step of a scenario on the simulated devices, and a device's sync through the real push and
// pull (lib/sync/server), as lib/sync/client does it.
import { expect } from "vitest";
import { MAX_MUTATIONS_PER_PUSH, SYNC_SCHEMA_VERSION, type Mutation, type MutationResult, type PullResponse, type PushResponse } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";
import { isTransient, pushMutations, type PushHooks } from "@/lib/sync/server/push";
import { validBody } from "../record-fixtures";
import { SimType, FIELDS, Fault, Step, applyLocal, Device, stats, Ledger } from "./simulation";

export type Run = { devices: Device[]; ledger: Ledger; labels: Map<string, number>; projectId: string };

export const serializationFailure = () => Object.assign(new Error("could not serialize access (injected)"), { code: "40001" });

/** The next batch, as lib/sync/client/push takeBatch: at most one change per record. */
export function takeBatch(device: Device): Mutation[] {
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

export function handleResult(device: Device, run: Run, result: MutationResult) {
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
export async function push(device: Device, run: Run, fault: Fault, at: number): Promise<boolean> {
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
export async function pull(device: Device) {
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

export async function sync(device: Device, run: Run, fault: Fault = "none", at = 0) {
  if (!device.online) return;
  // After a failed push the device backs off; it pulls only after a push that completed.
  if (await push(device, run, fault, at)) await pull(device);
}

export function step(run: Run, s: Step): Promise<void> | void {
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

// A scenario from start to quiescence, and the checks (a), (b), (c) of the property at quiescence.
import { eq, inArray } from "drizzle-orm";
import { expect } from "vitest";
import { db } from "@/db";
import { conflicts, deliveries, placements, syncMutations } from "@/db/schema";
import { addMembership, createProject, createUser } from "../helpers";
import { SimType, COMPARED, Step, Scenario, Device, stats, Ledger } from "./simulation";
import { Run, sync, step } from "./sync-steps";

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

export async function checkQuiescence(run: Run) {
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

export async function runScenario(scenario: Scenario) {
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

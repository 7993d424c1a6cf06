// Housekeeping (lib/housekeeping/prune.ts). The property: pruning stored sync results never removes
// one a device can still replay. A simulated device (its outbox and acknowledged watermark, as in
// lib/sync/client) talks to the real push, the real acknowledgement on pull and the real prune, in
// random orders with lost answers; after every step, every change still in the device's outbox that
// the server has applied must find its stored result, and a replay must answer exactly as the first
// time (SYNC.md promise 2, "the stored result is returned on replay").
import { randomUUID } from "node:crypto";
import { and, eq, lte, sql } from "drizzle-orm";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { invitations, rateLimits, signInTokens, syncClients, syncMutations } from "@/db/schema";
import { pruneInvitations, pruneRateLimits, pruneSignInTokens, pruneSyncResults } from "@/lib/housekeeping/prune";
import { SYNC_SCHEMA_VERSION, type Mutation, type MutationResult } from "@/lib/sync/protocol";
import { recordAck } from "@/lib/sync/server/ack";
import { pushMutations } from "@/lib/sync/server/push";
import { projectWithTeam, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";

type Step = { op: "write" } | { op: "push"; lost: boolean; n: number } | { op: "pull"; lost: boolean } | { op: "prune" };

const stepArb: fc.Arbitrary<Step> = fc.oneof(
  { weight: 3, arbitrary: fc.constant({ op: "write" as const }) },
  { weight: 3, arbitrary: fc.record({ op: fc.constant("push" as const), lost: fc.boolean(), n: fc.integer({ min: 1, max: 4 }) }) },
  { weight: 2, arbitrary: fc.record({ op: fc.constant("pull" as const), lost: fc.boolean() }) },
  { weight: 2, arbitrary: fc.constant({ op: "prune" as const }) },
);

class Device {
  outbox: Mutation[] = [];
  nextId = 1;
  acked = 0;
  constructor(readonly clientId: string, readonly projectId: string) {}
  write() {
    const body = validBody("placements");
    // Every third change is invalid on purpose, so "rejected" results take part too.
    const args = this.nextId % 3 === 0 ? { ...body, name: "" } : body;
    this.outbox.push({ id: this.nextId++, name: "create", recordType: "placements", projectId: this.projectId, recordId: body.id as string, args });
  }
}

async function serverWatermark(clientId: string) {
  const [row] = await db.select().from(syncClients).where(eq(syncClients.id, clientId));
  return row?.lastMutationId ?? 0;
}

async function runScenario(user: TestUser, projectId: string, steps: Step[]) {
  const device = new Device(randomUUID(), projectId);
  const firstAnswers = new Map<number, MutationResult>();
  const run = async (step: Step) => {
    if (step.op === "write") device.write();
    if (step.op === "push" && device.outbox.length) {
      const response = await pushMutations(user, { clientId: device.clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: device.outbox.slice(0, step.n) });
      for (const r of response.results) {
        if (!firstAnswers.has(r.id)) firstAnswers.set(r.id, r);
        else expect(r).toEqual(firstAnswers.get(r.id)); // a replay answers as the first time
      }
      // Answered entries leave the outbox (lib/sync/client/push.ts); a lost answer leaves them all.
      if (!step.lost) device.outbox = device.outbox.filter((m) => !response.results.some((r) => r.id === m.id));
    }
    if (step.op === "pull") {
      await recordAck(user, device.clientId, device.acked);
      const last = await serverWatermark(device.clientId);
      if (!step.lost) {
        device.outbox = device.outbox.filter((m) => m.id > last);
        device.acked = last;
      }
    }
    if (step.op === "prune") await pruneSyncResults();
  };
  for (const step of steps) {
    await run(step);
    // The invariant: whatever the device may still send, the server can still answer as before.
    const last = await serverWatermark(device.clientId);
    for (const m of device.outbox.filter((e) => e.id <= last)) {
      const [stored] = await db
        .select()
        .from(syncMutations)
        .where(and(eq(syncMutations.clientId, device.clientId), eq(syncMutations.mutationId, m.id)));
      expect(stored, `result of change ${m.id} pruned while it is still in the outbox`).toBeDefined();
    }
  }
  // At rest (everything sent, answered and acknowledged), a prune leaves no accepted result behind.
  while (device.outbox.length) await run({ op: "push", lost: false, n: 4 });
  await run({ op: "pull", lost: false });
  await run({ op: "pull", lost: false });
  await pruneSyncResults();
  const left = await db
    .select({ result: syncMutations.result })
    .from(syncMutations)
    .where(and(eq(syncMutations.clientId, device.clientId), lte(syncMutations.mutationId, device.acked)));
  expect(left.every((r) => r.result === "rejected")).toBe(true);
  expect(left.length).toBe(firstAnswers.size ? [...firstAnswers.values()].filter((r) => r.result === "rejected").length : 0);
}

describe("housekeeping", () => {
  it("pruning never removes a sync result a device can still replay (property)", async () => {
    const { project, team } = await projectWithTeam();
    await fc.assert(
      fc.asyncProperty(fc.array(stepArb, { minLength: 1, maxLength: 20 }), (steps) => runScenario(team.superintendent, project.id, steps)),
      { numRuns: Number(process.env.PRUNE_PROPERTY_RUNS ?? 15), seed: Number(process.env.PRUNE_PROPERTY_SEED ?? 7) },
    );
  }, 240_000);

  it("an acknowledgement never passes what the server applied, never moves back, and only counts for the device's owner", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const body = validBody("placements");
    await pushMutations(team.superintendent, {
      clientId,
      schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [{ id: 1, name: "create", recordType: "placements", projectId: project.id, recordId: body.id as string, args: body }],
    });
    const acked = async () => (await db.select().from(syncClients).where(eq(syncClients.id, clientId)))[0].ackedMutationId;
    await recordAck(team.inspector, clientId, 1);
    expect(await acked()).toBe(0);
    await recordAck(team.superintendent, clientId, 50);
    expect(await acked()).toBe(1);
    await recordAck(team.superintendent, clientId, 0);
    expect(await acked()).toBe(1);
  });

  it("prunes used or expired sign-in links and invitations and finished rate-limit windows, and nothing else", async () => {
    const { team } = await projectWithTeam();
    const hour = 3_600_000;
    const tag = randomUUID();
    const hash = (s: string) => `${tag}-${s}`.padEnd(64, "0").slice(0, 64);
    await db.insert(signInTokens).values([
      { tokenHash: hash("a"), userId: team.owner.id, expiresAt: new Date(Date.now() + hour) },
      { tokenHash: hash("b"), userId: team.owner.id, expiresAt: new Date(Date.now() + hour), usedAt: new Date() },
      { tokenHash: hash("c"), userId: team.owner.id, expiresAt: new Date(Date.now() - hour) },
    ]);
    await db.insert(invitations).values([
      { email: `${tag}@example.test`, name: "Open", tokenHash: hash("d"), expiresAt: new Date(Date.now() + hour) },
      { email: `${tag}@example.test`, name: "Accepted", tokenHash: hash("e"), expiresAt: new Date(Date.now() + hour), acceptedAt: new Date() },
      { email: `${tag}@example.test`, name: "Expired", tokenHash: hash("f"), expiresAt: new Date(Date.now() - hour) },
    ]);
    await db.insert(rateLimits).values([
      { key: `${tag}:live`, points: 2, expire: Date.now() + hour },
      { key: `${tag}:over`, points: 5, expire: Date.now() - 1000 },
      { key: `${tag}:forever`, points: 1, expire: null },
    ]);
    expect(await pruneSignInTokens()).toBeGreaterThanOrEqual(2);
    expect(await pruneInvitations()).toBeGreaterThanOrEqual(2);
    expect(await pruneRateLimits()).toBeGreaterThanOrEqual(1);
    const like = (col: unknown) => sql`${col}::text like ${tag + "%"}`;
    expect((await db.select().from(signInTokens).where(like(signInTokens.tokenHash))).map((r) => r.tokenHash)).toEqual([hash("a")]);
    expect((await db.select().from(invitations).where(like(invitations.tokenHash))).map((r) => r.name)).toEqual(["Open"]);
    expect((await db.select().from(rateLimits).where(like(rateLimits.key))).map((r) => r.key).sort()).toEqual([`${tag}:forever`, `${tag}:live`]);
  });
});

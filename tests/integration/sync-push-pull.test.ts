import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries, conflicts, deliveries, placements, syncClients } from "@/db/schema";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { POST as pullRoute } from "@/app/api/sync/pull/route";
import { markPlacementSigned } from "@/lib/placements/mark-signed";
import { transitionPlacement } from "@/lib/placements/transition";
import { createRecord } from "@/lib/records/write";
import { SYNC_SCHEMA_VERSION, type Mutation, type PullResponse } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";
import { pushMutations } from "@/lib/sync/server/push";
import { callRoute, projectWithTeam, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";

const push = (user: TestUser, clientId: string, mutations: Mutation[]) =>
  callRoute(pushRoute, { user, body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations } });

function createPlacement(id: number, projectId: string, extra: Record<string, unknown> = {}): Mutation {
  const body = validBody("placements");
  return { id, name: "create", recordType: "placements", projectId, recordId: body.id as string, args: { ...body, ...extra } };
}

async function countPlacements(projectId: string) {
  const r = await db.select({ n: sql<number>`count(*)::int` }).from(placements).where(eq(placements.projectId, projectId));
  return r[0].n;
}

async function watermark(clientId: string) {
  const [c] = await db.select().from(syncClients).where(eq(syncClients.id, clientId));
  return c?.lastMutationId ?? 0;
}

/** Moves a placement to "placed" the way the crew would. */
async function toPlaced(team: Awaited<ReturnType<typeof projectWithTeam>>["team"], projectId: string, id: string) {
  let v = 1;
  for (const [to, who] of [["ready", "superintendent"], ["cleared", "inspector"], ["placing", "superintendent"], ["placed", "superintendent"]] as const) {
    v = (await transitionPlacement({ user: team[who] }, projectId, id, { to, baseVersion: v })).version;
  }
  return v;
}

describe("sync push", () => {
  it("replaying a batch three times gives one set of rows and identical results", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const batch = [createPlacement(1, project.id), createPlacement(2, project.id)];
    const update: Mutation = { id: 3, name: "update", recordType: "placements", projectId: project.id, recordId: batch[0].recordId, args: { patch: { grid: "B-C/2-3" } }, baseVersion: 1 };
    batch.push(update);
    const answers = [];
    for (let i = 0; i < 3; i++) answers.push(await push(team.superintendent, clientId, batch));
    for (const a of answers) expect(a.status).toBe(200);
    expect(answers[1].json).toEqual(answers[0].json);
    expect(answers[2].json).toEqual(answers[0].json);
    expect(answers[0].json.results.map((r: { result: string }) => r.result)).toEqual(["applied", "applied", "applied"]);
    expect(await countPlacements(project.id)).toBe(2);
    const [row] = await db.select().from(placements).where(eq(placements.id, batch[0].recordId));
    expect(row).toMatchObject({ grid: "B-C/2-3", version: 2 });
    const audits = await db.select().from(auditEntries).where(eq(auditEntries.recordId, batch[0].recordId));
    expect(audits).toHaveLength(2);
    expect(audits.every((a) => a.deviceId === clientId)).toBe(true);
  });

  it("a gap applies nothing after it and names the expected id", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const res = await push(team.superintendent, clientId, [createPlacement(1, project.id), createPlacement(3, project.id)]);
    expect(res.status).toBe(409);
    expect(res.json.error).toMatchObject({ code: "conflict", reason: "gap", expectedId: 2 });
    expect(await countPlacements(project.id)).toBe(1);
    expect(await watermark(clientId)).toBe(1);
  });

  it("a permanent error is recorded as rejected and advances the watermark", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const bad = createPlacement(1, project.id, { plannedVolumeM3: -5 });
    const res = await push(team.superintendent, clientId, [bad, createPlacement(2, project.id)]);
    expect(res.status).toBe(200);
    expect(res.json.results[0]).toMatchObject({ id: 1, result: "rejected", reason: "invalid" });
    expect(res.json.results[0].message).toMatch(/volume/i);
    expect(res.json.results[1]).toMatchObject({ id: 2, result: "applied" });
    expect(res.json.lastMutationId).toBe(2);
    expect(await countPlacements(project.id)).toBe(1);
  });

  it("a role that may not write is rejected (forbidden) and the queue moves on", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const res = await push(team.owner, clientId, [createPlacement(1, project.id)]);
    expect(res.json.results[0]).toMatchObject({ result: "rejected", reason: "forbidden" });
    expect(await watermark(clientId)).toBe(1);
  });

  it("a transient error does not advance the watermark and leaves nothing written", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const m = createPlacement(1, project.id);
    const serializationFailure = Object.assign(new Error("could not serialize access"), { code: "40001" });
    await expect(
      pushMutations(team.superintendent, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [m] }, {
        afterApply: async () => {
          throw serializationFailure;
        },
      }),
    ).rejects.toBe(serializationFailure);
    expect(await watermark(clientId)).toBe(0);
    expect(await countPlacements(project.id)).toBe(0);
    // The retry goes through.
    const retry = await push(team.superintendent, clientId, [m]);
    expect(retry.json.results[0].result).toBe("applied");
  });

  it("a failure between the record write and the watermark leaves neither (nor an audit entry)", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const m = createPlacement(1, project.id);
    await expect(
      pushMutations(team.superintendent, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [m] }, {
        afterApply: async () => {
          throw new Error("power cut");
        },
      }),
    ).rejects.toThrow("power cut");
    expect(await countPlacements(project.id)).toBe(0);
    expect(await db.select().from(auditEntries).where(eq(auditEntries.recordId, m.recordId))).toHaveLength(0);
    expect(await watermark(clientId)).toBe(0);
  });

  it("another user's client id is refused for the whole request", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    await push(team.superintendent, clientId, [createPlacement(1, project.id)]);
    const stolen = await push(team.inspector, clientId, [createPlacement(2, project.id)]);
    expect(stolen.status).toBe(403);
    expect(await countPlacements(project.id)).toBe(1);
    const pull = await callRoute(pullRoute, { user: team.inspector, body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor: null } });
    expect(pull.status).toBe(403);
  });

  it("a stale edit of free text becomes a conflict with both payloads; a stale measured value merges", async () => {
    const { project, team } = await projectWithTeam();
    const delivery = await (async () => {
      const p = validBody("placements");
      await createRecord({ user: team.superintendent }, "placements", project.id, p);
      const d = validBody("deliveries", p.id as string);
      return (await createRecord({ user: team.superintendent }, "deliveries", project.id, d)).record;
    })();
    const office = randomUUID();
    const field = randomUUID();
    // The office corrects the ticket; the field, still on version 1, edits the same ticket number.
    await push(team.office, office, [{ id: 1, name: "update", recordType: "deliveries", projectId: project.id, recordId: delivery.id, args: { patch: { ticketNumber: "T-OFFICE" } }, baseVersion: 1 }]);
    const res = await push(team.superintendent, field, [
      { id: 1, name: "update", recordType: "deliveries", projectId: project.id, recordId: delivery.id, args: { patch: { ticketNumber: "T-FIELD" } }, baseVersion: 1 },
      { id: 2, name: "update", recordType: "deliveries", projectId: project.id, recordId: delivery.id, args: { patch: { revolutions: 240 } }, baseVersion: 1 },
    ]);
    expect(res.json.results[0]).toMatchObject({ result: "conflict", reason: "stale" });
    expect(res.json.results[1]).toMatchObject({ result: "applied" });
    const [c] = await db.select().from(conflicts).where(eq(conflicts.id, res.json.results[0].conflictId));
    expect(c.clientPayload).toMatchObject({ args: { patch: { ticketNumber: "T-FIELD" } } });
    expect(c.serverPayload).toMatchObject({ ticketNumber: "T-OFFICE" });
    const [row] = await db.select().from(deliveries).where(eq(deliveries.id, delivery.id));
    expect(row).toMatchObject({ ticketNumber: "T-OFFICE", revolutions: 240 });

    // The conflict shows in the field user's pull, and resolving it is a synced change.
    const pulled = await pullChanges(team.superintendent, { clientId: field, schemaVersion: SYNC_SCHEMA_VERSION, cursor: null });
    expect(pulled.conflicts.map((x) => x.id)).toContain(c.id);
    const resolve = await push(team.superintendent, field, [
      { id: 3, name: "resolve", recordType: "deliveries", projectId: project.id, recordId: delivery.id, args: { conflictId: c.id, patch: { ticketNumber: "T-FIELD" } }, baseVersion: row.version },
    ]);
    expect(resolve.json.results[0]).toMatchObject({ result: "applied" });
    const [after] = await db.select().from(deliveries).where(eq(deliveries.id, delivery.id));
    expect(after.ticketNumber).toBe("T-FIELD");
    const [closed] = await db.select().from(conflicts).where(eq(conflicts.id, c.id));
    expect(closed.resolvedAt).not.toBeNull();
    expect(await db.select().from(auditEntries).where(and(eq(auditEntries.recordId, c.id), eq(auditEntries.action, "resolve")))).toHaveLength(1);
  });

  it("a push racing a sign-off: one wins, the other payload is kept", async () => {
    const { project, team } = await projectWithTeam();
    const p = validBody("placements");
    await createRecord({ user: team.superintendent }, "placements", project.id, p);
    const d = validBody("deliveries", p.id as string);
    await createRecord({ user: team.superintendent }, "deliveries", project.id, d);
    const version = await toPlaced(team, project.id, p.id as string);
    const clientId = randomUUID();
    const lateEdit: Mutation = { id: 1, name: "update", recordType: "deliveries", projectId: project.id, recordId: d.id as string, args: { patch: { ticketNumber: "T-LATE" } }, baseVersion: 1 };

    const [signed, pushed] = await Promise.allSettled([
      markPlacementSigned({ user: team.inspector }, project.id, p.id as string, { baseVersion: version }),
      push(team.superintendent, clientId, [lateEdit]),
    ]);
    expect(pushed.status).toBe("fulfilled");
    const result = (pushed as PromiseFulfilledResult<{ json: { results: { result: string; reason?: string; conflictId?: string }[] } }>).value.json.results[0];
    if (signed.status === "fulfilled") {
      // Signed first (or the edit applied first and the signature still held the latest version).
      const [delivery] = await db.select().from(deliveries).where(eq(deliveries.id, d.id as string));
      if (result.result === "rejected") {
        expect(result.reason).toBe("signed");
        const [kept] = await db.select().from(conflicts).where(eq(conflicts.id, result.conflictId!));
        expect(kept.clientPayload).toMatchObject({ args: { patch: { ticketNumber: "T-LATE" } } });
        expect(delivery.ticketNumber).not.toBe("T-LATE");
      } else {
        expect(result.result).toBe("applied");
        expect(delivery.ticketNumber).toBe("T-LATE");
      }
    } else {
      // The edit won; the signature was refused and can be given again on the new version.
      expect(result.result).toBe("applied");
    }

    // Deterministic order: sign first, then the late edit arrives.
    const p2 = validBody("placements");
    await createRecord({ user: team.superintendent }, "placements", project.id, p2);
    const d2 = validBody("deliveries", p2.id as string);
    await createRecord({ user: team.superintendent }, "deliveries", project.id, d2);
    await markPlacementSigned({ user: team.inspector }, project.id, p2.id as string, { baseVersion: await toPlaced(team, project.id, p2.id as string) });
    const late = await push(team.superintendent, clientId, [{ ...lateEdit, id: 2, recordId: d2.id as string }]);
    expect(late.json.results[0]).toMatchObject({ result: "rejected", reason: "signed" });
    const [kept] = await db.select().from(conflicts).where(eq(conflicts.id, late.json.results[0].conflictId));
    expect(kept).toMatchObject({ reason: "signed", recordId: d2.id });
  });
});

describe("sync pull", () => {
  it("pages through changes with hasMore and a per-project cursor, tombstones included", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const creates = Array.from({ length: 5 }, (_, i) => createPlacement(i + 1, project.id));
    await push(team.superintendent, clientId, creates);
    await push(team.superintendent, clientId, [{ id: 6, name: "delete", recordType: "placements", projectId: project.id, recordId: creates[0].recordId, args: {}, baseVersion: 1 }]);

    const seen = new Map<string, { deletedAt: string | null }>();
    let cursor: PullResponse["cursor"] | null = null;
    let pages = 0;
    let first: PullResponse | null = null;
    for (;;) {
      const res = await callRoute(pullRoute, { user: team.superintendent, body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor, limit: 2 } });
      expect(res.status).toBe(200);
      const page = res.json as PullResponse;
      first ??= page;
      pages++;
      for (const c of page.changes) seen.set(c.record.id, c.record);
      cursor = page.cursor;
      if (!page.hasMore) break;
    }
    expect(first!.reset).toBe(true);
    expect(first!.lastMutationId).toBe(6);
    expect(pages).toBeGreaterThanOrEqual(3);
    expect(seen.size).toBe(5);
    expect(seen.get(creates[0].recordId)!.deletedAt).not.toBeNull();
    const again = await pullChanges(team.superintendent, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor });
    expect(again).toMatchObject({ reset: false, hasMore: false, changes: [] });
  });

  it("a cursor naming a project the user lost, or another schema version, resets", async () => {
    const { project, team, otherProject } = await projectWithTeam();
    const clientId = randomUUID();
    const lost = await pullChanges(team.owner, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor: { [project.id]: 0, [otherProject.id]: 4 } });
    expect(lost.reset).toBe(true);
    expect(Object.keys(lost.cursor)).toEqual([project.id]);
    const schema = await pullChanges(team.owner, { clientId, schemaVersion: SYNC_SCHEMA_VERSION + 1, cursor: lost.cursor });
    expect(schema.reset).toBe(true);
  });

  it("the pull-cursor race: a slow transaction committing after a faster one loses no row", async () => {
    const { project, team } = await projectWithTeam();
    const clientId = randomUUID();
    const start = await pullChanges(team.office, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor: null });
    const slow = validBody("placements");
    const fast = validBody("placements");

    let releaseSlow!: () => void;
    const slowMayCommit = new Promise<void>((r) => (releaseSlow = r));
    let slowWrote!: () => void;
    const slowHasWritten = new Promise<void>((r) => (slowWrote = r));
    const slowTx = db.transaction(async (tx) => {
      await createRecord({ user: team.superintendent, tx }, "placements", project.id, slow);
      slowWrote();
      await slowMayCommit; // holds its change number, uncommitted
    });
    await slowHasWritten;
    const fastWrite = createRecord({ user: team.superintendent }, "placements", project.id, fast);

    // While the slow one is open, a pull sees neither (the fast one waits for the change-number lock).
    await new Promise((r) => setTimeout(r, 200));
    const during = await pullChanges(team.office, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor: start.cursor });
    expect(during.changes.map((c) => c.record.id)).toEqual([]);

    releaseSlow();
    await slowTx;
    await fastWrite;
    const after = await pullChanges(team.office, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor: during.cursor });
    expect(after.changes.map((c) => c.record.id)).toEqual([slow.id, fast.id]);
  });
});

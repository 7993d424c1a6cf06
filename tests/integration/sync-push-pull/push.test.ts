// Sync push: replays, gaps, rejected and transient errors, the watermark, and whose client id it is.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries, placements } from "@/db/schema";
import { POST as pullRoute } from "@/app/api/sync/pull/route";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { pushMutations } from "@/lib/sync/server/push";
import { callRoute, projectWithTeam } from "../helpers";
import { push, createPlacement, countPlacements, watermark } from "./helpers";

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

});

// Sync pull: pages and cursors, resets, and the pull-cursor race.
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { POST as pullRoute } from "@/app/api/sync/pull/route";
import { createRecord } from "@/lib/records/write";
import { SYNC_SCHEMA_VERSION, type PullResponse } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";
import { callRoute, projectWithTeam } from "../helpers";
import { validBody } from "../record-fixtures";
import { push, createPlacement } from "./helpers";

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

// Sync push against newer server data: stale edits become conflicts or merge; a push racing a sign-off.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries, conflicts, deliveries } from "@/db/schema";
import { markPlacementSigned } from "@/lib/placements/mark-signed";
import { createRecord } from "@/lib/records/write";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";
import { projectWithTeam } from "../helpers";
import { validBody } from "../record-fixtures";
import { push, toPlaced } from "./helpers";

describe("sync push", () => {
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

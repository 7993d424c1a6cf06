// Who may record visits and findings through the sync push, and a finding's life: open → answered → closed → reopened.
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries } from "@/db/schema";
import { validBody } from "../record-fixtures";
import { s, push, findingRow, move, newVisit, setUpSiteVisits } from "./helpers";

setUpSiteVisits();

describe("who may record visits and findings (sync push)", () => {
  it("the inspector creates them; the superintendent and the owner cannot (rejected, nothing stored)", async () => {
    const { visitId } = await newVisit();
    for (const who of ["superintendent", "owner"] as const) {
      const body = validBody("findings", visitId);
      const r = await push(s.team[who], { name: "create", recordType: "findings", recordId: body.id as string, args: body });
      expect(r, who).toMatchObject({ result: "rejected", reason: "forbidden" });
      expect(await findingRow(body.id as string)).toBeUndefined();
      const visit = validBody("site-visits");
      expect((await push(s.team[who], { name: "create", recordType: "site-visits", recordId: visit.id as string, args: visit })).result).toBe("rejected");
    }
  });

  it("a finding cannot change state by an edit (the lifecycle is its own action)", async () => {
    const { findingId } = await newVisit();
    const r = await push(s.team.inspector, { name: "update", recordType: "findings", recordId: findingId, args: { patch: { state: "closed" } }, baseVersion: 1 });
    expect(r).toMatchObject({ result: "rejected", reason: "invalid" });
    expect((await findingRow(findingId)).state).toBe("open");
  });
});

describe("a finding's life through /api/sync/push: open → answered → closed → reopened", () => {
  it("each step is made by its role only; the wrong role is refused and nothing changes", async () => {
    const { findingId } = await newVisit();
    let f = await findingRow(findingId);
    expect(f.state).toBe("open");

    // open → answered: the superintendent only, with what was done.
    expect(await move(s.team.inspector, findingId, { to: "answered", response: "Fixed" }, f.version)).toMatchObject({ result: "rejected", reason: "forbidden" });
    expect(await move(s.team.office, findingId, { to: "answered", response: "Fixed" }, f.version)).toMatchObject({ result: "rejected", reason: "forbidden" });
    expect(await move(s.team.superintendent, findingId, { to: "answered" }, f.version)).toMatchObject({ result: "rejected", reason: "invalid" });
    expect((await findingRow(findingId)).version).toBe(f.version);
    expect((await move(s.team.superintendent, findingId, { to: "answered", response: "Chairs raised to 40 mm cover at C/3" }, f.version)).result).toBe("applied");
    f = await findingRow(findingId);
    expect(f).toMatchObject({ state: "answered", response: "Chairs raised to 40 mm cover at C/3", answeredBy: s.team.superintendent.id });

    // answered → closed: the inspector only (after re-inspection).
    for (const who of ["superintendent", "office", "owner"] as const) {
      expect(await move(s.team[who], findingId, { to: "closed" }, f.version), who).toMatchObject({ result: "rejected", reason: "forbidden" });
    }
    expect((await move(s.team.inspector, findingId, { to: "closed", note: "Cover measured 40–45 mm" }, f.version)).result).toBe("applied");
    f = await findingRow(findingId);
    expect(f).toMatchObject({ state: "closed", closedBy: s.team.inspector.id, closeNote: "Cover measured 40–45 mm" });

    // closed → open: the inspector only, with a reason; the earlier answer stays on the record.
    expect(await move(s.team.superintendent, findingId, { to: "open", reason: "x" }, f.version)).toMatchObject({ result: "rejected", reason: "forbidden" });
    expect(await move(s.team.inspector, findingId, { to: "open" }, f.version)).toMatchObject({ result: "rejected", reason: "invalid" });
    expect((await move(s.team.inspector, findingId, { to: "open", reason: "Chair crushed under the pump line at C/4" }, f.version)).result).toBe("applied");
    f = await findingRow(findingId);
    expect(f).toMatchObject({ state: "open", reopenedBy: s.team.inspector.id, reopenReason: "Chair crushed under the pump line at C/4", closedAt: null, closedBy: null });
    expect(f.response).toBe("Chairs raised to 40 mm cover at C/3");

    // Every accepted step is in the audit trail, in order.
    const trail = await db.select().from(auditEntries).where(and(eq(auditEntries.recordId, findingId), eq(auditEntries.action, "transition"))).orderBy(auditEntries.id);
    expect(trail.map((a) => a.note?.split(":")[0])).toEqual(["open → answered", "answered → closed", "closed → open"]);
  });

  it("a move that does not exist from the current state is refused and kept (closed → answered)", async () => {
    const { findingId } = await newVisit();
    expect((await move(s.team.inspector, findingId, { to: "closed" }, 1)).result).toBe("applied");
    const r = await move(s.team.superintendent, findingId, { to: "answered", response: "Done" }, 2);
    expect(["rejected", "conflict"]).toContain(r.result);
    expect(r.reason).toBe("state");
    expect((await findingRow(findingId)).state).toBe("closed");
  });
});

// Sign-off of a visit report: who may sign, and what stops a signature (409 naming why).
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { conflicts, signOffs } from "@/db/schema";
import { s, otherInspector, visitRow, newVisit, sign, submit, setUpSiteVisits } from "./helpers";

setUpSiteVisits();

describe("sign-off of a visit report", () => {
  it("a superintendent cannot sign (403); an inspector of another project cannot (404, not a member); a wrong password is 401", async () => {
    const { visitId } = await newVisit();
    const version = await submit(visitId);
    expect((await sign(s.team.superintendent, visitId, { baseVersion: version })).status).toBe(403);
    expect((await sign(otherInspector, visitId, { baseVersion: version })).status).toBe(404);
    const wrong = await sign(s.team.inspector, visitId, { baseVersion: version, password: "not-it" });
    expect(wrong.status).toBe(401);
    expect((await visitRow(visitId)).state).toBe("submitted");
    expect(await db.select().from(signOffs).where(eq(signOffs.recordId, visitId))).toHaveLength(0);
  });

  it("a draft, an out-of-date version, or open conflicts and uploading photos are 409 naming why", async () => {
    const { visitId, findingId } = await newVisit();
    const draft = await sign(s.team.inspector, visitId, { baseVersion: 1 });
    expect(draft.status).toBe(409);
    expect(draft.json.error.message).toMatch(/Submit the visit report/);
    const version = await submit(visitId);
    const stale = await sign(s.team.inspector, visitId, { baseVersion: version - 1 });
    expect(stale.status).toBe(409);
    expect(stale.json.error.reason).toBe("stale");
    await db.insert(conflicts).values({ projectId: s.project.id, recordType: "findings", recordId: findingId, clientPayload: { x: 1 }, reason: "stale" });
    await db.execute(sql`insert into photos (id, project_id, version, change_seq, record_type, record_id, sha256, size_bytes, content_type)
      values (${randomUUID()}, ${s.project.id}, 1, 0, 'findings', ${findingId}, ${"b".repeat(64)}, 1000, 'image/jpeg')`);
    const blocked = await sign(s.team.inspector, visitId, { baseVersion: version });
    expect(blocked.status).toBe(409);
    expect(blocked.json.error.message).toMatch(/1 conflict to resolve \(findings\)/);
    expect(blocked.json.error.message).toMatch(/1 photo still uploading/);
    expect((await visitRow(visitId)).state).toBe("submitted");
  });
});

import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { conflicts, deliveries, placements, signOffs } from "@/db/schema";
import { POST as signRoute, GET as verifyRoute } from "@/app/api/projects/[projectId]/placements/[id]/sign-off/route";
import { POST as amendRoute } from "@/app/api/projects/[projectId]/placements/[id]/amendments/route";
import { GET as auditRoute } from "@/app/api/projects/[projectId]/audit/[recordId]/route";
import { transitionPlacement } from "@/lib/placements/transition";
import { createRecord, updateRecord } from "@/lib/records/write";
import { callRoute, projectWithSigningInspectors, projectWithTeam } from "./helpers";
import { validBody } from "./record-fixtures";

const PASSWORD = "inspector-password-1";
const SIGNATURE = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;
let s: Setup;
let otherInspector: Setup["team"]["inspector"];

beforeAll(async () => {
  ({ setup: s, otherInspector } = await projectWithSigningInspectors(PASSWORD));
});

async function placedPlacement() {
  const p = validBody("placements");
  await createRecord({ user: s.team.superintendent }, "placements", s.project.id, p);
  const d = validBody("deliveries", p.id as string);
  await createRecord({ user: s.team.superintendent }, "deliveries", s.project.id, d);
  let v = 1;
  for (const [to, who] of [["ready", "superintendent"], ["cleared", "inspector"], ["placing", "superintendent"], ["placed", "superintendent"]] as const) {
    v = (await transitionPlacement({ user: s.team[who] }, s.project.id, p.id as string, { to, baseVersion: v })).version;
  }
  return { id: p.id as string, deliveryId: d.id as string, version: v };
}

const sign = (user: Setup["team"]["inspector"], id: string, body: Record<string, unknown>) =>
  callRoute(signRoute, { user, params: { projectId: s.project.id, id }, body: { password: PASSWORD, typedName: "Ines Marchetti", signatureImage: SIGNATURE, ...body } });

async function signOffCount(id: string) {
  return (await db.select().from(signOffs).where(eq(signOffs.recordId, id))).length;
}

describe("sign-off of a placement", () => {
  it("a superintendent cannot sign (403); an inspector of another project cannot (404, not a member)", async () => {
    const p = await placedPlacement();
    expect((await sign(s.team.superintendent, p.id, { baseVersion: p.version })).status).toBe(403);
    expect((await sign(otherInspector, p.id, { baseVersion: p.version })).status).toBe(404);
    expect(await signOffCount(p.id)).toBe(0);
  });

  it("a wrong password is 401 and nothing is stored", async () => {
    const p = await placedPlacement();
    const res = await sign(s.team.inspector, p.id, { baseVersion: p.version, password: "not-it" });
    expect(res.status).toBe(401);
    expect(res.json.error.message).toMatch(/password is not right/);
    expect(await signOffCount(p.id)).toBe(0);
    const [row] = await db.select().from(placements).where(eq(placements.id, p.id));
    expect(row.state).toBe("placed");
  });

  it("an out-of-date version is 409; a missing signature is 400 naming the field", async () => {
    const p = await placedPlacement();
    const stale = await sign(s.team.inspector, p.id, { baseVersion: p.version - 1 });
    expect(stale.status).toBe(409);
    const noSig = await sign(s.team.inspector, p.id, { baseVersion: p.version, signatureImage: "" });
    expect(noSig.status).toBe(400);
    expect(noSig.json.error.fields.signatureImage).toMatch(/signature/);
    expect(await signOffCount(p.id)).toBe(0);
  });

  it("open conflicts or photos still uploading block the sign-off, naming them", async () => {
    const p = await placedPlacement();
    await db.insert(conflicts).values({ projectId: s.project.id, recordType: "deliveries", recordId: p.deliveryId, clientPayload: { x: 1 }, reason: "stale" });
    await db.execute(sql`insert into photos (id, project_id, version, change_seq, record_type, record_id, sha256, size_bytes, content_type)
      values (${randomUUID()}, ${s.project.id}, 1, 0, 'deliveries', ${p.deliveryId}, ${"a".repeat(64)}, 1000, 'image/jpeg')`);
    const res = await sign(s.team.inspector, p.id, { baseVersion: p.version });
    expect(res.status).toBe(409);
    expect(res.json.error.message).toMatch(/1 conflict to resolve \(deliveries\)/);
    expect(res.json.error.message).toMatch(/1 photo still uploading/);
    expect(res.json.error.pendingPhotos).toHaveLength(1);
    expect(await signOffCount(p.id)).toBe(0);
  });

  it("after sign-off every write path is refused, an amendment is accepted and shown, verification detects a change behind the app's back", async () => {
    const p = await placedPlacement();
    const ok = await sign(s.team.inspector, p.id, { baseVersion: p.version });
    expect(ok.status).toBe(200);
    expect(ok.json.signOff.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const [stored] = await db.select().from(signOffs).where(eq(signOffs.recordId, p.id));
    expect(stored).toMatchObject({ typedName: "Ines Marchetti", role: "inspector", signerId: s.team.inspector.id, signatureImage: SIGNATURE });

    await expect(updateRecord({ user: s.team.office }, "deliveries", s.project.id, p.deliveryId, { baseVersion: 1, patch: { ticketNumber: "X" } })).rejects.toMatchObject({ code: "conflict" });
    await expect(db.execute(sql`update deliveries set ticket_number = 'RAW' where id = ${p.deliveryId}`)).rejects.toMatchObject({ cause: { code: "PW409" } });

    const verify1 = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id: p.id } });
    expect(verify1.json).toMatchObject({ signed: true, matches: true });

    const amendment = { id: randomUUID(), what: "Truck 2 ticket number is T-88812, not T-88821", why: "Typed from a smudged ticket; checked against the plant's copy" };
    const byOwner = await callRoute(amendRoute, { user: s.team.owner, params: { projectId: s.project.id, id: p.id }, body: amendment });
    expect(byOwner.status).toBe(403);
    const amended = await callRoute(amendRoute, { user: s.team.office, params: { projectId: s.project.id, id: p.id }, body: amendment });
    expect(amended.status).toBe(200);
    const verify2 = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id: p.id } });
    expect(verify2.json.amendments.map((a: { what: string }) => a.what)).toEqual([amendment.what]);
    expect(verify2.json.matches).toBe(true);

    // Someone with database rights goes around the trigger: the verification notices.
    await db.transaction(async (tx) => {
      await tx.execute(sql`set local session_replication_role = replica`);
      await tx.execute(sql`update deliveries set volume_m3 = volume_m3 + 1 where id = ${p.deliveryId}`);
    });
    const verify3 = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id: p.id } });
    expect(verify3.json).toMatchObject({ signed: true, matches: false });
    const [d] = await db.select().from(deliveries).where(eq(deliveries.id, p.deliveryId));
    expect(d.ticketNumber).not.toBe("RAW");
  });

  it("the audit trail of a record is readable by every member, owners included, and not by outsiders", async () => {
    const p = await placedPlacement();
    const trail = await callRoute(auditRoute, { user: s.team.owner, params: { projectId: s.project.id, recordId: p.id } });
    expect(trail.status).toBe(200);
    expect(trail.json.map((e: { action: string }) => e.action)).toEqual(["create", "transition", "transition", "transition", "transition"]);
    expect(trail.json[1].before.state).toBe("planned");
    expect(trail.json[1].after.state).toBe("ready");
    const outsider = await callRoute(auditRoute, { user: s.outsider, params: { projectId: s.project.id, recordId: p.id } });
    expect(outsider.status).toBe(404);
  });
});

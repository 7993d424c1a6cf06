// The inspection log (issue 7 item 7 and its acceptance): a finding's life through the sync push
// with the roles allowed at each step, and a signed visit report frozen like a signed placement
// (records route, sync push, raw SQL). Roles: issue 7 ("the superintendent answers a finding …;
// the inspector closes it after re-inspection or reopens it") [product brief].
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE, PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST as createRoute } from "@/app/api/projects/[projectId]/records/[type]/route";
import { GET as verifyRoute, POST as signRoute } from "@/app/api/projects/[projectId]/site-visits/[id]/sign-off/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { db } from "@/db";
import { auditEntries, conflicts, findings, signOffs, siteVisits, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { SIGNED_VISIT_MESSAGE } from "@/lib/records/db-errors";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { callRoute, projectWithTeam, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";

const PASSWORD = "inspector-password-7";
const SIGNATURE = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;
let s: Setup;
let otherInspector: TestUser;

/** One device per user, with its own mutation counter (SYNC.md: ids rise by one per client). */
const devices = new Map<string, { clientId: string; next: number }>();
async function push(user: TestUser, m: Omit<Mutation, "id" | "projectId">) {
  const device = devices.get(user.id) ?? { clientId: randomUUID(), next: 1 };
  devices.set(user.id, device);
  const mutation = { ...m, id: device.next++, projectId: s.project.id } as Mutation;
  const res = await callRoute(pushRoute, { user, body: { clientId: device.clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [mutation] } });
  expect(res.status).toBe(200);
  return res.json.results[0] as { result: string; reason?: string; conflictId?: string; message?: string; record?: { version: number } };
}

const findingRow = async (id: string) => (await db.select().from(findings).where(eq(findings.id, id)))[0];
const visitRow = async (id: string) => (await db.select().from(siteVisits).where(eq(siteVisits.id, id)))[0];
const move = (user: TestUser, id: string, args: Record<string, unknown>, baseVersion: number) =>
  push(user, { name: "transition", recordType: "findings", recordId: id, args, baseVersion });

async function newVisit() {
  const visit = validBody("site-visits");
  expect((await push(s.team.inspector, { name: "create", recordType: "site-visits", recordId: visit.id as string, args: visit })).result).toBe("applied");
  const finding = validBody("findings", visit.id as string);
  expect((await push(s.team.inspector, { name: "create", recordType: "findings", recordId: finding.id as string, args: finding })).result).toBe("applied");
  return { visitId: visit.id as string, findingId: finding.id as string };
}

async function pgErrorOf(statement: ReturnType<typeof sql>): Promise<{ code?: string }> {
  try {
    await db.execute(statement);
  } catch (error) {
    return (error as { cause?: { code?: string } }).cause ?? (error as { code?: string });
  }
  return {};
}

const sign = (user: TestUser, id: string, body: Record<string, unknown>) =>
  callRoute(signRoute, { user, params: { projectId: s.project.id, id }, body: { password: PASSWORD, typedName: "Ines Marchetti", signatureImage: SIGNATURE, ...body } });

/** Submits the report through the sync push and returns the version to sign. */
async function submit(visitId: string) {
  const v = await visitRow(visitId);
  expect((await push(s.team.inspector, { name: "transition", recordType: "site-visits", recordId: visitId, args: { to: "submitted" }, baseVersion: v.version })).result).toBe("applied");
  return (await visitRow(visitId)).version;
}

beforeAll(async () => {
  s = await projectWithTeam();
  const hash = await hashPassword(PASSWORD);
  await db.update(users).set({ passwordHash: hash }).where(eq(users.id, s.team.inspector.id));
  const other = await projectWithTeam();
  otherInspector = other.team.inspector;
  await db.update(users).set({ passwordHash: hash }).where(eq(users.id, otherInspector.id));
});

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

describe("a signed visit report refuses changes", () => {
  let visitId: string;
  let findingId: string;
  let signedVersion: number;

  beforeAll(async () => {
    ({ visitId, findingId } = await newVisit());
    const version = await submit(visitId);
    const res = await sign(s.team.inspector, visitId, { baseVersion: version });
    expect(res.status).toBe(200);
    // Signed with the finding still open: the answer lists it as outstanding.
    expect(res.json.outstandingFindings).toEqual([{ id: findingId, state: "open" }]);
    signedVersion = res.json.visitVersion;
  });

  it("records route: update and delete of the report and its findings, and a new finding, are 409", async () => {
    const params = (type: string, id: string) => ({ projectId: s.project.id, type, id });
    const p = await callRoute(PATCH, { user: s.team.inspector, method: "PATCH", params: params("site-visits", visitId), body: { baseVersion: signedVersion, patch: { notes: "late note" } } });
    expect(p.status).toBe(409);
    expect(p.json.error.message).toBe(SIGNED_VISIT_MESSAGE);
    const f = await callRoute(PATCH, { user: s.team.office, method: "PATCH", params: params("findings", findingId), body: { baseVersion: 1, patch: { severity: "minor" } } });
    expect(f.status).toBe(409);
    expect(f.json.error.reason).toBe("signed");
    const d = await callRoute(DELETE, { user: s.team.inspector, method: "DELETE", params: params("site-visits", visitId), body: { baseVersion: signedVersion } });
    expect(d.status).toBe(409);
    const add = await callRoute(createRoute, { user: s.team.inspector, params: { projectId: s.project.id, type: "findings" }, body: validBody("findings", visitId) });
    expect(add.status).toBe(409);
    expect((await findingRow(findingId)).severity).toBe("major");
  });

  it("sync push: a late edit is rejected as signed and kept beside the report", async () => {
    const r = await push(s.team.inspector, { name: "update", recordType: "findings", recordId: findingId, args: { patch: { location: "Grid D/3" } }, baseVersion: 1 });
    expect(r).toMatchObject({ result: "rejected", reason: "signed" });
    const [kept] = await db.select().from(conflicts).where(eq(conflicts.id, r.conflictId!));
    expect(kept).toMatchObject({ reason: "signed", recordId: findingId });
    expect(kept.clientPayload).toMatchObject({ args: { patch: { location: "Grid D/3" } } });
    const v = await push(s.team.inspector, { name: "update", recordType: "site-visits", recordId: visitId, args: { patch: { weather: "Rain" } }, baseVersion: signedVersion });
    expect(v).toMatchObject({ result: "rejected", reason: "signed" });
    expect((await visitRow(visitId)).weather).toBe("Overcast, 8 °C");
  });

  it("raw SQL: the trigger refuses changes to the report and to its findings' observations (SQLSTATE PW409)", async () => {
    const refusals = [
      sql`update site_visits set notes = 'edited behind the app' where id = ${visitId}`,
      sql`update site_visits set state = 'submitted' where id = ${visitId}`,
      sql`delete from site_visits where id = ${visitId}`,
      sql`update findings set description = 'nothing wrong' where id = ${findingId}`,
      sql`update findings set severity = 'minor' where id = ${findingId}`,
      sql`update findings set deleted_at = now() where id = ${findingId}`,
      sql`delete from findings where id = ${findingId}`,
      sql`insert into findings (id, project_id, change_seq, site_visit_id, description, severity)
          values (${randomUUID()}, ${s.project.id}, 1, ${visitId}, 'late finding', 'minor')`,
    ];
    for (const statement of refusals) expect((await pgErrorOf(statement)).code).toBe("PW409");
    expect(await visitRow(visitId)).toMatchObject({ state: "signed", notes: "" });
    expect(await findingRow(findingId)).toMatchObject({ description: validBody("findings", visitId).description, deletedAt: null });
  });

  it("raw SQL: photos of the signed report are frozen; a finding's photos stay, and new evidence may still be added", async () => {
    const photo = (recordType: string, recordId: string, id = randomUUID()) =>
      sql`insert into photos (id, project_id, version, change_seq, record_type, record_id, sha256, size_bytes, content_type)
          values (${id}, ${s.project.id}, 1, 0, ${recordType}, ${recordId}, ${"c".repeat(64)}, 1000, 'image/jpeg')`;
    expect((await pgErrorOf(photo("site-visits", visitId))).code).toBe("PW409");
    const evidence = randomUUID();
    expect(await pgErrorOf(photo("findings", findingId, evidence))).toEqual({});
    // The server completing the upload is allowed; changing or removing the photo is not.
    expect(await pgErrorOf(sql`update photos set stored_at = now(), storage_key = 'k', version = 2 where id = ${evidence}`)).toEqual({});
    for (const statement of [
      sql`update photos set caption = 'another view' where id = ${evidence}`,
      sql`update photos set sha256 = ${"d".repeat(64)} where id = ${evidence}`,
      sql`update photos set deleted_at = now() where id = ${evidence}`,
      sql`delete from photos where id = ${evidence}`,
    ]) {
      expect((await pgErrorOf(statement)).code).toBe("PW409");
    }
    await db.execute(sql`alter table photos disable trigger photos_signed_visit_frozen`);
    await db.execute(sql`delete from photos where id = ${evidence}`);
    await db.execute(sql`alter table photos enable trigger photos_signed_visit_frozen`);
  });

  it("the follow-up goes on after the sign-off, and the report still matches what was signed", async () => {
    expect((await move(s.team.superintendent, findingId, { to: "answered", response: "Chairs replaced" }, 1)).result).toBe("applied");
    expect((await move(s.team.inspector, findingId, { to: "closed" }, 2)).result).toBe("applied");
    const check = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id: visitId } });
    expect(check.status).toBe(200);
    expect(check.json).toMatchObject({ signed: true, matches: true, outstandingFindings: [] });
    expect(check.json.signOff.contentHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("the verification detects a finding changed behind the application's back", async () => {
    await db.transaction(async (tx) => {
      await tx.execute(sql`alter table findings disable trigger findings_signed_frozen`);
      await tx.execute(sql`update findings set location = 'Grid Z/9' where id = ${findingId}`);
      await tx.execute(sql`alter table findings enable trigger findings_signed_frozen`);
    });
    const check = await callRoute(verifyRoute, { user: s.team.office, params: { projectId: s.project.id, id: visitId } });
    expect(check.json).toMatchObject({ signed: true, matches: false });
  });

  it("an unsigned report's findings can still change in SQL (the trigger is specific)", async () => {
    const open = await newVisit();
    expect((await pgErrorOf(sql`update findings set location = 'Grid A/1' where id = ${open.findingId}`)).code).toBeUndefined();
  });
});

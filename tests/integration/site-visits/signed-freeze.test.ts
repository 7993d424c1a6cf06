// A signed visit report refuses changes through the records route, the sync push and raw SQL.
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE, PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST as createRoute } from "@/app/api/projects/[projectId]/records/[type]/route";
import { GET as verifyRoute } from "@/app/api/projects/[projectId]/site-visits/[id]/sign-off/route";
import { db } from "@/db";
import { conflicts } from "@/db/schema";
import { SIGNED_VISIT_MESSAGE } from "@/lib/records/db-errors";
import { callRoute } from "../helpers";
import { validBody } from "../record-fixtures";
import { s, push, findingRow, visitRow, move, newVisit, pgErrorOf, sign, submit, setUpSiteVisits } from "./helpers";

setUpSiteVisits();

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

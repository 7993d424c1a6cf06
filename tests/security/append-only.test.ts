// Finding 12 (first half): signatures, amendments and the audit trail are protected by the database.
// Attack: rewrite or remove a signature, an amendment or an audit entry with plain SQL on the app's
// connection (as a bug or an injected statement would). Each is refused with SQLSTATE PW409 and the
// rows are unchanged; deleting a whole project still removes its records.
// [PostgreSQL docs 41.10 "Trigger Functions": BEFORE row triggers that raise abort the statement]
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as amendRoute } from "@/app/api/projects/[projectId]/placements/[id]/amendments/route";
import { db } from "@/db";
import { amendments, auditEntries, signOffs } from "@/db/schema";
import { callRoute } from "../integration/helpers";
import { signedPlacement, teamWithPasswords, type Setup } from "./fixtures";

const snapshot = async (recordId: string, amendmentId: string) => ({
  signOffs: await db.select().from(signOffs).where(eq(signOffs.recordId, recordId)),
  amendments: await db.select().from(amendments).where(eq(amendments.id, amendmentId)),
  audit: await db.select().from(auditEntries).where(eq(auditEntries.recordId, recordId)),
});

describe("append-only tables", () => {
  let s: Setup;
  let placementId: string;
  let amendmentId: string;
  beforeAll(async () => {
    s = await teamWithPasswords();
    placementId = (await signedPlacement(s)).id;
    amendmentId = randomUUID();
    const res = await callRoute(amendRoute, {
      user: s.team.inspector,
      params: { projectId: s.project.id, id: placementId },
      body: { id: amendmentId, what: "Slump read 100 mm, not 10 mm", why: "A digit was dropped when typed" },
    });
    expect(res.status).toBe(200);
  });

  it.each([
    ["rewrite a signature's hash", (id: string) => sql`update sign_offs set content_hash = repeat('0', 64) where record_id = ${id}`],
    ["put another name on a signature", (id: string) => sql`update sign_offs set typed_name = 'Someone Else' where record_id = ${id}`],
    ["remove a signature", (id: string) => sql`delete from sign_offs where record_id = ${id}`],
    ["reword an amendment", (_id: string, a: string) => sql`update amendments set what = 'nothing happened' where id = ${a}`],
    ["remove an amendment", (_id: string, a: string) => sql`delete from amendments where id = ${a}`],
    ["rewrite the audit trail", (id: string) => sql`update audit_entries set user_id = null where record_id = ${id}`],
    ["remove the audit trail", (id: string) => sql`delete from audit_entries where record_id = ${id}`],
    ["truncate the audit trail", () => sql`truncate audit_entries`],
  ])("%s: refused (PW409), nothing changed", async (_name, statement) => {
    const before = await snapshot(placementId, amendmentId);
    expect(before.signOffs.length).toBeGreaterThan(0);
    await expect(db.execute(statement(placementId, amendmentId))).rejects.toMatchObject({ cause: { code: "PW409" } });
    expect(await snapshot(placementId, amendmentId)).toEqual(before);
  });

  it("new entries are still appended", async () => {
    const count = async () => (await db.execute(sql`select count(*)::int as n from audit_entries`)).rows[0] as { n: number };
    const before = (await count()).n;
    const res = await callRoute(amendRoute, {
      user: s.team.office,
      params: { projectId: s.project.id, id: placementId },
      body: { id: randomUUID(), what: "Ticket 4 volume 8.0 m3, not 0.8", why: "Decimal point misplaced" },
    });
    expect(res.status).toBe(200);
    expect((await count()).n).toBe(before + 1);
  });
});

// The inspector's review and the amendments' signatures, beyond what placement-transitions and
// sign-off already check: who may clear or hold (issue 7 acceptance: a superintendent cannot clear,
// hold or sign, 403; an inspector of another project cannot, 403 or 404), that nothing reaches
// placing before it is cleared (PRODUCT.md: planned → ready → cleared → placing), and that an
// amendment can itself be signed with the same password, name and signature as a sign-off.
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as transitionRoute } from "@/app/api/projects/[projectId]/placements/[id]/transition/route";
import { POST as signRoute, GET as verifyRoute } from "@/app/api/projects/[projectId]/placements/[id]/sign-off/route";
import { POST as amendRoute } from "@/app/api/projects/[projectId]/placements/[id]/amendments/route";
import { POST as signAmendmentRoute } from "@/app/api/projects/[projectId]/placements/[id]/amendments/[amendmentId]/sign-off/route";
import { db } from "@/db";
import { placements, signOffs, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { callRoute, projectWithTeam, type TestUser } from "./helpers";
import { makeRecord } from "./record-fixtures";

const PASSWORD = "inspection-password-7";
// A 1×1 PNG (the smallest valid image the schema takes).
const SIGNATURE = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;
let s: Setup;
let other: Setup;

beforeAll(async () => {
  s = await projectWithTeam();
  other = await projectWithTeam();
  const hash = await hashPassword(PASSWORD);
  for (const u of [s.team.inspector, s.team.office, s.team.superintendent, other.team.inspector]) {
    await db.update(users).set({ passwordHash: hash }).where(eq(users.id, u.id));
  }
});

const move = (user: TestUser, id: string, body: unknown, projectId = s.project.id) => callRoute(transitionRoute, { user, params: { projectId, id }, body });
const stateOf = async (id: string) => (await db.select().from(placements).where(eq(placements.id, id)))[0];

async function readyPlacement() {
  const p = await makeRecord("placements", s.project.id, s.team);
  const res = await move(s.team.superintendent, p.id, { to: "ready", baseVersion: 1 });
  expect(res.status).toBe(200);
  return p.id;
}

describe("clear or hold", () => {
  it("a superintendent can neither clear nor hold (403), and the placement stays ready", async () => {
    const id = await readyPlacement();
    const clear = await move(s.team.superintendent, id, { to: "cleared", baseVersion: 2 });
    const hold = await move(s.team.superintendent, id, { to: "held", reason: "I would like to wait", baseVersion: 2 });
    expect([clear.status, hold.status]).toEqual([403, 403]);
    expect(hold.json.error.message).toBe("Only the inspector can move a placement from “Ready for inspection” to “Held”.");
    expect(await stateOf(id)).toMatchObject({ state: "ready", version: 2, holdReason: null });
  });

  it("an inspector of another project cannot clear or hold: 404 through this project (not a member), 404 through theirs", async () => {
    const id = await readyPlacement();
    expect((await move(other.team.inspector, id, { to: "cleared", baseVersion: 2 })).status).toBe(404);
    expect((await move(other.team.inspector, id, { to: "held", reason: "Not mine", baseVersion: 2 })).status).toBe(404);
    expect((await move(other.team.inspector, id, { to: "cleared", baseVersion: 2 }, other.project.id)).status).toBe(404);
    expect(await stateOf(id)).toMatchObject({ state: "ready", version: 2 });
  });

  it("nothing goes to placing before it is cleared: ready → placing and held → placing are 409", async () => {
    const id = await readyPlacement();
    const early = await move(s.team.superintendent, id, { to: "placing", baseVersion: 2 });
    expect(early.status).toBe(409);
    expect(early.json.error.allowed).toEqual(["planned", "cleared", "held"]);
    await move(s.team.inspector, id, { to: "held", reason: "Cover short at SW-3", baseVersion: 2 });
    const whileHeld = await move(s.team.superintendent, id, { to: "placing", baseVersion: 3 });
    expect(whileHeld.status).toBe(409);
    expect(whileHeld.json.error.message).toBe("This placement is held. Next: the superintendent can ask for inspection.");
    // fixed, ready again, cleared: now it may start
    await move(s.team.superintendent, id, { to: "ready", baseVersion: 3 });
    await move(s.team.inspector, id, { to: "cleared", baseVersion: 4 });
    expect((await move(s.team.superintendent, id, { to: "placing", baseVersion: 5 })).json).toMatchObject({ state: "placing", version: 6 });
  });

  it("an inspector can hold a cleared placement again, with a reason that is kept", async () => {
    const id = await readyPlacement();
    await move(s.team.inspector, id, { to: "cleared", baseVersion: 2 });
    const held = await move(s.team.inspector, id, { to: "held", reason: "Rain forecast at start; no cover on site", baseVersion: 3 });
    expect(held.json).toMatchObject({ state: "held", holdReason: "Rain forecast at start; no cover on site" });
  });
});

describe("an amendment can itself be signed", () => {
  async function signedWithAmendment() {
    const id = await readyPlacement();
    let v = 2;
    for (const [who, to] of [["inspector", "cleared"], ["superintendent", "placing"], ["superintendent", "placed"]] as const) {
      v = (await move(s.team[who], id, { to, baseVersion: v })).json.version;
    }
    const signed = await callRoute(signRoute, {
      user: s.team.inspector,
      params: { projectId: s.project.id, id },
      body: { baseVersion: v, password: PASSWORD, typedName: "Ines Marchetti", signatureImage: SIGNATURE },
    });
    expect(signed.status).toBe(200);
    const amendment = { id: randomUUID(), what: "Truck 3 arrived at 10:52, not 10:25", why: "Digits swapped when typed; the ticket stamp reads 10:52" };
    expect((await callRoute(amendRoute, { user: s.team.inspector, params: { projectId: s.project.id, id }, body: amendment })).status).toBe(200);
    return { id, amendmentId: amendment.id };
  }
  const signAmendment = (user: TestUser, id: string, amendmentId: string, body: Record<string, unknown> = {}) =>
    callRoute(signAmendmentRoute, {
      user,
      params: { projectId: s.project.id, id, amendmentId },
      body: { baseVersion: 1, password: PASSWORD, typedName: "Olu Okafor", signatureImage: SIGNATURE, ...body },
    });
  const signOffsOf = async (amendmentId: string) =>
    db.select().from(signOffs).where(and(eq(signOffs.recordType, "amendments"), eq(signOffs.recordId, amendmentId)));

  it("the verification names the placement's signer and lists the amendment unsigned", async () => {
    const { id, amendmentId } = await signedWithAmendment();
    const v = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id } });
    expect(v.json.signOff).toMatchObject({ signerName: s.team.inspector.name, role: "inspector", typedName: "Ines Marchetti" });
    expect(v.json.amendments).toHaveLength(1);
    expect(v.json.amendments[0]).toMatchObject({ id: amendmentId, authorName: s.team.inspector.name, signOff: null, matches: null });
  });

  it("a superintendent cannot sign it (403), a wrong password is 401, a stale version 409; nothing is stored", async () => {
    const { id, amendmentId } = await signedWithAmendment();
    expect((await signAmendment(s.team.superintendent, id, amendmentId)).status).toBe(403);
    const wrong = await signAmendment(s.team.office, id, amendmentId, { password: "not-the-password" });
    expect(wrong.status).toBe(401);
    expect(wrong.json.error.message).toBe("That password is not right. Nothing was signed.");
    expect((await signAmendment(s.team.office, id, amendmentId, { baseVersion: 2 })).status).toBe(409);
    expect((await signAmendment(other.team.inspector, id, amendmentId)).status).toBe(404);
    expect(await signOffsOf(amendmentId)).toHaveLength(0);
  });

  it("the office signs it once; the verification shows the signature and notices a text changed behind the app's back", async () => {
    const { id, amendmentId } = await signedWithAmendment();
    const ok = await signAmendment(s.team.office, id, amendmentId);
    expect(ok.status).toBe(200);
    expect(ok.json.signOff.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const [stored] = await signOffsOf(amendmentId);
    expect(stored).toMatchObject({ role: "office", signerId: s.team.office.id, typedName: "Olu Okafor", signatureImage: SIGNATURE });
    const again = await signAmendment(s.team.office, id, amendmentId);
    expect(again.status).toBe(409);
    expect(again.json.error.message).toBe("This amendment is already signed.");

    const v1 = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id } });
    expect(v1.json.amendments[0]).toMatchObject({ matches: true, signOff: { typedName: "Olu Okafor", signerName: s.team.office.name, role: "office" } });

    // Behind the app's back, as the database owner (amendments are append-only for the app, drizzle/0011).
    await db.transaction(async (tx) => {
      await tx.execute(sql`set local session_replication_role = replica`);
      await tx.execute(sql`update amendments set what = 'Truck 3 arrived at 11:52' where id = ${amendmentId}`);
    });
    const v2 = await callRoute(verifyRoute, { user: s.team.owner, params: { projectId: s.project.id, id } });
    expect(v2.json.amendments[0].matches).toBe(false);
  });

  it("an amendment of another placement is 404 under this one", async () => {
    const a = await signedWithAmendment();
    const b = await signedWithAmendment();
    expect((await signAmendment(s.team.office, b.id, a.amendmentId)).status).toBe(404);
  });
});

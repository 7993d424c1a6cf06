// A placement taken through the real routes to "signed", for the attacks that need signed records.
import { eq } from "drizzle-orm";
import { expect } from "vitest";
import { POST as signRoute } from "@/app/api/projects/[projectId]/placements/[id]/sign-off/route";
import { POST as transitionRoute } from "@/app/api/projects/[projectId]/placements/[id]/transition/route";
import { db } from "@/db";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { callRoute, projectWithTeam, type TestUser } from "../integration/helpers";
import { makeRecord } from "../integration/record-fixtures";

export const PASSWORD = "security-test-password-9";
// A 1×1 PNG (the smallest valid image the schema takes).
export const SIGNATURE =
  "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==";

export type Setup = Awaited<ReturnType<typeof projectWithTeam>>;

/** A project with a team whose members all have PASSWORD. */
export async function teamWithPasswords(): Promise<Setup> {
  const s = await projectWithTeam();
  const hash = await hashPassword(PASSWORD);
  for (const u of Object.values(s.team)) await db.update(users).set({ passwordHash: hash }).where(eq(users.id, u.id));
  return s;
}

export const signBody = (baseVersion: number, extra: Record<string, unknown> = {}) => ({
  baseVersion,
  password: PASSWORD,
  typedName: "Ines Marchetti",
  signatureImage: SIGNATURE,
  ...extra,
});

/** A placement moved planned → ready → cleared → placing → placed; returns its id and version. */
export async function placedPlacement(s: Setup, overrides: Record<string, unknown> = {}) {
  const p = await makeRecord("placements", s.project.id, s.team, overrides);
  const move = (user: TestUser, to: string, baseVersion: number) =>
    callRoute(transitionRoute, { user, params: { projectId: s.project.id, id: p.id }, body: { to, baseVersion } });
  let v = 1;
  for (const [who, to] of [["superintendent", "ready"], ["inspector", "cleared"], ["superintendent", "placing"], ["superintendent", "placed"]] as const) {
    const res = await move(s.team[who], to, v);
    expect(res.status, `${to}: ${JSON.stringify(res.json)}`).toBe(200);
    v = res.json.version;
  }
  return { id: p.id, version: v, record: p };
}

export async function signedPlacement(s: Setup, overrides: Record<string, unknown> = {}) {
  const { id, version, record } = await placedPlacement(s, overrides);
  const res = await callRoute(signRoute, { user: s.team.inspector, params: { projectId: s.project.id, id }, body: signBody(version) });
  expect(res.status, JSON.stringify(res.json)).toBe(200);
  return { id, record };
}

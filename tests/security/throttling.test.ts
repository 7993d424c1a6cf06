// Finding 3: throttling. Attacks: parallel password guesses racing a check-then-record limit,
// one password sprayed over many addresses from one network, telling accounts apart by timing,
// unlimited sign-in-link mail, invitation tokens guessed without limit, and password guessing
// through the sign-off dialog of a session left open. [OWASP Authentication Cheat Sheet:
// "Protect against automated attacks", "Authentication and error messages" (timing)]
import { randomInt } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as acceptRoute } from "@/app/api/invitations/accept/route";
import { POST as signRoute } from "@/app/api/projects/[projectId]/placements/[id]/sign-off/route";
import { POST as linkRoute } from "@/app/api/sign-in-link/route";
import { db } from "@/db";
import { auditEntries, signInTokens, users } from "@/db/schema";
import { authorizePassword, WRONG_PASSWORD } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { LIMITS } from "@/lib/auth/rate-limit";
import { createUser } from "../integration/helpers";
import { attack, tableCounts } from "./attack";
import { PASSWORD, placedPlacement, signBody, teamWithPasswords } from "./fixtures";

const ip = () => `198.51.100.${randomInt(1, 255)}, 10.${randomInt(0, 255)}.${randomInt(0, 255)}.${randomInt(1, 255)}`;
const lastHop = (forwarded: string) => forwarded.split(",").pop()!.trim();

async function userWithPassword() {
  const user = await createUser();
  await db.update(users).set({ passwordHash: await hashPassword(PASSWORD) }).where(eq(users.id, user.id));
  return user;
}
const attempt = (email: string, password: string, from: string) =>
  authorizePassword({ email, password }, from).then(
    () => "ok",
    (e: Error) => e.message,
  );

describe("sign-in throttling", () => {
  it("parallel guesses cannot pass the per-address cap: the right password sent among 30 wrong ones is refused", async () => {
    const user = await userWithPassword();
    const from = lastHop(ip());
    const wrong = Array.from({ length: 30 }, (_, i) => attempt(user.email, `guess-${i}`, `${from}-${i}`));
    await new Promise((r) => setTimeout(r, 50)); // the wrong ones are past the limit check, still hashing
    const right = await attempt(user.email, PASSWORD, from);
    const answers = await Promise.all(wrong);
    expect(right).toMatch(/Too many wrong passwords/);
    expect(answers.filter((a) => a === WRONG_PASSWORD).length).toBeLessThanOrEqual(LIMITS.signInEmail.points);
  });

  it("one network spraying one password over many addresses is stopped per address of origin", async () => {
    const from = lastHop(ip());
    for (let i = 0; i < LIMITS.signInIp.points; i++) await attempt(`spray-${i}-${randomInt(1e9)}@example.test`, "Winter2026!", from);
    const victim = await userWithPassword();
    expect(await attempt(victim.email, PASSWORD, from)).toMatch(/from this network/);
    expect(await attempt(victim.email, PASSWORD, lastHop(ip()))).toBe("ok");
  });

  it("a successful sign-in gives its point back, so a person who types well is never locked out", async () => {
    const user = await userWithPassword();
    const from = lastHop(ip());
    for (let i = 0; i < LIMITS.signInIp.points + 5; i++) expect(await attempt(user.email, PASSWORD, from)).toBe("ok");
  });

  it("an unknown address takes as long as a known one with a wrong password (a hash is checked either way)", async () => {
    const known = await userWithPassword();
    const time = async (email: string) => {
      const t0 = performance.now();
      await attempt(email, "not-the-password", lastHop(ip()));
      return performance.now() - t0;
    };
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const knownMs: number[] = [];
    const unknownMs: number[] = [];
    for (let i = 0; i < 4; i++) {
      knownMs.push(await time(known.email));
      unknownMs.push(await time(`nobody-${randomInt(1e9)}@example.test`));
    }
    // argon2id verification dominates both [RFC 9106]; without it the unknown case is a few ms.
    expect(median(unknownMs)).toBeGreaterThan(median(knownMs) * 0.5);
  });
});

describe("sign-in links and invitations", () => {
  it("more links to one address than the limit: 429, no token stored, no mail", async () => {
    const user = await createUser();
    const tokens = async () => (await db.select().from(signInTokens).where(eq(signInTokens.userId, user.id))).length;
    for (let i = 0; i < LIMITS.linkEmail.points; i++) {
      expect((await attack(linkRoute, { body: JSON.stringify({ email: user.email }), headers: { "x-forwarded-for": ip() } })).status).toBe(200);
    }
    const stored = await tokens();
    const res = await attack(linkRoute, { body: JSON.stringify({ email: user.email }), headers: { "x-forwarded-for": ip() } });
    expect(res.status).toBe(429);
    expect(await tokens()).toBe(stored);
  });

  it("one network asking for links to many addresses is stopped", async () => {
    const forwarded = ip();
    for (let i = 0; i < LIMITS.linkIp.points; i++) {
      await attack(linkRoute, { body: JSON.stringify({ email: `who-${i}-${randomInt(1e9)}@example.test` }), headers: { "x-forwarded-for": forwarded } });
    }
    const before = await tableCounts();
    const res = await attack(linkRoute, { body: JSON.stringify({ email: (await createUser()).email }), headers: { "x-forwarded-for": forwarded } });
    expect(res.status).toBe(429);
    expect((await tableCounts()).sign_in_tokens).toBe(before.sign_in_tokens);
  });

  it("guessing invitation tokens is limited per network; nothing is created", async () => {
    const forwarded = ip();
    const before = await tableCounts();
    const statuses: number[] = [];
    for (let i = 0; i <= LIMITS.invitationIp.points; i++) {
      const res = await attack(acceptRoute, {
        body: JSON.stringify({ token: `guess-${i}-${"x".repeat(40)}`, password: "a-long-enough-password" }),
        headers: { "x-forwarded-for": forwarded },
      });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, LIMITS.invitationIp.points).every((st) => st === 404)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    const after = await tableCounts();
    expect({ ...after, rate_limits: 0 }).toEqual({ ...before, rate_limits: 0 });
  });
});

describe("the password re-entered to sign", () => {
  let s: Awaited<ReturnType<typeof teamWithPasswords>>;
  beforeAll(async () => {
    s = await teamWithPasswords();
  });

  it("is limited per user, every wrong one is audited, and nothing is signed", async () => {
    const { id, version } = await placedPlacement(s);
    const sign = (password: string) =>
      attack(signRoute, { user: s.team.inspector, params: { projectId: s.project.id, id }, body: JSON.stringify(signBody(version, { password })) });
    for (let i = 0; i < LIMITS.signerPassword.points; i++) expect((await sign(`guess-${i}`)).status).toBe(401);
    const locked = await sign(PASSWORD);
    expect(locked.status).toBe(429);
    const failures = await db
      .select()
      .from(auditEntries)
      .where(and(eq(auditEntries.recordId, id), eq(auditEntries.action, "sign-password-failed"), eq(auditEntries.userId, s.team.inspector.id)));
    expect(failures).toHaveLength(LIMITS.signerPassword.points);
    const signOffs = await db.execute(`select count(*)::int as n from sign_offs where record_id = '${id}'`);
    expect((signOffs.rows[0] as { n: number }).n).toBe(0);
  });
});

import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { invitations, memberships, signInTokens, users } from "@/db/schema";
import { POST as inviteRoute } from "@/app/api/invitations/route";
import { POST as acceptRoute } from "@/app/api/invitations/accept/route";
import { POST as linkRoute } from "@/app/api/sign-in-link/route";
import { verifyPassword } from "@/lib/auth/password";
import { hashToken } from "@/lib/auth/tokens";
import { consumeSignInToken } from "@/lib/users/queries";
import { authorizePassword, WRONG_PASSWORD } from "@/lib/auth/options";
import { callRoute, createProject, createUser } from "./helpers";

const mailbox = process.env.MAILBOX_URL ?? "http://127.0.0.1:2581";

async function lastMailTo(address: string): Promise<{ subject: string; text: string }> {
  for (let i = 0; i < 50; i++) {
    const res = await fetch(`${mailbox}/messages?to=${encodeURIComponent(address)}`);
    const list = (await res.json()) as { subject: string; text: string }[];
    if (list.length) return list[list.length - 1];
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail for ${address} in the local mailbox`);
}


describe("sign-in link and invitations", () => {
  it("a sign-in link arrives by e-mail, is stored hashed, works once", async () => {
    const user = await createUser();
    const res = await callRoute(linkRoute, { body: { email: user.email.toUpperCase() } });
    expect(res.status).toBe(200);
    const mail = await lastMailTo(user.email);
    expect(mail.subject).toMatch(/sign-in link/);
    const token = decodeURIComponent(mail.text.match(/token=([^&\s]+)/)![1]);
    const stored = await db.select().from(signInTokens).where(eq(signInTokens.userId, user.id));
    expect(stored).toHaveLength(1);
    expect(stored[0].tokenHash).toBe(hashToken(token));
    expect(stored[0].tokenHash).not.toContain(token);
    expect((await consumeSignInToken(hashToken(token)))?.id).toBe(user.id);
    expect(await consumeSignInToken(hashToken(token))).toBeUndefined();
  });

  it("an unknown address gets the same answer and no mail", async () => {
    const res = await callRoute(linkRoute, { body: { email: "nobody-at-all@example.test" } });
    expect(res.status).toBe(200);
    const list = await (await fetch(`${mailbox}/messages?to=nobody-at-all@example.test`)).json();
    expect(list).toHaveLength(0);
  });

  it("an invitation e-mails a link; accepting sets an argon2id password and the membership", async () => {
    const admin = await createUser({ isAdmin: true });
    const project = await createProject();
    const email = `invitee-${Date.now()}@example.test`;
    const res = await callRoute(inviteRoute, { user: admin, body: { email, name: "Ivy Newcomb", projectId: project.id, role: "inspector" } });
    expect(res.status).toBe(200);
    const mail = await lastMailTo(email);
    const token = decodeURIComponent(mail.text.match(/token=([^&\s]+)/)![1]);
    const [inv] = await db.select().from(invitations).where(eq(invitations.email, email));
    expect(inv.tokenHash).toBe(hashToken(token));

    const short = await callRoute(acceptRoute, { body: { token, password: "short" } });
    expect(short.status).toBe(400);
    expect(short.json.error.fields.password).toMatch(/at least 10/);

    const ok = await callRoute(acceptRoute, { body: { token, password: "a-long-enough-password" } });
    expect(ok.status).toBe(200);
    const [user] = await db.select().from(users).where(eq(users.email, email));
    expect(user.passwordHash).toMatch(/^\$argon2id\$/);
    expect(await verifyPassword(user.passwordHash, "a-long-enough-password")).toBe(true);
    const [m] = await db.select().from(memberships).where(eq(memberships.userId, user.id));
    expect(m).toMatchObject({ projectId: project.id, role: "inspector" });

    const reused = await callRoute(acceptRoute, { body: { token, password: "another-password-123" } });
    expect(reused.status).toBe(404);
  });

  it("wrong passwords are refused with a clear message and locked after five", async () => {
    const user = await createUser();
    const { hashPassword } = await import("@/lib/auth/password");
    await db.update(users).set({ passwordHash: await hashPassword("correct-horse-battery") }).where(eq(users.id, user.id));
    const attempt = (password: string) => authorizePassword({ email: user.email, password });
    await expect(attempt("wrong")).rejects.toThrow(WRONG_PASSWORD);
    for (let i = 0; i < 4; i++) await expect(attempt("wrong")).rejects.toThrow(WRONG_PASSWORD);
    await expect(attempt("wrong")).rejects.toThrow(/Too many wrong passwords/);
    // Locked: even the right password waits.
    await expect(attempt("correct-horse-battery")).rejects.toThrow(/Too many wrong passwords/);
  });

  it("the right password signs in and clears earlier failures", async () => {
    const user = await createUser();
    const { hashPassword } = await import("@/lib/auth/password");
    await db.update(users).set({ passwordHash: await hashPassword("correct-horse-battery") }).where(eq(users.id, user.id));
    await expect(authorizePassword({ email: user.email, password: "nope" })).rejects.toThrow();
    await expect(authorizePassword({ email: user.email, password: "correct-horse-battery" })).resolves.toMatchObject({ id: user.id });
  });
});

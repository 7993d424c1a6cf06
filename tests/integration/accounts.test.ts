// Accounts: disable / enable, password set and change, session revocation and idle expiry.
// The rules checked here are [common practice] for session management (OWASP Session Management
// Cheat Sheet: server-side invalidation on logout and password change, idle timeout).
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { accountSettings, placements, userSessions, users } from "@/db/schema";
import { POST as passwordRoute } from "@/app/api/account/password/route";
import { POST as everywhereRoute } from "@/app/api/account/sign-out-everywhere/route";
import { POST as statusRoute } from "@/app/api/admin/users/[userId]/status/route";
import { GET as settingsGet, PUT as settingsPut } from "@/app/api/admin/settings/route";
import { GET as projectsRoute } from "@/app/api/projects/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { authOptions, authorizePassword, WRONG_PASSWORD } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { revokeSession } from "@/lib/auth/user-sessions";
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { callRoute, projectWithTeam, signedInSession, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";

const PASSWORD = "correct horse battery";

async function withPassword(user: TestUser, password = PASSWORD) {
  await db.update(users).set({ passwordHash: await hashPassword(password) }).where(eq(users.id, user.id));
}

const projectsAs = (cookie: string) => callRoute(projectsRoute, { cookie });

afterAll(async () => {
  await db.delete(accountSettings);
});

describe("disabling a person", () => {
  it("refuses sign-in, the API and sync push, ends their sessions, keeps their records; enabling restores access", async () => {
    const { project, team, admin } = await projectWithTeam();
    const sam = team.superintendent;
    await withPassword(sam);
    const session = await signedInSession(sam);
    const placement = validBody("placements");
    const clientId = randomUUID();
    const pushed = await callRoute(pushRoute, {
      cookie: session.cookie,
      body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [{ id: 1, name: "create", recordType: "placements", projectId: project.id, recordId: placement.id, args: placement }] },
    });
    expect(pushed.status).toBe(200);

    const disabled = await callRoute(statusRoute, { user: admin, params: { userId: sam.id }, body: { disabled: true } });
    expect(disabled.status).toBe(200);
    expect(disabled.json).toEqual({ id: sam.id, disabled: true });

    await expect(authorizePassword({ email: sam.email, password: PASSWORD })).rejects.toThrow(WRONG_PASSWORD);
    expect((await projectsAs(session.cookie)).status).toBe(401);
    const fresh = await signedInSession(sam); // even a session opened after the disable
    expect((await projectsAs(fresh.cookie)).status).toBe(401);
    const placement2 = validBody("placements");
    const refused = await callRoute(pushRoute, {
      cookie: fresh.cookie,
      body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [{ id: 2, name: "create", recordType: "placements", projectId: project.id, recordId: placement2.id, args: placement2 }] },
    });
    expect(refused.status).toBe(401);
    // Records kept: the synced placement is still there, written by Sam; nothing new arrived.
    const rows = await db.select().from(placements).where(eq(placements.projectId, project.id));
    expect(rows.map((r) => r.id)).toEqual([placement.id]);
    expect(rows[0].updatedBy).toBe(sam.id);

    const enabled = await callRoute(statusRoute, { user: admin, params: { userId: sam.id }, body: { disabled: false } });
    expect(enabled.json).toEqual({ id: sam.id, disabled: false });
    expect((await authorizePassword({ email: sam.email, password: PASSWORD })).id).toBe(sam.id);
    expect((await projectsAs((await signedInSession(sam)).cookie)).status).toBe(200);
    // The sessions that the disable ended stay ended.
    expect((await projectsAs(session.cookie)).status).toBe(401);
  });

  it("only an administrator may disable, and not themselves", async () => {
    const { team, admin } = await projectWithTeam();
    const byOffice = await callRoute(statusRoute, { user: team.office, params: { userId: team.superintendent.id }, body: { disabled: true } });
    expect(byOffice.status).toBe(403);
    const self = await callRoute(statusRoute, { user: admin, params: { userId: admin.id }, body: { disabled: true } });
    expect(self.status).toBe(409);
    const bad = await callRoute(statusRoute, { user: admin, params: { userId: team.superintendent.id }, body: { disabled: "yes" } });
    expect(bad.status).toBe(400);
    const [row] = await db.select().from(users).where(eq(users.id, team.superintendent.id));
    expect(row.disabledAt).toBeNull();
  });
});

describe("passwords", () => {
  it("changing the password ends every other session and keeps this one", async () => {
    const { team } = await projectWithTeam();
    const ines = team.inspector;
    await withPassword(ines);
    const phone = await signedInSession(ines);
    const laptop = await signedInSession(ines);
    const wrong = await callRoute(passwordRoute, { cookie: phone.cookie, body: { currentPassword: "not it at all", newPassword: "a new long password" } });
    expect(wrong.status).toBe(400);
    expect(wrong.json.error.fields.currentPassword).toBeTruthy();
    expect((await projectsAs(laptop.cookie)).status).toBe(200);

    const changed = await callRoute(passwordRoute, { cookie: phone.cookie, body: { currentPassword: PASSWORD, newPassword: "a new long password" } });
    expect(changed.status).toBe(200);
    expect((await projectsAs(phone.cookie)).status).toBe(200);
    expect((await projectsAs(laptop.cookie)).status).toBe(401);
    await expect(authorizePassword({ email: ines.email, password: PASSWORD })).rejects.toThrow(WRONG_PASSWORD);
    expect((await authorizePassword({ email: ines.email, password: "a new long password" })).id).toBe(ines.id);
  });

  it("a person who came in by e-mailed link sets a first password without a current one", async () => {
    const { team } = await projectWithTeam();
    const olu = team.office; // created without a password, as a sign-in link user
    const session = await signedInSession(olu);
    const short = await callRoute(passwordRoute, { cookie: session.cookie, body: { newPassword: "short" } });
    expect(short.status).toBe(400);
    const set = await callRoute(passwordRoute, { cookie: session.cookie, body: { newPassword: "first password here" } });
    expect(set.status).toBe(200);
    expect((await authorizePassword({ email: olu.email, password: "first password here" })).id).toBe(olu.id);
    // Once set, changing it needs the current one.
    const again = await callRoute(passwordRoute, { cookie: session.cookie, body: { newPassword: "another password here" } });
    expect(again.status).toBe(400);
  });
});

describe("sessions", () => {
  it("sign-in opens a session row; a revoked session is refused on the next request", async () => {
    const { team } = await projectWithTeam();
    const jwt = authOptions.callbacks!.jwt!;
    const token = await jwt({ token: {}, user: { ...team.owner }, account: null } as never);
    expect(token.sid).toBeTruthy();
    const [row] = await db.select().from(userSessions).where(eq(userSessions.id, token.sid as string));
    expect(row.userId).toBe(team.owner.id);

    const session = await signedInSession(team.owner);
    expect((await projectsAs(session.cookie)).status).toBe(200);
    await revokeSession(session.sessionId); // what sign-out does (next-auth signOut event)
    expect((await projectsAs(session.cookie)).status).toBe(401);
  });

  it("sign out everywhere ends every session, this one too", async () => {
    const { team } = await projectWithTeam();
    const a = await signedInSession(team.owner);
    const b = await signedInSession(team.owner);
    expect((await callRoute(everywhereRoute, { cookie: a.cookie, method: "POST" })).status).toBe(200);
    expect((await projectsAs(a.cookie)).status).toBe(401);
    expect((await projectsAs(b.cookie)).status).toBe(401);
    expect((await projectsAs((await signedInSession(team.owner)).cookie)).status).toBe(200);
  });

  it("a session idle longer than the administrator's limit is refused; use keeps it alive", async () => {
    const { team, admin } = await projectWithTeam();
    const tooLow = await callRoute(settingsPut, { user: admin, method: "PUT", body: { idleTimeoutMinutes: 5, offlineWindowHours: 72 } });
    expect(tooLow.status).toBe(400);
    const byOwner = await callRoute(settingsPut, { user: team.owner, method: "PUT", body: { idleTimeoutMinutes: 60, offlineWindowHours: 72 } });
    expect(byOwner.status).toBe(403);
    const set = await callRoute(settingsPut, { user: admin, method: "PUT", body: { idleTimeoutMinutes: 60, offlineWindowHours: 48 } });
    expect(set.status).toBe(200);
    expect((await callRoute(settingsGet, { user: admin })).json).toEqual({ idleTimeoutMinutes: 60, offlineWindowHours: 48 });

    const idle = await signedInSession(team.owner);
    const busy = await signedInSession(team.owner);
    const ago = (min: number) => sql`now() - make_interval(mins => ${min})`;
    await db.update(userSessions).set({ lastSeenAt: ago(61) }).where(eq(userSessions.id, idle.sessionId));
    await db.update(userSessions).set({ lastSeenAt: ago(59) }).where(eq(userSessions.id, busy.sessionId));
    expect((await projectsAs(idle.cookie)).status).toBe(401);
    expect((await projectsAs(busy.cookie)).status).toBe(200);
    // That request counted as use: the session is good for another hour from now.
    const [row] = await db.select().from(userSessions).where(eq(userSessions.id, busy.sessionId));
    expect(Date.now() - row.lastSeenAt.getTime()).toBeLessThan(60_000);
  });
});

// Server-side session state behind the next-auth JWT (db/schema/sessions.ts): the cookie names a
// row; the row says whether it still counts. Checked on every request by lib/auth/session.ts.
import { and, eq, sql } from "drizzle-orm";
import { db, readDb, type Executor } from "@/db";
import { accountSettings, DEFAULT_IDLE_TIMEOUT_MINUTES, userSessions, users } from "@/db/schema";
import type { UserRow } from "@/lib/users/queries";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Opens a session row at sign-in, valid for the user's current session version. */
export async function openSession(userId: string, userAgent?: string | null): Promise<string> {
  const [row] = await db
    .insert(userSessions)
    .values({
      userId,
      sessionVersion: sql`(select ${users.sessionVersion} from ${users} where ${users.id} = ${userId})`,
      userAgent: userAgent?.slice(0, 200) ?? null,
    })
    .returning({ id: userSessions.id });
  return row.id;
}

/**
 * The user of a live session, or null when the session was revoked, belongs to an older session
 * version (sign out everywhere, password change, disable), sat idle past the administrator's limit,
 * or the account is disabled. A good session's last use is refreshed at most once a minute.
 */
export async function userOfLiveSession(sessionId: string, userId: string): Promise<UserRow | null> {
  if (!UUID.test(sessionId) || !UUID.test(userId)) return null;
  // One statement: this runs on every request (on the read pool, so writers waiting on locks never delay it).
  const [row] = await readDb
    .select({
      user: users,
      live: sql<boolean>`(${userSessions.revokedAt} is null and ${userSessions.sessionVersion} = ${users.sessionVersion}
        and ${users.disabledAt} is null
        and ${userSessions.lastSeenAt} > now() - make_interval(mins => coalesce(${accountSettings.idleTimeoutMinutes}, ${DEFAULT_IDLE_TIMEOUT_MINUTES})))`,
      staleTouch: sql<boolean>`${userSessions.lastSeenAt} < now() - interval '1 minute'`,
    })
    .from(users)
    .innerJoin(userSessions, eq(userSessions.userId, users.id))
    .leftJoin(accountSettings, eq(accountSettings.id, 1))
    .where(and(eq(userSessions.id, sessionId), eq(users.id, userId)));
  if (!row?.live) return null;
  if (row.staleTouch) await readDb.update(userSessions).set({ lastSeenAt: sql`now()` }).where(eq(userSessions.id, sessionId));
  return row.user;
}

/** Ends one session (sign-out on this browser). */
export async function revokeSession(sessionId: string, tx: Executor = db): Promise<void> {
  await tx.update(userSessions).set({ revokedAt: sql`now()` }).where(and(eq(userSessions.id, sessionId), sql`${userSessions.revokedAt} is null`));
}

/**
 * Ends every session of the user at once; `keepSessionId` (the browser that asked, e.g. after a
 * password change) moves to the new version and stays signed in. Returns the new version.
 */
export async function bumpSessionVersion(tx: Executor, userId: string, keepSessionId?: string): Promise<number> {
  const [row] = await tx
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date() })
    .where(eq(users.id, userId))
    .returning({ sessionVersion: users.sessionVersion });
  if (keepSessionId) {
    await tx
      .update(userSessions)
      .set({ sessionVersion: row.sessionVersion })
      .where(and(eq(userSessions.id, keepSessionId), eq(userSessions.userId, userId)));
  }
  return row.sessionVersion;
}

// Server-side session state behind the next-auth JWT (db/schema/sessions.ts): the cookie names a
// row; the row says whether it still counts. Checked on every request by lib/auth/session.ts.
import { and, eq, sql } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { DEFAULT_IDLE_TIMEOUT_MINUTES, userSessions, users } from "@/db/schema";
import type { UserRow } from "@/lib/users/queries";

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
  const result = await db.execute(sql`
    select u.id,
      (s.revoked_at is null and s.session_version = u.session_version and u.disabled_at is null
        and s.last_seen_at > now() - make_interval(mins => coalesce(a.idle_timeout_minutes, ${DEFAULT_IDLE_TIMEOUT_MINUTES}))) as live,
      s.last_seen_at < now() - interval '1 minute' as stale_touch
    from user_sessions s
    join users u on u.id = s.user_id
    left join account_settings a on a.id = 1
    where s.id = ${sessionId} and s.user_id = ${userId}`);
  const row = result.rows[0] as { id: string; live: boolean; stale_touch: boolean } | undefined;
  if (!row?.live) return null;
  if (row.stale_touch) await db.update(userSessions).set({ lastSeenAt: sql`now()` }).where(eq(userSessions.id, sessionId));
  const [user] = await db.select().from(users).where(eq(users.id, userId));
  return user ?? null;
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

import { sql } from "drizzle-orm";
import { check, index, integer, pgTable, timestamp, uuid, varchar } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { createdAtColumn, idColumn, instantColumn } from "./columns";

/** Defaults of the account settings (the row's column defaults and the value before any row exists). */
export const DEFAULT_IDLE_TIMEOUT_MINUTES = 3 * 24 * 60;
export const DEFAULT_OFFLINE_WINDOW_HOURS = 72;

/**
 * One row per signed-in browser. The session cookie (a next-auth JWT) only names its row; the row
 * decides whether it is still good: not revoked, its `sessionVersion` equal to the user's (bumped by
 * "sign out everywhere", a disable or a password change), and used within the idle period.
 */
export const userSessions = pgTable(
  "user_sessions",
  {
    id: idColumn(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    sessionVersion: integer("session_version").notNull(),
    userAgent: varchar("user_agent", { length: 200 }),
    createdAt: createdAtColumn(),
    lastSeenAt: timestamp("last_seen_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
    revokedAt: instantColumn("revoked_at"),
  },
  (t) => [index("user_sessions_user_idx").on(t.userId)],
);

/** Organisation-wide account settings, one row (id 1), changed by an administrator. */
export const accountSettings = pgTable(
  "account_settings",
  {
    id: integer("id").primaryKey().default(1),
    /** A session unused for this long is refused (the person signs in again). */
    idleTimeoutMinutes: integer("idle_timeout_minutes").notNull().default(DEFAULT_IDLE_TIMEOUT_MINUTES),
    /** How long after the last good session a device may open a person's offline data without a PIN. */
    offlineWindowHours: integer("offline_window_hours").notNull().default(DEFAULT_OFFLINE_WINDOW_HOURS),
    updatedAt: timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [check("account_settings_one_row", sql`${t.id} = 1`)],
);

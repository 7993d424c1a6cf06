import { sql } from "drizzle-orm";
import { bigint, integer, timestamp, uuid } from "drizzle-orm/pg-core";

/** UUID primary key; the database default only applies to rows created on the server. */
export const idColumn = () => uuid("id").primaryKey().default(sql`gen_random_uuid()`);

export const createdAtColumn = () =>
  timestamp("created_at", { withTimezone: true, mode: "date" }).notNull().defaultNow();

export const updatedAtColumn = () =>
  timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow();

/** A timestamp with time zone, as a JS Date (all record times are instants). */
export const instantColumn = (name: string) => timestamp(name, { withTimezone: true, mode: "date" });

/**
 * Columns of every record a field device can create (see SYNC.md "Server"): the client supplies
 * the UUID; `version` +1 per accepted write; `changeSeq` from the project's counter on every write;
 * `deletedAt` is the tombstone (rows are never hard-deleted). The foreign keys of `projectId` and
 * `updatedBy` and the (projectId, changeSeq) index come from `syncedConstraints` in ./synced.ts,
 * which can import the auth tables without an import cycle (auth.ts imports this file).
 */
export const syncedColumns = () => ({
  id: uuid("id").primaryKey(),
  projectId: uuid("project_id").notNull(),
  version: integer("version").notNull().default(1),
  changeSeq: bigint("change_seq", { mode: "number" }).notNull(),
  createdAt: createdAtColumn(),
  updatedAt: updatedAtColumn(),
  updatedBy: uuid("updated_by"),
  deletedAt: instantColumn("deleted_at"),
});

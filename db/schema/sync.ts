import { bigint, index, integer, jsonb, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { projects, users } from "./auth";
import { createdAtColumn, idColumn, instantColumn } from "./columns";

/**
 * One row per project; `lastSeq` is taken with UPDATE … RETURNING inside each write transaction so
 * the row lock is held to commit and change sequence numbers become visible in commit order.
 */
export const projectChangeCounters = pgTable("project_change_counters", {
  projectId: uuid("project_id")
    .primaryKey()
    .references(() => projects.id, { onDelete: "cascade" }),
  lastSeq: bigint("last_seq", { mode: "number" }).notNull().default(0),
});

/** A write that could not be applied as sent: both payloads are kept until a person resolves it. */
export const conflicts = pgTable(
  "conflicts",
  {
    id: idColumn(),
    projectId: uuid("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    recordType: varchar("record_type", { length: 48 }).notNull(),
    recordId: uuid("record_id").notNull(),
    baseVersion: integer("base_version"),
    serverVersion: integer("server_version"),
    clientPayload: jsonb("client_payload").notNull(),
    serverPayload: jsonb("server_payload"),
    reason: text("reason").notNull(),
    createdBy: uuid("created_by").references(() => users.id),
    createdAt: createdAtColumn(),
    resolvedAt: instantColumn("resolved_at"),
    resolvedBy: uuid("resolved_by").references(() => users.id),
    resolution: jsonb("resolution"),
  },
  (t) => [index("conflicts_project_open_idx").on(t.projectId, t.resolvedAt), index("conflicts_record_idx").on(t.recordType, t.recordId)],
);

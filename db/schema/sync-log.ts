import { integer, jsonb, pgTable, primaryKey, text, timestamp, uuid, varchar } from "drizzle-orm/pg-core";
import { projects, users } from "./auth";
import { createdAtColumn } from "./columns";

/** A device (per user): its mutations are applied in order, each once (SYNC.md). */
export const syncClients = pgTable("sync_clients", {
  id: uuid("id").primaryKey(),
  userId: uuid("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  lastMutationId: integer("last_mutation_id").notNull().default(0),
  /**
   * The highest mutation id the device has dropped from its outbox (it says so on pull): it can
   * never send one of those again, so their stored results may be pruned.
   */
  ackedMutationId: integer("acked_mutation_id").notNull().default(0),
  createdAt: createdAtColumn(),
  lastSeenAt: timestamp("last_seen_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
});

/**
 * Every mutation a device sent and what became of it. The stored result is returned when the same
 * mutation arrives again, and the payload of a refused change stays here for a person to see.
 */
export const syncMutations = pgTable(
  "sync_mutations",
  {
    clientId: uuid("client_id")
      .notNull()
      .references(() => syncClients.id, { onDelete: "cascade" }),
    mutationId: integer("mutation_id").notNull(),
    name: varchar("name", { length: 24 }).notNull(),
    recordType: varchar("record_type", { length: 48 }).notNull(),
    // Null when the change named a project the sender does not belong to (refused, nothing kept).
    projectId: uuid("project_id").references(() => projects.id, { onDelete: "cascade" }),
    recordId: uuid("record_id").notNull(),
    args: jsonb("args").notNull(),
    baseVersion: integer("base_version"),
    result: varchar("result", { length: 16 }).notNull(),
    reason: varchar("reason", { length: 48 }),
    message: text("message"),
    version: integer("version"),
    conflictId: uuid("conflict_id"),
    createdAt: createdAtColumn(),
  },
  (t) => [primaryKey({ columns: [t.clientId, t.mutationId] })],
);

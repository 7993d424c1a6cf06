import { bigserial, index, jsonb, pgTable, text, timestamp, uuid, varchar } from "drizzle-orm/pg-core";
import { projects, users } from "./auth";

/** Every accepted change: who, when, from which device, before and after. Append-only. */
export const auditEntries = pgTable(
  "audit_entries",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    projectId: uuid("project_id").references(() => projects.id, { onDelete: "cascade" }),
    userId: uuid("user_id").references(() => users.id),
    deviceId: varchar("device_id", { length: 64 }),
    recordType: varchar("record_type", { length: 48 }).notNull(),
    recordId: uuid("record_id"),
    action: varchar("action", { length: 48 }).notNull(),
    before: jsonb("before"),
    after: jsonb("after"),
    note: text("note"),
    at: timestamp("at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [index("audit_record_idx").on(t.recordType, t.recordId), index("audit_project_idx").on(t.projectId, t.at)],
);

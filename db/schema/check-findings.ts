import { date, doublePrecision, index, jsonb, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { projects } from "./auth";
import { idColumn, updatedAtColumn } from "./columns";
import { placements } from "./placements";

/**
 * The rulebook's findings (lib/checks) as the server last computed them, per project-local day:
 * recomputed in the same transaction as every write that can change them (lib/findings), and read
 * by the review table. Cautions and warnings only; information is not stored.
 */
export const checkFindings = pgTable(
  "check_findings",
  {
    id: idColumn(),
    projectId: uuid("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    /** Null for a day-level finding (cold weather) or a site-wide reading. */
    placementId: uuid("placement_id").references(() => placements.id),
    localDate: date("local_date", { mode: "string" }).notNull(),
    rule: varchar("rule", { length: 40 }).notNull(),
    severity: varchar("severity", { length: 16 }).notNull(),
    subjectType: varchar("subject_type", { length: 20 }).notNull(),
    subjectId: varchar("subject_id", { length: 80 }).notNull(),
    title: text("title").notNull(),
    message: text("message").notNull(),
    appliedValue: doublePrecision("applied_value"),
    appliedLimit: doublePrecision("applied_limit"),
    appliedUnit: varchar("applied_unit", { length: 20 }).notNull(),
    /** The Source of lib/checks (document, edition, clause, basis). */
    source: jsonb("source").notNull(),
    computedAt: updatedAtColumn(),
  },
  (t) => [index("check_findings_project_date_idx").on(t.projectId, t.localDate), index("check_findings_placement_idx").on(t.placementId)],
);

import { date, foreignKey, index, pgEnum, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { instantColumn, syncedColumns } from "./columns";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";
import { FINDING_SEVERITIES, FINDING_STATES, SITE_VISIT_STATES } from "./enums";

export const siteVisitState = pgEnum("site_visit_state", SITE_VISIT_STATES);
export const findingState = pgEnum("finding_state", FINDING_STATES);
export const findingSeverity = pgEnum("finding_severity", FINDING_SEVERITIES);

/**
 * The inspector's report of one visit to the site. Its state changes only through the lifecycle
 * (lib/site-visits); a signed report is frozen by drizzle's custom migration "site-visits-frozen".
 */
export const siteVisits = pgTable(
  "site_visits",
  {
    ...syncedColumns(),
    visitDate: date("visit_date", { mode: "string" }).notNull(),
    arrivedAt: instantColumn("arrived_at"),
    leftAt: instantColumn("left_at"),
    areasInspected: text("areas_inspected").notNull().default(""),
    elementsInspected: text("elements_inspected").notNull().default(""),
    testsWitnessed: text("tests_witnessed").notNull().default(""),
    weather: varchar("weather", { length: 300 }).notNull().default(""),
    notes: text("notes").notNull().default(""),
    /** Placements looked at on this visit (same project; checked by the write path). */
    placementIds: uuid("placement_ids").array().notNull().default([]),
    state: siteVisitState("state").notNull().default("draft"),
    submittedAt: instantColumn("submitted_at"),
    signedAt: instantColumn("signed_at"),
    signedBy: uuid("signed_by"),
  },
  (t) => [
    ...syncedConstraints("site_visits", t),
    index("site_visits_project_date_idx").on(t.projectId, t.visitDate),
    foreignKey({ name: "site_visits_signed_by_fk", columns: [t.signedBy], foreignColumns: [users.id] }),
  ],
);

/**
 * Something found on a visit that does not conform. The observation (what, where, severity, the
 * requirement, the action and its due date) is the inspector's and is frozen with the signed
 * report; the follow-up (state, the superintendent's response, who answered, closed or reopened it
 * and when) goes on through the lifecycle after the sign-off.
 */
export const findings = pgTable(
  "findings",
  {
    ...syncedColumns(),
    siteVisitId: uuid("site_visit_id")
      .notNull()
      .references(() => siteVisits.id),
    /** The placement this finding holds up, if any. */
    placementId: uuid("placement_id").references(() => placements.id),
    description: text("description").notNull(),
    location: varchar("location", { length: 200 }).notNull().default(""),
    severity: findingSeverity("severity").notNull(),
    requirement: varchar("requirement", { length: 300 }).notNull().default(""),
    actionRequired: text("action_required").notNull().default(""),
    dueDate: date("due_date", { mode: "string" }),
    state: findingState("state").notNull().default("open"),
    response: text("response"),
    answeredAt: instantColumn("answered_at"),
    answeredBy: uuid("answered_by"),
    closedAt: instantColumn("closed_at"),
    closedBy: uuid("closed_by"),
    closeNote: text("close_note"),
    reopenedAt: instantColumn("reopened_at"),
    reopenedBy: uuid("reopened_by"),
    reopenReason: text("reopen_reason"),
  },
  (t) => [
    ...syncedConstraints("findings", t),
    index("findings_visit_idx").on(t.siteVisitId),
    index("findings_placement_idx").on(t.placementId),
    foreignKey({ name: "findings_answered_by_fk", columns: [t.answeredBy], foreignColumns: [users.id] }),
    foreignKey({ name: "findings_closed_by_fk", columns: [t.closedBy], foreignColumns: [users.id] }),
    foreignKey({ name: "findings_reopened_by_fk", columns: [t.reopenedBy], foreignColumns: [users.id] }),
  ],
);

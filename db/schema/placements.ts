import { doublePrecision, foreignKey, index, pgEnum, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { instantColumn, syncedColumns } from "./columns";
import { mixDesigns } from "./mixes";
import { syncedConstraints } from "./synced";
import { ELEMENT_TYPES, PLACEMENT_STATES } from "./enums";

export const placementState = pgEnum("placement_state", PLACEMENT_STATES);
export const elementType = pgEnum("element_type", ELEMENT_TYPES);

/** A pour. Its state changes only through the workflow (lib/placements); signed rows are frozen. */
export const placements = pgTable(
  "placements",
  {
    ...syncedColumns(),
    element: varchar("element", { length: 120 }).notNull(),
    level: varchar("level", { length: 60 }).notNull().default(""),
    grid: varchar("grid", { length: 60 }).notNull().default(""),
    elementType: elementType("element_type").notNull(),
    leastDimensionMm: doublePrecision("least_dimension_mm"),
    plannedVolumeM3: doublePrecision("planned_volume_m3"),
    mixId: uuid("mix_id").references(() => mixDesigns.id),
    plannedStart: instantColumn("planned_start").notNull(),
    state: placementState("state").notNull().default("planned"),
    holdReason: text("hold_reason"),
    signedAt: instantColumn("signed_at"),
    signedBy: uuid("signed_by"),
  },
  (t) => [
    ...syncedConstraints("placements", t),
    index("placements_project_start_idx").on(t.projectId, t.plannedStart),
    foreignKey({ name: "placements_signed_by_fk", columns: [t.signedBy], foreignColumns: [users.id] }),
  ],
);

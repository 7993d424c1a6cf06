import { doublePrecision, index, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { instantColumn, syncedColumns } from "./columns";
import { deliveries } from "./deliveries";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";

/** Fresh-concrete tests on a sample of one delivery (ASTM C143, C231, C1064, C138). */
export const fieldTests = pgTable(
  "field_tests",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id")
      .notNull()
      .references(() => placements.id),
    deliveryId: uuid("delivery_id").references(() => deliveries.id),
    sampledAt: instantColumn("sampled_at").notNull(),
    slumpMm: doublePrecision("slump_mm"),
    slumpFlowMm: doublePrecision("slump_flow_mm"),
    airPct: doublePrecision("air_pct"),
    concreteTempC: doublePrecision("concrete_temp_c"),
    airTempC: doublePrecision("air_temp_c"),
    densityKgM3: doublePrecision("density_kg_m3"),
    notes: text("notes"),
    /** Who ran the tests (a certified field technician, by name); the time is sampledAt. */
    testedBy: varchar("tested_by", { length: 120 }),
  },
  (t) => [...syncedConstraints("field_tests", t), index("field_tests_placement_idx").on(t.placementId)],
);

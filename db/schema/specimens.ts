import { doublePrecision, index, integer, pgTable, uuid, varchar } from "drizzle-orm/pg-core";
import { instantColumn, syncedColumns } from "./columns";
import { deliveries } from "./deliveries";
import { temperatureSensors } from "./maturity";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";

/** Cylinders moulded from one sample (ASTM C31), with their initial-curing temperatures. */
export const specimenSets = pgTable(
  "specimen_sets",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id")
      .notNull()
      .references(() => placements.id),
    deliveryId: uuid("delivery_id").references(() => deliveries.id),
    setCode: varchar("set_code", { length: 40 }).notNull(),
    cylinderDiameterMm: integer("cylinder_diameter_mm").notNull(),
    cylinderLengthMm: doublePrecision("cylinder_length_mm").notNull(),
    count: integer("count").notNull(),
    castAt: instantColumn("cast_at").notNull(),
    initialCuringMinC: doublePrecision("initial_curing_min_c"),
    initialCuringMaxC: doublePrecision("initial_curing_max_c"),
    testAgesDays: integer("test_ages_days").array().notNull(),
    /**
     * The logger that cured with the set (cast in a field-cured cylinder or placed beside it); null:
     * standard curing. The calibration reads this sensor's record from the cast to each break.
     */
    sensorId: uuid("sensor_id").references(() => temperatureSensors.id),
  },
  (t) => [...syncedConstraints("specimen_sets", t), index("specimen_sets_placement_idx").on(t.placementId)],
);

/**
 * One cylinder broken by the lab (ASTM C39). Not frozen by the placement's sign-off: breaks arrive
 * days or weeks after the placement was signed.
 */
export const breaks = pgTable(
  "breaks",
  {
    ...syncedColumns(),
    specimenSetId: uuid("specimen_set_id")
      .notNull()
      .references(() => specimenSets.id),
    testedAt: instantColumn("tested_at").notNull(),
    ageDays: integer("age_days").notNull(),
    loadKN: doublePrecision("load_kn").notNull(),
    diameterMm: doublePrecision("diameter_mm").notNull(),
    lengthMm: doublePrecision("length_mm"),
    fractureType: integer("fracture_type"),
    /** Computed on the server from load and dimensions (lib/concrete cylinderStrengthMPa). */
    strengthMPa: doublePrecision("strength_mpa").notNull(),
  },
  (t) => [...syncedConstraints("breaks", t), index("breaks_set_idx").on(t.specimenSetId)],
);

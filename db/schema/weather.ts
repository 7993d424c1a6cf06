import { doublePrecision, index, pgEnum, pgTable, uuid } from "drizzle-orm/pg-core";
import { instantColumn, syncedColumns } from "./columns";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";
import { SUN_EXPOSURES } from "./enums";

export const sunExposure = pgEnum("sun_exposure", SUN_EXPOSURES);

/** A timed weather reading at the site, for one placement or for the project in general. */
export const weatherObservations = pgTable(
  "weather_observations",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id").references(() => placements.id),
    observedAt: instantColumn("observed_at").notNull(),
    airTempC: doublePrecision("air_temp_c").notNull(),
    relativeHumidityPct: doublePrecision("relative_humidity_pct").notNull(),
    windKmh: doublePrecision("wind_kmh").notNull(),
    concreteTempC: doublePrecision("concrete_temp_c"),
    sun: sunExposure("sun"),
    /** Computed on the server (Uno's form of the ACI 305R nomograph); null without a concrete temperature. */
    evaporationKgM2H: doublePrecision("evaporation_kg_m2_h"),
  },
  (t) => [
    ...syncedConstraints("weather_observations", t),
    index("weather_observations_placement_idx").on(t.placementId),
  ],
);

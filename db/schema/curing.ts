import { doublePrecision, index, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { instantColumn, syncedColumns } from "./columns";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";

/** Protection and curing log: one temperature reading of the concrete or its enclosure. */
export const curingReadings = pgTable(
  "curing_readings",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id")
      .notNull()
      .references(() => placements.id),
    method: varchar("method", { length: 80 }).notNull(),
    readAt: instantColumn("read_at").notNull(),
    tempC: doublePrecision("temp_c").notNull(),
    location: varchar("location", { length: 120 }).notNull().default(""),
    note: text("note"),
  },
  (t) => [...syncedConstraints("curing_readings", t), index("curing_readings_placement_idx").on(t.placementId)],
);

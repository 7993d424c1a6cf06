import { index, integer, jsonb, pgEnum, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { READING_SOURCES } from "./enums";
import { instantColumn, syncedColumns } from "./columns";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";

export const readingSource = pgEnum("reading_source", READING_SOURCES);

/**
 * A temperature sensor cast into a placement (maturity method, ASTM C1074). Not frozen by the
 * placement's signature: the record runs for days after the pour is signed.
 */
export const temperatureSensors = pgTable(
  "temperature_sensors",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id")
      .notNull()
      .references(() => placements.id),
    name: varchar("name", { length: 80 }).notNull(),
    location: varchar("location", { length: 160 }).notNull().default(""),
    /** The logger's interval; null: judged from the record (hand readings). */
    loggingIntervalMinutes: integer("logging_interval_minutes"),
    /** When monitoring ended; null while the sensor is still read. */
    endedAt: instantColumn("ended_at"),
    note: text("note"),
  },
  (t) => [...syncedConstraints("temperature_sensors", t), index("temperature_sensors_placement_idx").on(t.placementId)],
);

/**
 * A batch of one sensor's readings: one hand reading, or up to 1,000 rows of an imported logger
 * file, so a 100,000-row file syncs as about a hundred inserts that never conflict.
 * `readings` holds [ISO instant, °C] pairs in time order.
 */
export const sensorReadings = pgTable(
  "sensor_readings",
  {
    ...syncedColumns(),
    sensorId: uuid("sensor_id")
      .notNull()
      .references(() => temperatureSensors.id),
    source: readingSource("source").notNull(),
    readings: jsonb("readings").$type<[string, number][]>().notNull(),
    firstAt: instantColumn("first_at").notNull(),
    lastAt: instantColumn("last_at").notNull(),
  },
  (t) => [
    ...syncedConstraints("sensor_readings", t),
    index("sensor_readings_sensor_idx").on(t.sensorId),
  ],
);

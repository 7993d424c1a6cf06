import { z } from "zod";
import { MAX_READINGS_PER_BATCH, READING_SOURCES } from "@/lib/records/enums";
import { clientId, instant, optionalText, recordId, requiredText, temperatureC, wholeNumber } from "./fields";

export const sensorFields = {
  name: requiredText("Sensor name", 80),
  location: optionalText("Where the sensor sits", 160),
  loggingIntervalMinutes: wholeNumber("Logging interval", 1, 1_440, "min").nullable(),
  endedAt: instant("Monitoring end").nullable(),
  note: optionalText("Note", 1_000).nullable(),
};
export const sensorCreateSchema = z
  .object({ id: clientId, placementId: recordId("Placement"), ...sensorFields })
  .partial({ location: true, loggingIntervalMinutes: true, endedAt: true, note: true });
export const sensorUpdateSchema = z.object(sensorFields).partial();

/** One reading as stored: [ISO instant in UTC, °C]. Offsets are resolved on the device that reads the file. */
const readingPair = z.tuple(
  [
    z.iso
      .datetime({ offset: true, error: "Reading time must be a date and time with its offset" })
      .transform((v) => new Date(v).toISOString()),
    temperatureC("Temperature"),
  ],
  { error: "A reading is a time and a temperature" },
);

const readingList = z
  .array(readingPair, { error: "Readings must be a list" })
  .min(1, "Enter at least one reading")
  .max(MAX_READINGS_PER_BATCH, `At most ${MAX_READINGS_PER_BATCH} readings in one batch`);

function inTimeOrder(v: { readings?: [string, number][] }, ctx: z.RefinementCtx) {
  const list = v.readings ?? [];
  for (let i = 1; i < list.length; i += 1) {
    if (list[i][0] < list[i - 1][0]) {
      ctx.addIssue({ code: "custom", path: ["readings", i], message: "Readings must be in time order" });
      return;
    }
  }
}

/** A batch of one sensor's readings; `firstAt` and `lastAt` are derived here, never sent on their own. */
export const sensorReadingsCreateSchema = z
  .object({
    id: clientId,
    sensorId: recordId("Sensor"),
    source: z.enum(READING_SOURCES, { error: "Readings come from a hand entry or an imported file" }),
    readings: readingList,
  })
  .superRefine(inTimeOrder)
  .transform((v) => ({ ...v, firstAt: new Date(v.readings[0][0]), lastAt: new Date(v.readings[v.readings.length - 1][0]) }));
/** A mistyped hand reading is corrected by replacing the batch's readings (the server re-derives the span). */
export const sensorReadingsUpdateSchema = z.object({ readings: readingList }).partial().superRefine(inTimeOrder);

// What the server fills in when a create leaves a field out (db/schema/maturity.ts).
export const sensorDefaults = z.object({
  location: sensorFields.location.default(""),
  loggingIntervalMinutes: sensorFields.loggingIntervalMinutes.default(null),
  endedAt: sensorFields.endedAt.default(null),
  note: sensorFields.note.default(null),
});
export const sensorReadingsDefaults = z.object({});

// Field builders for the record schemas: one wording for every form, the API and sync, in words a
// site user understands ("Slump must be between 0 and 300 mm", not "Expected number").
// No zod defaults here: the same field shapes build the partial update schemas, and a default
// there would silently overwrite stored values. The server's column defaults are each record's
// separate `…Defaults` object (lib/records/descriptions.ts), never part of a create or update schema.
import { z } from "zod";

const lower = (label: string) => label.charAt(0).toLowerCase() + label.slice(1);
const unitSuffix = (unit: string) => (unit ? (unit === "%" ? " %" : ` ${unit}`) : "");

const missingOr = (label: string, wrong: string) => (issue: { input: unknown }) =>
  issue.input === undefined || issue.input === null ? `Enter the ${lower(label)}` : wrong;

/** A measured quantity in SI with its physical bounds (inclusive). */
export function measure(label: string, min: number, max: number, unit: string) {
  const range = `${label} must be between ${min} and ${max}${unitSuffix(unit)}`;
  return z
    .number({ error: missingOr(label, `${label} must be a number`) })
    .min(min, min === 0 ? `${label} cannot be negative` : range)
    .max(max, range);
}

/** A whole number with bounds (counts, days, revolutions). */
export function wholeNumber(label: string, min: number, max: number, unit = "") {
  return measure(label, min, max, unit).int(`${label} must be a whole number`);
}

/** Air, concrete and enclosure temperatures: −40 to 70 °C covers any site. */
export const temperatureC = (label: string) => measure(label, -40, 70, "°C");

export function requiredText(label: string, max: number) {
  const enter = `Enter the ${lower(label)}`;
  return z
    .string({ error: missingOr(label, `${label} must be text`) })
    .trim()
    .min(1, enter)
    .max(max, `${label} can be at most ${max} characters`);
}

export function optionalText(label: string, max: number) {
  return z
    .string({ error: `${label} must be text` })
    .trim()
    .max(max, `${label} can be at most ${max} characters`);
}

/** Ids are UUIDs made by the device that creates the record (or by the server for its own rows). */
export function recordId(label: string) {
  return z.guid({ error: missingOr(label, `${label} must be an id (a UUID)`) });
}

export const clientId = z.guid({
  error: (issue) =>
    issue.input === undefined ? "Each record needs an id made on the device (a UUID)" : "The record id must be a UUID",
});

const EARLIEST_YEAR = 2000;
const LATEST_YEAR = 2100;

/**
 * A moment in time: an ISO 8601 string with its offset ("2026-11-09T14:30:00-06:00" or "…Z"), or a
 * Date (rows read back from the database). A time without an offset is refused: it is ambiguous.
 */
export function instant(label: string) {
  return z
    .union(
      [
        z.date({ error: `${label} must be a valid date and time` }),
        z.iso.datetime({ offset: true, error: `${label} must be a date and time with its offset, like 2026-11-09T14:30:00-06:00` }),
      ],
      { error: missingOr(label, `${label} must be a date and time`) },
    )
    .transform((value) => new Date(value))
    .refine(
      (value) => value.getUTCFullYear() >= EARLIEST_YEAR && value.getUTCFullYear() <= LATEST_YEAR,
      `${label} must be between the years ${EARLIEST_YEAR} and ${LATEST_YEAR}`,
    );
}

// A device's clock and the server's differ by a few minutes; a reading stamped "now" on one is
// never refused by the other. Anything later than this is a time that has not happened yet.
const CLOCK_SKEW_MS = 10 * 60_000;

/**
 * A moment that has already happened (a truck's discharge, a reading): a time in the future is
 * refused, on the device when it is typed and on the server when it arrives, with the same words.
 */
export function pastInstant(label: string) {
  return instant(label).refine(
    (value) => value.getTime() <= Date.now() + CLOCK_SKEW_MS,
    `${label} is in the future: enter a time that has already passed (on a night pour, check the date)`,
  );
}

/** A calendar date in the project's time zone, e.g. a diary day. */
export function calendarDate(label: string) {
  return z.iso.date({ error: missingOr(label, `${label} must be a calendar date like 2026-11-09`) });
}

export function choice<const T extends readonly [string, ...string[]]>(label: string, values: T) {
  return z.enum(values, { error: missingOr(label, `${label} must be one of: ${values.join(", ")}`) });
}

/**
 * Adds an issue on `path` when `later` is before `earlier`. Object-level refinements also run when
 * a field already failed its own check (zod reports every problem at once), so the values may be
 * anything: only two real dates are compared.
 */
export function ordered(ctx: z.RefinementCtx, earlier: unknown, later: unknown, path: string, message: string) {
  if (earlier instanceof Date && later instanceof Date && later.getTime() < earlier.getTime()) {
    ctx.addIssue({ code: "custom", path: [path], message });
  }
}

/**
 * Fields only the server writes (a sign-off, an answer), as the device stores them: JSON, so an
 * instant is its ISO string. Null until the server fills them in.
 */
export const serverOwned = {
  instant: () => z.iso.datetime({ offset: true }).nullable().default(null),
  id: () => z.guid().nullable().default(null),
  text: () => z.string().nullable().default(null),
};

// The one home of list query-string and filter pieces: comma lists, 1/0 flags, calendar-day
// bounds and their order, sort direction, and the page of an offset-paged list. Every list schema
// (lib/review, lib/records/read, lib/lab) builds on these, so a bad page or date gets the same
// message on every list. Client-safe: zod only.
import { z } from "zod";

export const MAX_LIST_PAGE_SIZE = 200;

/** "a, b,,c" → ["a", "b", "c"]. */
export const commaList = (label: string) =>
  z
    .string({ error: `${label} must be text` })
    .transform((v) => v.split(",").map((part) => part.trim()).filter(Boolean));

/** A comma-separated list, each one of `values`. */
export const oneOrMoreOf = <S extends string>(label: string, values: readonly S[]) =>
  commaList(label)
    .refine((list) => list.every((v) => (values as readonly string[]).includes(v)), {
      message: `${label} must be one or more of: ${values.join(", ")}`,
    })
    .transform((list) => list as S[]);

/** A query-string switch: 1/0 or true/false. */
export const flag = (label: string) =>
  z.enum(["0", "1", "true", "false"], { error: `${label} must be 1 or 0` }).transform((v) => v === "1" || v === "true");

const calendarDay = (label: string) => z.iso.date({ error: `${label} must be a date like 2026-11-09` });
/** The bounds of a date-range filter (project-local calendar days). */
export const fromDay = calendarDay("From");
export const toDay = calendarDay("To");
/** Refinement of an object with `from`/`to`: the range may not run backwards. */
export const orderedRange = <T extends { from?: string; to?: string }>(q: T) => !q.from || !q.to || q.from <= q.to;
export const orderedRangeMessage = { message: "The start date must not be after the end date", path: ["from"] };

export const sortDir = z.enum(["asc", "desc"], { error: "Direction must be asc or desc" });

/** The page of an offset-paged list (query strings: numbers are coerced). */
export const pageParam = z.coerce
  .number({ error: "Page must be a number" })
  .int("Page must be a whole number")
  .min(1, "Page must be 1 or more")
  .max(100_000, "Page is too large")
  .default(1);

export const pageSizeParam = z.coerce
  .number({ error: "Page size must be a number" })
  .int("Page size must be a whole number")
  .min(1, `Page size must be between 1 and ${MAX_LIST_PAGE_SIZE}`)
  .max(MAX_LIST_PAGE_SIZE, `Page size must be between 1 and ${MAX_LIST_PAGE_SIZE}`)
  .default(50);

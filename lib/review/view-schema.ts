// The saved default view of a review table (one zod schema, used by the API and the screen).
// Client-safe: no database imports.
import { z } from "zod";
import { PLACEMENT_STATES } from "@/lib/records/enums";
import { fromDay, orderedRange, orderedRangeMessage, sortDir, toDay } from "@/lib/list-query";
import { DIARY_COLUMNS, PLACEMENT_COLUMNS } from "./columns";
import { DIARY_SORTS, DIARY_STATES, PLACEMENT_SORTS, REVIEW_PAGE_SIZES } from "./query-schemas";

const keysOf = <T extends readonly { key: string }[]>(cols: T) => cols.map((c) => c.key) as [T[number]["key"], ...T[number]["key"][]];

const projects = z.array(z.guid({ error: "Projects must be project ids" }), { error: "Projects must be a list" }).max(100, "Choose at most 100 projects");
const pageSize = z
  .number({ error: "Page size must be a number" })
  .refine((n) => (REVIEW_PAGE_SIZES as readonly number[]).includes(n), { message: `Page size must be one of ${REVIEW_PAGE_SIZES.join(", ")}` });

const columns = <T extends [string, ...string[]]>(keys: T) =>
  z
    .array(z.enum(keys, { error: `Columns must be among: ${keys.join(", ")}` }), { error: "Columns must be a list" })
    .min(1, "Show at least one column")
    .refine((cols) => new Set(cols).size === cols.length, { message: "A column is listed twice" });

export const placementViewSchema = z
  .object({
    list: z.literal("placements"),
    columns: columns(keysOf(PLACEMENT_COLUMNS)),
    sort: z.enum(PLACEMENT_SORTS, { error: `Sort must be one of: ${PLACEMENT_SORTS.join(", ")}` }),
    dir: sortDir,
    pageSize,
    filters: z
      .object({
        projects: projects.optional(),
        from: fromDay.optional(),
        to: toDay.optional(),
        state: z.array(z.enum(PLACEMENT_STATES, { error: `State must be one of: ${PLACEMENT_STATES.join(", ")}` })).optional(),
        hasWarnings: z.boolean({ error: "Has warnings must be true or false" }).optional(),
      })
      .strict()
      .refine(orderedRange, orderedRangeMessage),
  })
  .strict();

export const diaryViewSchema = z
  .object({
    list: z.literal("diaries"),
    columns: columns(keysOf(DIARY_COLUMNS)),
    sort: z.enum(DIARY_SORTS, { error: `Sort must be one of: ${DIARY_SORTS.join(", ")}` }),
    dir: sortDir,
    pageSize,
    filters: z
      .object({
        projects: projects.optional(),
        from: fromDay.optional(),
        to: toDay.optional(),
        state: z.array(z.enum(DIARY_STATES, { error: `State must be one of: ${DIARY_STATES.join(", ")}` })).optional(),
      })
      .strict()
      .refine(orderedRange, orderedRangeMessage),
  })
  .strict();

export const reviewViewSchema = z.discriminatedUnion("list", [placementViewSchema, diaryViewSchema], {
  error: "List must be placements or diaries",
});
export type PlacementView = z.output<typeof placementViewSchema>;
export type DiaryView = z.output<typeof diaryViewSchema>;
export type ReviewView = z.output<typeof reviewViewSchema>;
export type SavedViews = { placements: PlacementView | null; diaries: DiaryView | null };

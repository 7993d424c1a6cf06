// Every list query and saved filter takes its page, date bounds, sort direction and state lists from
// lib/list-query.ts (one home), so a bad page or date gets the same message on every list.
// Expected values: ISO 8601 calendar dates (YYYY-MM-DD) [src: ISO 8601-1:2019 §5.2.2]; an
// offset-paged list starts at page 1 [common practice].
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { queueQuerySchema } from "@/lib/lab/schemas";
import { fromDay, pageParam, pageSizeParam, sortDir, toDay } from "@/lib/list-query";
import { diaryListQuery, placementListQuery } from "@/lib/review/query-schemas";
import { diaryViewSchema, placementViewSchema } from "@/lib/review/view-schema";

const unwrap = (schema: z.ZodType): z.ZodType => {
  let s = schema as z.ZodType & { unwrap?: () => z.ZodType; def: { innerType?: z.ZodType } };
  // Optional and default wrappers around the shared piece.
  while (s.def.innerType) s = s.def.innerType as typeof s;
  return s;
};
const messageOf = (schema: z.ZodType, input: unknown, path: string) => {
  const result = schema.safeParse(input);
  expect(result.success).toBe(false);
  return result.error!.issues.find((i) => i.path.join(".") === path)?.message;
};

const LIST_QUERIES = { placements: placementListQuery, diaries: diaryListQuery };
const VIEW_FILTERS = { placements: placementViewSchema.shape.filters, diaries: diaryViewSchema.shape.filters };

describe("one schema for the page and the date range of every list", () => {
  it("the review lists share the page, page size, date bounds and direction objects", () => {
    for (const query of Object.values(LIST_QUERIES)) {
      expect(unwrap(query.shape.page)).toBe(unwrap(pageParam));
      expect(unwrap(query.shape.pageSize)).toBe(unwrap(pageSizeParam));
      expect(unwrap(query.shape.from)).toBe(fromDay);
      expect(unwrap(query.shape.to)).toBe(toDay);
      expect(unwrap(query.shape.dir)).toBe(sortDir);
    }
  });

  it("the saved views' filters use the same date bounds and direction", () => {
    for (const [list, filters] of Object.entries(VIEW_FILTERS)) {
      expect(unwrap(filters.shape.from), list).toBe(fromDay);
      expect(unwrap(filters.shape.to), list).toBe(toDay);
    }
    expect(placementViewSchema.shape.dir).toBe(sortDir);
    expect(diaryViewSchema.shape.dir).toBe(sortDir);
  });

  it("a bad page gets the same message on every list", () => {
    for (const query of Object.values(LIST_QUERIES)) {
      expect(messageOf(query, { page: "0" }, "page")).toBe("Page must be 1 or more");
      expect(messageOf(query, { page: "1.5" }, "page")).toBe("Page must be a whole number");
      expect(messageOf(query, { pageSize: "201" }, "pageSize")).toBe("Page size must be between 1 and 200");
    }
  });

  it("a bad or backwards date gets the same message on every list and saved view", () => {
    const viewBase = {
      placements: { list: "placements", columns: ["date"], sort: "date", dir: "asc", pageSize: 50 },
      diaries: { list: "diaries", columns: ["date"], sort: "date", dir: "asc", pageSize: 50 },
    };
    for (const [list, query] of Object.entries(LIST_QUERIES)) {
      expect(messageOf(query, { from: "2026-13-01" }, "from"), list).toBe("From must be a date like 2026-11-09");
      expect(messageOf(query, { to: "11/09/2026" }, "to"), list).toBe("To must be a date like 2026-11-09");
      expect(messageOf(query, { from: "2026-05-01", to: "2026-04-01" }, "from"), list).toBe("The start date must not be after the end date");
    }
    for (const [list, view] of Object.entries({ placements: placementViewSchema, diaries: diaryViewSchema })) {
      const base = viewBase[list as keyof typeof viewBase];
      expect(messageOf(view, { ...base, filters: { from: "2026-13-01" } }, "filters.from"), list).toBe("From must be a date like 2026-11-09");
      expect(messageOf(view, { ...base, filters: { from: "2026-05-01", to: "2026-04-01" } }, "filters.from"), list).toBe("The start date must not be after the end date");
    }
  });

  it("state and status lists name the choices the same way on the review and lab lists", () => {
    expect(messageOf(placementListQuery, { state: "placed,poured" }, "state")).toMatch(/^State must be one or more of: planned, /);
    expect(messageOf(diaryListQuery, { state: "late" }, "state")).toBe("State must be one or more of: missing, draft, submitted");
    expect(messageOf(queueQuerySchema, { status: "late" }, "status")).toBe("Status must be one or more of: due, overdue, tested");
  });
});

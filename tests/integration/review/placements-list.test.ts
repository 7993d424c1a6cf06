// GET /api/review/placements over 5,000 rows: filters, sorting, pages and the number of statements.
import { describe, expect, it } from "vitest";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { BULK, office, bulkProject, bulk, countQueries, list, setUpReviewData } from "./fixtures";

setUpReviewData();

describe("placements list over 5,000 rows", () => {
  const filters = { projects: "", from: "2026-03-01", to: "2026-08-31", state: "placed,held", hasWarnings: "1" };
  const matching = () =>
    bulk.filter((p) => p.date >= filters.from && p.date <= filters.to && ["placed", "held"].includes(p.state) && p.warned);

  it("returns only the matching rows, in order, with the total", async () => {
    const query = { ...filters, projects: bulkProject.id, sort: "date", dir: "asc", page: "2", pageSize: "25" };
    const res = await list(office, query);
    expect(res.status).toBe(200);
    // Expected order: planned start ascending, then id (the API's documented tie-break).
    const expected = matching().sort((x, y) => (x.plannedStart < y.plannedStart ? -1 : x.plannedStart > y.plannedStart ? 1 : x.id < y.id ? -1 : 1));
    expect(expected.length).toBeGreaterThan(50);
    expect(res.json.total).toBe(expected.length);
    expect(res.json.rows.map((r: PlacementReviewRow) => r.id)).toEqual(expected.slice(25, 50).map((p) => p.id));
    for (const row of res.json.rows as PlacementReviewRow[]) {
      const p = bulk.find((b) => b.id === row.id)!;
      expect(row.hasWarnings).toBe(true);
      expect(row.lateTrucks).toBe(p.lateTrucks);
      expect(row.testsOut).toBe(p.testsOut);
      expect(["placed", "held"]).toContain(row.state);
    }
  });

  it("sorts on a computed column (late trucks, descending) and pages past the end", async () => {
    const query = { projects: bulkProject.id, sort: "lateTrucks", dir: "desc", pageSize: "200" };
    const first = await list(office, query);
    expect(first.json.total).toBe(BULK);
    const lates = bulk.filter((p) => p.lateTrucks).length;
    const rows = first.json.rows as PlacementReviewRow[];
    expect(rows.every((r) => r.lateTrucks === 1)).toBe(true);
    // Within equal keys: planned start, then id, both descending.
    const sorted = [...rows].sort((x, y) => (x.plannedStart > y.plannedStart ? -1 : x.plannedStart < y.plannedStart ? 1 : x.id > y.id ? -1 : 1));
    expect(rows.map((r) => r.id)).toEqual(sorted.map((r) => r.id));
    const boundary = await list(office, { ...query, page: String(Math.floor(lates / 200) + 1) });
    const b = boundary.json.rows as PlacementReviewRow[];
    expect(b.filter((r) => r.lateTrucks === 1)).toHaveLength(lates % 200);
    const beyond = await list(office, { ...query, page: "999" });
    expect(beyond.json).toMatchObject({ rows: [], total: BULK });
  });

  it("answers a page in a fixed number of statements, whatever the page or filter", async () => {
    const counts: number[] = [];
    let last: string[] = [];
    const queries: Record<string, string>[] = [
      { projects: bulkProject.id, pageSize: "25" },
      { ...filters, projects: bulkProject.id, page: "3", pageSize: "200", sort: "testsOut" },
      { pageSize: "200", page: "20", sort: "evaporationRisk", dir: "asc" },
      { hasWarnings: "0", pageSize: "100", sort: "project" },
    ];
    for (const query of queries) {
      const { result, queries, texts } = await countQueries(() => list(office, query));
      expect(result.status).toBe(200);
      counts.push(queries);
      last = texts;
    }
    // The session's re-read of the user row, one read of the memberships (for can()), and one
    // statement for the page and its count.
    expect(counts).toEqual([3, 3, 3, 3]);
    expect(last[0]).toMatch(/from "users"/);
    expect(last[1]).toMatch(/from "memberships"/);
    expect(last[2]).toMatch(/^\s*with f as/);
  });
});

// The review list's CSV export, parsed back with papaparse.
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import * as placementsRoute from "@/app/api/review/placements/route";
import { PLACEMENT_COLUMNS } from "@/lib/review/columns";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { sessionCookie } from "../helpers";
import { NextRequest } from "next/server";
import { office, bulkProject, list, setUpReviewData } from "./fixtures";

setUpReviewData();

describe("CSV export", () => {
  it("parses back (papaparse) to the rows of the API page, with the chosen columns", async () => {
    const query = { projects: bulkProject.id, from: "2026-02-01", to: "2026-02-28", hasWarnings: "1", sort: "element", dir: "asc", pageSize: "200" };
    const page = await list(office, query);
    const req = new NextRequest(new URL(`/api/review/placements?${new URLSearchParams({ ...query, format: "csv", columns: "date,element,lateTrucks,testsOut,state" })}`, "http://localhost:3100"), {
      headers: { cookie: await sessionCookie(office) },
    });
    const res = await placementsRoute.GET(req, { params: Promise.resolve({}) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(await res.text(), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const label = (key: string) => PLACEMENT_COLUMNS.find((c) => c.key === key)!.label;
    expect(parsed.meta.fields).toEqual(["date", "element", "lateTrucks", "testsOut", "state"].map(label));
    expect(parsed.data).toEqual(
      (page.json.rows as PlacementReviewRow[]).map((r) => ({
        [label("date")]: r.date,
        [label("element")]: r.element,
        [label("lateTrucks")]: String(r.lateTrucks),
        [label("testsOut")]: String(r.testsOut),
        [label("state")]: r.state,
      })),
    );
    expect(parsed.data.length).toBe(page.json.total);
  });

  it("refuses an unknown column", async () => {
    const res = await list(office, { format: "csv", columns: "date,secret" });
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/Unknown column: secret/);
  });
});

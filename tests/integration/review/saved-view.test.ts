// The saved default view of a review list (GET/PUT/DELETE /api/review/views).
import { describe, expect, it } from "vitest";
import * as viewsRoute from "@/app/api/review/views/route";
import { callRoute, countRows } from "../helpers";
import { office, owner, setUpReviewData } from "./fixtures";

setUpReviewData({ bulk: false });

describe("saved default view", () => {
  const view = {
    list: "placements",
    columns: ["date", "project", "element", "lateTrucks", "testsOut"],
    sort: "lateTrucks",
    dir: "desc",
    pageSize: 100,
    filters: { hasWarnings: true, state: ["placed", "held"], from: "2026-03-01" },
  };

  it("is stored per user and list, replaced on save and removed on delete", async () => {
    const empty = await callRoute(viewsRoute.GET, { user: office });
    expect(empty.json).toEqual({ placements: null, diaries: null });
    const saved = await callRoute(viewsRoute.PUT, { user: office, method: "PUT", body: view });
    expect(saved.status).toBe(200);
    expect(saved.json.placements).toEqual(view);
    const changed = { ...view, pageSize: 25, columns: ["element", "date"] };
    await callRoute(viewsRoute.PUT, { user: office, method: "PUT", body: changed });
    const diary = { list: "diaries", columns: ["date", "state"], sort: "date", dir: "asc", pageSize: 50, filters: { state: ["missing"] } };
    await callRoute(viewsRoute.PUT, { user: office, method: "PUT", body: diary });
    const read = await callRoute(viewsRoute.GET, { user: office });
    expect(read.json).toEqual({ placements: changed, diaries: diary });
    // Another user's views are their own.
    expect((await callRoute(viewsRoute.GET, { user: owner })).json).toEqual({ placements: null, diaries: null });
    const removed = await callRoute(viewsRoute.DELETE, { user: office, method: "DELETE", body: { list: "placements" } });
    expect(removed.json).toEqual({ placements: null, diaries: diary });
  });

  it("refuses a bad view with a specific message and keeps the saved one", async () => {
    await callRoute(viewsRoute.PUT, { user: owner, method: "PUT", body: view });
    const before = await countRows("review_views");
    const bad: [unknown, string, RegExp][] = [
      [{ ...view, columns: ["date", "password"] }, "columns.1", /Columns must be among/],
      [{ ...view, columns: [] }, "columns", /at least one column/],
      [{ ...view, pageSize: 33 }, "pageSize", /one of 25, 50, 100, 200/],
      [{ ...view, sort: "crew" }, "sort", /Sort must be one of/],
      [{ ...view, filters: { from: "2026-05-01", to: "2026-04-01" } }, "filters.from", /must not be after/],
      [{ ...view, list: "trucks" }, "list", /placements or diaries/],
    ];
    for (const [body, field, message] of bad) {
      const res = await callRoute(viewsRoute.PUT, { user: owner, method: "PUT", body });
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.json.error.fields[field], JSON.stringify(res.json.error)).toMatch(message);
    }
    expect(await countRows("review_views")).toBe(before);
    expect((await callRoute(viewsRoute.GET, { user: owner })).json.placements).toEqual(view);
    expect((await callRoute(viewsRoute.PUT, { user: null, method: "PUT", body: view })).status).toBe(401);
  });
});

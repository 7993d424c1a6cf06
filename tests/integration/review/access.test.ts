// Who sees what on the review lists, and bad parameters.
import { describe, expect, it } from "vitest";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { countRows } from "../helpers";
import { BULK, office, outsider, owner, bulkProject, list, setUpReviewData } from "./fixtures";

setUpReviewData();

describe("who sees what", () => {
  it("a user sees only the projects they belong to", async () => {
    const res = await list(outsider, { pageSize: "200" });
    expect(res.status).toBe(200);
    expect(res.json.total).toBe(0);
    const mine = await list(owner, { pageSize: "10" });
    expect(mine.json.total).toBe(BULK);
    expect((mine.json.rows as PlacementReviewRow[]).every((r) => r.projectId === bulkProject.id)).toBe(true);
  });

  it("asking for a project the user is not a member of is refused", async () => {
    const res = await list(outsider, { projects: bulkProject.id });
    expect(res.status).toBe(403);
    expect(res.json.error.code).toBe("forbidden");
  });

  it("anonymous requests are refused", async () => {
    expect((await list(null, {})).status).toBe(401);
  });

  it("bad parameters answer 400 with a specific message and change nothing", async () => {
    const before = await countRows("placements");
    const cases: [Record<string, string>, string, RegExp][] = [
      [{ sort: "password" }, "sort", /Sort must be one of/],
      [{ pageSize: "5000" }, "pageSize", /between 1 and 200/],
      [{ page: "0" }, "page", /1 or more/],
      [{ from: "2026-13-01" }, "from", /date like 2026-11-09/],
      [{ from: "2026-05-01", to: "2026-04-01" }, "from", /must not be after/],
      [{ state: "poured" }, "state", /State must be one or more of/],
      [{ projects: "not-a-uuid" }, "projects", /project ids/],
      [{ hasWarnings: "maybe" }, "hasWarnings", /1 or 0/],
      [{ colour: "red" }, "_", /./],
    ];
    for (const [query, field, message] of cases) {
      const res = await list(office, query);
      expect(res.status, JSON.stringify(query)).toBe(400);
      expect(res.json.error.code).toBe("invalid_input");
      expect(res.json.error.fields[field] ?? res.json.error.message, JSON.stringify(query)).toMatch(message);
    }
    expect(await countRows("placements")).toBe(before);
  });
});

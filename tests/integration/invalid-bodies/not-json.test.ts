// A body that is not JSON, or not an object, is refused with a 400 by every record type's write route.
import { beforeAll, describe, expect, it } from "vitest";
import { POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { callRoute, projectWithTeam } from "../helpers";
import { RECORD_TYPES, WRITER } from "../record-fixtures";

describe("invalid bodies", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;

  beforeAll(async () => {
    s = await projectWithTeam();
  });

  it("a body that is not JSON, or not an object, is a 400 too", async () => {
    for (const type of RECORD_TYPES) {
      const params = { projectId: s.project.id, type };
      const user = s.team[WRITER[type]];
      const notJson = await callRoute(POST, { user, params, rawBody: "{oops" });
      expect(notJson.status).toBe(400);
      expect(notJson.json.error.fields._).toMatch(/not valid JSON/);
      for (const body of [[], "text", 42, null]) {
        const res = await callRoute(POST, { user, params, body });
        expect(res.status).toBe(400);
        expect(Object.keys(res.json.error.fields).length).toBeGreaterThan(0);
      }
    }
  }, 120_000);
});

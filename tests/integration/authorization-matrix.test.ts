// Every route × every role (and a non-member) × own project / a record of another project / another
// project, against a table of expected outcomes; and no row of a project leaks to a non-member.
import { beforeAll, describe, expect, it } from "vitest";
import { POST as transitionRoute } from "@/app/api/projects/[projectId]/placements/[id]/transition/route";
import { DELETE, GET as readRoute, PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { GET as listRoute, POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import type { RecordType } from "@/lib/records/registry";
import type { RecordRow } from "@/lib/records/types";
import { callRoute, projectWithTeam, type TestUser } from "./helpers";
import { bodyWithParents, makeRecord, PATCHES, RECORD_TYPES, WRITERS } from "./record-fixtures";

const ACTORS = ["superintendent", "inspector", "office", "owner", "outsider"] as const;
type Actor = (typeof ACTORS)[number];
const TARGETS = ["own", "foreign-record", "foreign-project"] as const;
type Target = (typeof TARGETS)[number];
type Route = "list" | "create" | "read" | "update" | "delete";

/** The table of expected outcomes: allow (200/201), 403 or 404. */
function expected(route: Route, type: RecordType, actor: Actor, target: Target): number {
  // A project the caller does not belong to answers like one that does not exist (no existence oracle).
  if (actor === "outsider" || target === "foreign-project") return 404;
  const reading = route === "list" || route === "read";
  if (!reading && !WRITERS[type].includes(actor)) return 403;
  if (target === "foreign-record") return 404;
  return route === "create" ? 201 : 200;
}

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;

describe("authorization matrix", () => {
  let s: Setup;
  let f: Setup; // a foreign project with its own team and records
  const actor = (a: Actor): TestUser => (a === "outsider" ? s.outsider : s.team[a]);

  beforeAll(async () => {
    s = await projectWithTeam();
    f = await projectWithTeam();
  });

  describe.each(RECORD_TYPES.map((type) => [type]))("%s", (type) => {
    let ownShared: RecordRow;
    let foreign: RecordRow;
    beforeAll(async () => {
      ownShared = await makeRecord(type, s.project.id, s.team);
      foreign = await makeRecord(type, f.project.id, f.team);
    });

    async function call(route: Route, who: Actor, target: Target): Promise<number> {
      const user = actor(who);
      const projectId = target === "foreign-project" ? f.project.id : s.project.id;
      const params = { projectId, type };
      const willWrite = (route === "update" || route === "delete") && expected(route, type, who, target) === 200;
      // Accepted writes get a fresh record each; refused ones aim at a shared record that must not change.
      const record = target === "own" ? (willWrite ? await makeRecord(type, s.project.id, s.team) : ownShared) : foreign;
      switch (route) {
        case "list":
          return (await callRoute(listRoute, { user, params })).status;
        case "create": {
          const body = await bodyWithParents(type, s.project.id, s.team);
          return (await callRoute(POST, { user, params, body })).status;
        }
        case "read":
          return (await callRoute(readRoute, { user, params: { ...params, id: record.id } })).status;
        case "update":
          return (await callRoute(PATCH, { user, method: "PATCH", params: { ...params, id: record.id }, body: { baseVersion: record.version, patch: PATCHES[type] } })).status;
        case "delete":
          return (await callRoute(DELETE, { user, method: "DELETE", params: { ...params, id: record.id }, body: { baseVersion: record.version } })).status;
      }
    }

    it.each(["list", "create", "read", "update", "delete"] as Route[])("%s", async (route) => {
      const mismatches: string[] = [];
      for (const who of ACTORS) {
        for (const target of TARGETS) {
          if ((route === "list" || route === "create") && target === "foreign-record") continue;
          const want = expected(route, type, who, target);
          const got = await call(route, who, target);
          if (got !== want) mismatches.push(`${route} ${type} as ${who} on ${target}: got ${got}, want ${want}`);
        }
      }
      expect(mismatches).toEqual([]);
    });

    it("refused writes left the shared records unchanged", async () => {
      const own = await callRoute(readRoute, { user: s.team.owner, params: { projectId: s.project.id, type, id: ownShared.id } });
      expect(own.json.version).toBe(1);
      const theirs = await callRoute(readRoute, { user: f.team.owner, params: { projectId: f.project.id, type, id: foreign.id } });
      expect(theirs.json.version).toBe(1);
    });

    it("no row of a project leaks into a list of a non-member or of another project", async () => {
      for (const who of ["superintendent", "inspector", "office", "owner"] as const) {
        const mine = await callRoute(listRoute, { user: s.team[who], params: { projectId: s.project.id, type }, url: "/x?limit=200&includeDeleted=1" });
        expect(mine.status).toBe(200);
        expect(mine.json.items.length).toBeGreaterThan(0);
        expect(mine.json.items.every((r: RecordRow) => r.projectId === s.project.id)).toBe(true);
        expect(mine.json.items.map((r: RecordRow) => r.id)).not.toContain(foreign.id);
      }
      const outsiderOwn = await callRoute(listRoute, { user: s.outsider, params: { projectId: s.otherProject.id, type }, url: "/x?limit=200&includeDeleted=1" });
      expect(outsiderOwn.status).toBe(200);
      expect(outsiderOwn.json.items).toEqual([]);
      const outsiderTheirs = await callRoute(listRoute, { user: s.outsider, params: { projectId: s.project.id, type } });
      expect(outsiderTheirs.status).toBe(404);
      expect(outsiderTheirs.json.items).toBeUndefined();
      // An administrator without a membership reads no project records either.
      expect((await callRoute(listRoute, { user: s.admin, params: { projectId: s.project.id, type } })).status).toBe(404);
    });
  });

  describe("placement transition route", () => {
    // planned → ready is the superintendent's move; every other role gets 403.
    const expectedMove = (who: Actor, target: Target) => {
      if (who === "outsider" || target === "foreign-project") return 404;
      if (who === "office" || who === "owner") return 403; // they make no moves at all
      if (target === "foreign-record") return 404;
      return who === "superintendent" ? 200 : 403;
    };

    it("every role × own project / foreign record / foreign project", async () => {
      const mismatches: string[] = [];
      const foreign = await makeRecord("placements", f.project.id, f.team);
      for (const who of ACTORS) {
        for (const target of TARGETS) {
          const record = target === "own" ? await makeRecord("placements", s.project.id, s.team) : foreign;
          const projectId = target === "foreign-project" ? f.project.id : s.project.id;
          const res = await callRoute(transitionRoute, { user: actor(who), params: { projectId, id: record.id }, body: { to: "ready", baseVersion: 1 } });
          const want = expectedMove(who, target);
          if (res.status !== want) mismatches.push(`transition as ${who} on ${target}: got ${res.status}, want ${want}`);
        }
      }
      expect(mismatches).toEqual([]);
    });
  });

  it("an unknown record type is a 404 on every route", async () => {
    const params = { projectId: s.project.id, type: "pour-tickets", id: s.project.id };
    expect((await callRoute(listRoute, { user: s.team.owner, params })).status).toBe(404);
    expect((await callRoute(POST, { user: s.team.office, params, body: {} })).status).toBe(404);
    expect((await callRoute(readRoute, { user: s.team.owner, params })).status).toBe(404);
    expect((await callRoute(PATCH, { user: s.team.office, method: "PATCH", params, body: { baseVersion: 1, patch: {} } })).status).toBe(404);
    expect((await callRoute(DELETE, { user: s.team.office, method: "DELETE", params, body: { baseVersion: 1 } })).status).toBe(404);
  });

  it("no session is a 401 on every route", async () => {
    const params = { projectId: s.project.id, type: "placements", id: s.project.id };
    for (const [handler, method] of [[listRoute, "GET"], [POST, "POST"], [readRoute, "GET"], [PATCH, "PATCH"], [DELETE, "DELETE"], [transitionRoute, "POST"]] as const) {
      expect((await callRoute(handler, { user: null, method, params, body: method === "GET" ? undefined : {} })).status).toBe(401);
    }
  });
});

// Who may enter breaks, and bad break input.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as acceptanceRoute } from "@/app/api/projects/[projectId]/lab/acceptance/route";
import { GET as setsRoute } from "@/app/api/projects/[projectId]/lab/sets/route";
import { POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { callRoute, countRows, createProject, projectWithTeam, type TestUser } from "../helpers";
import { makeRecord, validBody } from "../record-fixtures";

describe("who may enter breaks, and bad break input", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  let setId: string;
  beforeAll(async () => {
    s = await projectWithTeam();
    setId = (await makeRecord("specimen-sets", s.project.id, s.team)).id;
  });
  const post = (user: TestUser, body: unknown, projectId = s.project.id) =>
    callRoute(POST, { user, params: { projectId, type: "breaks" }, body });

  it("owner, inspector and superintendent get 403 (lib/auth/can.ts: the office enters breaks); nothing stored", async () => {
    const before = await countRows("breaks");
    for (const role of ["owner", "inspector", "superintendent"] as const) {
      const res = await post(s.team[role], validBody("breaks", setId));
      expect(res.status, role).toBe(403);
      expect(res.json.error.message).toBe("Your role on this project does not allow that.");
    }
    const outsider = await post(s.outsider, validBody("breaks", setId));
    expect(outsider.status).toBe(404);
    expect(outsider.json.error.message).toBe("Project not found.");
    expect(await countRows("breaks")).toBe(before);
    const ok = await post(s.team.office, validBody("breaks", setId));
    expect(ok.status).toBe(201);
    // ASTM C39: 180 kN on a 100 mm cylinder (L/D 2, no correction) → 180 000 / 7854.0 = 22.918 MPa [computed].
    expect(ok.json.strengthMPa).toBeCloseTo(22.918, 3);
  });

  it("another project's user and a project that does not exist get the same 404 on the lab reads", async () => {
    expect((await callRoute(acceptanceRoute, { user: s.outsider, params: { projectId: s.project.id } })).status).toBe(404);
    expect((await callRoute(setsRoute, { user: s.outsider, params: { projectId: s.project.id } })).status).toBe(404);
    const ghost = randomUUID();
    expect((await callRoute(acceptanceRoute, { user: s.team.office, params: { projectId: ghost } })).status).toBe(404);
    // A set of this project cannot receive a break through another project's URL.
    const other = await createProject();
    const cross = await post(s.team.office, validBody("breaks", setId), other.id);
    expect([403, 404]).toContain(cross.status);
  });

  it("a negative load or a missing diameter is a 400 naming the field, and nothing is stored", async () => {
    const before = await countRows("breaks");
    const negative = await post(s.team.office, { ...validBody("breaks", setId), loadKN: -50 });
    expect(negative.status).toBe(400);
    expect(negative.json.error).toMatchObject({ code: "invalid_input", message: "Maximum load cannot be negative", fields: { loadKN: "Maximum load cannot be negative" } });
    const zero = await post(s.team.office, { ...validBody("breaks", setId), loadKN: 0 });
    expect(zero.status).toBe(400);
    expect(zero.json.error.fields.loadKN).toBe("Maximum load must be greater than zero");
    const { diameterMm: _omit, ...noDiameter } = validBody("breaks", setId);
    void _omit;
    const missing = await post(s.team.office, noDiameter);
    expect(missing.status).toBe(400);
    expect(missing.json.error.fields).toEqual({ diameterMm: "Enter the diameter" });
    // ASTM C39 L/D correction stops at 1.0: a 90 mm long, 100 mm cylinder cannot be corrected.
    const short = await post(s.team.office, { ...validBody("breaks", setId), lengthMm: 90 });
    expect(short.status).toBe(400);
    expect(short.json.error.fields.lengthMm).toMatch(/L\/D below 1\.0/);
    expect(await countRows("breaks")).toBe(before);
  });

  it("the sets route lists the set with its break and a strength test still short of cylinders", async () => {
    const res = await callRoute(setsRoute, { user: s.team.office, params: { projectId: s.project.id } });
    expect(res.status).toBe(200);
    const set = res.json.sets.find((x: { id: string }) => x.id === setId);
    expect(set.breaks).toHaveLength(1);
    // One 100 mm cylinder is not a strength test: ACI 318 wants three of that size.
    expect(set.tests[0]).toMatchObject({ ageDays: 7, averageMPa: null, needed: 3 });
    expect(set.tests[0].incompleteReason).toMatch(/at least 3 cylinders/);
  });
});

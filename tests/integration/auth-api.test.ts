import { describe, expect, it } from "vitest";
import { GET as listProjects } from "@/app/api/projects/route";
import { POST as createProjectRoute } from "@/app/api/admin/projects/route";
import { POST as addMemberRoute } from "@/app/api/admin/projects/[projectId]/members/route";
import { POST as inviteRoute } from "@/app/api/invitations/route";
import { addMembership, callRoute, countRows, createProject, createUser, projectWithTeam } from "./helpers";

describe("API conventions: 401, 403, 400, and nothing written when refused", () => {
  it("a request without a session gets 401 with the JSON error shape", async () => {
    const before = await countRows("projects");
    const res = await callRoute(createProjectRoute, { user: null, body: { name: "X", code: "XX", timeZone: "UTC", unitSystem: "SI" } });
    expect(res.status).toBe(401);
    expect(res.json.error.code).toBe("unauthenticated");
    expect(res.json.error.message).toMatch(/sign in/i);
    expect(await countRows("projects")).toBe(before);
  });

  it("a non-admin cannot create projects (403) and nothing is written", async () => {
    const user = await createUser();
    const before = await countRows("projects");
    const res = await callRoute(createProjectRoute, { user, body: { name: "Nope", code: "NOPE-1", timeZone: "UTC", unitSystem: "SI" } });
    expect(res.status).toBe(403);
    expect(res.json.error.code).toBe("forbidden");
    expect(await countRows("projects")).toBe(before);
  });

  it("bad JSON is a 400 that says so; invalid fields are named", async () => {
    const admin = await createUser({ isAdmin: true });
    const before = await countRows("projects");
    const bad = await callRoute(createProjectRoute, { user: admin, rawBody: "{not json" });
    expect(bad.status).toBe(400);
    expect(bad.json.error.message).toMatch(/not valid JSON/);

    const invalid = await callRoute(createProjectRoute, { user: admin, body: { name: "Ok name", code: "a b", timeZone: "Mars/Olympus", unitSystem: "XX" } });
    expect(invalid.status).toBe(400);
    expect(invalid.json.error.code).toBe("invalid_input");
    expect(Object.keys(invalid.json.error.fields).sort()).toEqual(["code", "timeZone", "unitSystem"]);
    expect(invalid.json.error.fields.timeZone).toMatch(/time zone/);
    expect(JSON.stringify(invalid.json)).not.toMatch(/stack|SELECT|insert into/i);
    expect(await countRows("projects")).toBe(before);
  });

  it("an admin creates a project; a duplicate code is a 409 naming the field", async () => {
    const admin = await createUser({ isAdmin: true });
    const code = `IT-${Date.now().toString(36).toUpperCase()}`;
    const ok = await callRoute(createProjectRoute, { user: admin, body: { name: "Integration Yard", code, timeZone: "America/Chicago", unitSystem: "IP" } });
    expect(ok.status).toBe(200);
    expect(ok.json.code).toBe(code);
    const again = await callRoute(createProjectRoute, { user: admin, body: { name: "Other", code, timeZone: "UTC", unitSystem: "SI" } });
    expect(again.status).toBe(409);
    expect(again.json.error.fields.code).toBeDefined();
  });

  it("a member sees only the projects they belong to", async () => {
    const { project, team, otherProject, outsider } = await projectWithTeam();
    const mine = await callRoute(listProjects, { user: team.owner });
    expect(mine.status).toBe(200);
    expect(mine.json.map((p: { id: string }) => p.id)).toEqual([project.id]);
    expect(mine.json[0].role).toBe("owner");
    const theirs = await callRoute(listProjects, { user: outsider });
    expect(theirs.json.map((p: { id: string }) => p.id)).toEqual([otherProject.id]);
  });

  it("adding a member: unknown address 404 with the field, duplicate 409, non-admin 403", async () => {
    const admin = await createUser({ isAdmin: true });
    const project = await createProject();
    const person = await createUser();
    const params = { projectId: project.id };
    const before = await countRows("memberships");
    const unknown = await callRoute(addMemberRoute, { user: admin, params, body: { email: "nobody-here@example.test", role: "owner" } });
    expect(unknown.status).toBe(404);
    expect(unknown.json.error.fields.email).toBeDefined();
    const notAdmin = await callRoute(addMemberRoute, { user: person, params, body: { email: person.email, role: "owner" } });
    expect(notAdmin.status).toBe(403);
    expect(await countRows("memberships")).toBe(before);
    const ok = await callRoute(addMemberRoute, { user: admin, params, body: { email: person.email, role: "inspector" } });
    expect(ok.status).toBe(200);
    const dup = await callRoute(addMemberRoute, { user: admin, params, body: { email: person.email, role: "owner" } });
    expect(dup.status).toBe(409);
    expect(await countRows("memberships")).toBe(before + 1);
  });

  it("an invitation for an address that already has a password is refused", async () => {
    const admin = await createUser({ isAdmin: true });
    const project = await createProject();
    const member = await createUser();
    await addMembership(member.id, project.id, "office");
    const badRole = await callRoute(inviteRoute, { user: admin, body: { email: "new.person@example.test", name: "New Person", projectId: project.id } });
    expect(badRole.status).toBe(400);
    expect(badRole.json.error.fields.role).toMatch(/project and a role/);
  });
});

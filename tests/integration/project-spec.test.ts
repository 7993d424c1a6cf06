// The project specification's values: only an administrator changes them, a bad value changes
// nothing, and a change re-judges the project's stored findings at once (the review, the digest and
// the PDF read those), so no surface keeps a verdict from the old limit.
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries, checkFindings, projects } from "@/db/schema";
import * as specRoute from "@/app/api/admin/projects/[projectId]/route";
import { callRoute, projectWithTeam, type TestUser } from "./helpers";
import { makeRecord, type Team } from "./record-fixtures";

const patch = (user: TestUser, projectId: string, body: unknown) =>
  callRoute(specRoute.PATCH, { user, method: "PATCH", params: { projectId }, body });

const dischargeFindings = (projectId: string) =>
  db.select().from(checkFindings).where(and(eq(checkFindings.projectId, projectId), eq(checkFindings.rule, "discharge-time")));

describe("PATCH /api/admin/projects/:projectId (project specification)", () => {
  it("a shorter discharge limit re-judges a stored 60-minute truck as late (ASTM C94 §10.7: the purchaser may set another limit)", async () => {
    const { project, team, admin } = await projectWithTeam();
    // The fixture truck: batched 08:00, discharge finished 09:00 — inside the default 90 min.
    await makeRecord("deliveries", project.id, team as Team);
    expect(await dischargeFindings(project.id)).toHaveLength(0);

    const res = await patch(admin, project.id, { dischargeLimitMinutes: 45 });
    expect(res.status).toBe(200);
    expect(res.json.dischargeLimitMinutes).toBe(45);
    const found = await dischargeFindings(project.id);
    expect(found).toHaveLength(1);
    expect(found[0].appliedLimit).toBe(45);

    const [audit] = await db.select().from(auditEntries).where(and(eq(auditEntries.recordId, project.id), eq(auditEntries.action, "update")));
    expect(audit.before).toEqual({ dischargeLimitMinutes: 90 });
    expect(audit.after).toEqual({ dischargeLimitMinutes: 45 });
  });

  it("refuses a value out of range in the project's units and changes nothing", async () => {
    const { project, admin } = await projectWithTeam();
    await db.update(projects).set({ unitSystem: "IP" }).where(eq(projects.id, project.id));
    const res = await patch(admin, project.id, { maxConcreteTempC: 95, dischargeLimitMinutes: 60 });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.maxConcreteTempC).toBe("The maximum concrete temperature must be between 59 °F and 113 °F.");
    const [row] = await db.select().from(projects).where(eq(projects.id, project.id));
    expect(row.maxConcreteTempC).toBe(35);
    expect(row.dischargeLimitMinutes).toBe(90);
  });

  it("refuses a field that is not the specification's (the unit system is chosen once)", async () => {
    const { project, admin } = await projectWithTeam();
    const res = await patch(admin, project.id, { unitSystem: "IP" });
    expect(res.status).toBe(400);
    expect(res.json.error.message).toBe("Only the project specification's values can be changed here.");
    const [row] = await db.select().from(projects).where(eq(projects.id, project.id));
    expect(row.unitSystem).toBe("SI");
  });

  it("is refused to every project role (can.ts: project.manage is the administrator's), and nothing changes", async () => {
    const { project, team, outsider } = await projectWithTeam();
    for (const user of [...Object.values(team), outsider]) {
      const res = await patch(user, project.id, { dischargeLimitMinutes: 60 });
      expect([403, 404]).toContain(res.status);
    }
    const [row] = await db.select().from(projects).where(eq(projects.id, project.id));
    expect(row.dischargeLimitMinutes).toBe(90);
  });

  it("answers 400 naming the parameter for a malformed id and 404 for a missing project", async () => {
    const { admin } = await projectWithTeam();
    const malformed = await patch(admin, "not-a-uuid", { dischargeLimitMinutes: 60 });
    expect(malformed.status).toBe(400);
    expect(malformed.json.error.message).toMatch(/projectId/);
    const missing = await patch(admin, "00000000-0000-4000-8000-000000000000", { dischargeLimitMinutes: 60 });
    expect(missing.status).toBe(404);
  });
});

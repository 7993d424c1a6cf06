// The digest's history and recipients follow lib/auth/can.ts like every project record: the admin
// flag manages people and projects, it reads a project's records only through a membership
// [the rule written in can.ts; product brief "Roles"].
import { describe, expect, it } from "vitest";
import { GET as historyRoute } from "@/app/api/projects/[projectId]/digest/history/route";
import { GET as recipientsRoute } from "@/app/api/projects/[projectId]/digest/recipients/route";
import { can } from "@/lib/auth/can";
import { accessTo } from "@/lib/auth/access";
import { getDigestHistory, getDigestView } from "@/lib/digest/access";
import { AppError } from "@/lib/errors";
import { addMembership, callRoute, projectWithTeam } from "./helpers";

const refused = async (p: Promise<unknown>) => {
  const error = await p.then(() => null, (e: unknown) => e);
  return error instanceof AppError ? error.code : error;
};

describe("digest history and recipients: the rule table, no admin exception", () => {
  it("an administrator with no membership reads neither, through the route or through lib", async () => {
    const { project, admin } = await projectWithTeam();
    expect(can(admin, "digest.manage", null)).toBe(false);
    const params = { projectId: project.id };
    expect((await callRoute(historyRoute, { user: admin, params })).status).toBe(404);
    expect((await callRoute(recipientsRoute, { user: admin, params })).status).toBe(404);
    // Pages call lib directly: the same rule holds there.
    expect(await refused(getDigestHistory(await accessTo(admin, project.id)))).toBe("forbidden");
    expect(await refused(getDigestView(await accessTo(admin, project.id)))).toBe("forbidden");
  });

  it("with the office role an administrator reads both; the owner reads only their own row, no history", async () => {
    const { project, admin, team } = await projectWithTeam();
    await addMembership(admin.id, project.id, "office");
    const params = { projectId: project.id };
    const history = await callRoute(historyRoute, { user: admin, params });
    expect(history.status).toBe(200);
    expect(Array.isArray(history.json.history)).toBe(true);
    expect((await callRoute(historyRoute, { user: team.owner, params })).status).toBe(403);
    const ownerView = await getDigestView(await accessTo(team.owner, project.id));
    expect(ownerView.canManage).toBe(false);
    expect(ownerView.recipients.every((r) => r.userId === team.owner.id)).toBe(true);
    expect(await refused(getDigestView(await accessTo(team.superintendent, project.id)))).toBe("forbidden");
  });
});

// Digest recipients: an owner sees and changes only their own row.
import { describe, expect, it } from "vitest";
import * as recipientsRoute from "@/app/api/projects/[projectId]/digest/recipients/route";
import * as recipientRoute from "@/app/api/projects/[projectId]/digest/recipients/[recipientId]/route";
import { callRoute, projectWithTeam } from "../helpers";
import { tag, testProjects, setUpDigest } from "./helpers";

setUpDigest();

describe("owners and their own preferences", () => {
  it("an owner sees and changes only their own row", async () => {
    const { project, team } = await projectWithTeam();
    testProjects.push(project.id);
    await callRoute(recipientsRoute.POST, { user: team.office, params: { projectId: project.id }, body: { email: `digest-${tag}-b@example.test` } });
    const mine = await callRoute(recipientsRoute.GET, { user: team.owner, params: { projectId: project.id } });
    expect(mine.status).toBe(200);
    expect(mine.json.recipients.map((r: { email: string }) => r.email)).toEqual([team.owner.email.toLowerCase()]);
    const all = await callRoute(recipientsRoute.GET, { user: team.office, params: { projectId: project.id } });
    expect(all.json.recipients).toHaveLength(2);
    const other = all.json.recipients.find((r: { source: string }) => r.source === "added");
    const own = mine.json.recipients[0];
    const params = (recipientId: string) => ({ projectId: project.id, recipientId });
    expect((await callRoute(recipientRoute.PATCH, { user: team.owner, method: "PATCH", params: params(own.id), body: { hourOverride: 20, sendEmptyDays: false } })).json.hourOverride).toBe(20);
    expect((await callRoute(recipientRoute.PATCH, { user: team.owner, method: "PATCH", params: params(other.id), body: { hourOverride: 20 } })).status).toBe(403);
    expect((await callRoute(recipientRoute.PATCH, { user: team.owner, method: "PATCH", params: params(own.id), body: { hourOverride: 7 } })).status).toBe(400);
    expect((await callRoute(recipientRoute.DELETE, { user: team.superintendent, method: "DELETE", params: params(other.id) })).status).toBe(403);
    expect((await callRoute(recipientRoute.DELETE, { user: team.office, method: "DELETE", params: params(own.id) })).status).toBe(409);
    expect((await callRoute(recipientRoute.DELETE, { user: team.office, method: "DELETE", params: params(other.id) })).status).toBe(200);
  });
});

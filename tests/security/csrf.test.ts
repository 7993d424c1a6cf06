// Finding 11: CSRF. SameSite=Lax still sends the cookie on a top-level form POST and from a sibling
// subdomain. Attack: state-changing requests carrying a signed-in cookie but another site's Origin,
// a cross-site Sec-Fetch-Site, or a form content type. Each is refused and writes nothing.
// [OWASP CSRF Prevention Cheat Sheet: "Verifying origin with standard headers"; Fetch Metadata]
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as createRoute } from "@/app/api/projects/[projectId]/records/[type]/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { POST as acceptRoute } from "@/app/api/invitations/accept/route";
import { POST as adminProjects } from "@/app/api/admin/projects/route";
import { projectWithTeam } from "../integration/helpers";
import { validBody } from "../integration/record-fixtures";
import { APP_URL, attack, tableCounts } from "./attack";

describe("state-changing routes check where the request comes from", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  beforeAll(async () => {
    s = await projectWithTeam();
  });
  const body = () => JSON.stringify(validBody("mix-designs"));

  it.each([
    ["another site's Origin", { origin: "https://evil.example" }],
    ["a look-alike Origin", { origin: `${APP_URL}.evil.example` }],
    ["the null Origin of a sandboxed frame", { origin: "null" }],
    ["Sec-Fetch-Site cross-site without Origin", { "sec-fetch-site": "cross-site" }],
    ["Sec-Fetch-Site same-site (a sibling subdomain)", { "sec-fetch-site": "same-site" }],
  ])("%s: 403 and nothing written", async (_name, headers) => {
    const before = await tableCounts();
    const routes = [
      attack(createRoute, { user: s.team.office, params: { projectId: s.project.id, type: "mix-designs" }, headers, body: body() }),
      attack(pushRoute, { user: s.team.office, headers, body: JSON.stringify({ clientId: crypto.randomUUID(), schemaVersion: SYNC_SCHEMA_VERSION, mutations: [] }) }),
      attack(adminProjects, { user: s.admin, headers, body: JSON.stringify({ name: "Evil", code: "EVIL-1", timeZone: "UTC", unitSystem: "SI" }) }),
      attack(acceptRoute, { headers, body: JSON.stringify({ token: "x".repeat(43), password: "long-enough-password" }) }),
    ];
    for (const res of await Promise.all(routes)) {
      expect(res.status).toBe(403);
      expect(res.json.error.message).toMatch(/another site/);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it("a form post (text/plain, the content type a cross-site form can send) is 415 and writes nothing", async () => {
    const before = await tableCounts();
    const res = await attack(createRoute, {
      user: s.team.office,
      params: { projectId: s.project.id, type: "mix-designs" },
      headers: { "content-type": "text/plain" },
      body: body(),
    });
    expect(res.status).toBe(415);
    expect(await tableCounts()).toEqual(before);
  });

  it("the app's own origin is accepted", async () => {
    const res = await attack(createRoute, {
      user: s.team.office,
      params: { projectId: s.project.id, type: "mix-designs" },
      headers: { origin: new URL(APP_URL).origin, "sec-fetch-site": "same-origin" },
      body: body(),
    });
    expect(res.status).toBe(201);
  });
});

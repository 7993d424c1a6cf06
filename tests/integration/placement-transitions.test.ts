// The workflow enforced by the server: legal moves by the right role, 409 naming the allowed moves,
// 403 for a move that belongs to another role, hold needs a reason, the version must be current.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as transition } from "@/app/api/projects/[projectId]/placements/[id]/transition/route";
import { db } from "@/db";
import { auditEntries } from "@/db/schema";
import { markPlacementSigned } from "@/lib/placements/mark-signed";
import { callRoute, projectWithTeam } from "./helpers";
import { makeRecord, type Team } from "./record-fixtures";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;

describe("placement transitions", () => {
  let s: Setup;
  let team: Team;
  beforeAll(async () => {
    s = await projectWithTeam();
    team = s.team;
  });

  const move = (user: Team[keyof Team], id: string, body: unknown) =>
    callRoute(transition, { user, params: { projectId: s.project.id, id }, body });

  it("walks planned → ready → cleared → placing → placed with the right roles, each a new version", async () => {
    const p = await makeRecord("placements", s.project.id, team);
    const steps: [keyof Team, string][] = [
      ["superintendent", "ready"],
      ["inspector", "cleared"],
      ["superintendent", "placing"],
      ["superintendent", "placed"],
    ];
    let version = 1;
    let seq = p.changeSeq;
    for (const [role, to] of steps) {
      const res = await move(team[role], p.id, { to, baseVersion: version });
      expect(res.status, JSON.stringify(res.json)).toBe(200);
      expect(res.json.state).toBe(to);
      expect(res.json.version).toBe(++version);
      expect(res.json.changeSeq).toBeGreaterThan(seq);
      seq = res.json.changeSeq;
    }
    const audit = await db.select().from(auditEntries).where(eq(auditEntries.recordId, p.id));
    expect(audit.filter((a) => a.action === "transition").map((a) => a.note)).toEqual([
      "planned → ready",
      "ready → cleared",
      "cleared → placing",
      "placing → placed",
    ]);
  });

  it("an illegal move is a 409 that says which moves are allowed now", async () => {
    const p = await makeRecord("placements", s.project.id, team);
    const res = await move(team.superintendent, p.id, { to: "placed", baseVersion: 1 });
    expect(res.status).toBe(409);
    expect(res.json.error.message).toBe("This placement is planned. Next: the superintendent can ask for inspection.");
    expect(res.json.error.allowed).toEqual(["ready"]);
  });

  it("a move that belongs to another role is a 403; office and owner move nothing; a non-member gets 404", async () => {
    const p = await makeRecord("placements", s.project.id, team);
    await move(team.superintendent, p.id, { to: "ready", baseVersion: 1 });
    const superClears = await move(team.superintendent, p.id, { to: "cleared", baseVersion: 2 });
    expect(superClears.status).toBe(403);
    expect(superClears.json.error.message).toMatch(/Only the inspector/);
    for (const role of ["office", "owner"] as const) {
      expect((await move(team[role], p.id, { to: "cleared", baseVersion: 2 })).status).toBe(403);
    }
    expect((await move(s.outsider, p.id, { to: "cleared", baseVersion: 2 })).status).toBe(404);
  });

  it("holding needs a reason; the reason is kept, and cleared when the placement is ready again", async () => {
    const p = await makeRecord("placements", s.project.id, team);
    await move(team.superintendent, p.id, { to: "ready", baseVersion: 1 });
    const noReason = await move(team.inspector, p.id, { to: "held", baseVersion: 2 });
    expect(noReason.status).toBe(400);
    expect(noReason.json.error.fields.reason).toBe("Say why the placement is held");
    const held = await move(team.inspector, p.id, { to: "held", reason: "Cover short at C/4", baseVersion: 2 });
    expect(held.json).toMatchObject({ state: "held", holdReason: "Cover short at C/4", version: 3 });
    const ready = await move(team.superintendent, p.id, { to: "ready", baseVersion: 3 });
    expect(ready.json).toMatchObject({ state: "ready", holdReason: null, version: 4 });
  });

  it("a stale version is a 409 with the current version", async () => {
    const p = await makeRecord("placements", s.project.id, team);
    await move(team.superintendent, p.id, { to: "ready", baseVersion: 1 });
    const stale = await move(team.superintendent, p.id, { to: "planned", baseVersion: 1 });
    expect(stale.status).toBe(409);
    expect(stale.json.error.currentVersion).toBe(2);
  });

  it("signing is the sign-off's job: the plain transition refuses it, markPlacementSigned does it for the inspector", async () => {
    const p = await makeRecord("placements", s.project.id, team);
    let v = 1;
    for (const [role, to] of [["superintendent", "ready"], ["inspector", "cleared"], ["superintendent", "placing"], ["superintendent", "placed"]] as const) {
      await move(team[role], p.id, { to, baseVersion: v++ });
    }
    const viaRoute = await move(team.inspector, p.id, { to: "signed", baseVersion: v });
    expect(viaRoute.status).toBe(409);
    expect(viaRoute.json.error.message).toMatch(/sign-off/);
    await expect(markPlacementSigned({ user: team.superintendent }, s.project.id, p.id, { baseVersion: v })).rejects.toMatchObject({ code: "forbidden" });
    await expect(markPlacementSigned({ user: team.inspector }, s.project.id, p.id, { baseVersion: v - 1 })).rejects.toMatchObject({ code: "conflict" });
    const signed = await markPlacementSigned({ user: team.inspector }, s.project.id, p.id, { baseVersion: v });
    expect(signed).toMatchObject({ state: "signed", signedBy: team.inspector.id, version: v + 1 });
    const after = await move(team.superintendent, p.id, { to: "ready", baseVersion: v + 1 });
    expect(after.status).toBe(409);
    expect(after.json.error.message).toBe("This placement is signed; add an amendment instead.");
  });

  it("a placement of another project is a 404; a malformed id is a 400 naming the parameter, not an error", async () => {
    const other = await projectWithTeam();
    const foreign = await makeRecord("placements", other.project.id, other.team);
    expect((await move(team.superintendent, foreign.id, { to: "ready", baseVersion: 1 })).status).toBe(404);
    const malformed = await move(team.superintendent, "not-a-uuid", { to: "ready", baseVersion: 1 });
    expect(malformed.status).toBe(400);
    expect(malformed.json.error.fields).toHaveProperty("id");
  });
});

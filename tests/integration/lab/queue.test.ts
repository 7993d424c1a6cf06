// The lab queue: every planned age by due date, and only the user's projects.
import { beforeAll, describe, expect, it } from "vitest";
import { GET as queueRoute } from "@/app/api/lab/queue/route";
import { listLabQueue } from "@/lib/lab/queue";
import { createRecord } from "@/lib/records/write";
import { callRoute, projectWithTeam } from "../helpers";
import { makeRecord, T0, validBody } from "../record-fixtures";
import { DAY_MS, HOUR_MS } from "./helpers";

describe("lab queue", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  const cast = (hours: number) => new Date(T0 + hours * HOUR_MS);
  // Cast times chosen around the ASTM C39 age tolerances [memory: 7 d ± 6 h, 28 d ± 20 h].
  const CASTS = { A: cast(0), B: cast(48), C: cast(84), D: cast(68) };
  const now = new Date(T0 + 10 * DAY_MS);

  beforeAll(async () => {
    s = await projectWithTeam();
    const placement = await makeRecord("placements", s.project.id, s.team);
    const ids: Record<string, string> = {};
    // Created in a scrambled order so that order of creation cannot pass for order of due date.
    for (const key of ["C", "A", "D", "B"] as const) {
      const set = await makeRecord("specimen-sets", s.project.id, s.team, {
        placementId: placement.id, setCode: `Q-${key}`, castAt: CASTS[key].toISOString(), testAgesDays: [28, 7],
      });
      ids[key] = set.id;
    }
    await createRecord({ user: s.team.office }, "breaks", s.project.id, {
      ...validBody("breaks", ids.B), testedAt: new Date(CASTS.B.getTime() + 7 * DAY_MS).toISOString(), ageDays: 7,
    });
  });

  it("lists every planned age by due date (cast + age) with due, overdue and tested", async () => {
    const queue = await listLabQueue(s.team.office, { projectId: s.project.id }, now);
    const got = queue.items.map((i) => [i.setCode, i.ageDays, i.status]);
    // Due dates: A7 = T0+7 d, B7 = +9 d, D7 = +9 d 20 h, C7 = +10 d 12 h, A28 = +28 d, B28, D28, C28.
    expect(got).toEqual([
      ["Q-A", 7, "overdue"], // window closed at +7 d 6 h, nothing broken
      ["Q-B", 7, "tested"],
      ["Q-D", 7, "due"], // due 4 h ago, still inside the ± 6 h window
      ["Q-C", 7, "due"], // not due yet
      ["Q-A", 28, "due"],
      ["Q-B", 28, "due"],
      ["Q-D", 28, "due"],
      ["Q-C", 28, "due"],
    ]);
    for (let i = 1; i < queue.items.length; i++) expect(queue.items[i - 1].dueAt <= queue.items[i].dueAt).toBe(true);
    expect(queue.items[0].dueAt).toBe(new Date(CASTS.A.getTime() + 7 * DAY_MS).toISOString());
    expect(queue.items[1]).toMatchObject({ brokenCount: 1, averageMPa: expect.any(Number) });
    const overdueOnly = await listLabQueue(s.team.office, { projectId: s.project.id, status: "overdue" }, now);
    expect(overdueOnly.items.map((i) => i.setCode)).toEqual(["Q-A"]);
  });

  it("the route shows only the user's projects; another project's user sees none of it", async () => {
    const mine = await callRoute(queueRoute, { user: s.team.owner, url: "/api/lab/queue" });
    expect(mine.status).toBe(200);
    expect(mine.json.items.length).toBe(8);
    expect(new Set(mine.json.items.map((i: { projectId: string }) => i.projectId))).toEqual(new Set([s.project.id]));
    expect(mine.json.projects).toEqual([{ id: s.project.id, name: s.project.name, canEnterBreaks: false }]);
    const theirs = await callRoute(queueRoute, { user: s.outsider, url: `/api/lab/queue?projectId=${s.project.id}` });
    expect(theirs.status).toBe(200);
    expect(theirs.json.items).toEqual([]);
    const bad = await callRoute(queueRoute, { user: s.team.office, url: "/api/lab/queue?status=late" });
    expect(bad.status).toBe(400);
    expect(bad.json.error.message).toBe("Status must be one or more of: due, overdue, tested");
    const anonymous = await callRoute(queueRoute, { url: "/api/lab/queue" });
    expect(anonymous.status).toBe(401);
  });
});

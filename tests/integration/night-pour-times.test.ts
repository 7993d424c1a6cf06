// Times on the record are instants in the project's time zone: a night pour's truck crosses midnight,
// the daylight-saving change days of America/Chicago (2026-03-08 forward, 2026-11-01 back; tz database
// [published]) count real minutes, and a time that has not happened yet is refused with its reason.
// Late against ASTM C94 §10.7's 90 min [published]; the instants come from the function the form uses.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { resolveTicketTimes } from "@/components/field/delivery-times";
import { db } from "@/db";
import { checkFindings } from "@/db/schema";
import { callRoute, projectWithTeam } from "./helpers";
import { bodyWithParents, makeRecord } from "./record-fixtures";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;
const ZONE = "America/Chicago";
let s: Setup;
let placementId: string;

beforeAll(async () => {
  s = await projectWithTeam();
  placementId = (await makeRecord("placements", s.project.id, s.team)).id;
});

async function postTruck(times: { batchedAt: string; arrivedAt: string; dischargeStartedAt: string; dischargeFinishedAt: string }, date: string) {
  const at = resolveTicketTimes({ ...times, waterFirstAt: "", waterLastAt: "" }, ZONE, new Date(), date).at;
  const id = randomUUID();
  const body = { id, placementId, ticketNumber: `N-${id.slice(0, 6)}`, truck: "27", volumeM3: 8, ...at };
  const res = await callRoute(POST, { user: s.team.superintendent, params: { projectId: s.project.id, type: "deliveries" }, body });
  return { id, res, at };
}

const minutes = (a: string, b: string) => (Date.parse(b) - Date.parse(a)) / 60_000;

describe("truck tickets across midnight and the daylight-saving changes", () => {
  it("batched 23:05, discharged 00:50 the next day: saved; the stored late finding is on the batch's day at 105 min", async () => {
    const { id, res } = await postTruck({ batchedAt: "23:05", arrivedAt: "23:40", dischargeStartedAt: "00:10", dischargeFinishedAt: "00:50" }, "2026-07-14");
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.batchedAt).toBe("2026-07-15T04:05:00.000Z");
    expect(res.json.dischargeFinishedAt).toBe("2026-07-15T05:50:00.000Z");
    const [late] = await db.select().from(checkFindings).where(and(eq(checkFindings.subjectId, id), eq(checkFindings.rule, "discharge-time")));
    expect(late).toMatchObject({ severity: "warning", appliedValue: 105, appliedLimit: 90 });
  });

  it("2026-03-08 (clocks forward at 02:00): batched 01:30, discharged 03:10 is 40 min, in time", async () => {
    const { id, res } = await postTruck({ batchedAt: "01:30", arrivedAt: "01:55", dischargeStartedAt: "03:00", dischargeFinishedAt: "03:10" }, "2026-03-08");
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(minutes(res.json.batchedAt, res.json.dischargeFinishedAt)).toBe(40);
    expect(await db.select().from(checkFindings).where(eq(checkFindings.subjectId, id))).toHaveLength(0);
  });

  it("2026-11-01 (clocks back at 02:00): 00:45 CDT → 01:50 CDT → 01:10 CST → 01:40 CST is 115 min, late", async () => {
    const { id, res } = await postTruck({ batchedAt: "00:45", arrivedAt: "01:50", dischargeStartedAt: "01:10", dischargeFinishedAt: "01:40" }, "2026-11-01");
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    expect(res.json.dischargeStartedAt).toBe("2026-11-01T07:10:00.000Z");
    expect(minutes(res.json.batchedAt, res.json.dischargeFinishedAt)).toBe(115);
    const [late] = await db.select().from(checkFindings).where(and(eq(checkFindings.subjectId, id), eq(checkFindings.rule, "discharge-time")));
    expect(late.appliedValue).toBe(115);
  });
});

describe("a time that has not happened yet is refused, and nothing is stored", () => {
  const inAnHour = () => new Date(Date.now() + 60 * 60_000).toISOString();
  const past = () => new Date(Date.now() - 60 * 60_000).toISOString();

  it("a discharge end an hour from now", async () => {
    const id = randomUUID();
    const body = { id, placementId, ticketNumber: "F-1", volumeM3: 8, batchedAt: past(), arrivedAt: past(), dischargeStartedAt: past(), dischargeFinishedAt: inAnHour() };
    const res = await callRoute(POST, { user: s.team.superintendent, params: { projectId: s.project.id, type: "deliveries" }, body });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.dischargeFinishedAt).toBe("Discharge end is in the future: enter a time that has already passed (on a night pour, check the date)");
  });

  it.each([
    ["weather-observations", "observedAt", "Observation time"],
    ["curing-readings", "readAt", "Reading time"],
    ["field-tests", "sampledAt", "Sampling time"],
  ] as const)("%s: %s an hour from now", async (type, field, label) => {
    const body = { ...(await bodyWithParents(type, s.project.id, s.team)), [field]: inAnHour() };
    const res = await callRoute(POST, { user: s.team.inspector, params: { projectId: s.project.id, type }, body });
    expect(res.status).toBe(400);
    expect(res.json.error.fields[field]).toMatch(new RegExp(`^${label} is in the future`));
  });
});

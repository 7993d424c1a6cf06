// A specimen set cured with a logger: only a sensor of its own placement (same project) is
// accepted, on the records API and the sync push; the calibration then takes that logger's
// maturity for the set's breaks instead of standard curing.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { db } from "@/db";
import { projects, specimenSets } from "@/db/schema";
import { readMaturityRecords } from "@/lib/maturity/records";
import { buildMaturityView } from "@/lib/maturity/view";
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { callRoute, projectWithTeam } from "./helpers";
import { makeRecord, validBody } from "./record-fixtures";

const H = 3_600_000;

async function setup() {
  const ctx = await projectWithTeam();
  const { project, team } = ctx;
  const mix = await makeRecord("mix-designs", project.id, team);
  const placement = await makeRecord("placements", project.id, team, { mixId: mix.id });
  const sensor = await makeRecord("temperature-sensors", project.id, team, { placementId: placement.id, name: "Cyl box T3" });
  return { ...ctx, mix, placement, sensor };
}

describe("a specimen set's logger must be a sensor of its placement", () => {
  it("a sensor of another project, or of another placement, is refused with a 400 naming it; nothing changes", async () => {
    const { project, team, placement } = await setup();
    const set = await makeRecord("specimen-sets", project.id, team, { placementId: placement.id });
    const other = await projectWithTeam();
    const foreign = await makeRecord("temperature-sensors", other.project.id, other.team);
    const neighbour = await makeRecord("temperature-sensors", project.id, team); // on a new placement of the same project

    const params = { projectId: project.id, type: "specimen-sets", id: set.id };
    const a = await callRoute(PATCH, { user: team.inspector, method: "PATCH", params, body: { baseVersion: 1, patch: { sensorId: foreign.id } } });
    expect(a.status).toBe(400);
    expect(a.json.error.fields.sensorId).toBe("There is no temperature sensor with this id on this project");
    const b = await callRoute(PATCH, { user: team.inspector, method: "PATCH", params, body: { baseVersion: 1, patch: { sensorId: neighbour.id } } });
    expect(b.status).toBe(400);
    expect(b.json.error.fields.sensorId).toBe("That temperature sensor belongs to another placement");
    const [row] = await db.select().from(specimenSets).where(eq(specimenSets.id, set.id));
    expect(row).toMatchObject({ version: 1, sensorId: null });
  });

  it("the sync push applies a set created with its placement's sensor and rejects one with a foreign sensor", async () => {
    const { project, team, placement, sensor } = await setup();
    const other = await projectWithTeam();
    const foreign = await makeRecord("temperature-sensors", other.project.id, other.team);
    const good: Record<string, unknown> = { ...validBody("specimen-sets", placement.id), sensorId: sensor.id };
    const bad: Record<string, unknown> = { ...validBody("specimen-sets", placement.id), sensorId: foreign.id };
    const mutations = [good, bad].map((args, i) => ({ id: i + 1, name: "create", recordType: "specimen-sets", projectId: project.id, recordId: args.id as string, args }));
    const res = await callRoute(pushRoute, { user: team.inspector, body: { clientId: randomUUID(), schemaVersion: SYNC_SCHEMA_VERSION, mutations } });
    expect(res.status).toBe(200);
    expect(res.json.results[0]).toMatchObject({ id: 1, result: "applied" });
    expect(res.json.results[1]).toMatchObject({ id: 2, result: "rejected", reason: "invalid" });
    expect(res.json.results[1].message).toMatch(/no temperature sensor with this id on this project/);
    const [stored] = await db.select().from(specimenSets).where(eq(specimenSets.id, good.id as string));
    expect(stored.sensorId).toBe(sensor.id);
    expect(await db.select().from(specimenSets).where(eq(specimenSets.id, bad.id as string))).toHaveLength(0);
  });
});

describe("an attached set changes its calibration point's maturity", () => {
  it("7-day breaks take the logger's Nurse-Saul maturity (hand sum) once the set is attached", async () => {
    const { project, team, placement, sensor } = await setup();
    await db.update(projects).set({ maturityDatumC: -10 }).where(eq(projects.id, project.id));
    const cast = Date.parse("2026-11-16T09:00:00-06:00");
    const iso = (hours: number) => new Date(cast + hours * H).toISOString();
    // Field-cured cylinders: 6 °C the first day, then 12 °C, logged hourly for 8 days.
    const readings = Array.from({ length: 8 * 24 + 1 }, (_, h) => [iso(h), h <= 24 ? 6 : 12]);
    for (let i = 0; i < readings.length; i += 100) {
      await makeRecord("sensor-readings", project.id, team, { sensorId: sensor.id, source: "import", readings: readings.slice(i, i + 100) });
    }
    const setOf = (ages: number[]) => makeRecord("specimen-sets", project.id, team, { placementId: placement.id, castAt: iso(0), testAgesDays: ages });
    const standard = await setOf([3, 7, 14, 28]);
    const field = await setOf([7]);
    for (const [setId, ageDays] of [[standard.id, 3], [standard.id, 7], [standard.id, 14], [standard.id, 28], [field.id, 7]] as const) {
      await makeRecord("breaks", project.id, team, { specimenSetId: setId, ageDays, testedAt: iso(ageDays * 24), loadKN: 60 + ageDays * 4 });
    }
    const point7 = async () => {
      const [p] = await db.select().from(projects).where(eq(projects.id, project.id));
      const records = await readMaturityRecords(db, project.id, placement.id, placement.mixId as string);
      const view = buildMaturityView({ project: p, placement: { ...placement, id: placement.id }, mixCode: "M", ...records, targetMPa: null, now: new Date(cast + 200 * H) });
      return view.calibration!.points.filter((x) => x.ageDays === 7);
    };
    // Standard curing, 23 °C (ASTM C511 [memory]): (23 + 10) × 168 = 5544 °C·h [computed by hand].
    expect((await point7()).map((p) => [p.maturity, p.logger])).toEqual([[5544, null]]);

    const res = await callRoute(PATCH, { user: team.office, method: "PATCH", params: { projectId: project.id, type: "specimen-sets", id: field.id }, body: { baseVersion: 1, patch: { sensorId: sensor.id } } });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    // ASTM C1074 Nurse-Saul, T0 = −10 °C, by hand: 24 h × 16 + 1 h × (9 + 10) + 143 h × 22 = 384 + 19 + 3146 = 3549 °C·h.
    const after = await point7();
    expect(after.map((p) => p.logger)).toEqual(["Cyl box T3", null]);
    expect(after[0].maturity).toBeCloseTo(3549, 6);
    expect(after[1].maturity).toBeCloseTo(5544, 6);
  });
});

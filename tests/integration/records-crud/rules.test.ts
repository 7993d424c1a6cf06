// The rules a record write keeps: computed values, unique codes, stale patches, links inside the project.
import { describe, expect, it } from "vitest";
import { PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { cToF, cylinderStrengthMPa, evaporationRateIP, evaporationRateSI, kmhToMph, lbFt2hToKgM2h } from "@/lib/concrete";
import { createRecord, deleteRecord, updateRecord } from "@/lib/records/write";
import { addMembership, callRoute, createProject, projectWithTeam } from "../helpers";
import { at, makeRecord, validBody } from "../record-fixtures";
import { auditOf, s, team, setUpProjectWithTeam } from "./helpers";

setUpProjectWithTeam();

describe("record rules", () => {
  it("records the device of a write in the audit entry", async () => {
    const body = validBody("mix-designs");
    await createRecord({ user: team.office, deviceId: "office-laptop-3" }, "mix-designs", s.project.id, body);
    const [entry] = await auditOf(body.id as string);
    expect(entry.deviceId).toBe("office-laptop-3");
  });

  it("computes a break's strength on the server and ignores one sent by the client", async () => {
    const set = await makeRecord("specimen-sets", s.project.id, team);
    const body = { ...validBody("breaks", set.id), strengthMPa: 99 };
    const res = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "breaks" }, body });
    expect(res.status).toBe(201);
    expect(res.json.strengthMPa).toBeCloseTo(cylinderStrengthMPa({ maxLoadKN: 180, diameterMm: 100, lengthMm: 200 }), 9);
    const patched = await updateRecord({ user: team.office }, "breaks", s.project.id, res.json.id, { baseVersion: 1, patch: { loadKN: 200, strengthMPa: 1 } });
    expect(patched.strengthMPa).toBeCloseTo((200_000 / (Math.PI * 100 * 100)) * 4, 6);
  });

  it("a short cylinder that cannot be corrected is a 400 naming the length", async () => {
    const set = await makeRecord("specimen-sets", s.project.id, team);
    const res = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "breaks" }, body: { ...validBody("breaks", set.id), lengthMm: 80 } });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.lengthMm).toBeDefined();
  });

  it("computes the evaporation rate in the project's unit system form (SI and inch-pound)", async () => {
    const obs = await makeRecord("weather-observations", s.project.id, team, { placementId: null, airTempC: 25, relativeHumidityPct: 50, windKmh: 20, concreteTempC: 30 });
    expect(obs.evaporationKgM2H).toBeCloseTo(evaporationRateSI({ concreteTempC: 30, airTempC: 25, relativeHumidityPct: 50, windKmh: 20 }), 9);
    expect(obs.evaporationKgM2H).toBeCloseTo(1.188, 3); // DOMAIN.md check value

    const ipProject = await createProject({ unitSystem: "IP" });
    await addMembership(team.superintendent.id, ipProject.id, "superintendent");
    const { record } = await createRecord({ user: team.superintendent }, "weather-observations", ipProject.id, {
      ...validBody("weather-observations"),
      airTempC: 35,
      relativeHumidityPct: 30,
      windKmh: 29,
      concreteTempC: 33.3,
    });
    const ip = evaporationRateIP({ concreteTempF: cToF(33.3), airTempF: cToF(35), relativeHumidityPct: 30, windMph: kmhToMph(29) });
    expect(record.evaporationKgM2H).toBeCloseTo(lbFt2hToKgM2h(ip), 9);

    // No concrete temperature: one behaviour everywhere, an estimate with the air temperature standing
    // in for it (lib/checks evaporationOf), labelled as estimated wherever it is shown.
    const noConcrete = await makeRecord("weather-observations", s.project.id, team, { placementId: null, concreteTempC: null });
    expect(noConcrete.concreteTempC).toBeNull();
    expect(noConcrete.evaporationKgM2H).toBeCloseTo(
      evaporationRateSI({ concreteTempC: noConcrete.airTempC as number, airTempC: noConcrete.airTempC as number, relativeHumidityPct: noConcrete.relativeHumidityPct as number, windKmh: noConcrete.windKmh as number }),
      9,
    );
  });

  it("a duplicate mix code or diary date is a 409 naming the field; after deleting, the code is free again", async () => {
    const mix = await makeRecord("mix-designs", s.project.id, team, { code: "LC-DUP" });
    const dup = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "mix-designs" }, body: { ...validBody("mix-designs"), code: "LC-DUP" } });
    expect(dup.status).toBe(409);
    expect(dup.json.error.fields.code).toMatch(/already has a mix/);
    await deleteRecord({ user: team.office }, "mix-designs", s.project.id, mix.id, { baseVersion: 1 });
    const reuse = await callRoute(POST, { user: team.office, params: { projectId: s.project.id, type: "mix-designs" }, body: { ...validBody("mix-designs"), code: "LC-DUP" } });
    expect(reuse.status).toBe(201);

    const entry = await makeRecord("diary-entries", s.project.id, team, { date: "2026-11-20" });
    const sameDay = await callRoute(POST, { user: team.superintendent, params: { projectId: s.project.id, type: "diary-entries" }, body: { ...validBody("diary-entries"), date: "2026-11-20" } });
    expect(sameDay.status).toBe(409);
    expect(sameDay.json.error.fields.date).toBeDefined();
    expect(entry.date).toBe("2026-11-20");
  });

  it("sync may apply a stale patch of mergeable fields only (mergeStale); free text stays a conflict", async () => {
    const reading = await makeRecord("field-tests", s.project.id, team);
    await updateRecord({ user: team.inspector }, "field-tests", s.project.id, reading.id, { baseVersion: 1, patch: { airPct: 6 } });
    const merged = await updateRecord({ user: team.inspector }, "field-tests", s.project.id, reading.id, { baseVersion: 1, patch: { slumpMm: 95 } }, { mergeStale: true });
    expect(merged).toMatchObject({ version: 3, slumpMm: 95, airPct: 6 });
    await expect(
      updateRecord({ user: team.inspector }, "field-tests", s.project.id, reading.id, { baseVersion: 1, patch: { notes: "late edit" } }, { mergeStale: true }),
    ).rejects.toMatchObject({ code: "conflict", details: { reason: "stale", currentVersion: 3 } });
  });

  it("the generic update never changes a placement's state", async () => {
    const placement = await makeRecord("placements", s.project.id, team);
    const res = await callRoute(PATCH, { user: team.superintendent, method: "PATCH", params: { projectId: s.project.id, type: "placements", id: placement.id }, body: { baseVersion: 1, patch: { state: "placed" } } });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.state).toMatch(/transition/);
  });

  it("checks the whole record after a patch: discharge cannot end before it started", async () => {
    const delivery = await makeRecord("deliveries", s.project.id, team);
    const res = await callRoute(PATCH, { user: team.superintendent, method: "PATCH", params: { projectId: s.project.id, type: "deliveries", id: delivery.id }, body: { baseVersion: 1, patch: { dischargeFinishedAt: at(20) } } });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.dischargeFinishedAt).toBe("Discharge must finish after it started");
  });

  it("links must stay inside the project and the placement", async () => {
    const other = await projectWithTeam();
    const foreignPlacement = await makeRecord("placements", other.project.id, other.team);
    const res = await callRoute(POST, { user: team.superintendent, params: { projectId: s.project.id, type: "deliveries" }, body: validBody("deliveries", foreignPlacement.id) });
    expect(res.status).toBe(400);
    expect(res.json.error.fields.placementId).toMatch(/no placement/i);

    const p1 = await makeRecord("placements", s.project.id, team);
    const p2 = await makeRecord("placements", s.project.id, team);
    const truck = await makeRecord("deliveries", s.project.id, team, { placementId: p1.id });
    const test = await callRoute(POST, { user: team.inspector, params: { projectId: s.project.id, type: "field-tests" }, body: { ...validBody("field-tests", p2.id), deliveryId: truck.id } });
    expect(test.status).toBe(400);
    expect(test.json.error.fields.deliveryId).toMatch(/another placement/);
  });

});

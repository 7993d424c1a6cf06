// The field screens' model: the device's rows (Dexie: ISO strings, SI units, `pending` and
// `serverCopy` beside the server's fields) judged by the rulebook exactly as the server judges its own.
// Check values: ../shared DOMAIN §1 (Uno's forms, ACI Materials Journal 95(4), 1998), §2 (ACI 306R),
// §3 (ASTM C94); each test names its source.
import { describe, expect, it } from "vitest";
import { draftFindings, fieldFindings, findingsFor, placementFindings, type FieldRecords } from "@/components/field/findings-model";
import { fToC, inToMm, mphToKmh } from "./fixtures";

type Row = Record<string, unknown>;
const device = (row: Row): Row => ({ projectId: "pr1", version: 1, changeSeq: 1, deletedAt: null, pending: 0, serverCopy: null, ...row });

const ipProject: Row = {
  id: "pr1",
  name: "Fenwick Hollow Pump Station",
  code: "FH",
  role: "inspector",
  unitSystem: "IP",
  timeZone: "America/Chicago",
  evaporationHighKgM2H: null,
  maxConcreteTempC: 35,
  dischargeLimitMinutes: 90,
  revolutionLimit: null,
  coldWeatherDefinition: "aci306r-current",
};
const mixRow = device({
  id: "m1",
  code: "BR-4000-AE",
  fcMPa: 27.6,
  fcAgeDays: 28,
  slumpTargetMm: 100,
  slumpType: "target",
  slumpToleranceMm: null,
  airTargetPct: 6,
  airTolerancePct: null,
  maxConcreteTempC: null,
  siteWaterAllowedLPerM3: 0,
  lowBleed: false,
});
// A 10 in wall: least dimension under 12 in, so the ACI 306R minimum is 55 °F (13 °C in SI).
const placementRow = device({ id: "p1", element: "Wet well wall", leastDimensionMm: inToMm(10), plannedVolumeM3: 40, plannedStart: "2026-07-14T14:00:00.000Z", mixId: "m1", state: "placing" });
const otherPlacement = device({ id: "p2", element: "Valve vault slab", leastDimensionMm: inToMm(10), plannedVolumeM3: 20, plannedStart: "2026-07-20T14:00:00.000Z", mixId: "m1", state: "planned" });

const weatherRow = (id: string, airF: number, concreteF: number | null, rh: number, mph: number, at = "2026-07-14T20:00:00.000Z", placementId = "p1") =>
  device({ id, placementId, observedAt: at, airTempC: fToC(airF), relativeHumidityPct: rh, windKmh: mphToKmh(mph), concreteTempC: concreteF === null ? null : fToC(concreteF), sun: "sun" });

const records = (more: Partial<FieldRecords> = {}, project: Row = ipProject): FieldRecords => ({
  project,
  mixes: [mixRow],
  placements: [placementRow, otherPlacement],
  deliveries: [],
  fieldTests: [],
  weather: [],
  curing: [],
  specimenSets: [],
  breaks: [],
  ...more,
});
const NOW = new Date("2026-07-14T21:00:00.000Z");

describe("evaporation on an inch-pound project, from device rows", () => {
  it("80 °F air and concrete, 50 %, 15 mph: 0.2004 lb/ft²/h, a warning at ACI 305R's 0.2 lb/ft²/h [DOMAIN §1 check value, computed]", () => {
    const all = fieldFindings(records({ weather: [weatherRow("w1", 80, 80, 50, 15)] }), NOW);
    const [f] = findingsFor(all, "weather", "w1", "evaporation");
    // The old screen used the SI form and SI limits (about 0.19 lb/ft²/h, "caution"): the phone must say what the server says.
    expect(f.applied.value).toBeCloseTo(0.2004, 4);
    expect(f.applied.unit).toBe("lb/ft²/h");
    expect(f.severity).toBe("warning");
    expect(f.title).toBe("High evaporation: 0.2004 lb/ft²/h");
    expect(f.source).toMatchObject({ document: "ACI 305R", clause: "Fig. 2.1.5" });
    expect(f.governs).toMatch(/project specification, local codes and the engineer of record govern/);
  });

  it("a blank concrete temperature is an estimate from the air, and says so [DOMAIN §1; issue item 1]", () => {
    const [f] = findingsFor(fieldFindings(records({ weather: [weatherRow("w1", 80, null, 50, 15)] }), NOW), "weather", "w1", "evaporation");
    expect(f.applied.value).toBeCloseTo(0.2004, 4);
    expect(f.title).toContain("(estimated)");
  });

  it("a reading being typed gets the same finding as the saved reading", () => {
    const saved = findingsFor(fieldFindings(records({ weather: [weatherRow("w1", 80, 80, 50, 15)] }), NOW), "weather", "w1", "evaporation")[0];
    const draft = weatherRow("x", 80, 80, 50, 15);
    const [typed] = draftFindings(records(), "weather", draft, NOW).filter((f) => f.rule === "evaporation");
    expect(typed.title).toBe(saved.title);
    expect(typed.severity).toBe(saved.severity);
  });

  it("tombstoned rows are not judged", () => {
    const gone = { ...weatherRow("w1", 80, 80, 50, 15), deletedAt: "2026-07-14T20:30:00.000Z" };
    expect(fieldFindings(records({ weather: [gone] }), NOW)).toEqual([]);
  });
});

describe("curing on an inch-pound project (issue item 3)", () => {
  const curing = (id: string, tempF: number) => device({ id, placementId: "p1", readAt: "2026-07-15T11:00:00.000Z", tempC: fToC(tempF), method: "Insulated blankets" });

  it("55 °F is at the ACI 306R minimum for a section under 12 in and is not flagged; 54 °F is [src: ACI 306R / ACI 306.1 Table 3.1, 55 °F]", () => {
    const all = fieldFindings(records({ curing: [curing("c55", 55), curing("c54", 54)] }), NOW);
    expect(findingsFor(all, "curing", "c55")).toEqual([]);
    const [low] = findingsFor(all, "curing", "c54");
    expect(low.rule).toBe("curing-temperature");
    expect(low.applied).toMatchObject({ limit: 55, unit: "°F" });
    expect(low.title).toContain("minimum 55 °F");
  });

  it("on an SI project the SI value applies: 12.9 °C is below 13 °C [src: ACI 306R, 13 °C]", () => {
    const si = { ...ipProject, unitSystem: "SI" };
    const row = device({ id: "c", placementId: "p1", readAt: "2026-07-15T11:00:00.000Z", tempC: 12.9, method: "Blankets" });
    expect(findingsFor(fieldFindings(records({ curing: [row] }, si), NOW), "curing", "c")[0]?.applied).toMatchObject({ limit: 13, unit: "°C" });
  });
});

describe("cold weather under the project's definition (issue item 2)", () => {
  it("ACI 306R current: 40 °F air is cold weather on the placement's day, 41 °F is not [src: ACI 306R, 40 °F]", () => {
    const cold = fieldFindings(records({ weather: [weatherRow("w1", 40, 60, 50, 5, "2026-07-14T11:00:00.000Z")] }), NOW);
    const mine = placementFindings(records({ weather: [weatherRow("w1", 40, 60, 50, 5, "2026-07-14T11:00:00.000Z")] }), cold, "p1");
    expect(mine.filter((f) => f.rule === "cold-weather")).toHaveLength(1);
    expect(mine.find((f) => f.rule === "cold-weather")?.subject).toEqual({ type: "day", id: "2026-07-14" });
    const warm = fieldFindings(records({ weather: [weatherRow("w1", 41, 60, 50, 5, "2026-07-14T11:00:00.000Z")] }), NOW);
    expect(warm.filter((f) => f.rule === "cold-weather")).toEqual([]);
  });

  it("ACI 306.1-90: one cold reading is not cold weather (it needs more than 3 successive cold days) [src: ACI 306.1-90]", () => {
    const p = { ...ipProject, coldWeatherDefinition: "aci306-1990" };
    const all = fieldFindings(records({ weather: [weatherRow("w1", 35, 60, 50, 5, "2026-07-14T11:00:00.000Z")] }, p), NOW);
    expect(all.filter((f) => f.rule === "cold-weather")).toEqual([]);
  });

  it("another placement's day is not this placement's", () => {
    const r = records({ weather: [weatherRow("w9", 35, 60, 50, 5, "2026-07-20T11:00:00.000Z", "p2")] });
    const all = fieldFindings(r, NOW);
    expect(placementFindings(r, all, "p1")).toEqual([]);
    expect(placementFindings(r, all, "p2").map((f) => f.rule)).toContain("cold-weather");
  });
});

describe("a truck still discharging (issue item 6)", () => {
  const truck = (more: Row) =>
    device({ id: "d1", placementId: "p1", ticketNumber: "BR-2207", truck: "14", volumeM3: 7.6, batchedAt: "2026-07-14T15:00:00.000Z", arrivedAt: "2026-07-14T15:35:00.000Z", dischargeStartedAt: "2026-07-14T15:40:00.000Z", dischargeFinishedAt: null, status: "accepted", ...more });

  it("with only the discharge start, shows the minutes since batching against the 90 min limit, and no verdict [src: ASTM C94 §10.7]", () => {
    const all = fieldFindings(records({ deliveries: [truck({})] }), new Date("2026-07-14T16:10:00.000Z"));
    const found = findingsFor(all, "delivery", "d1");
    expect(found.map((f) => f.rule)).toEqual(["discharge-elapsed"]);
    expect(found[0]).toMatchObject({ severity: "info", applied: { value: 70, limit: 90, unit: "min" } });
    expect(found[0].title).toBe("Discharging: 70 of 90 min since batching");
  });

  it("past the limit while still discharging, says the limit has passed; finished at 91 min is a late truck [src: ASTM C94 §10.7: 10:00 → 11:31 exceeded]", () => {
    const running = findingsFor(fieldFindings(records({ deliveries: [truck({})] }), new Date("2026-07-14T16:35:00.000Z")), "delivery", "d1");
    expect(running[0].message).toMatch(/limit has passed/);
    const late = findingsFor(fieldFindings(records({ deliveries: [truck({ dischargeFinishedAt: "2026-07-14T16:31:00.000Z" })] }), NOW), "delivery", "d1");
    expect(late.map((f) => [f.rule, f.severity])).toEqual([["discharge-time", "warning"]]);
    const onTime = findingsFor(fieldFindings(records({ deliveries: [truck({ dischargeFinishedAt: "2026-07-14T16:30:00.000Z" })] }), NOW), "delivery", "d1");
    expect(onTime).toEqual([]);
  });
});

describe("field tests against the mix's own tolerances (issue item 4)", () => {
  const test = device({ id: "t1", placementId: "p1", deliveryId: null, sampledAt: "2026-07-14T15:45:00.000Z", slumpMm: inToMm(4.5), airPct: 6, concreteTempC: fToC(75) });

  it("4½ in against a 4 in target: within ASTM C94's ±1 in, outside a mix tolerance of ±½ in [memory: C94 §7 slump tolerance]", () => {
    const withC94 = fieldFindings(records({ fieldTests: [test] }), NOW);
    expect(findingsFor(withC94, "field-test", "t1")).toEqual([]);
    const tight = { ...mixRow, slumpToleranceMm: inToMm(0.5) };
    const [f] = findingsFor(fieldFindings(records({ mixes: [tight], fieldTests: [test] }), NOW), "field-test", "t1");
    expect(f.rule).toBe("slump");
    expect(f.source.document).toBe("Mix design (project specification)");
    expect(f.applied.unit).toBe("in");
  });
});

// The adapter from stored rows (PostgreSQL: Dates and numeric strings; the device's IndexedDB: ISO
// strings, missing keys) to what the rulebook reads, and the one-line citation every surface prints.
// Defaults are the published ones the rules name: 90 min (ASTM C94 §10.7), 35 °C (ACI 305.1-14
// §3.3.1), design age 28 days (ACI 318 [common practice]), ACI 306R's current cold-weather definition.
import { describe, expect, it } from "vitest";
import { GOVERNS, citation, findingKey, toCheckInput, toCheckMix, toCheckProject } from "@/lib/checks";

describe("toCheckProject / toCheckMix: settings as stored, with the published defaults", () => {
  it("an empty project row: SI, UTC, 90 min, no revolution or evaporation limit, 35 °C, ACI 306R current", () => {
    expect(toCheckProject({})).toEqual({
      unitSystem: "SI",
      timeZone: "UTC",
      dischargeLimitMinutes: 90,
      revolutionLimit: null,
      evaporationHighKgM2H: null,
      maxConcreteTempC: 35,
      coldWeatherDefinition: "aci306r-current",
    });
    expect(toCheckProject({ timeZone: "", dischargeLimitMinutes: "", revolutionLimit: "" })).toMatchObject({ timeZone: "UTC", dischargeLimitMinutes: 90, revolutionLimit: null });
  });

  it("a project's own settings, numeric strings included, are kept", () => {
    expect(
      toCheckProject({
        unitSystem: "IP",
        timeZone: "America/Chicago",
        dischargeLimitMinutes: "60",
        revolutionLimit: 300,
        evaporationHighKgM2H: "0.75",
        maxConcreteTempC: 32,
        coldWeatherDefinition: "aci306-1990",
      }),
    ).toEqual({
      unitSystem: "IP",
      timeZone: "America/Chicago",
      dischargeLimitMinutes: 60,
      revolutionLimit: 300,
      evaporationHighKgM2H: 0.75,
      maxConcreteTempC: 32,
      coldWeatherDefinition: "aci306-1990",
    });
  });

  it("a mix: 28-day design age and no site water unless stated; slump as a maximum and low bleed only when said so", () => {
    expect(toCheckMix({ code: "LC-4000-A", fcMPa: "27.6" })).toEqual({
      code: "LC-4000-A",
      fcMPa: 27.6,
      fcAgeDays: 28,
      slumpTargetMm: null,
      slumpType: "target",
      slumpToleranceMm: null,
      airTargetPct: null,
      airTolerancePct: null,
      maxConcreteTempC: null,
      siteWaterAllowedLPerM3: 0,
      lowBleed: false,
    });
    expect(toCheckMix({ code: null, fcMPa: 40, fcAgeDays: 56, slumpType: "maximum", siteWaterAllowedLPerM3: "10", lowBleed: true })).toMatchObject({
      code: "",
      fcAgeDays: 56,
      slumpType: "maximum",
      siteWaterAllowedLPerM3: 10,
      lowBleed: true,
    });
    expect(toCheckMix({ fcMPa: 30, lowBleed: "true" }).lowBleed).toBe(false);
  });
});

describe("toCheckInput: every record type, tombstones left out", () => {
  const iso = "2026-07-14T15:00:00.000Z";
  const input = toCheckInput({
    project: {},
    mixes: [{ id: "m1", code: "LC-4000-A", fcMPa: 27.6, deletedAt: null }],
    placements: [
      { id: "p1", element: "Level 2 deck", leastDimensionMm: "250", plannedVolumeM3: null, plannedStart: iso, mixId: "m1" },
      { id: "p2", element: "Wall W3", leastDimensionMm: null, plannedStart: new Date(iso), mixId: null, deletedAt: undefined },
      { id: "gone", element: "Old", plannedStart: iso, deletedAt: iso },
    ],
    deliveries: [
      { id: "d1", placementId: "p1", ticketNumber: 1042, truck: null, volumeM3: "8", batchedAt: iso, arrivedAt: iso, dischargeStartedAt: "", dischargeFinishedAt: iso, revolutions: null, waterAddedL: "", waterFirstAt: null, status: "rejected" },
    ],
    fieldTests: [{ id: "t1", placementId: "p1", deliveryId: null, sampledAt: iso, slumpMm: "100", airPct: 6, concreteTempC: null }],
    weather: [{ id: "w1", placementId: "", observedAt: iso, airTempC: "25", relativeHumidityPct: 50, windKmh: 20, concreteTempC: "" }],
    curing: [{ id: "c1", placementId: "p1", readAt: iso, tempC: "12.5" }],
    specimenSets: [{ id: "s1", placementId: "p1", setCode: "A", castAt: iso, cylinderDiameterMm: "150" }],
    breaks: [{ id: "b1", specimenSetId: "s1", testedAt: iso, ageDays: "28", strengthMPa: "30.1" }, { id: "b0", specimenSetId: "s1", testedAt: iso, ageDays: 7, strengthMPa: 20, deletedAt: iso }],
  });

  it("placements with their mix; a missing least dimension stays unknown", () => {
    expect(input.placements.map((p) => p.id)).toEqual(["p1", "p2"]);
    expect(input.placements[0]).toMatchObject({ leastDimensionMm: 250, plannedVolumeM3: null, plannedStart: new Date(iso), mix: { code: "LC-4000-A" } });
    expect(input.placements[1]).toMatchObject({ leastDimensionMm: null, mix: null });
  });

  it("a truck ticket: times as Dates, blanks as null, the rejected status kept", () => {
    expect(input.deliveries).toEqual([
      {
        id: "d1",
        placementId: "p1",
        ticketNumber: "1042",
        truck: "",
        volumeM3: 8,
        batchedAt: new Date(iso),
        arrivedAt: new Date(iso),
        dischargeStartedAt: null,
        dischargeFinishedAt: new Date(iso),
        revolutions: null,
        waterAddedL: null,
        waterFirstAt: null,
        waterLastAt: null,
        mixCode: null,
        status: "rejected",
      },
    ]);
    expect(toCheckInput({ project: {}, mixes: [], placements: [], deliveries: [{ id: "d2", batchedAt: iso, arrivedAt: iso }] }).deliveries[0].status).toBe("accepted");
  });

  it("tests, weather, curing, sets and breaks", () => {
    expect(input.fieldTests).toEqual([{ id: "t1", placementId: "p1", deliveryId: null, sampledAt: new Date(iso), slumpMm: 100, airPct: 6, concreteTempC: null }]);
    expect(input.weather).toEqual([{ id: "w1", placementId: null, observedAt: new Date(iso), airTempC: 25, relativeHumidityPct: 50, windKmh: 20, concreteTempC: null }]);
    expect(input.curing).toEqual([{ id: "c1", placementId: "p1", readAt: new Date(iso), tempC: 12.5 }]);
    expect(input.specimenSets).toEqual([{ id: "s1", placementId: "p1", setCode: "A", castAt: new Date(iso), cylinderDiameterMm: 150 }]);
    expect(input.breaks).toEqual([{ id: "b1", specimenSetId: "s1", testedAt: new Date(iso), ageDays: 28, strengthMPa: 30.1 }]);
    expect(toCheckInput({ project: {}, mixes: [], placements: [] })).toMatchObject({ deliveries: [], fieldTests: [], weather: [], curing: [], specimenSets: [], breaks: [] });
  });
});

describe("citations and identity", () => {
  it("one line per source, saying how sure it is", () => {
    expect(citation({ document: "ASTM C94", clause: "§10.7", basis: "published" })).toBe("ASTM C94 §10.7");
    expect(citation({ document: "ACI 306.1", edition: "90", basis: "memory" })).toBe("ACI 306.1-90 [from memory, not checked against the text]");
    expect(citation({ document: "Placewright caution band", basis: "product" })).toBe("Placewright caution band (this product's own choice, not a published limit)");
    expect(citation({ document: "Project specification", basis: "project" })).toBe("Project specification");
    expect(citation({ document: "Trade practice", basis: "practice" })).toBe("Trade practice (common practice)");
  });

  it("a finding's key: rule, record and severity; the governing note", () => {
    expect(findingKey({ rule: "slump", subject: { type: "field-test", id: "t1" }, severity: "warning" })).toBe("slump:field-test:t1:warning");
    expect(GOVERNS).toBe("The project specification, local codes and the engineer of record govern over these defaults.");
  });
});

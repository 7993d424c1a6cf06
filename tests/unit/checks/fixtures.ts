// Small builders for rulebook tests: an SI or inch-pound project, a mix and records, stored in SI as
// the database and the device store them.
import type { CheckDelivery, CheckFieldTest, CheckInput, CheckMix, CheckPlacement, CheckProject, CheckWeather } from "@/lib/checks";

export const fToC = (f: number) => ((f - 32) * 5) / 9;
export const mphToKmh = (mph: number) => mph * 1.609344;
export const inToMm = (inches: number) => inches * 25.4;

export function project(overrides: Partial<CheckProject> = {}): CheckProject {
  return {
    unitSystem: "SI",
    timeZone: "America/Chicago",
    dischargeLimitMinutes: 90,
    revolutionLimit: null,
    evaporationHighKgM2H: null,
    maxConcreteTempC: 35,
    coldWeatherDefinition: "aci306r-current",
    ...overrides,
  };
}

export function mix(overrides: Partial<CheckMix> = {}): CheckMix {
  return {
    code: "LC-4000-A",
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
    ...overrides,
  };
}

export function placement(overrides: Partial<CheckPlacement> = {}): CheckPlacement {
  return { id: "p1", element: "Level 2 deck", leastDimensionMm: 250, plannedVolumeM3: 80, plannedStart: new Date("2026-07-14T14:00:00Z"), mix: mix(), ...overrides };
}

export function weather(overrides: Partial<CheckWeather> = {}): CheckWeather {
  return { id: "w1", placementId: "p1", observedAt: new Date("2026-07-14T20:00:00Z"), airTempC: 25, relativeHumidityPct: 50, windKmh: 20, concreteTempC: 25, ...overrides };
}

export function delivery(overrides: Partial<CheckDelivery> = {}): CheckDelivery {
  return {
    id: "d1",
    placementId: "p1",
    ticketNumber: "BR-1042",
    truck: "31",
    volumeM3: 8,
    mixCode: null,
    batchedAt: new Date("2026-07-14T15:00:00Z"),
    arrivedAt: new Date("2026-07-14T15:35:00Z"),
    dischargeStartedAt: new Date("2026-07-14T15:40:00Z"),
    dischargeFinishedAt: new Date("2026-07-14T16:20:00Z"),
    revolutions: null,
    waterAddedL: null,
    waterFirstAt: null,
    waterLastAt: null,
    status: "accepted",
    ...overrides,
  };
}

export function fieldTest(overrides: Partial<CheckFieldTest> = {}): CheckFieldTest {
  return { id: "t1", placementId: "p1", deliveryId: "d1", sampledAt: new Date("2026-07-14T15:45:00Z"), slumpMm: 100, airPct: 6, concreteTempC: 24, ...overrides };
}

export function input(overrides: Partial<CheckInput> = {}): CheckInput {
  return { project: project(), placements: [placement()], deliveries: [], fieldTests: [], weather: [], curing: [], specimenSets: [], breaks: [], ...overrides };
}

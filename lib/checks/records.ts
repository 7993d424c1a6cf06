// One adapter from stored records to what the rulebook reads, for every surface: rows from PostgreSQL
// (Date objects) and rows from the device's IndexedDB (ISO strings) alike. Tombstoned rows are left out.
import type {
  CheckBreak,
  CheckCuring,
  CheckDelivery,
  CheckFieldTest,
  CheckInput,
  CheckMix,
  CheckPlacement,
  CheckProject,
  CheckSpecimenSet,
  CheckWeather,
} from "./types";

type Row = Record<string, unknown>;

export type StoredRecords = {
  project: Row;
  mixes: Row[];
  placements: Row[];
  deliveries?: Row[];
  fieldTests?: Row[];
  weather?: Row[];
  curing?: Row[];
  specimenSets?: Row[];
  breaks?: Row[];
};

const live = (rows: Row[] | undefined) => (rows ?? []).filter((r) => r.deletedAt === null || r.deletedAt === undefined);
const num = (v: unknown): number | null => (v === null || v === undefined || v === "" ? null : Number(v));
const date = (v: unknown): Date => (v instanceof Date ? v : new Date(String(v)));
const dateOrNull = (v: unknown): Date | null => (v === null || v === undefined || v === "" ? null : date(v));
const text = (v: unknown): string => (v === null || v === undefined ? "" : String(v));

export function toCheckProject(p: Row): CheckProject {
  return {
    unitSystem: p.unitSystem === "IP" ? "IP" : "SI",
    timeZone: text(p.timeZone) || "UTC",
    dischargeLimitMinutes: num(p.dischargeLimitMinutes) ?? 90,
    revolutionLimit: num(p.revolutionLimit),
    evaporationHighKgM2H: num(p.evaporationHighKgM2H),
    maxConcreteTempC: num(p.maxConcreteTempC) ?? 35,
    coldWeatherDefinition: p.coldWeatherDefinition === "aci306-1990" ? "aci306-1990" : "aci306r-current",
  };
}

export function toCheckMix(m: Row): CheckMix {
  return {
    code: text(m.code),
    fcMPa: Number(m.fcMPa),
    fcAgeDays: num(m.fcAgeDays) ?? 28,
    slumpTargetMm: num(m.slumpTargetMm),
    slumpType: m.slumpType === "maximum" ? "maximum" : "target",
    slumpToleranceMm: num(m.slumpToleranceMm),
    airTargetPct: num(m.airTargetPct),
    airTolerancePct: num(m.airTolerancePct),
    maxConcreteTempC: num(m.maxConcreteTempC),
    siteWaterAllowedLPerM3: num(m.siteWaterAllowedLPerM3) ?? 0,
    lowBleed: m.lowBleed === true,
  };
}

export function toCheckInput(src: StoredRecords): CheckInput {
  const mixes = new Map(live(src.mixes).map((m) => [text(m.id), toCheckMix(m)]));
  const placements: CheckPlacement[] = live(src.placements).map((p) => ({
    id: text(p.id),
    element: text(p.element),
    leastDimensionMm: num(p.leastDimensionMm),
    plannedVolumeM3: num(p.plannedVolumeM3),
    plannedStart: date(p.plannedStart),
    mix: p.mixId ? (mixes.get(text(p.mixId)) ?? null) : null,
  }));
  const deliveries: CheckDelivery[] = live(src.deliveries).map((d) => ({
    id: text(d.id),
    placementId: text(d.placementId),
    ticketNumber: text(d.ticketNumber),
    truck: text(d.truck),
    volumeM3: Number(d.volumeM3),
    mixCode: typeof d.mixCode === "string" && d.mixCode.trim() ? d.mixCode.trim() : null,
    batchedAt: date(d.batchedAt),
    arrivedAt: date(d.arrivedAt),
    dischargeStartedAt: dateOrNull(d.dischargeStartedAt),
    dischargeFinishedAt: dateOrNull(d.dischargeFinishedAt),
    revolutions: num(d.revolutions),
    waterAddedL: num(d.waterAddedL),
    waterFirstAt: dateOrNull(d.waterFirstAt),
    waterLastAt: dateOrNull(d.waterLastAt),
    status: d.status === "rejected" ? "rejected" : "accepted",
  }));
  const fieldTests: CheckFieldTest[] = live(src.fieldTests).map((t) => ({
    id: text(t.id),
    placementId: text(t.placementId),
    deliveryId: t.deliveryId ? text(t.deliveryId) : null,
    sampledAt: date(t.sampledAt),
    slumpMm: num(t.slumpMm),
    airPct: num(t.airPct),
    concreteTempC: num(t.concreteTempC),
  }));
  const weather: CheckWeather[] = live(src.weather).map((w) => ({
    id: text(w.id),
    placementId: w.placementId ? text(w.placementId) : null,
    observedAt: date(w.observedAt),
    airTempC: Number(w.airTempC),
    relativeHumidityPct: Number(w.relativeHumidityPct),
    windKmh: Number(w.windKmh),
    concreteTempC: num(w.concreteTempC),
  }));
  const curing: CheckCuring[] = live(src.curing).map((c) => ({ id: text(c.id), placementId: text(c.placementId), readAt: date(c.readAt), tempC: Number(c.tempC) }));
  const specimenSets: CheckSpecimenSet[] = live(src.specimenSets).map((s) => ({
    id: text(s.id),
    placementId: text(s.placementId),
    setCode: text(s.setCode),
    castAt: date(s.castAt),
    cylinderDiameterMm: Number(s.cylinderDiameterMm),
  }));
  const breaks: CheckBreak[] = live(src.breaks).map((b) => ({
    id: text(b.id),
    specimenSetId: text(b.specimenSetId),
    testedAt: date(b.testedAt),
    ageDays: Number(b.ageDays),
    strengthMPa: Number(b.strengthMPa),
  }));
  return { project: toCheckProject(src.project), placements, deliveries, fieldTests, weather, curing, specimenSets, breaks };
}

// What a weather reading means for the fresh surface: the evaporation rate of bleed water (the
// ACI 305R nomograph as Uno's formula, in the project's unit system) against the precaution level,
// and hot weather (ACI 305.1). One home: the field screen, the server, the digest and the PDF call this.
import {
  CAUTION_FRACTION,
  EVAPORATION_LIMITS,
  LOW_BLEED_FACTOR,
  cToF,
  evaporationRateIP,
  evaporationRateSI,
  kgM2hToLbFt2h,
  kmhToMph,
  lbFt2hToKgM2h,
  temperatureInUnits,
  unitLabel,
  formatSpeed,
  formatTemperature,
  type UnitSystem,
} from "@/lib/concrete";
import { localDate } from "@/lib/time/zone";
import { GOVERNS, type CheckInput, type CheckMix, type CheckProject, type CheckWeather, type Finding, type Severity, type Source } from "./types";

export type Evaporation = {
  /** In the project's unit: kg/m²/h (SI) or lb/ft²/h (IP). */
  rate: number;
  /** The same rate in kg/m²/h, as stored. */
  rateKgM2H: number;
  unit: string;
  /** True when the concrete temperature was not measured and the air temperature stood in for it. */
  estimated: boolean;
};

// Uno 1998, in the form of the project's unit system (the two published forms differ by ~4 %).
// Without a measured concrete temperature the air temperature stands in, and the result says so.
export function evaporationOf(reading: Pick<CheckWeather, "airTempC" | "relativeHumidityPct" | "windKmh" | "concreteTempC">, unitSystem: UnitSystem): Evaporation {
  const estimated = reading.concreteTempC === null;
  const concreteTempC = reading.concreteTempC ?? reading.airTempC;
  const unit = unitLabel("evaporationRate", unitSystem);
  if (unitSystem === "SI") {
    const rate = evaporationRateSI({ concreteTempC, airTempC: reading.airTempC, relativeHumidityPct: reading.relativeHumidityPct, windKmh: reading.windKmh });
    return { rate, rateKgM2H: rate, unit, estimated };
  }
  const rate = evaporationRateIP({
    concreteTempF: cToF(concreteTempC),
    airTempF: cToF(reading.airTempC),
    relativeHumidityPct: reading.relativeHumidityPct,
    windMph: kmhToMph(reading.windKmh),
  });
  return { rate, rateKgM2H: lbFt2hToKgM2h(rate), unit, estimated };
}

export type EvaporationLimit = {
  /** Precautions needed when the rate approaches this, in the project's unit. */
  highAt: number;
  /** Our caution band starts here (this product's choice). */
  cautionAt: number;
  source: Source;
  /** Why this limit: "published", "low-bleed" or "project". */
  kind: "published" | "low-bleed" | "project";
};

// Project specification first; else ACI 305R, halved for a low-bleed mix (Silica Fume Association guidance).
export function evaporationLimit(project: Pick<CheckProject, "unitSystem" | "evaporationHighKgM2H">, mix: Pick<CheckMix, "lowBleed"> | null): EvaporationLimit {
  const units = project.unitSystem;
  if (project.evaporationHighKgM2H !== null) {
    // Stored in kg/m²/h; an inch-pound project typed it in lb/ft²/h, so it reads back as typed.
    const highAt = units === "SI" ? project.evaporationHighKgM2H : Math.round(kgM2hToLbFt2h(project.evaporationHighKgM2H) * 1e6) / 1e6;
    return { highAt, cautionAt: highAt * CAUTION_FRACTION, kind: "project", source: { document: "Project specification", basis: "project" } };
  }
  const published = EVAPORATION_LIMITS[units].highAt;
  if (mix?.lowBleed) {
    const highAt = published * LOW_BLEED_FACTOR;
    return {
      highAt,
      cautionAt: highAt * CAUTION_FRACTION,
      kind: "low-bleed",
      source: { document: "Silica Fume Association guidance for low-bleed mixes", basis: "published" },
    };
  }
  return {
    highAt: published,
    cautionAt: EVAPORATION_LIMITS[units].cautionAt,
    kind: "published",
    source: { document: "ACI 305R", clause: "Fig. 2.1.5", basis: "published" },
  };
}

const PRECAUTIONS =
  "Fog the air above the surface, put up windbreaks and sunshades, apply an evaporation reducer between finishing passes, and start curing promptly.";
const UNCERTAINTY = "The estimate is uncertain by about ±40 % (Hover, ACI SP-338): read it as a risk level.";

/** A limit as published: 1.0, 0.2, 0.25 (trailing zeros dropped, one decimal kept). */
export function limitText(value: number): string {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Number.isInteger(rounded) ? rounded.toFixed(1) : String(rounded);
}

/** A rate with enough digits that it never reads as equal to the limit it was judged against. */
export function rateText(rate: number, limit: number, unitSystem: UnitSystem): string {
  let digits = unitSystem === "SI" ? 2 : 3;
  while (digits < 5 && rate !== limit && rate.toFixed(digits) === limit.toFixed(digits)) digits += 1;
  return rate.toFixed(digits);
}

/** The finding for one weather reading, whatever its level (info below the caution band). */
export function evaporationFinding(reading: CheckWeather, project: CheckProject, mix: CheckMix | null): Finding {
  const units = project.unitSystem;
  const e = evaporationOf(reading, units);
  const limit = evaporationLimit(project, mix);
  const severity: Severity = e.rate >= limit.highAt ? "warning" : e.rate >= limit.cautionAt ? "caution" : "info";
  // Digits enough to tell the rate from the nearest limit it sits beside.
  const rate = `${rateText(e.rate, severity === "info" ? limit.cautionAt : limit.highAt, units)} ${e.unit}`;
  const high = `${limitText(limit.highAt)} ${e.unit}`;
  const whose =
    limit.kind === "project"
      ? `the project specification's limit of ${high}`
      : limit.kind === "low-bleed"
        ? `${high}, half the ACI 305R level for a low-bleed mix`
        : `${high} (ACI 305R)`;
  const estimate = e.estimated ? " Estimated: the concrete temperature was not measured, so the air temperature stands in for it." : "";
  const conditions = `Air ${formatTemperature(reading.airTempC, units)}, humidity ${Math.round(reading.relativeHumidityPct)} %, wind ${formatSpeed(reading.windKmh, units)}${reading.concreteTempC !== null ? `, concrete ${formatTemperature(reading.concreteTempC, units)}` : ""}.`;
  const level = { warning: "High evaporation", caution: "Evaporation approaching the precaution level", info: "Evaporation" }[severity];
  const messages: Record<Severity, string> = {
    warning: `Precautions against plastic-shrinkage cracking are needed when the rate approaches ${whose}. ${PRECAUTIONS}`,
    caution: `The rate is within our caution band (from ${limitText(limit.cautionAt)} ${e.unit}, half of ${whose}; the band is this product's own choice, not a published limit). Have fogging, windbreaks and curing ready.`,
    info: `Below our caution band (from ${limitText(limit.cautionAt)} ${e.unit}). Start curing promptly after finishing.`,
  };
  return {
    rule: "evaporation",
    severity,
    subject: { type: "weather", id: reading.id },
    placementId: reading.placementId,
    at: reading.observedAt.toISOString(),
    title: `${level}: ${rate}${e.estimated ? " (estimated)" : ""}`,
    message: `${messages[severity]} ${conditions}${estimate} ${UNCERTAINTY}`,
    applied: { value: e.rate, limit: severity === "caution" ? limit.cautionAt : limit.highAt, unit: e.unit },
    source: severity === "caution" ? { document: "Placewright caution band (half the precaution level)", basis: "product" } : limit.source,
    governs: GOVERNS,
  };
}

// ACI 305.1: hot weather when the air or concrete is at or above 27 °C (80 °F) and evaporation exceeds the
// precaution level; [common practice] crews need water, shade and rest in the same conditions.
const HOT = { SI: 27, IP: 80 } as const;

/** One finding per project-local day on which a reading meets ACI 305.1's hot-weather condition (at its hottest such reading). */
export function hotWeatherFindings(input: Pick<CheckInput, "project" | "weather" | "placements">): Finding[] {
  const { project } = input;
  const units = project.unitSystem;
  const mixOf = (id: string | null) => input.placements.find((p) => p.id === id)?.mix ?? null;
  const hottestByDay = new Map<string, { reading: CheckWeather; tempC: number }>();
  for (const w of input.weather) {
    const tempC = Math.max(w.airTempC, w.concreteTempC ?? -Infinity);
    if (temperatureInUnits(tempC, units) < HOT[units]) continue;
    if (!(evaporationOf(w, units).rate > evaporationLimit(project, mixOf(w.placementId)).highAt)) continue;
    const date = localDate(w.observedAt, project.timeZone);
    const best = hottestByDay.get(date);
    if (!best || tempC > best.tempC) hottestByDay.set(date, { reading: w, tempC });
  }
  const unit = units === "SI" ? "°C" : "°F";
  return [...hottestByDay.entries()].map(([date, { reading, tempC }]) => ({
    rule: "hot-weather" as const,
    severity: "caution" as const,
    subject: { type: "day" as const, id: date },
    placementId: null,
    at: reading.observedAt.toISOString(),
    title: `Hot weather: up to ${formatTemperature(tempC, units)} with high evaporation`,
    message:
      `ACI 305.1 treats ${HOT[units]} ${unit} or more with evaporation above the precaution level as hot weather: use the hot-weather checklist ` +
      "(cool the materials, place in cooler hours, dampen the subgrade, shade the cylinders). Watch crews for heat stress: water, shade and rest breaks.",
    applied: { value: temperatureInUnits(tempC, units), limit: HOT[units], unit },
    source: { document: "ACI 305.1", edition: "14", basis: "published" as const },
    governs: GOVERNS,
  }));
}

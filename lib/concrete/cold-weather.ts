// Cold-weather temperature limits (ACI 306R / 306.1): the minimum by section, the definition of cold
// weather and the protection period. The temperature at discharge is in ./discharge-temperature.ts.
// The cautions that go with cold-weather work are the rulebook's (lib/checks/cold-weather.ts).
import { ConcreteInputError, assertFinite, assertPositive } from "./errors";
import { cToF, fToC, formatTemperature, mmToIn, type UnitSystem } from "./units";

// Table by least section dimension. The SI and inch-pound editions publish their own round
// numbers (13 °C vs 55 °F), so each system keeps its own row; °F limits are turned into °C
// only to compare with the stored SI temperature.
const SECTION_LIMITS = {
  SI: { minimum: [13, 10, 7, 5], maxDrop: [28, 22, 17, 11] },
  // maxDrop from memory of ACI 306R: 50/40/30/20 °F (differences, so no 32 °F offset).
  IP: { minimum: [55, 50, 45, 40], maxDrop: [50, 40, 30, 20] },
} as const;

// ACI 306R: "less than 12 in", "12 to 36 in", "36 to 72 in", "over 72 in"; the SI edition uses
// 300/900/1800 mm. Exactly 300 mm (12 in) therefore belongs to the second column.
function sectionColumn(leastDimensionMm: number, unitSystem: UnitSystem): number {
  assertPositive(leastDimensionMm, "leastDimensionMm", "Least section dimension");
  // Rounded so that 304.8 mm reads as exactly 12 in despite binary floating point.
  const size = unitSystem === "SI" ? leastDimensionMm : Math.round(mmToIn(leastDimensionMm) * 1e6) / 1e6;
  const [first, second, third] = unitSystem === "SI" ? [300, 900, 1800] : [12, 36, 72];
  if (size < first) return 0;
  if (size <= second) return 1;
  if (size <= third) return 2;
  return 3;
}

// ACI 306R Line 1 / ACI 306.1 Table 3.1: minimum concrete temperature as placed and maintained, °C.
export function minimumConcreteTempC(leastDimensionMm: number, unitSystem: UnitSystem = "SI"): number {
  const value = minimumConcreteTemp(leastDimensionMm, unitSystem);
  return unitSystem === "SI" ? value : fToC(value);
}

// The same minimum as published in the unit system's own edition: 13 °C or 55 °F, never converted.
export function minimumConcreteTemp(leastDimensionMm: number, unitSystem: UnitSystem): number {
  return SECTION_LIMITS[unitSystem].minimum[sectionColumn(leastDimensionMm, unitSystem)];
}

/** A stored temperature (°C) in the project's unit system, for comparing with a published value. */
export function temperatureInUnits(tempC: number, unitSystem: UnitSystem): number {
  return inUnits(tempC, unitSystem);
}

// ACI 306R [memory]: largest gradual drop in the 24 h after protection ends, as a difference in °C.
export function maxTemperatureDropC(leastDimensionMm: number, unitSystem: UnitSystem = "SI"): number {
  const column = sectionColumn(leastDimensionMm, unitSystem);
  const value = SECTION_LIMITS[unitSystem].maxDrop[column];
  return unitSystem === "SI" ? value : (value * 5) / 9;
}

// Cold-weather limits, published per unit system and edition (never converted at run time).
export const COLD_WEATHER_LIMITS = {
  // ACI 306R (current): air has fallen to, or is expected to fall below, 4 °C (40 °F).
  "aci306r-current": { SI: { below: 4 }, IP: { below: 40 } },
  // ACI 306.1-90 / ACI 306R-88: average daily temperature below 40 °F for more than 3 successive days,
  // unless the air is above 50 °F for more than half of any 24 h. The SI edition's 5 °C and 10 °C are
  // from memory.
  "aci306-1990": { SI: { below: 5, warm: 10 }, IP: { below: 40, warm: 50 } },
} as const;
/** ACI 306.1-90: a day with the air above the warm limit for more than this many hours is not cold weather. */
export const WARM_HOURS_LIMIT = 12;
/** PCA, cold-weather chapter: protect fresh concrete from freezing until it reaches about this strength. */
export const FREEZE_PROTECTION_STRENGTH = { SI: { value: 3.5, unit: "MPa" }, IP: { value: 500, unit: "psi" } } as const;

export type ColdWeatherInput =
  | {
      /** ACI 306R current definition. */
      definition: "aci306r-current";
      /** Air temperatures already observed during the protection period. */
      observedAirTempsC?: number[];
      /** Lowest forecast air temperature for the rest of the protection period. */
      forecastMinAirTempC?: number;
      unitSystem?: UnitSystem;
      /** Project override of the 4 °C (40 °F) limit. */
      thresholdC?: number;
    }
  | {
      /** ACI 306.1-90 / ACI 308.1 wording still cited by older specifications. */
      definition: "aci306-1990";
      /** Average daily temperature (mean of the day's high and low), one per day, oldest first, ending today. */
      dailyMeanTempsC: number[];
      /** Hours of each of those days with the air above 10 °C (50 °F), where known. */
      dailyWarmHours?: (number | null)[];
      unitSystem?: UnitSystem;
      thresholdC?: number;
    };

export interface ColdWeatherResult {
  cold: boolean;
  reason: string;
  /** The limit applied, in the project's unit system. */
  limit: number;
}

function temperatureList(values: number[], field: string): number[] {
  values.forEach((value, i) => assertFinite(value, `${field}[${i}]`, "Temperature"));
  return values;
}

// Temperatures are compared in the project's unit system with that system's published value;
// rounding to 1e-6 keeps a stored 40 °F (4.444… °C) equal to 40 °F.
const inUnits = (tempC: number, unitSystem: UnitSystem) => (unitSystem === "SI" ? tempC : Math.round(cToF(tempC) * 1e6) / 1e6);

// ACI 306R (current) or ACI 306.1-90 definition of cold weather, chosen per project.
export function isColdWeather(input: ColdWeatherInput): ColdWeatherResult {
  const unitSystem = input.unitSystem ?? "SI";
  const published = COLD_WEATHER_LIMITS[input.definition][unitSystem];
  if (input.thresholdC !== undefined) assertFinite(input.thresholdC, "thresholdC", "Cold-weather limit");
  const limit = input.thresholdC !== undefined ? inUnits(input.thresholdC, unitSystem) : published.below;
  const unit = unitSystem === "SI" ? "°C" : "°F";
  const limitText = `${limit} ${unit}`;
  const show = (tempC: number) => formatTemperature(tempC, unitSystem, 1);

  if (input.definition === "aci306-1990") {
    const days = temperatureList(input.dailyMeanTempsC, "dailyMeanTempsC");
    if (days.length === 0) {
      throw new ConcreteInputError("dailyMeanTempsC", "Enter at least one average daily temperature");
    }
    const warm = COLD_WEATHER_LIMITS["aci306-1990"][unitSystem].warm;
    // The run of cold days that ends today; a day warm for more than half of its 24 h breaks it.
    let run = 0;
    let warmDayBroke = false;
    for (let i = days.length - 1; i >= 0; i--) {
      // Hours not known count as none: only a day known to be warm breaks the run.
      const warmHours = input.dailyWarmHours?.[i] ?? 0;
      if (warmHours > WARM_HOURS_LIMIT) {
        warmDayBroke = true;
        break;
      }
      if (!(inUnits(days[i], unitSystem) < limit)) break;
      run += 1;
    }
    const cold = run > 3;
    const warmNote = warmDayBroke ? `; the air was above ${warm} ${unit} for more than half of a day, which ends the run` : "";
    return {
      cold,
      limit,
      reason: cold
        ? `Average daily temperature has been below ${limitText} for ${run} successive days (more than 3)`
        : `Average daily temperature has been below ${limitText} for ${run} successive day${run === 1 ? "" : "s"}; cold weather needs more than 3${warmNote}`,
    };
  }

  const observed = temperatureList(input.observedAirTempsC ?? [], "observedAirTempsC");
  const forecast = input.forecastMinAirTempC;
  if (forecast !== undefined) assertFinite(forecast, "forecastMinAirTempC", "Forecast temperature");
  if (observed.length === 0 && forecast === undefined) {
    throw new ConcreteInputError("forecastMinAirTempC", "Enter an observed or forecast air temperature");
  }
  // "Has fallen to, or is expected to fall below": reaching the limit counts once observed.
  // With nothing observed (or no forecast) the lowest is +∞, which is below no limit.
  const lowestObserved = Math.min(...observed);
  if (inUnits(lowestObserved, unitSystem) <= limit) {
    return { cold: true, limit, reason: `Air temperature fell to ${show(lowestObserved)}, at or below ${limitText}` };
  }
  const forecastLow = forecast ?? Number.POSITIVE_INFINITY;
  if (inUnits(forecastLow, unitSystem) < limit) {
    return { cold: true, limit, reason: `Air temperature is forecast to fall to ${show(forecastLow)}, below ${limitText}` };
  }
  return { cold: false, limit, reason: `Air temperature stays above ${limitText} during the protection period` };
}

/**
 * Hours of a series of air readings above a limit, by straight lines between readings (readings
 * further apart than `maxGapHours` are not joined: that time is unknown and not counted).
 */
export function hoursAbove(readings: { at: Date; tempC: number }[], limitC: number, maxGapHours = 3): number {
  const sorted = [...readings].sort((a, b) => a.at.getTime() - b.at.getTime());
  let hours = 0;
  for (let i = 1; i < sorted.length; i++) {
    const a = sorted[i - 1];
    const b = sorted[i];
    const span = (b.at.getTime() - a.at.getTime()) / 3_600_000;
    // Sorted, so span ≥ 0; two readings at the same instant add nothing either way.
    if (span > maxGapHours) continue;
    // Stryker disable next-line EqualityOperator: with one end exactly at the limit, the crossing share below is the whole span too.
    if (a.tempC > limitC && b.tempC > limitC) hours += span;
    else if (a.tempC > limitC || b.tempC > limitC) {
      // The share of the interval on the warm side of the crossing.
      const warmEnd = Math.max(a.tempC, b.tempC) - limitC;
      hours += (span * warmEnd) / Math.abs(b.tempC - a.tempC);
    }
  }
  return hours;
}

export type ProtectionServiceCategory =
  | "no-load-not-exposed"
  | "no-load-exposed"
  | "partial-load-exposed"
  | "full-load-exposed";

const PROTECTION_DAYS: Record<Exclude<ProtectionServiceCategory, "full-load-exposed">, [number, number]> = {
  "no-load-not-exposed": [2, 1],
  "no-load-exposed": [3, 2],
  "partial-load-exposed": [6, 4],
};

// ACI 306R protection table, air-entrained concrete [memory]; null for full load (strength-based, engineer decides).
export function protectionPeriodDays({
  serviceCategory,
  acceleratedSet = false,
}: {
  serviceCategory: ProtectionServiceCategory;
  /** High-early-strength cement or an accelerating admixture. */
  acceleratedSet?: boolean;
}): number | null {
  if (serviceCategory === "full-load-exposed") return null;
  const [normal, accelerated] = PROTECTION_DAYS[serviceCategory];
  return acceleratedSet ? accelerated : normal;
}

// Cold- and hot-weather temperature limits (ACI 306R / 306.1, ACI 305.1, ACI 301).
import { ConcreteInputError, assertFinite, assertPositive } from "./errors";
import { fToC, formatTemperature, mmToIn, type UnitSystem } from "./units";

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
  const column = sectionColumn(leastDimensionMm, unitSystem);
  const value = SECTION_LIMITS[unitSystem].minimum[column];
  return unitSystem === "SI" ? value : fToC(value);
}

// ACI 306R [memory]: largest gradual drop in the 24 h after protection ends, as a difference in °C.
export function maxTemperatureDropC(leastDimensionMm: number, unitSystem: UnitSystem = "SI"): number {
  const column = sectionColumn(leastDimensionMm, unitSystem);
  const value = SECTION_LIMITS[unitSystem].maxDrop[column];
  return unitSystem === "SI" ? value : (value * 5) / 9;
}

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
      /** Average daily temperature (mean of the day's high and low), one per day, in order. */
      dailyMeanTempsC: number[];
      unitSystem?: UnitSystem;
      thresholdC?: number;
    };

export interface ColdWeatherResult {
  cold: boolean;
  reason: string;
}

function temperatureList(values: number[], field: string): number[] {
  values.forEach((value, i) => assertFinite(value, `${field}[${i}]`, "Temperature"));
  return values;
}

// ACI 306R (current) or ACI 306.1-90 definition of cold weather, chosen per project.
export function isColdWeather(input: ColdWeatherInput): ColdWeatherResult {
  const unitSystem = input.unitSystem ?? "SI";
  const thresholdC = input.thresholdC ?? (unitSystem === "SI" ? 4 : fToC(40));
  assertFinite(thresholdC, "thresholdC", "Cold-weather limit");
  const limit = formatTemperature(thresholdC, unitSystem);
  const show = (tempC: number) => formatTemperature(tempC, unitSystem, 1);

  if (input.definition === "aci306-1990") {
    const days = temperatureList(input.dailyMeanTempsC, "dailyMeanTempsC");
    if (days.length === 0) {
      throw new ConcreteInputError("dailyMeanTempsC", "Enter at least one average daily temperature");
    }
    let run = 0;
    let longest = 0;
    for (const mean of days) {
      run = mean < thresholdC ? run + 1 : 0;
      longest = Math.max(longest, run);
    }
    const cold = longest > 3;
    return {
      cold,
      reason: cold
        ? `Average daily temperature was below ${limit} for ${longest} successive days (more than 3)`
        : `Average daily temperature was below ${limit} for at most ${longest} successive days; cold weather needs more than 3`,
    };
  }

  const observed = temperatureList(input.observedAirTempsC ?? [], "observedAirTempsC");
  const forecast = input.forecastMinAirTempC;
  if (forecast !== undefined) assertFinite(forecast, "forecastMinAirTempC", "Forecast temperature");
  if (observed.length === 0 && forecast === undefined) {
    throw new ConcreteInputError("forecastMinAirTempC", "Enter an observed or forecast air temperature");
  }
  // "Has fallen to, or is expected to fall below": reaching the limit counts once observed.
  const lowestObserved = observed.length > 0 ? Math.min(...observed) : undefined;
  if (lowestObserved !== undefined && lowestObserved <= thresholdC) {
    return { cold: true, reason: `Air temperature fell to ${show(lowestObserved)}, at or below ${limit}` };
  }
  if (forecast !== undefined && forecast < thresholdC) {
    return { cold: true, reason: `Air temperature is forecast to fall to ${show(forecast)}, below ${limit}` };
  }
  return { cold: false, reason: `Air temperature stays above ${limit} during the protection period` };
}

export interface DischargeTempCheck {
  ok: boolean;
  tooHot: boolean;
  tooCold: boolean;
  /** The limit the verdict refers to: the minimum when too cold, otherwise the maximum. */
  limitC: number;
  maxC: number;
  minC?: number;
  message: string;
}

// ACI 305.1-14 §3.3.1 / ACI 301: 35 °C (95 °F) maximum at discharge; minimum from ACI 306 by section.
export function checkConcreteTempAtDischarge({
  concreteTempC,
  maxC = 35,
  minC,
  leastDimensionMm,
  unitSystem = "SI",
}: {
  concreteTempC: number;
  maxC?: number;
  /** Pass in cold weather only; otherwise taken from leastDimensionMm when that is given. */
  minC?: number;
  leastDimensionMm?: number;
  unitSystem?: UnitSystem;
}): DischargeTempCheck {
  assertFinite(concreteTempC, "concreteTempC", "Concrete temperature");
  assertFinite(maxC, "maxC", "Maximum concrete temperature");
  const minimumC =
    minC ?? (leastDimensionMm !== undefined ? minimumConcreteTempC(leastDimensionMm, unitSystem) : undefined);
  if (minimumC !== undefined) assertFinite(minimumC, "minC", "Minimum concrete temperature");
  const tooHot = concreteTempC > maxC;
  const tooCold = minimumC !== undefined && concreteTempC < minimumC;
  const show = (tempC: number) => formatTemperature(tempC, unitSystem, 1);
  const limitC = tooCold && minimumC !== undefined ? minimumC : maxC;
  let message: string;
  if (tooHot) message = `Concrete at ${show(concreteTempC)} is above the ${show(maxC)} maximum at discharge`;
  else if (tooCold) message = `Concrete at ${show(concreteTempC)} is below the ${show(limitC)} minimum for this section`;
  else message = `Concrete at ${show(concreteTempC)} is within the temperature limits`;
  return {
    ok: !tooHot && !tooCold,
    tooHot,
    tooCold,
    limitC,
    maxC,
    ...(minimumC !== undefined ? { minC: minimumC } : {}),
    message,
  };
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

const GOVERNANCE = "Project specifications, local codes and the engineer of record govern over these defaults";

// ACI 306R practice and PCA cold-weather guidance [common practice]: cautions shown with cold-weather placements.
export function coldWeatherCautions(): string[] {
  return [
    "Vent combustion heaters in enclosures to the outside: their exhaust carries carbon monoxide",
    "Protect fresh concrete from freezing until it reaches about 3.5 MPa (500 psi)",
    "Do not place concrete on frozen ground or against ice on forms or reinforcement",
    "Remove protection gradually so the concrete does not cool faster than the allowed drop",
    GOVERNANCE,
  ];
}

// ACI 305R ch. 3–4 [memory] and crew safety [common practice]: cautions shown with hot-weather placements.
export function hotWeatherCautions(): string[] {
  return [
    "Watch crews for heat stress: water, shade and rest breaks",
    "Cool the materials, use a retarder and place in the cooler hours",
    "Dampen the subgrade and forms without leaving standing water",
    "Use windbreaks, sunshades, fogging or an evaporation reducer when evaporation is high",
    "Start curing promptly and shade the test cylinders",
    GOVERNANCE,
  ];
}

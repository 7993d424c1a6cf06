// Evaporation of bleed water from fresh concrete: the ACI 305R / 308R nomograph as formulas.
import { ConcreteInputError, assertFinite, assertNonNegative, assertRange } from "./errors";
import { saturationVapourPressurePsi } from "./psychro";
import type { UnitSystem } from "./units";

export interface EvaporationInputSI {
  concreteTempC: number;
  airTempC: number;
  relativeHumidityPct: number;
  windKmh: number;
}

export interface EvaporationInputIP {
  concreteTempF: number;
  airTempF: number;
  relativeHumidityPct: number;
  windMph: number;
}

export type EvaporationRisk = "low" | "caution" | "high";

export interface EvaporationRiskOptions {
  /** Silica fume or low w/cm mixes bleed little, so cracking starts at about half the rate. */
  lowBleed?: boolean;
  cautionAt?: number;
  highAt?: number;
}

// ACI 305R Fig. 2.1.5: precautions are needed when the rate approaches 1.0 kg/m²/h (0.2 lb/ft²/h);
// published per unit system, not an exact conversion of each other. The caution band from half of
// that is this product's own choice, not a published limit.
export const EVAPORATION_LIMITS: Record<UnitSystem, { cautionAt: number; highAt: number }> = {
  SI: { cautionAt: 0.5, highAt: 1.0 },
  IP: { cautionAt: 0.1, highAt: 0.2 },
};
/** Low-bleed mixes (silica fume, low w/cm) crack at about half the rate (Silica Fume Association guidance). */
export const LOW_BLEED_FACTOR = 0.5;
/** Our caution band starts at this fraction of the precaution level (this product's choice). */
export const CAUTION_FRACTION = 0.5;

function validateSI(input: EvaporationInputSI): void {
  assertRange(input.concreteTempC, "concreteTempC", "Concrete temperature", -40, 70, "°C");
  assertRange(input.airTempC, "airTempC", "Air temperature", -40, 70, "°C");
  assertRange(input.relativeHumidityPct, "relativeHumidityPct", "Relative humidity", 0, 100, "%");
  assertNonNegative(input.windKmh, "windKmh", "Wind speed");
}

function validateIP(input: EvaporationInputIP): void {
  assertRange(input.concreteTempF, "concreteTempF", "Concrete temperature", -40, 158, "°F");
  assertRange(input.airTempF, "airTempF", "Air temperature", -40, 158, "°F");
  assertRange(input.relativeHumidityPct, "relativeHumidityPct", "Relative humidity", 0, 100, "%");
  assertNonNegative(input.windMph, "windMph", "Wind speed");
}

// Uno's power law stands in for vapour pressure and reaches zero at −18 °C (0 °F); below that the
// real vapour pressure is negligible here, and a fractional power of a negative base is NaN.
const powerTerm = (base: number): number => Math.pow(Math.max(0, base), 2.5);

function unoSIRaw({ concreteTempC, airTempC, relativeHumidityPct, windKmh }: EvaporationInputSI) {
  const r = relativeHumidityPct / 100;
  return 5 * (powerTerm(concreteTempC + 18) - r * powerTerm(airTempC + 18)) * (windKmh + 4) * 1e-6;
}

function unoIPRaw({ concreteTempF, airTempF, relativeHumidityPct, windMph }: EvaporationInputIP) {
  const r = relativeHumidityPct / 100;
  return (powerTerm(concreteTempF) - r * powerTerm(airTempF)) * (1 + 0.4 * windMph) * 1e-6;
}

// Uno 1998 (ACI Materials Journal 95(4)), SI form of the ACI 305R nomograph; kg/m²/h, never negative.
export function evaporationRateSI(input: EvaporationInputSI): number {
  validateSI(input);
  return Math.max(0, unoSIRaw(input));
}

// Uno 1998 (ACI Materials Journal 95(4)), inch-pound form; lb/ft²/h, never negative.
export function evaporationRateIP(input: EvaporationInputIP): number {
  validateIP(input);
  return Math.max(0, unoIPRaw(input));
}

// Menzel 1954 with ASHRAE 2017 vapour pressures (psi); lb/ft²/h, a cross-check on Uno's form.
export function evaporationRateMenzelIP(input: EvaporationInputIP): number {
  validateIP(input);
  const { concreteTempF, airTempF, relativeHumidityPct, windMph } = input;
  const surfacePsi = saturationVapourPressurePsi(concreteTempF);
  const airPsi = (relativeHumidityPct / 100) * saturationVapourPressurePsi(airTempF);
  return Math.max(0, 0.44 * (surfacePsi - airPsi) * (0.253 + 0.096 * windMph));
}

// ACI 305R Fig. 2.1.5 thresholds (low-bleed: Silica Fume Association guidance); rate in the system's unit.
export function evaporationRisk(
  rate: number,
  unitSystem: UnitSystem,
  options: EvaporationRiskOptions = {},
): EvaporationRisk {
  assertNonNegative(rate, "rate", "Evaporation rate");
  const defaults = EVAPORATION_LIMITS[unitSystem];
  const factor = options.lowBleed ? LOW_BLEED_FACTOR : 1;
  const cautionAt = options.cautionAt ?? defaults.cautionAt * factor;
  const highAt = options.highAt ?? defaults.highAt * factor;
  assertFinite(cautionAt, "cautionAt", "Caution threshold");
  assertFinite(highAt, "highAt", "High threshold");
  if (cautionAt > highAt) {
    throw new ConcreteInputError("cautionAt", "Caution threshold must not be above the high threshold");
  }
  if (rate >= highAt) return "high";
  if (rate >= cautionAt) return "caution";
  return "low";
}

export type DescribeEvaporationInput =
  | ({ unitSystem: "SI" } & EvaporationInputSI & EvaporationRiskOptions)
  | ({ unitSystem: "IP" } & EvaporationInputIP & EvaporationRiskOptions);

export interface EvaporationDescription {
  /** In the input's unit system: kg/m²/h (SI) or lb/ft²/h (IP). */
  rate: number;
  unitSystem: UnitSystem;
  risk: EvaporationRisk;
  rule: string;
  negativeReason?: string;
  actions: string[];
  uncertaintyNote: string;
  windNote: string;
}

const RULE =
  "ACI 305R: precautions are needed when evaporation approaches 1.0 kg/m²/h (0.2 lb/ft²/h); " +
  "the caution band from half of that is this product's own choice, not a published limit";
const NEGATIVE_REASON = "Concrete is cooler than the dew point of the air: no evaporation";
const UNCERTAINTY_NOTE =
  "The estimate is uncertain by about ±40 % (Hover 2020): read it as a risk level, not a precise number.";
const WIND_NOTE =
  "Use the average wind speed (not gusts) about 0.5 m (20 in) above the concrete surface; " +
  "airport wind is measured higher up and usually reads faster.";
const PRECAUTIONS = [
  "Fog the air above the surface (do not puddle water on it)",
  "Put up windbreaks",
  "Put up sunshades",
  "Apply an evaporation reducer between finishing passes",
  "Reschedule to cooler hours (early morning, evening or night)",
  "Start curing promptly after finishing",
];
const LOW_RISK_ACTIONS = ["Start curing promptly after finishing"];

// ACI 305R / 308R nomograph (Uno 1998) with the risk level and precautions for the field screen.
export function describeEvaporation(input: DescribeEvaporationInput): EvaporationDescription {
  let raw: number;
  if (input.unitSystem === "SI") {
    validateSI(input);
    raw = unoSIRaw(input);
  } else {
    validateIP(input);
    raw = unoIPRaw(input);
  }
  const rate = Math.max(0, raw);
  const risk = evaporationRisk(rate, input.unitSystem, {
    lowBleed: input.lowBleed,
    cautionAt: input.cautionAt,
    highAt: input.highAt,
  });
  return {
    rate,
    unitSystem: input.unitSystem,
    risk,
    rule: RULE,
    ...(raw < 0 ? { negativeReason: NEGATIVE_REASON } : {}),
    actions: risk === "low" ? [...LOW_RISK_ACTIONS] : [...PRECAUTIONS],
    uncertaintyNote: UNCERTAINTY_NOTE,
    windNote: WIND_NOTE,
  };
}


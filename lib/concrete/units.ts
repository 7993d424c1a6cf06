// Unit conversion at the edges: values are stored in SI; forms and labels follow the
// project's unit system. Published limits are never converted here (see DOMAIN "Units").
import { assertFinite } from "./errors";

export type UnitSystem = "SI" | "IP";

// Exact factors (NIST SP 811 definitions of the pound, foot, inch and US gallon).
export const KG_M2_H_PER_LB_FT2_H = 4.882428;
export const MPA_PER_PSI = 0.006894757;
export const M3_PER_YD3 = 0.764554858;
export const KMH_PER_MPH = 1.609344;
export const KG_M3_PER_LB_FT3 = 16.01846;
export const L_PER_US_GAL = 3.785411784;
export const MM_PER_IN = 25.4;
export const KN_PER_LBF = 0.00444822162;
export const M2_PER_FT2 = 0.09290304;
export const KG_PER_LB = 0.45359237;
export const M3_PER_FT3 = 0.028316846592;

// Celsius/Fahrenheit by definition of the two scales.
export const fToC = (tempF: number): number => ((tempF - 32) * 5) / 9;
export const cToF = (tempC: number): number => (tempC * 9) / 5 + 32;

export const lbFt2hToKgM2h = (rate: number): number => rate * KG_M2_H_PER_LB_FT2_H;
export const kgM2hToLbFt2h = (rate: number): number => rate / KG_M2_H_PER_LB_FT2_H;
export const psiToMPa = (psi: number): number => psi * MPA_PER_PSI;
export const mpaToPsi = (mpa: number): number => mpa / MPA_PER_PSI;
export const yd3ToM3 = (yd3: number): number => yd3 * M3_PER_YD3;
export const m3ToYd3 = (m3: number): number => m3 / M3_PER_YD3;
export const mphToKmh = (mph: number): number => mph * KMH_PER_MPH;
export const kmhToMph = (kmh: number): number => kmh / KMH_PER_MPH;
export const lbFt3ToKgM3 = (density: number): number => density * KG_M3_PER_LB_FT3;
export const kgM3ToLbFt3 = (density: number): number => density / KG_M3_PER_LB_FT3;
export const galToL = (gal: number): number => gal * L_PER_US_GAL;
export const lToGal = (litres: number): number => litres / L_PER_US_GAL;
export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const lbfToKN = (lbf: number): number => lbf * KN_PER_LBF;
export const kNToLbf = (kn: number): number => kn / KN_PER_LBF;
export const ft2ToM2 = (ft2: number): number => ft2 * M2_PER_FT2;
export const m2ToFt2 = (m2: number): number => m2 / M2_PER_FT2;
export const lbToKg = (lb: number): number => lb * KG_PER_LB;
export const kgToLb = (kg: number): number => kg / KG_PER_LB;
export const ft3ToM3 = (ft3: number): number => ft3 * M3_PER_FT3;
export const m3ToFt3 = (m3: number): number => m3 / M3_PER_FT3;

/** Quantities a form can show in either unit system; the stored value is always SI. */
export type Quantity =
  | "temperature"
  | "length"
  | "volume"
  | "speed"
  | "strength"
  | "density"
  | "evaporationRate"
  | "waterVolume";

interface QuantityUnits {
  siUnit: string;
  ipUnit: string;
  toIP: (si: number) => number;
  fromIP: (ip: number) => number;
  // Display precision follows how the value is read on site (e.g. C1064 reports to 0.5 °C / 1 °F).
  siDigits: number;
  ipDigits: number;
}

const QUANTITIES: Record<Quantity, QuantityUnits> = {
  temperature: { siUnit: "°C", ipUnit: "°F", toIP: cToF, fromIP: fToC, siDigits: 0, ipDigits: 0 },
  length: { siUnit: "mm", ipUnit: "in", toIP: mmToIn, fromIP: inToMm, siDigits: 0, ipDigits: 1 },
  volume: { siUnit: "m³", ipUnit: "yd³", toIP: m3ToYd3, fromIP: yd3ToM3, siDigits: 2, ipDigits: 2 },
  speed: { siUnit: "km/h", ipUnit: "mph", toIP: kmhToMph, fromIP: mphToKmh, siDigits: 0, ipDigits: 0 },
  strength: { siUnit: "MPa", ipUnit: "psi", toIP: mpaToPsi, fromIP: psiToMPa, siDigits: 1, ipDigits: 0 },
  density: {
    siUnit: "kg/m³",
    ipUnit: "lb/ft³",
    toIP: kgM3ToLbFt3,
    fromIP: lbFt3ToKgM3,
    siDigits: 0,
    ipDigits: 1,
  },
  evaporationRate: {
    siUnit: "kg/m²/h",
    ipUnit: "lb/ft²/h",
    toIP: kgM2hToLbFt2h,
    fromIP: lbFt2hToKgM2h,
    siDigits: 2,
    ipDigits: 2,
  },
  waterVolume: { siUnit: "L", ipUnit: "gal", toIP: lToGal, fromIP: galToL, siDigits: 0, ipDigits: 1 },
};

// Unit label shown beside a form field.
export function unitLabel(quantity: Quantity, unitSystem: UnitSystem): string {
  const units = QUANTITIES[quantity];
  return unitSystem === "SI" ? units.siUnit : units.ipUnit;
}

// Stored SI value → number shown in the project's unit system (unrounded, for inputs).
export function toDisplay(quantity: Quantity, valueSI: number, unitSystem: UnitSystem): number {
  return unitSystem === "SI" ? valueSI : QUANTITIES[quantity].toIP(valueSI);
}

// Number typed in the project's unit system → SI value to store.
export function fromDisplay(quantity: Quantity, displayValue: number, unitSystem: UnitSystem): number {
  return unitSystem === "SI" ? displayValue : QUANTITIES[quantity].fromIP(displayValue);
}

// Rounded value with its unit, e.g. "29 °C" or "84 °F".
export function formatQuantity(
  quantity: Quantity,
  valueSI: number,
  unitSystem: UnitSystem,
  digits?: number,
): string {
  return `${displayText(quantity, valueSI, unitSystem, digits)} ${unitLabel(quantity, unitSystem)}`;
}

/** The number formatQuantity shows, without its unit ("34.4"): for tables and exports that put the unit in a header. */
export function displayText(quantity: Quantity, valueSI: number, unitSystem: UnitSystem, digits?: number): string {
  assertFinite(valueSI, quantity, "Value");
  const units = QUANTITIES[quantity];
  const places = digits ?? (unitSystem === "SI" ? units.siDigits : units.ipDigits);
  const text = toDisplay(quantity, valueSI, unitSystem).toFixed(places);
  // toFixed keeps the sign of a tiny negative ("-0"), which reads as an error on site.
  return Number(text) === 0 ? (0).toFixed(places) : text;
}

export const formatTemperature = (tempC: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("temperature", tempC, unitSystem, digits);
export const formatEvaporation = (rateKgM2h: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("evaporationRate", rateKgM2h, unitSystem, digits);
export const formatLength = (lengthMm: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("length", lengthMm, unitSystem, digits);
export const formatVolume = (volumeM3: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("volume", volumeM3, unitSystem, digits);
export const formatStrength = (strengthMPa: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("strength", strengthMPa, unitSystem, digits);
export const formatSpeed = (speedKmh: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("speed", speedKmh, unitSystem, digits);
export const formatDensity = (densityKgM3: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("density", densityKgM3, unitSystem, digits);
export const formatWaterVolume = (waterL: number, unitSystem: UnitSystem, digits?: number) =>
  formatQuantity("waterVolume", waterL, unitSystem, digits);

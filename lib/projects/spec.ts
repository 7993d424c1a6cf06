// The values a project's specification sets for the rulebook: its own limits where it differs from
// the published defaults, the cold-weather definition it follows, and the maturity settings
// (ASTM C1074). Stored in SI like every value; the form shows the project's units and the schema's
// messages name the bounds in those units. Pure: used by the admin form and by the server.
import { z } from "zod";
import {
  DEFAULT_MATURITY_SETTINGS,
  EVAPORATION_LIMITS,
  formatQuantity,
  fromDisplay,
  toDisplay,
  unitLabel,
  type Quantity,
  type UnitSystem,
} from "@/lib/concrete";

export type ProjectSpec = {
  evaporationHighKgM2H: number | null;
  maxConcreteTempC: number;
  dischargeLimitMinutes: number;
  revolutionLimit: number | null;
  coldWeatherDefinition: "aci306r-current" | "aci306-1990";
  specEditions: string;
  maturityMethod: "nurse-saul" | "equivalent-age";
  maturityDatumC: number;
  maturityActivationEnergyJPerMol: number;
  maturityTargetMPa: number | null;
};
export type SpecField = keyof ProjectSpec;

/**
 * Plausible ranges, not rules: a value outside them is a typing slip (a Fahrenheit figure in a
 * Celsius project, a missing digit), so it is refused with the range in the project's units.
 * The rule each value feeds stays in lib/checks; these bounds only keep it meaningful.
 */
export const SPEC_BOUNDS = {
  evaporationHighKgM2H: { min: 0.1, max: 2.0, quantity: "evaporationRate" },
  maxConcreteTempC: { min: 15, max: 45, quantity: "temperature" },
  dischargeLimitMinutes: { min: 30, max: 240, quantity: null },
  revolutionLimit: { min: 50, max: 1000, quantity: null },
  maturityDatumC: { min: -15, max: 10, quantity: "temperature" },
  maturityActivationEnergyJPerMol: { min: 20_000, max: 70_000, quantity: null },
  maturityTargetMPa: { min: 1, max: 100, quantity: "strength" },
} as const satisfies Partial<Record<SpecField, { min: number; max: number; quantity: Quantity | null }>>;
type BoundedField = keyof typeof SPEC_BOUNDS;

const WHAT: Record<BoundedField, string> = {
  evaporationHighKgM2H: "The evaporation limit",
  maxConcreteTempC: "The maximum concrete temperature",
  dischargeLimitMinutes: "The discharge time limit",
  revolutionLimit: "The drum revolution limit",
  maturityDatumC: "The datum temperature",
  maturityActivationEnergyJPerMol: "The activation energy",
  maturityTargetMPa: "The target strength",
};

/** A bound as the person reads it: "0.02 lb/ft²/h", "59 °F", "240 min", "20 kJ/mol". */
function boundText(field: BoundedField, valueSI: number, unitSystem: UnitSystem): string {
  const { quantity } = SPEC_BOUNDS[field];
  if (quantity) return formatQuantity(quantity, valueSI, unitSystem);
  if (field === "maturityActivationEnergyJPerMol") return `${valueSI / 1000} kJ/mol`;
  if (field === "dischargeLimitMinutes") return `${valueSI} min`;
  return `${valueSI}`;
}

function bounded(field: BoundedField, unitSystem: UnitSystem) {
  const { min, max } = SPEC_BOUNDS[field];
  const message = `${WHAT[field]} must be between ${boundText(field, min, unitSystem)} and ${boundText(field, max, unitSystem)}.`;
  const number = z.number({ error: `${WHAT[field]} must be a number.` }).refine(Number.isFinite, message);
  const inRange = number.refine((v) => v >= min && v <= max, message);
  return field === "dischargeLimitMinutes" || field === "revolutionLimit"
    ? inRange.refine(Number.isInteger, `${WHAT[field]} must be a whole number.`)
    : inRange;
}

/** The change an administrator sends: any subset of the fields, each checked in the project's units. */
export function projectSpecSchema(unitSystem: UnitSystem) {
  return z
    .strictObject(
      {
      evaporationHighKgM2H: bounded("evaporationHighKgM2H", unitSystem).nullable(),
      maxConcreteTempC: bounded("maxConcreteTempC", unitSystem),
      dischargeLimitMinutes: bounded("dischargeLimitMinutes", unitSystem),
      revolutionLimit: bounded("revolutionLimit", unitSystem).nullable(),
      coldWeatherDefinition: z.enum(["aci306r-current", "aci306-1990"], { error: "Choose one of the two cold-weather definitions." }),
      specEditions: z.string().trim().max(200, "The editions can be at most 200 characters."),
      maturityMethod: z.enum(["nurse-saul", "equivalent-age"], { error: "Choose Nurse-Saul or equivalent age." }),
      maturityDatumC: bounded("maturityDatumC", unitSystem),
      maturityActivationEnergyJPerMol: bounded("maturityActivationEnergyJPerMol", unitSystem),
      maturityTargetMPa: bounded("maturityTargetMPa", unitSystem).nullable(),
      },
      { error: (issue) => (issue.code === "unrecognized_keys" ? "Only the project specification's values can be changed here." : undefined) },
    )
    .partial()
    .refine((v) => Object.keys(v).length > 0, "Nothing has changed.");
}
export type ProjectSpecChange = z.infer<ReturnType<typeof projectSpecSchema>>;

// ── The form: strings as typed in the project's units, converted at the edge ──

export type SpecFormValues = Record<SpecField, string>;

/** Where a field's number is shown in another unit than it is stored. */
const FORM_QUANTITY: Partial<Record<SpecField, Quantity>> = {
  evaporationHighKgM2H: "evaporationRate",
  maxConcreteTempC: "temperature",
  maturityDatumC: "temperature",
  maturityTargetMPa: "strength",
};
const NUMERIC: SpecField[] = [
  "evaporationHighKgM2H",
  "maxConcreteTempC",
  "dischargeLimitMinutes",
  "revolutionLimit",
  "maturityDatumC",
  "maturityActivationEnergyJPerMol",
  "maturityTargetMPa",
];
const NULLABLE = new Set<SpecField>(["evaporationHighKgM2H", "revolutionLimit", "maturityTargetMPa"]);

/** The unit beside a field in the project's system. */
export function specUnit(field: SpecField, unitSystem: UnitSystem): string | undefined {
  const quantity = FORM_QUANTITY[field];
  if (quantity) return unitLabel(quantity, unitSystem);
  if (field === "maturityActivationEnergyJPerMol") return "kJ/mol";
  if (field === "dischargeLimitMinutes") return "min";
  return undefined;
}

function toForm(field: SpecField, value: number, unitSystem: UnitSystem): string {
  const quantity = FORM_QUANTITY[field];
  if (field === "maturityActivationEnergyJPerMol") return String(value / 1000);
  if (!quantity) return String(value);
  // Enough digits that a value set in the other system survives a round trip unchanged.
  return String(Number(toDisplay(quantity, value, unitSystem).toFixed(3)));
}

function fromForm(field: SpecField, text: string, unitSystem: UnitSystem): number | null {
  if (text.trim() === "") return NULLABLE.has(field) ? null : Number.NaN;
  const value = Number(text.trim());
  const quantity = FORM_QUANTITY[field];
  if (field === "maturityActivationEnergyJPerMol") return value * 1000;
  return quantity && Number.isFinite(value) ? fromDisplay(quantity, value, unitSystem) : value;
}

/** The stored project as the form shows it. */
export function specFormValues(spec: ProjectSpec, unitSystem: UnitSystem): SpecFormValues {
  const values = {} as SpecFormValues;
  for (const field of Object.keys(spec) as SpecField[]) {
    const v = spec[field];
    values[field] = v === null ? "" : typeof v === "number" ? toForm(field, v, unitSystem) : v;
  }
  return values;
}

/** The touched fields of the form as the change the server checks (SI). */
export function specChange(values: SpecFormValues, touched: SpecField[], unitSystem: UnitSystem): Record<string, unknown> {
  return Object.fromEntries(
    touched.map((field) => [field, NUMERIC.includes(field) ? fromForm(field, values[field], unitSystem) : values[field]]),
  );
}

/** The published values the blank fields fall back to, as hints in the project's units. */
export function specDefaults(unitSystem: UnitSystem) {
  const evaporation = EVAPORATION_LIMITS[unitSystem].highAt;
  return {
    evaporation: `${evaporation} ${unitLabel("evaporationRate", unitSystem)} (ACI 305R)`,
    datum: formatQuantity("temperature", DEFAULT_MATURITY_SETTINGS.datumC, unitSystem),
    activationEnergy: `${DEFAULT_MATURITY_SETTINGS.activationEnergyJPerMol / 1000} kJ/mol`,
  };
}

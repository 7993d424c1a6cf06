// The mix design form in the project's units: strings as typed, converted to SI at the edge and
// then checked by the one mix schema (lib/records/schemas/mix-design.ts).
import { fromDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from "@/lib/concrete/units";
import { mixDesignCreateSchema, type MixDesignValues } from "@/lib/records/schemas/mix-design";
import { waterRateFromDisplay, waterRateToDisplay, waterRateUnit } from "./units";

export type MixFormValues = {
  code: string;
  supplier: string;
  fcMPa: string;
  fcAgeDays: "28" | "56";
  maxWcm: string;
  slumpTargetMm: string;
  slumpType: "target" | "maximum";
  slumpToleranceMm: string;
  airTargetPct: string;
  airTolerancePct: string;
  maxConcreteTempC: string;
  cementType: string;
  scms: string;
  siteWaterAllowedLPerM3: string;
  lowBleed: boolean;
};

type NumericField = Exclude<keyof MixFormValues, "code" | "supplier" | "fcAgeDays" | "slumpType" | "cementType" | "scms" | "lowBleed">;
type Conversion = { quantity: Quantity | "waterRate" | null; nullable: boolean; digits: Record<UnitSystem, number> };

export const NUMERIC_FIELDS: Record<NumericField, Conversion> = {
  fcMPa: { quantity: "strength", nullable: false, digits: { SI: 1, IP: 0 } },
  maxWcm: { quantity: null, nullable: true, digits: { SI: 2, IP: 2 } },
  slumpTargetMm: { quantity: "length", nullable: true, digits: { SI: 0, IP: 2 } },
  slumpToleranceMm: { quantity: "length", nullable: true, digits: { SI: 0, IP: 2 } },
  airTargetPct: { quantity: null, nullable: true, digits: { SI: 1, IP: 1 } },
  airTolerancePct: { quantity: null, nullable: true, digits: { SI: 1, IP: 1 } },
  maxConcreteTempC: { quantity: "temperature", nullable: true, digits: { SI: 0, IP: 0 } },
  siteWaterAllowedLPerM3: { quantity: "waterRate", nullable: false, digits: { SI: 1, IP: 2 } },
};

export function unitFor(field: NumericField, unitSystem: UnitSystem): string | undefined {
  const { quantity } = NUMERIC_FIELDS[field];
  if (quantity === null) return field === "maxWcm" ? undefined : "%";
  return quantity === "waterRate" ? waterRateUnit(unitSystem) : unitLabel(quantity, unitSystem);
}

function toSI(field: NumericField, value: number, unitSystem: UnitSystem): number {
  const { quantity } = NUMERIC_FIELDS[field];
  if (quantity === null) return value;
  return quantity === "waterRate" ? waterRateFromDisplay(value, unitSystem) : fromDisplay(quantity, value, unitSystem);
}

function fromSI(field: NumericField, value: number, unitSystem: UnitSystem): number {
  const { quantity } = NUMERIC_FIELDS[field];
  if (quantity === null) return value;
  return quantity === "waterRate" ? waterRateToDisplay(value, unitSystem) : toDisplay(quantity, value, unitSystem);
}

/** A stored SI value as the form shows it: rounded the way it is read, without trailing zeros. */
function displayText(field: NumericField, value: number | null | undefined, unitSystem: UnitSystem): string {
  if (value === null || value === undefined) return "";
  return String(Number(fromSI(field, value, unitSystem).toFixed(NUMERIC_FIELDS[field].digits[unitSystem])));
}

export function formDefaults(mix: Partial<MixDesignValues> | null, unitSystem: UnitSystem): MixFormValues {
  const numeric = Object.fromEntries(
    (Object.keys(NUMERIC_FIELDS) as NumericField[]).map((f) => [f, displayText(f, mix?.[f] as number | null | undefined, unitSystem)]),
  ) as Record<NumericField, string>;
  return {
    ...numeric,
    code: mix?.code ?? "",
    supplier: mix?.supplier ?? "",
    fcAgeDays: mix?.fcAgeDays === 56 ? "56" : "28",
    slumpType: mix?.slumpType ?? "target",
    cementType: mix?.cementType ?? "",
    scms: mix?.scms ?? "",
    lowBleed: mix?.lowBleed ?? false,
    siteWaterAllowedLPerM3: mix ? numeric.siteWaterAllowedLPerM3 : "0",
  };
}

/** Form strings → the SI record the schema checks. Empty optional numbers become null; text that is not a number stays NaN so the schema names it. */
export function formToRecord(values: MixFormValues, unitSystem: UnitSystem, id: string): Record<string, unknown> {
  const record: Record<string, unknown> = {
    id,
    code: values.code,
    supplier: values.supplier,
    fcAgeDays: Number(values.fcAgeDays),
    slumpType: values.slumpType,
    cementType: values.cementType,
    scms: values.scms,
    lowBleed: values.lowBleed,
  };
  for (const field of Object.keys(NUMERIC_FIELDS) as NumericField[]) {
    const text = values[field].trim().replace(",", ".");
    if (text === "") record[field] = NUMERIC_FIELDS[field].nullable ? null : undefined;
    else record[field] = toSI(field, Number(text), unitSystem);
  }
  return record;
}

/**
 * The schema words its limits in SI ("between 10 and 150 MPa"); an inch-pound user reads them in
 * their own units, converted here for the fields the form converts.
 */
export function localiseMessage(field: string, message: string, unitSystem: UnitSystem): string {
  if (unitSystem === "SI" || !(field in NUMERIC_FIELDS)) return message;
  const f = field as NumericField;
  const unit = unitFor(f, unitSystem);
  if (!unit || NUMERIC_FIELDS[f].quantity === null) return message;
  const fmt = (si: string) => String(Number(fromSI(f, Number(si), unitSystem).toFixed(NUMERIC_FIELDS[f].digits.IP)));
  return message.replace(/between (-?[\d.]+) and (-?[\d.]+) \S+$/, (_, a: string, b: string) => `between ${fmt(a)} and ${fmt(b)} ${unit}`);
}

export type MixCheck = { ok: true; values: MixDesignValues } | { ok: false; errors: Record<string, string> };

/** Converts and validates with the shared schema; errors keyed by form field, in the form's units. */
export function checkMixForm(values: MixFormValues, unitSystem: UnitSystem, id: string): MixCheck {
  const result = mixDesignCreateSchema.safeParse(formToRecord(values, unitSystem, id));
  if (result.success) return { ok: true, values: result.data };
  const errors: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const field = String(issue.path[0] ?? "code");
    errors[field] ??= localiseMessage(field, issue.message, unitSystem);
  }
  return { ok: false, errors };
}

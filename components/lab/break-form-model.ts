// The break form in the project's units: strings as typed, converted to SI at the edge, then
// checked by the one break schema (lib/records/schemas/specimens.ts), as the API and sync do.
import { cylinderStrengthMPa, inToMm, kNToLbf, lbfToKN, mmToIn, type UnitSystem } from "@/lib/concrete";
import { breakAgeDays, dueAt } from "@/lib/lab/due";
import { breakCreateSchema } from "@/lib/records/schemas/specimens";
import { localDateTime, localDateTimeToInstant } from "@/lib/time/zone";

export type BreakFormValues = { testedAt: string; load: string; diameter: string; length: string; fractureType: string };

export const loadUnit = (u: UnitSystem) => (u === "SI" ? "kN" : "lbf");
export const sizeUnit = (u: UnitSystem) => (u === "SI" ? "mm" : "in");

const num = (text: string) => {
  const t = text.trim().replace(",", ".");
  return t === "" ? undefined : Number(t);
};

export type SetForForm = { id: string; castAt: string | Date; cylinderDiameterMm: number; cylinderLengthMm: number; testAgesDays: number[]; testedAges: number[] };

export function breakDefaults(set: SetForForm, units: UnitSystem, timeZone: string): BreakFormValues {
  const next = [...set.testAgesDays].sort((a, b) => a - b).find((age) => !set.testedAges.includes(age)) ?? set.testAgesDays[set.testAgesDays.length - 1];
  const size = (mm: number) => (units === "SI" ? String(mm) : String(Number(mmToIn(mm).toFixed(2))));
  return {
    testedAt: localDateTime(dueAt(new Date(set.castAt), next), timeZone),
    load: "",
    // The set records the nominal class (100 or 150 mm); inch-pound labs mould 4 in and 6 in cylinders.
    diameter: units === "SI" ? String(set.cylinderDiameterMm) : set.cylinderDiameterMm >= 150 ? "6" : "4",
    length: size(set.cylinderLengthMm),
    fractureType: "",
  };
}

/** Form strings → the SI break record; NaN stays NaN so the schema names the field. */
export function formToBreak(values: BreakFormValues, set: SetForForm, units: UnitSystem, timeZone: string, id: string) {
  const testedAt = localDateTimeToInstant(values.testedAt, timeZone);
  const load = num(values.load);
  const diameter = num(values.diameter);
  const length = num(values.length);
  const toMm = (v: number | undefined) => (v === undefined ? undefined : units === "SI" ? v : inToMm(v));
  const ageDays = testedAt ? breakAgeDays(new Date(set.castAt), testedAt, set.testAgesDays) : null;
  return {
    id,
    specimenSetId: set.id,
    testedAt: testedAt ? testedAt.toISOString() : values.testedAt,
    ageDays: ageDays ?? -1,
    loadKN: load === undefined ? undefined : units === "SI" ? load : lbfToKN(load),
    diameterMm: toMm(diameter),
    lengthMm: length === undefined ? null : toMm(length),
    fractureType: values.fractureType === "" ? null : Number(values.fractureType),
  };
}

const FORM_FIELD: Record<string, keyof BreakFormValues> = { testedAt: "testedAt", ageDays: "testedAt", loadKN: "load", diameterMm: "diameter", lengthMm: "length", fractureType: "fractureType" };

/** The schema's SI wording ("between 50 and 200 mm") in the project's units for inch-pound users. */
function localise(field: string, message: string, units: UnitSystem): string {
  if (field === "ageDays") return "The test time must be after the cast time";
  if (units === "SI") return message;
  const conv = field === "loadKN" ? (v: number) => `${Math.round(kNToLbf(v))}` : field === "diameterMm" || field === "lengthMm" ? (v: number) => `${Number(mmToIn(v).toFixed(1))}` : null;
  if (!conv) return message;
  const unit = field === "loadKN" ? "lbf" : "in";
  return message.replace(/between ([\d.]+) and ([\d.]+) \S+$/, (_, a: string, b: string) => `between ${conv(Number(a))} and ${conv(Number(b))} ${unit}`);
}

export type BreakCheck =
  | { ok: true; body: ReturnType<typeof formToBreak>; strengthMPa: number | null }
  | { ok: false; errors: Partial<Record<keyof BreakFormValues, string>>; strengthMPa: number | null };

/** Validates with the shared schema and computes the strength at once (ASTM C39, L/D-corrected). */
export function checkBreak(values: BreakFormValues, set: SetForForm, units: UnitSystem, timeZone: string, id: string): BreakCheck {
  const body = formToBreak(values, set, units, timeZone, id);
  let strengthMPa: number | null = null;
  try {
    if (body.loadKN && body.diameterMm) strengthMPa = cylinderStrengthMPa({ maxLoadKN: body.loadKN, diameterMm: body.diameterMm, lengthMm: body.lengthMm ?? undefined });
  } catch {
    strengthMPa = null;
  }
  const result = breakCreateSchema.safeParse(body);
  if (result.success && strengthMPa !== null) return { ok: true, body, strengthMPa };
  const errors: Partial<Record<keyof BreakFormValues, string>> = {};
  for (const issue of result.success ? [] : result.error.issues) {
    const field = String(issue.path[0]);
    const key = FORM_FIELD[field] ?? "load";
    errors[key] ??= localise(field, issue.message, units);
  }
  if (result.success && strengthMPa === null) errors.length = "Specimens shorter than their diameter cannot be corrected (L/D below 1.0)";
  return { ok: false, errors, strengthMPa };
}

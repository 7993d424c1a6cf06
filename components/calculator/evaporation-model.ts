// Pure helpers behind the evaporation calculator: parsing what was typed, unit switching, the
// lib/concrete call with field errors, and the chart series. No React here, so it is unit-tested.
import { evaluate as evaluateRules, toCheckInput, type Finding, type Source } from "@/lib/checks";
import { evaporationLimit } from "@/lib/checks/weather";
import {
  ConcreteInputError,
  describeEvaporation,
  fromDisplay,
  toDisplay,
  unitLabel,
  type EvaporationDescription,
  type UnitSystem,
} from "@/lib/concrete";

export type FieldName = "airTemp" | "humidity" | "wind" | "concreteTemp";
export const FIELD_NAMES: FieldName[] = ["airTemp", "humidity", "wind", "concreteTemp"];

/** What is in the four inputs, as typed, in the unit system named beside it. */
export type Draft = Record<FieldName, string>;
export type Readings = Record<FieldName, number>;

// An afternoon that needs precautions, as a worked example the user overwrites.
export const DEFAULT_DRAFTS: Record<UnitSystem, Draft> = {
  IP: { airTemp: "90", humidity: "30", wind: "12", concreteTemp: "88" },
  SI: { airTemp: "32", humidity: "30", wind: "20", concreteTemp: "31" },
};

export const FIELD_LABELS: Record<FieldName, string> = {
  airTemp: "Air temperature",
  humidity: "Relative humidity",
  wind: "Wind speed",
  concreteTemp: "Concrete temperature",
};

export function fieldUnit(field: FieldName, unitSystem: UnitSystem): string {
  if (field === "humidity") return "%";
  return unitLabel(field === "wind" ? "speed" : "temperature", unitSystem);
}

// Site phones type "1,5" as often as "1.5"; anything else that is not a plain decimal is refused
// (Number() would accept "0x10" or "1e3", which nobody means on a slab).
const DECIMAL = /^[-+\u2212]?(\d+([.,]\d*)?|[.,]\d+)$/;

export function parseDecimal(text: string): number {
  const trimmed = text.trim();
  if (!DECIMAL.test(trimmed)) return Number.NaN;
  return Number(trimmed.replace("\u2212", "-").replace(",", "."));
}

function roundForInput(value: number): string {
  const rounded = Math.round(value * 10) / 10;
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

/** True while every field still holds the worked example: the screen says the readings are an example. */
export const isExample = (draft: Draft, unitSystem: UnitSystem): boolean => FIELD_NAMES.every((f) => draft[f] === DEFAULT_DRAFTS[unitSystem][f]);

/** The same conditions in the other unit system; the untouched example maps to its own round numbers. */
export function convertDraft(draft: Draft, from: UnitSystem, to: UnitSystem): Draft {
  if (from === to) return draft;
  const example = DEFAULT_DRAFTS[from];
  if (FIELD_NAMES.every((f) => draft[f] === example[f])) return DEFAULT_DRAFTS[to];
  const convert = (text: string, quantity: "temperature" | "speed") => {
    const value = parseDecimal(text);
    if (!Number.isFinite(value)) return text;
    return roundForInput(toDisplay(quantity, fromDisplay(quantity, value, from), to));
  };
  return {
    airTemp: convert(draft.airTemp, "temperature"),
    humidity: draft.humidity,
    wind: convert(draft.wind, "speed"),
    concreteTemp: convert(draft.concreteTemp, "temperature"),
  };
}

// lib/concrete names the failing input; map its field names onto the form's.
const LIB_FIELDS: Record<string, FieldName> = {
  airTempC: "airTemp",
  airTempF: "airTemp",
  relativeHumidityPct: "humidity",
  windKmh: "wind",
  windMph: "wind",
  concreteTempC: "concreteTemp",
  concreteTempF: "concreteTemp",
};

function describe(readings: Readings, unitSystem: UnitSystem, lowBleed: boolean): EvaporationDescription {
  const { airTemp, humidity, wind, concreteTemp } = readings;
  return unitSystem === "SI"
    ? describeEvaporation({
        unitSystem,
        airTempC: airTemp,
        relativeHumidityPct: humidity,
        windKmh: wind,
        concreteTempC: concreteTemp,
        lowBleed,
      })
    : describeEvaporation({
        unitSystem,
        airTempF: airTemp,
        relativeHumidityPct: humidity,
        windMph: wind,
        concreteTempF: concreteTemp,
        lowBleed,
      });
}

export type Evaluation =
  | { ok: true; readings: Readings; description: EvaporationDescription }
  | { ok: false; errors: Partial<Record<FieldName, string>> };

// The library stops at the first bad input; to mark every bad field at once, each failing field
// is noted and replaced by the example value before asking again.
export function evaluate(draft: Draft, unitSystem: UnitSystem, lowBleed: boolean): Evaluation {
  const errors: Partial<Record<FieldName, string>> = {};
  const readings = {} as Readings;
  for (const field of FIELD_NAMES) {
    readings[field] = parseDecimal(draft[field]);
    if (draft[field].trim() === "") errors[field] = `Enter the ${FIELD_LABELS[field].toLowerCase()}`;
    else if (!Number.isFinite(readings[field])) errors[field] = `${FIELD_LABELS[field]} must be a number`;
    if (errors[field]) readings[field] = parseDecimal(DEFAULT_DRAFTS[unitSystem][field]);
  }
  for (let attempt = 0; attempt <= FIELD_NAMES.length; attempt++) {
    try {
      const description = describe(readings, unitSystem, lowBleed);
      return Object.keys(errors).length > 0 ? { ok: false, errors } : { ok: true, readings, description };
    } catch (error) {
      if (!(error instanceof ConcreteInputError)) throw error;
      const field = LIB_FIELDS[error.field];
      if (!field || errors[field]) throw error;
      errors[field] = error.message;
      readings[field] = parseDecimal(DEFAULT_DRAFTS[unitSystem][field]);
    }
  }
  return { ok: false, errors };
}

// The levels the calculator draws and names come from the rulebook (ACI 305R, halved for a low-bleed
// mix; the caution band is this product's own choice), with no project specification of its own.
export function riskThresholds(unitSystem: UnitSystem, lowBleed: boolean): { cautionAt: number; highAt: number; source: Source } {
  const limit = evaporationLimit({ unitSystem, evaporationHighKgM2H: null }, { lowBleed });
  return { cautionAt: limit.cautionAt, highAt: limit.highAt, source: limit.source };
}

/** Rates are read to two decimals; the estimate is ±40 % anyway. */
export const formatRate = (rate: number): string => rate.toFixed(2);

export interface WeatherCautions {
  /** ACI 305.1 hot weather (hot air or concrete with high evaporation), with the crew's heat-stress caution. */
  hot: Finding | null;
  /** ACI 306R cold weather (current definition), with the heater and freezing cautions. */
  cold: Finding | null;
  /** Concrete above the maximum temperature at discharge (ACI 305.1 / ACI 301 default). */
  tooHotConcrete: Finding | null;
}

const CALCULATOR = "calculator";

/**
 * The rulebook's hot, cold and too-hot notices for the conditions typed, as for one reading on a
 * project with the published defaults (no project specification): the same code the field screens run.
 */
export function weatherCautions(readings: Readings, unitSystem: UnitSystem, lowBleed = false, at = new Date()): WeatherCautions {
  const concreteTempC = fromDisplay("temperature", readings.concreteTemp, unitSystem);
  const observedAt = at.toISOString();
  const findings = evaluateRules(
    toCheckInput({
      project: { unitSystem, timeZone: "UTC" },
      mixes: [{ id: CALCULATOR, code: "", fcMPa: 0, lowBleed }],
      placements: [{ id: CALCULATOR, element: "", plannedStart: observedAt, mixId: CALCULATOR, leastDimensionMm: null }],
      weather: [
        {
          id: CALCULATOR,
          placementId: CALCULATOR,
          observedAt,
          airTempC: fromDisplay("temperature", readings.airTemp, unitSystem),
          relativeHumidityPct: readings.humidity,
          windKmh: fromDisplay("speed", readings.wind, unitSystem),
          concreteTempC,
        },
      ],
      fieldTests: [{ id: CALCULATOR, placementId: CALCULATOR, deliveryId: null, sampledAt: observedAt, slumpMm: null, airPct: null, concreteTempC }],
    }),
  );
  const of = (rule: Finding["rule"]) => findings.find((f) => f.rule === rule) ?? null;
  return { hot: of("hot-weather"), cold: of("cold-weather"), tooHotConcrete: of("concrete-temperature") };
}

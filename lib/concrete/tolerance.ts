// Acceptance ranges for fresh-concrete tests on delivery (ASTM C94 §7 tolerances).
import { ConcreteInputError, assertFinite, assertNonNegative, atLeast, atMost } from "./errors";
import { inToMm, mmToIn, type UnitSystem } from "./units";

export interface NumericRange {
  min: number;
  max: number;
}

export type SlumpType = "target" | "maximum";

// C94 publishes its own round numbers per edition: 15 mm in C94M where C94 says ½ in (12.7 mm).
// Bands are [upper bound of the specified slump, minus, plus]; the last band is open-ended.
const SLUMP_BANDS: Record<UnitSystem, Record<SlumpType, [number, number, number][]>> = {
  SI: {
    target: [[50, 15, 15], [100, 25, 25], [Infinity, 40, 40]],
    maximum: [[75, 40, 0], [Infinity, 65, 0]],
  },
  IP: {
    target: [[2, 0.5, 0.5], [4, 1, 1], [Infinity, 1.5, 1.5]],
    maximum: [[3, 1.5, 0], [Infinity, 2.5, 0]],
  },
};

// Rounded so that 101.6 mm reads as exactly 4 in at a band boundary.
const toInches = (mm: number) => Math.round(mmToIn(mm) * 1e6) / 1e6;

// ASTM C94 §7 [memory]: slump tolerance for a "target" or "maximum / not to exceed" specification, mm.
export function slumpRangeMm(
  specifiedMm: number,
  slumpType: SlumpType,
  unitSystem: UnitSystem = "SI",
): NumericRange {
  assertNonNegative(specifiedMm, "specifiedSlumpMm", "Specified slump");
  const specified = unitSystem === "SI" ? specifiedMm : toInches(specifiedMm);
  const bands = SLUMP_BANDS[unitSystem][slumpType];
  if (!bands) throw new ConcreteInputError("slumpType", "Slump must be specified as a target or a maximum");
  // Stryker disable next-line ArithmeticOperator: unreachable, the last band is open-ended (Infinity)
  const [, minus, plus] = bands.find(([upTo]) => specified <= upTo) ?? bands[bands.length - 1];
  const toMm = (value: number) => (unitSystem === "SI" ? value : inToMm(value));
  return { min: toMm(Math.max(0, specified - minus)), max: toMm(specified + plus) };
}

// ASTM C94 [memory]: air content within ±1.5 percentage points of the specified value.
export function airRangePct(specifiedPct: number): NumericRange {
  assertNonNegative(specifiedPct, "specifiedAirPct", "Specified air content");
  return { min: Math.max(0, specifiedPct - 1.5), max: specifiedPct + 1.5 };
}

// ASTM C94 slump-flow tolerance [memory]: ±50 mm (2 in) below 560 mm (22 in), ±75 mm (3 in) from there up.
export function slumpFlowRangeMm(specifiedMm: number, unitSystem: UnitSystem = "SI"): NumericRange {
  assertNonNegative(specifiedMm, "specifiedSlumpFlowMm", "Specified slump flow");
  if (unitSystem === "IP") {
    const specifiedIn = toInches(specifiedMm);
    const tolIn = specifiedIn < 22 ? 2 : 3;
    return { min: inToMm(Math.max(0, specifiedIn - tolIn)), max: inToMm(specifiedIn + tolIn) };
  }
  const tolMm = specifiedMm < 560 ? 50 : 75;
  return { min: Math.max(0, specifiedMm - tolMm), max: specifiedMm + tolMm };
}

// Inclusive range test used by every tolerance check; a missing bound does not restrict.
export function withinRange(value: number, range: Partial<NumericRange>): boolean {
  assertFinite(value, "value", "Test result");
  // Edge tolerance so an IP limit converted to mm (e.g. 3½ in) still accepts the typed 3½ in.
  if (range.min !== undefined && !atLeast(value, range.min)) return false;
  if (range.max !== undefined && !atMost(value, range.max)) return false;
  return true;
}

export interface PropertyCheck<R = NumericRange> {
  value: number;
  range: R;
  ok: boolean;
}

export interface FieldTestCheck {
  slump?: PropertyCheck;
  air?: PropertyCheck;
  temperature?: PropertyCheck<Partial<NumericRange>>;
  /** True when every property that was measured is within its range. */
  ok: boolean;
  /** Present when the slump or the air content is out of range (ASTM C94's check test). */
  retestNote?: string;
}

// ASTM C94, slump and air content tolerance clause: the check test is made on another portion of the
// same sample; after a second failure the concrete has failed the specification, and what happens to
// the load is the purchaser's decision. It covers slump and air, not temperature.
export const CHECK_TEST_NOTE =
  "Slump or air content out of range: make a check test at once on another portion of the same sample. " +
  "If the check test also fails, the concrete has failed the specification; what happens to the load is the purchaser's decision (ASTM C94).";

// ASTM C94 §7 tolerances plus the discharge temperature limit (ACI 305.1 §3.3.1) for one load's tests.
export function checkFieldTest({
  slumpMm,
  slumpType,
  specifiedSlumpMm,
  airPct,
  specifiedAirPct,
  concreteTempC,
  maxConcreteTempC = 35,
  minConcreteTempC,
  unitSystem = "SI",
}: {
  slumpMm?: number;
  slumpType: SlumpType;
  specifiedSlumpMm: number;
  airPct?: number;
  specifiedAirPct: number;
  concreteTempC?: number;
  maxConcreteTempC?: number;
  minConcreteTempC?: number;
  unitSystem?: UnitSystem;
}): FieldTestCheck {
  // Stryker disable next-line ObjectLiteral,BooleanLiteral: equivalent, ok is recomputed below before returning
  const result: FieldTestCheck = { ok: true };
  if (slumpMm !== undefined) {
    assertNonNegative(slumpMm, "slumpMm", "Slump");
    const range = slumpRangeMm(specifiedSlumpMm, slumpType, unitSystem);
    result.slump = { value: slumpMm, range, ok: withinRange(slumpMm, range) };
  }
  if (airPct !== undefined) {
    assertNonNegative(airPct, "airPct", "Air content");
    const range = airRangePct(specifiedAirPct);
    result.air = { value: airPct, range, ok: withinRange(airPct, range) };
  }
  if (concreteTempC !== undefined) {
    assertFinite(concreteTempC, "concreteTempC", "Concrete temperature");
    const range: Partial<NumericRange> = { max: maxConcreteTempC };
    if (minConcreteTempC !== undefined) range.min = minConcreteTempC;
    result.temperature = { value: concreteTempC, range, ok: withinRange(concreteTempC, range) };
  }
  result.ok = [result.slump, result.air, result.temperature].every((check) => check?.ok ?? true);
  if (result.slump?.ok === false || result.air?.ok === false) result.retestNote = CHECK_TEST_NOTE;
  return result;
}

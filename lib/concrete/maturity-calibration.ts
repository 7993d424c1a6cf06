// The strength–maturity relationship of one mix from the lab's breaks (ASTM C1074 calibration), and
// estimates read from it that never leave the calibrated range.
import { ConcreteInputError, assertFinite, assertNonNegative, assertPositive } from "./errors";
import {
  DEFAULT_MATURITY_SETTINGS,
  fitLogStrengthMaturity,
  maturityRatePerHour,
  type MaturitySettings,
  type StrengthMaturityFit,
} from "./maturity";

// ASTM C1074 [memory]: cylinders broken at (at least) 1, 3, 7, 14 and 28 days; four ages is our floor.
export const MIN_CALIBRATION_AGES = 4;

// ASTM C511 / C31 [memory]: standard moist curing at 23.0 ± 2.0 °C (73.5 ± 3.5 °F).
export const STANDARD_CURE_C = 23;

export type CalibrationBreak = {
  ageDays: number;
  strengthMPa: number;
  /** The maturity its set's logger recorded from the cast to this break; absent: standard curing. */
  maturity?: number;
  /** The logger's name when `maturity` came from it. */
  logger?: string | null;
  /** Why a set with a logger was taken at standard curing for this break (shown beside the point). */
  note?: string | null;
};
/** `logger`: the sensor the point's maturity came from (null: standard curing); `notes`: why not, when it was meant to. */
export type CalibrationPoint = { ageDays: number; maturity: number; strengthMPa: number; breaks: number; logger: string | null; notes: string[] };

export type Calibration =
  | { ok: true; fit: StrengthMaturityFit; points: CalibrationPoint[]; settings: MaturitySettings; maxStrengthMPa: number }
  | { ok: false; reason: string; points: CalibrationPoint[] };

// Standard-cured cylinders sit at one temperature, so the maturity of an age is the rate × the age.
export function standardCureMaturity(
  ageDays: number,
  settings: MaturitySettings = DEFAULT_MATURITY_SETTINGS,
  cureC: number = STANDARD_CURE_C,
): number {
  assertPositive(ageDays, "ageDays", "Test age");
  assertFinite(cureC, "cureC", "Curing temperature");
  return maturityRatePerHour(cureC, settings) * ageDays * 24;
}

/**
 * ASTM C1074 calibration: the mean strength at each test age against the maturity of that age,
 * fitted as S = a + b·log10(M). Fewer than four ages gives no calibration, with the reason.
 * `maturityAtAge` replaces the standard-cure maturity of an age; a break that carries its own
 * `maturity` (its set's logger) is a point of its own per age and logger, averaged over its breaks.
 */
export function calibrateFromBreaks(
  breaks: CalibrationBreak[],
  settings: MaturitySettings = DEFAULT_MATURITY_SETTINGS,
  maturityAtAge: (ageDays: number) => number = (ageDays) => standardCureMaturity(ageDays, settings),
): Calibration {
  breaks.forEach((b, i) => {
    assertPositive(b.ageDays, `breaks[${i}].ageDays`, "Test age");
    assertNonNegative(b.strengthMPa, `breaks[${i}].strengthMPa`, "Strength");
  });
  const groups = new Map<string, CalibrationBreak[]>();
  for (const b of breaks) {
    const key = `${b.ageDays}|${typeof b.maturity === "number" ? (b.logger ?? "") : ""}|${typeof b.maturity === "number" ? "logger" : "standard"}`;
    groups.set(key, [...(groups.get(key) ?? []), b]);
  }
  const mean = (xs: number[]) => xs.reduce((sum, x) => sum + x, 0) / xs.length;
  const points: CalibrationPoint[] = [...groups.values()]
    .map((group) => {
      const fromLogger = typeof group[0].maturity === "number";
      return {
        ageDays: group[0].ageDays,
        maturity: fromLogger ? mean(group.map((b) => b.maturity!)) : maturityAtAge(group[0].ageDays),
        strengthMPa: mean(group.map((b) => b.strengthMPa)),
        breaks: group.length,
        logger: fromLogger ? (group[0].logger ?? null) : null,
        notes: [...new Set(group.map((b) => b.note).filter((n): n is string => typeof n === "string" && n !== ""))],
      };
    })
    .sort((p, q) => p.ageDays - q.ageDays || p.maturity - q.maturity);
  const ages = new Set(points.map((p) => p.ageDays)).size;
  if (ages < MIN_CALIBRATION_AGES) {
    const have = ages === 1 ? "1 age" : `${ages} ages`;
    return {
      ok: false,
      reason: `The mix has breaks at ${have}; a maturity calibration needs at least ${MIN_CALIBRATION_AGES}.`,
      points,
    };
  }
  const fit = fitLogStrengthMaturity(points.map((p) => ({ maturity: p.maturity, strength: p.strengthMPa })));
  if (fit.b <= 0) {
    return { ok: false, reason: "Strength does not rise with maturity in these breaks, so they cannot calibrate the mix.", points };
  }
  return { ok: true, fit, points, settings, maxStrengthMPa: Math.max(...points.map((p) => p.strengthMPa)) };
}

export type StrengthEstimate =
  | { status: "estimate"; strengthMPa: number }
  /** Below the lowest calibrated maturity: only that the strength is under the lowest calibrated point. */
  | { status: "below-range"; belowMPa: number }
  /** Beyond the highest calibrated maturity: never extrapolated; at least the curve's top value. */
  | { status: "above-range"; atLeastMPa: number };

const curve = (fit: Pick<StrengthMaturityFit, "a" | "b">, maturity: number) => fit.a + fit.b * Math.log10(maturity);

// ASTM C1074: the relationship holds only within the calibrated maturities; no extrapolation either way.
export function estimateWithinCalibration(fit: StrengthMaturityFit, maturity: number): StrengthEstimate {
  assertNonNegative(maturity, "maturity", "Maturity");
  if (maturity < fit.minMaturity) return { status: "below-range", belowMPa: Math.max(0, curve(fit, fit.minMaturity)) };
  if (maturity > fit.maxMaturity) return { status: "above-range", atLeastMPa: curve(fit, fit.maxMaturity) };
  return { status: "estimate", strengthMPa: Math.max(0, curve(fit, maturity)) };
}

export type TargetMaturity = { ok: true; maturity: number } | { ok: false; reason: string };

// Inverse of S = a + b·log10(M); refused beyond the highest calibrated point, raised to the lowest one below it.
export function maturityForStrength(fit: StrengthMaturityFit, targetMPa: number): TargetMaturity {
  assertPositive(targetMPa, "targetMPa", "Target strength");
  if (fit.b <= 0) throw new ConcreteInputError("fit", "The calibration curve must rise with maturity");
  const maturity = 10 ** ((targetMPa - fit.a) / fit.b);
  if (maturity > fit.maxMaturity * (1 + 1e-9)) {
    return {
      ok: false,
      reason: "The target is above the strongest calibrated age; the estimate is not extended beyond the calibration.",
    };
  }
  // Below the weakest calibrated age the curve is not trusted either: wait for that age's maturity (conservative).
  return { ok: true, maturity: Math.max(maturity, fit.minMaturity) };
}

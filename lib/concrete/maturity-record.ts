// Reading a sensor's temperature record: when a maturity was (or will be) reached, and where the
// record has holes. Pure; the series comes from maturitySeries (lib/concrete/maturity.ts).
import { assertFinite, assertNonNegative, assertPositive } from "./errors";
import { DEFAULT_MATURITY_SETTINGS, maturityRatePerHour, type MaturitySettings } from "./maturity";

const MS_PER_HOUR = 3_600_000;
const MS_PER_MINUTE = 60_000;

export type SeriesPoint = { at: Date; tempC: number; maturity: number };

export type TargetTime =
  /** Reached inside the record: the instant, interpolated linearly between the two readings around it. */
  | { status: "reached"; at: Date }
  /** Not reached yet: predicted if the last reading's temperature holds from the last reading on. */
  | { status: "predicted"; at: Date; assumedTempC: number }
  /** Not reached, and the last temperature adds no maturity (at or below the datum). */
  | { status: "not-gaining"; assumedTempC: number };

/** When a sensor's maturity reaches `targetMaturity`: from the record if it is there, else a prediction. */
export function timeToMaturity(
  series: SeriesPoint[],
  targetMaturity: number,
  settings: MaturitySettings = DEFAULT_MATURITY_SETTINGS,
): TargetTime {
  assertNonNegative(targetMaturity, "targetMaturity", "Target maturity");
  if (series.length === 0) throw new RangeError("A maturity series needs at least one point");
  // Maturity never falls, so the first point at or above the target brackets the crossing.
  let lo = 0;
  let hi = series.length - 1;
  if (series[hi].maturity >= targetMaturity) {
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (series[mid].maturity >= targetMaturity) hi = mid;
      else lo = mid + 1;
    }
    if (hi === 0) return { status: "reached", at: series[0].at };
    const before = series[hi - 1];
    const after = series[hi];
    // before < target <= after here (hi is the first point at or above it), so the span is never zero.
    const fraction = (targetMaturity - before.maturity) / (after.maturity - before.maturity);
    const ms = before.at.getTime() + fraction * (after.at.getTime() - before.at.getTime());
    return { status: "reached", at: new Date(ms) };
  }
  const last = series[series.length - 1];
  const rate = maturityRatePerHour(last.tempC, settings);
  if (rate <= 0) return { status: "not-gaining", assumedTempC: last.tempC };
  const hours = (targetMaturity - last.maturity) / rate;
  return { status: "predicted", at: new Date(last.at.getTime() + hours * MS_PER_HOUR), assumedTempC: last.tempC };
}

// A logger's clock drifts by seconds; a gap is a missed reading, so allow half an interval of slack.
// [product choice] not a published limit.
export const GAP_SLACK_FRACTION = 0.5;

export type ReadingGap = { from: Date; to: Date; minutes: number; kind: "gap" | "stopped" };

/** The usual spacing of a record: the median interval between readings, in minutes (null under 2 readings). */
export function loggingIntervalMinutes(times: Date[]): number | null {
  // Under two readings there is no step, so the empty case below answers null.
  const steps = times
    .slice(1)
    .map((t, i) => (t.getTime() - times[i].getTime()) / MS_PER_MINUTE)
    .filter((m) => m > 0)
    .sort((a, b) => a - b);
  if (steps.length === 0) return null;
  const mid = steps.length >> 1;
  return steps.length % 2 ? steps[mid] : (steps[mid - 1] + steps[mid]) / 2;
}

/**
 * Holes in a record longer than the logging interval (C1074 asks for a continuous record), and a
 * sensor that stopped: no reading since longer than the interval before `now`, while still monitored.
 */
export function findReadingGaps(times: Date[], intervalMinutes: number, now?: Date): ReadingGap[] {
  assertPositive(intervalMinutes, "intervalMinutes", "Logging interval");
  const limitMs = intervalMinutes * (1 + GAP_SLACK_FRACTION) * MS_PER_MINUTE;
  const gaps: ReadingGap[] = [];
  for (let i = 1; i < times.length; i += 1) {
    const ms = times[i].getTime() - times[i - 1].getTime();
    if (ms > limitMs) gaps.push({ from: times[i - 1], to: times[i], minutes: ms / MS_PER_MINUTE, kind: "gap" });
  }
  if (now && times.length > 0) {
    assertFinite(now.getTime(), "now", "Current time");
    const last = times[times.length - 1];
    const ms = now.getTime() - last.getTime();
    if (ms > limitMs) gaps.push({ from: last, to: now, minutes: ms / MS_PER_MINUTE, kind: "stopped" });
  }
  return gaps;
}

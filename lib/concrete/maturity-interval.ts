// The maturity a logger recorded between two instants: a specimen set's record from its cast to a
// break (ASTM C1074: the maturity of each calibration cylinder from its own temperature history).
import { assertDate } from "./errors";
import { DEFAULT_MATURITY_SETTINGS, maturitySeries, type MaturitySettings, type TemperatureReading } from "./maturity";

const MS_PER_HOUR = 3_600_000;

export type IntervalMaturity =
  | { status: "ok"; maturity: number }
  /** No reading at or before `from`: the record cannot say what happened from the cast on. */
  | { status: "starts-after"; startsAt: Date | null; hoursAfter: number | null }
  /** The last reading is before `to`: the record stops before the break. */
  | { status: "ends-before"; endsAt: Date; hoursBefore: number };

// Linear between the two readings around `at` (the same straight line the interval means assume).
function temperatureAt(before: TemperatureReading, after: TemperatureReading, at: number): number {
  const span = after.at.getTime() - before.at.getTime();
  if (span === 0) return after.tempC;
  return before.tempC + ((after.tempC - before.tempC) * (at - before.at.getTime())) / span;
}

/**
 * Maturity from `from` to `to` out of readings in time order, cut at both ends by linear
 * interpolation. A record that does not cover the whole interval gives no figure, only why: the
 * caller says so and uses another basis, never part logger and part assumption silently.
 */
export function maturityBetween(
  readings: TemperatureReading[],
  from: Date,
  to: Date,
  settings: MaturitySettings = DEFAULT_MATURITY_SETTINGS,
): IntervalMaturity {
  assertDate(from, "from", "Cast time");
  assertDate(to, "to", "Break time");
  const start = from.getTime();
  const end = to.getTime();
  if (readings.length === 0 || readings[0].at.getTime() > start) {
    const first = readings[0]?.at ?? null;
    return { status: "starts-after", startsAt: first, hoursAfter: first ? (first.getTime() - start) / MS_PER_HOUR : null };
  }
  const last = readings[readings.length - 1];
  if (last.at.getTime() < end) return { status: "ends-before", endsAt: last.at, hoursBefore: (end - last.at.getTime()) / MS_PER_HOUR };
  if (end <= start) return { status: "ok", maturity: 0 };
  const cut: TemperatureReading[] = [];
  for (let i = 0; i < readings.length; i += 1) {
    const r = readings[i];
    const t = r.at.getTime();
    const previous = readings[i - 1];
    if (t >= start && cut.length === 0) cut.push({ at: from, tempC: t === start || !previous ? r.tempC : temperatureAt(previous, r, start) });
    if (t > start && t < end) cut.push(r);
    if (t >= end) {
      cut.push({ at: to, tempC: t === end ? r.tempC : temperatureAt(previous, r, end) });
      break;
    }
  }
  return { status: "ok", maturity: maturitySeries(cut, settings).at(-1)!.maturity };
}

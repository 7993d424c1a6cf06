import { describe, it, expect } from "vitest";

import {
  DEFAULT_MATURITY_SETTINGS,
  equivalentAgeHours,
  maturitySeries,
  temperatureTimeFactor,
  type TemperatureReading,
} from "../../../lib/concrete/maturity";
import { findReadingGaps, loggingIntervalMinutes, timeToMaturity } from "../../../lib/concrete/maturity-record";

const start = Date.UTC(2026, 10, 2, 7, 0, 0);
const HOUR = 3_600_000;
const reading = (hours: number, tempC: number): TemperatureReading => ({ at: new Date(start + hours * HOUR), tempC });

// A second, independent implementation of ASTM C1074's two equations (rectangles of the mean
// temperature over each interval), written from the standard's formulas for these tests only.
function reference(readings: TemperatureReading[], datumC: number, qKelvin: number) {
  let m = 0;
  let te = 0;
  for (let i = 1; i < readings.length; i += 1) {
    const dtH = (readings[i].at.getTime() - readings[i - 1].at.getTime()) / HOUR;
    const ta = (readings[i].tempC + readings[i - 1].tempC) / 2;
    if (ta > datumC) m += (ta - datumC) * dtH;
    te += Math.exp(-qKelvin * (1 / (ta + 273.15) - 1 / 293.15)) * dtH;
  }
  return { m, te };
}

describe("a four-day record against a second implementation [computed, second implementation]", () => {
  // 15-minute readings over four days: a daily swing of ±6 °C about 12 °C with a hydration bump.
  const record = Array.from({ length: 4 * 96 + 1 }, (_, i) => {
    const h = i / 4;
    return reading(h, 12 + 6 * Math.sin((2 * Math.PI * h) / 24) + 8 * Math.exp(-(((h - 14) / 8) ** 2)));
  });
  const ref = reference(record, 0, 41_570 / 8.314);

  it("temperature-time factor matches", () => {
    expect(temperatureTimeFactor(record)).toBeCloseTo(ref.m, 6);
  });

  it("equivalent age matches", () => {
    expect(equivalentAgeHours(record)).toBeCloseTo(ref.te, 6);
  });

  it("the cumulative series ends at the total and never falls", () => {
    const series = maturitySeries(record);
    expect(series).toHaveLength(record.length);
    expect(series[0].maturity).toBe(0);
    expect(series.at(-1)!.maturity).toBeCloseTo(ref.m, 6);
    series.slice(1).forEach((p, i) => expect(p.maturity).toBeGreaterThanOrEqual(series[i].maturity));
  });
});

describe("timeToMaturity: interpolation inside the record, prediction after it", () => {
  // 20 °C for 10 h (200 °C·h), then 10 °C for 10 h (+100 → 300 °C·h).
  const series = maturitySeries([reading(0, 20), reading(10, 20), reading(10, 10), reading(20, 10)]);

  it("interpolates between readings: 250 °C·h at 15 h [computed by hand: 200 + 10·5]", () => {
    expect(timeToMaturity(series, 250)).toEqual({ status: "reached", at: new Date(start + 15 * HOUR) });
  });

  it("a target met exactly at a reading returns that reading's time; zero returns the first", () => {
    expect(timeToMaturity(series, 200)).toEqual({ status: "reached", at: new Date(start + 10 * HOUR) });
    expect(timeToMaturity(series, 0)).toEqual({ status: "reached", at: new Date(start) });
  });

  it("predicts with the last temperature holding: 400 °C·h at 20 h + 100/10 = 30 h [computed by hand]", () => {
    expect(timeToMaturity(series, 400)).toEqual({ status: "predicted", at: new Date(start + 30 * HOUR), assumedTempC: 10 });
  });

  it("predicts in equivalent age: 24 h at 30 °C per 42.13 h, so 42.13 h more takes 24 h [DOMAIN §6, computed]", () => {
    const settings = { ...DEFAULT_MATURITY_SETTINGS, method: "equivalent-age" as const };
    const s = maturitySeries([reading(0, 30), reading(24, 30)], settings);
    const t = timeToMaturity(s, 2 * s.at(-1)!.maturity, settings);
    expect(t.status).toBe("predicted");
    expect(t.status === "predicted" && (t.at.getTime() - start) / HOUR).toBeCloseTo(48, 6);
    expect(s.at(-1)!.maturity).toBeCloseTo(42.13, 2);
  });

  it("a target equal to the last point's maturity is reached at that reading, not predicted", () => {
    expect(timeToMaturity(series, 300)).toEqual({ status: "reached", at: new Date(start + 20 * HOUR) });
  });

  it("on a plateau (an interval at the 0 °C datum adds nothing) the target is reached when first met [computed by hand]", () => {
    // 20 °C for 5 h → 100 °C·h; 0 °C from 5 h to 8 h → still 100; 20 °C again to 13 h → 200 °C·h.
    const plateau = maturitySeries([reading(0, 20), reading(5, 20), reading(5, 0), reading(8, 0), reading(8, 20), reading(13, 20)]);
    expect(timeToMaturity(plateau, 100)).toEqual({ status: "reached", at: new Date(start + 5 * HOUR) });
    expect(timeToMaturity(plateau, 150)).toEqual({ status: "reached", at: new Date(start + 10.5 * HOUR) });
  });

  it("refuses an empty series with its own message", () => {
    expect(() => timeToMaturity([], 100)).toThrow("A maturity series needs at least one point");
  });

  it("gives no time when the last temperature is at or below the datum", () => {
    const cold = maturitySeries([reading(0, 5), reading(5, -2)]);
    expect(timeToMaturity(cold, 500)).toEqual({ status: "not-gaining", assumedTempC: -2 });
  });
});

describe("reading gaps and stopped sensors", () => {
  const every15 = (n: number, offsetH = 0) => Array.from({ length: n }, (_, i) => new Date(start + offsetH * HOUR + i * 15 * 60_000));

  it("the logging interval is the median spacing", () => {
    expect(loggingIntervalMinutes(every15(10))).toBe(15);
    expect(loggingIntervalMinutes([new Date(start)])).toBeNull();
    expect(loggingIntervalMinutes([])).toBeNull();
  });

  it("two readings give their spacing; an even count of steps takes the mean of the middle two [median, computed by hand]", () => {
    const min = (m: number) => new Date(start + m * 60_000);
    expect(loggingIntervalMinutes([min(0), min(20)])).toBe(20);
    // Steps 10 and 20 → median 15.
    expect(loggingIntervalMinutes([min(0), min(10), min(30)])).toBe(15);
    // Steps 30, 10, 15 (not in order) → sorted 10, 15, 30 → median 15.
    expect(loggingIntervalMinutes([min(0), min(30), min(40), min(55)])).toBe(15);
    // Repeated timestamps (a step change) are not intervals: steps 0, 0, 15 → 15.
    expect(loggingIntervalMinutes([min(0), min(0), min(0), min(15)])).toBe(15);
    // Only repeated timestamps: no interval at all.
    expect(loggingIntervalMinutes([min(5), min(5)])).toBeNull();
  });

  it("a 2-hour hole in a 15-minute record is one gap of 120 minutes", () => {
    const times = [...every15(4), ...every15(4, 2.75)];
    const gaps = findReadingGaps(times, 15);
    expect(gaps).toHaveLength(1);
    expect(gaps[0]).toMatchObject({ kind: "gap", minutes: 120, from: times[3], to: times[4] });
  });

  it("a reading a few seconds late is not a gap; a missed reading is", () => {
    const late = [new Date(start), new Date(start + 15 * 60_000 + 20_000)];
    expect(findReadingGaps(late, 15)).toEqual([]);
    expect(findReadingGaps([new Date(start), new Date(start + 30 * 60_000)], 15)).toHaveLength(1);
  });

  it("a sensor silent for longer than the interval before now has stopped", () => {
    const times = every15(4);
    const now = new Date(start + 3 * HOUR);
    expect(findReadingGaps(times, 15, now)).toEqual([{ kind: "stopped", from: times[3], to: now, minutes: 135 }]);
    expect(findReadingGaps(times, 15, new Date(start + 50 * 60_000))).toEqual([]);
  });

  it("a hole of exactly 1.5 intervals (22.5 min at 15 min) is still within the slack; just over it is a gap [product choice: half an interval]", () => {
    const t0 = new Date(start);
    expect(findReadingGaps([t0, new Date(start + 22.5 * 60_000)], 15)).toEqual([]);
    expect(findReadingGaps([t0, new Date(start + 22.5 * 60_000 + 1)], 15)).toHaveLength(1);
    expect(findReadingGaps([t0], 15, new Date(start + 22.5 * 60_000))).toEqual([]);
    expect(findReadingGaps([t0], 15, new Date(start + 22.5 * 60_000 + 1))).toHaveLength(1);
  });

  it("no readings at all: nothing to measure a stop from", () => {
    expect(findReadingGaps([], 15, new Date(start))).toEqual([]);
  });

  it("refuses a non-positive interval", () => {
    expect(() => findReadingGaps(every15(3), 0)).toThrow("Logging interval must be greater than zero");
  });
});

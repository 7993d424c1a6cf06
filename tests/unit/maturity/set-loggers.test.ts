import { describe, expect, it } from "vitest";

import { DEFAULT_MATURITY_SETTINGS, calibrateFromBreaks, standardCureMaturity } from "@/lib/concrete";
import { calibrationBreaks } from "@/lib/maturity/set-maturity";

const H = 3_600_000;
const cast = Date.UTC(2026, 10, 2, 14, 0, 0);
const iso = (hours: number) => new Date(cast + hours * H).toISOString();
const settings = { ...DEFAULT_MATURITY_SETTINGS, datumC: -10 };
// A logger in a field-cured cylinder: 8 °C for the first day, then 14 °C, read hourly for 8 days.
const readings: [string, number][] = Array.from({ length: 8 * 24 + 1 }, (_, h) => [iso(h), h <= 24 ? 8 : 14]);
const loggers = { sensors: [{ id: "s-t3", name: "T3" }], batches: [{ sensorId: "s-t3", readings }] };

describe("calibrationBreaks: a set's logger gives its breaks' maturity (ASTM C1074)", () => {
  it("a 7-day break takes the logger's maturity from the cast to the break [computed by hand, Nurse-Saul, T0 = −10 °C]", () => {
    // 24 h at 18 °C above the datum, 1 h at the mean of 8 and 14 (21 above), 143 h at 24 above:
    // 432 + 21 + 3432 = 3885 °C·h.
    const [b] = calibrationBreaks([{ ageDays: 7, strengthMPa: 24, castAt: iso(0), testedAt: iso(168), sensorId: "s-t3" }], loggers, settings);
    expect(b.maturity).toBeCloseTo(3885, 9);
    expect(b.logger).toBe("T3");
  });

  it("a record ending before the break falls back to standard curing and says so", () => {
    const short = { ...loggers, batches: [{ sensorId: "s-t3", readings: readings.slice(0, 121) }] };
    const [b] = calibrationBreaks([{ ageDays: 7, strengthMPa: 24, castAt: iso(0), testedAt: iso(168), sensorId: "s-t3" }], short, settings);
    expect(b.maturity).toBeUndefined();
    expect(b.note).toBe("Logger record of T3 ends at 120 h, before the break at 168 h; standard curing used for this point.");
    const cal = calibrateFromBreaks([b], settings);
    // Standard curing: 23 °C (ASTM C511 [memory]) − (−10) = 33 °C × 168 h = 5544 °C·h [computed by hand].
    expect(cal.points[0]).toMatchObject({ maturity: 5544, logger: null, notes: [b.note] });
  });

  it("a set without a logger, and one whose logger was deleted, are standard-cured", () => {
    const gone = { sensors: [{ id: "s-t3", name: "T3", deletedAt: iso(100) }], batches: loggers.batches };
    const [plain, deleted] = calibrationBreaks(
      [
        { ageDays: 7, strengthMPa: 24, castAt: iso(0), testedAt: iso(168), sensorId: null },
        { ageDays: 7, strengthMPa: 24, castAt: iso(0), testedAt: iso(168), sensorId: "s-t3" },
      ],
      gone,
      settings,
    );
    expect(plain).toEqual({ ageDays: 7, strengthMPa: 24 });
    expect(deleted.maturity).toBeUndefined();
    expect(deleted.note).toMatch(/no longer on the project; standard curing used/);
  });

  it("a logger point sits beside the standard point of the same age; ages, not points, count toward the four", () => {
    const standard = [3, 7, 14].map((ageDays) => ({ ageDays, strengthMPa: 10 + ageDays }));
    const withLogger = calibrationBreaks(
      [...standard, { ageDays: 7, strengthMPa: 15, castAt: iso(0), testedAt: iso(168), sensorId: "s-t3" }],
      loggers,
      settings,
    );
    const cal = calibrateFromBreaks(withLogger, settings);
    expect(cal.ok).toBe(false); // three ages only
    expect(cal.points.map((p) => [p.ageDays, p.logger])).toEqual([[3, null], [7, "T3"], [7, null], [14, null]]);
    expect(cal.points[2].maturity).toBeCloseTo(standardCureMaturity(7, settings), 9);
    const four = calibrateFromBreaks([...withLogger, { ageDays: 28, strengthMPa: 40 }], settings);
    expect(four.ok).toBe(true);
  });
});

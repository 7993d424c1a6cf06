// One placement's maturity picture (ASTM C1074): the estimate is read at the sensor with the least
// maturity (the critical location), and the placement reaches a target when its last sensor does.
// Check values are computed by hand from the Nurse-Saul relation M = Σ (Ta − T0)·Δt with T0 = 0 °C
// [ASTM C1074 worked relation] and a synthetic calibration S = −45 + 20·log10(M) built from
// standard-cured breaks (23 °C × 24 h = 552 °C·h per day), so its range is 552 to 15 456 °C·h.
import { describe, it, expect } from "vitest";

import { assessPlacementMaturity, type SensorRecord } from "../../../lib/concrete/maturity-assessment";
import { calibrateFromBreaks } from "../../../lib/concrete/maturity-calibration";
import { DEFAULT_MATURITY_SETTINGS, type TemperatureReading } from "../../../lib/concrete/maturity";

const HOUR = 3_600_000;
const start = Date.UTC(2026, 10, 2, 13, 0, 0);
const at = (hours: number) => new Date(start + hours * HOUR);
/** Hourly readings at one temperature from hour 0 to `hours`. */
const steady = (hours: number, tempC: number): TemperatureReading[] => Array.from({ length: hours + 1 }, (_, h) => ({ at: at(h), tempC }));
const sensor = (id: string, readings: TemperatureReading[]): SensorRecord => ({ id, name: id.toUpperCase(), readings });

const calibration = calibrateFromBreaks([1, 3, 7, 14, 28].map((ageDays) => ({ ageDays, strengthMPa: -45 + 20 * Math.log10(552 * ageDays) })));
const settings = DEFAULT_MATURITY_SETTINGS;
const hoursFromStart = (d: Date) => (d.getTime() - start) / HOUR;

describe("the coldest sensor and its estimate", () => {
  // 48 h at 15 °C → 720 °C·h; 48 h at 20 °C → 960 °C·h [computed by hand]. The cold one is listed first.
  const sensors = [sensor("cold", steady(48, 15)), sensor("warm", steady(48, 20))];

  it("reads the estimate at the least mature sensor even when it is listed first: S(720) = −45 + 20·log10 720 = 12.147 MPa", () => {
    const a = assessPlacementMaturity({ sensors, settings, calibration, targetMPa: null });
    expect(a.coldest?.id).toBe("cold");
    expect(a.sensors.map((s) => s.maturity)).toEqual([720, 960]);
    expect(a.estimate?.status).toBe("estimate");
    expect(a.estimate?.status === "estimate" && a.estimate.strengthMPa).toBeCloseTo(-45 + 20 * Math.log10(720), 9);
    expect(a.reason).toBeNull();
    // No target asked for: no target on the sensors or the placement.
    expect(a.sensors.map((s) => s.target)).toEqual([null, null]);
    expect(a.target).toEqual({ status: "no-target" });
  });

  it("of two sensors with the same maturity, the first listed is the coldest (and the placement's time)", () => {
    const twins = [sensor("a", steady(24, 12)), sensor("b", steady(24, 12))];
    const a = assessPlacementMaturity({ sensors: twins, settings, calibration, targetMPa: 20 });
    expect(a.coldest?.id).toBe("a");
    expect(a.target).toMatchObject({ status: "predicted", sensorId: "a" });
  });

  it("readings arrive in any order: sorted by time before the series is built", () => {
    const shuffled = [...steady(4, 10)].reverse();
    const a = assessPlacementMaturity({ sensors: [sensor("s", shuffled)], settings, calibration: null, targetMPa: null });
    expect(a.sensors[0].series.map((p) => hoursFromStart(p.at))).toEqual([0, 1, 2, 3, 4]);
    expect(a.sensors[0].maturity).toBe(40); // 4 h × 10 °C [computed by hand]
  });

  it("a sensor with one reading has no series, no maturity and is never the coldest; two readings are enough", () => {
    const a = assessPlacementMaturity({
      sensors: [sensor("one", steady(0, 30)), sensor("two", steady(1, 18))],
      settings,
      calibration,
      targetMPa: null,
    });
    expect(a.sensors[0]).toEqual({ id: "one", name: "ONE", series: [], maturity: null, estimate: null, target: null });
    expect(a.sensors[1].maturity).toBe(18); // 1 h × 18 °C [computed by hand]
    expect(a.coldest?.id).toBe("two");
    // 18 °C·h is under the lowest calibrated maturity (552 °C·h): below-range, never extrapolated.
    expect(a.estimate?.status).toBe("below-range");
  });
});

describe("why there is no estimate", () => {
  const sensors = [sensor("s", steady(24, 20))];

  it("no calibration: says the mix has none, and estimates nothing", () => {
    const a = assessPlacementMaturity({ sensors, settings, calibration: null, targetMPa: 20 });
    expect(a.reason).toBe("The placement's mix has no calibration, so there is no strength estimate.");
    expect(a.estimate).toBeNull();
    expect(a.sensors[0].estimate).toBeNull();
    expect(a.target).toEqual({ status: "no-target" });
  });

  it("a calibration that failed: its own reason, and no target even when one is asked for", () => {
    const failed = calibrateFromBreaks([{ ageDays: 7, strengthMPa: 20 }]);
    const a = assessPlacementMaturity({ sensors, settings, calibration: failed, targetMPa: 20 });
    expect(a.reason).toBe("The mix has breaks at 1 age; a maturity calibration needs at least 4.");
    expect(a.estimate).toBeNull();
    expect(a.target).toEqual({ status: "no-target" });
  });

  it("calibrated but every sensor has under two readings: asks for readings", () => {
    const a = assessPlacementMaturity({ sensors: [sensor("s", steady(0, 20))], settings, calibration, targetMPa: 20 });
    expect(a.reason).toBe("A sensor needs at least two readings before there is an estimate.");
    expect(a.coldest).toBeNull();
    expect(a.estimate).toBeNull();
    // The target maturity exists (1778 °C·h) but no sensor has a record to reach it with.
    expect(a.target).toEqual({ status: "no-target" });
  });
});

describe("when the placement reaches a target: at its last sensor", () => {
  // 20 MPa → M = 10^((20 + 45)/20) = 10^3.25 = 1778.28 °C·h [computed by hand].
  const targetM = 10 ** 3.25;

  it("the later of two predictions, whichever order the sensors come in: 48 + (1778.28 − 720)/15 = 118.55 h", () => {
    for (const order of [
      ["cold", "warm"],
      ["warm", "cold"],
    ]) {
      const temps: Record<string, number> = { cold: 15, warm: 20 };
      const a = assessPlacementMaturity({ sensors: order.map((id) => sensor(id, steady(48, temps[id]))), settings, calibration, targetMPa: 20 });
      expect(a.target.status).toBe("predicted");
      expect(a.target.status === "predicted" && a.target.sensorId).toBe("cold");
      expect(a.target.status === "predicted" && hoursFromStart(a.target.at)).toBeCloseTo(48 + (targetM - 720) / 15, 6);
      // Each sensor keeps its own time: the warm one at 48 + (1778.28 − 960)/20 = 88.91 h.
      const warm = a.sensors.find((s) => s.id === "warm")!;
      expect(warm.target?.status === "predicted" && hoursFromStart(warm.target.at)).toBeCloseTo(48 + (targetM - 960) / 20, 6);
    }
  });

  it("a sensor that is not gaining (last reading below the 0 °C datum) holds the placement back", () => {
    const freezing = sensor("frozen", [
      { at: at(0), tempC: 5 },
      { at: at(2), tempC: -3 },
    ]);
    const a = assessPlacementMaturity({ sensors: [sensor("warm", steady(48, 20)), freezing], settings, calibration, targetMPa: 20 });
    expect(a.target).toEqual({ status: "not-gaining", assumedTempC: -3, sensorId: "frozen" });
  });

  it("a target above the strongest calibrated age is refused with the reason", () => {
    const a = assessPlacementMaturity({ sensors: [sensor("s", steady(24, 20))], settings, calibration, targetMPa: 80 });
    expect(a.target).toEqual({
      status: "refused",
      reason: "The target is above the strongest calibrated age; the estimate is not extended beyond the calibration.",
    });
    expect(a.sensors[0].target).toBeNull();
  });
});

import { describe, it, expect } from "vitest";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import {
  equivalentAgeHours,
  estimateStrength,
  fitLogStrengthMaturity,
  maturityUnit,
  temperatureTimeFactor,
  type TemperatureReading,
} from "../../../lib/concrete/maturity";

const start = Date.UTC(2025, 0, 6, 8, 0, 0);
const reading = (hours: number, tempC: number): TemperatureReading => ({
  at: new Date(start + hours * 3_600_000),
  tempC,
});

describe("temperatureTimeFactor (ASTM C1074 Nurse-Saul)", () => {
  it("48 h at 20 °C → 960 °C·h with T0 = 0 °C [computed]", () => {
    expect(temperatureTimeFactor([reading(0, 20), reading(24, 20), reading(48, 20)])).toBeCloseTo(960, 9);
  });

  it("48 h at 20 °C → 1440 °C·h with T0 = −10 °C [computed]", () => {
    expect(temperatureTimeFactor([reading(0, 20), reading(48, 20)], -10)).toBeCloseTo(1440, 9);
  });

  it("12 h at 20 °C then 12 h at 25 °C → 540 °C·h [computed from M = Σ (Ta − T0)·Δt: 12 × 20 + 12 × 25]", () => {
    // The repeated timestamp records the step change without a ramp between readings.
    const readings = [reading(0, 20), reading(12, 20), reading(12, 25), reading(24, 25)];
    expect(temperatureTimeFactor(readings)).toBeCloseTo(540, 9);
  });

  it("uses the mean of each interval and adds nothing below the datum [computed]", () => {
    // 0 → 10 °C over 2 h: mean 5 °C → 10 °C·h; then −6 → −4 °C: below datum, adds 0.
    expect(temperatureTimeFactor([reading(0, 0), reading(2, 10)])).toBeCloseTo(10, 9);
    expect(temperatureTimeFactor([reading(0, -6), reading(5, -4)])).toBe(0);
  });

  it("refuses fewer than two readings and readings out of order", () => {
    expect(() => temperatureTimeFactor([reading(0, 20)])).toThrow(ConcreteInputError);
    try {
      temperatureTimeFactor([reading(0, 20), reading(5, 20), reading(4, 20)]);
      throw new Error("expected a throw");
    } catch (error) {
      expect(error).toBeInstanceOf(ConcreteInputError);
      expect((error as ConcreteInputError).field).toBe("readings[2].at");
      expect((error as ConcreteInputError).message).toBe("Temperature readings must be in time order");
    }
  });
});

describe("equivalentAgeHours (ASTM C1074 Arrhenius)", () => {
  it("24 h at 30 °C → 42.13 h at 20 °C [computed, Q = 5000 K]", () => {
    expect(equivalentAgeHours([reading(0, 30), reading(24, 30)])).toBeCloseTo(42.13, 2);
  });

  it("24 h at 10 °C → 13.14 h [computed, Q = 5000 K]", () => {
    expect(equivalentAgeHours([reading(0, 10), reading(24, 10)])).toBeCloseTo(13.14, 2);
  });

  it("equals the elapsed time at the reference temperature, and follows E [computed]", () => {
    expect(equivalentAgeHours([reading(0, 20), reading(36, 20)])).toBeCloseTo(36, 9);
    // E = 33 256 J/mol → Q = 4000 K: exp(4000 × 10 / (303.15 × 293.15)) × 24
    const expected = Math.exp((4000 * 10) / (303.15 * 293.15)) * 24;
    expect(equivalentAgeHours([reading(0, 30), reading(24, 30)], { activationEnergyJPerMol: 33_256 })).toBeCloseTo(expected, 9);
    expect(equivalentAgeHours([reading(0, 23), reading(24, 23)], { referenceC: 23 })).toBeCloseTo(24, 9);
  });
});

describe("fitLogStrengthMaturity and estimateStrength", () => {
  it("recovers a = −40, b = 25 from exact points [computed]", () => {
    const points = [100, 300, 1000, 3000, 10_000].map((maturity) => ({ maturity, strength: -40 + 25 * Math.log10(maturity) }));
    const fit = fitLogStrengthMaturity(points);
    expect(fit.a).toBeCloseTo(-40, 9);
    expect(fit.b).toBeCloseTo(25, 9);
    expect(fit.minMaturity).toBe(100);
    expect(fit.maxMaturity).toBe(10_000);
    expect(estimateStrength(fit, 1000)).toBeCloseTo(35, 9);
  });

  it("fits a least-squares line through scattered calibration data [computed by hand]", () => {
    // log10 M = 2, 3, 4; S = 10, 22, 28 → mean x 3, mean y 20, Sxy 18, Sxx 2 → b = 9, a = 20 − 27 = −7
    const fit = fitLogStrengthMaturity([
      { maturity: 100, strength: 10 },
      { maturity: 1000, strength: 22 },
      { maturity: 10_000, strength: 28 },
    ]);
    expect(fit.b).toBeCloseTo(9, 9);
    expect(fit.a).toBeCloseTo(-7, 9);
  });

  it("estimates zero rather than a negative strength at very low maturity", () => {
    expect(estimateStrength({ a: -40, b: 25 }, 10)).toBe(0);
  });

  it("refuses too few points, non-positive maturity and a single maturity", () => {
    expect(() => fitLogStrengthMaturity([{ maturity: 100, strength: 10 }])).toThrow(ConcreteInputError);
    try {
      fitLogStrengthMaturity([
        { maturity: 100, strength: 10 },
        { maturity: 0, strength: 0 },
      ]);
      throw new Error("expected a throw");
    } catch (error) {
      expect((error as ConcreteInputError).field).toBe("points[1].maturity");
    }
    expect(() =>
      fitLogStrengthMaturity([
        { maturity: 500, strength: 10 },
        { maturity: 500, strength: 12 },
      ]),
    ).toThrow("Calibration points need at least two different maturities");
    expect(() => estimateStrength({ a: 0, b: 1 }, 0)).toThrow(ConcreteInputError);
  });
});

describe("maturityUnit and the fit of equal strengths", () => {
  it("Nurse-Saul gives °C·h, equivalent age gives hours [ASTM C1074: temperature-time factor in °C·h, equivalent age in h or days]", () => {
    expect(maturityUnit("nurse-saul")).toBe("°C·h");
    expect(maturityUnit("equivalent-age")).toBe("h");
  });

  it("equal strengths lie on a flat line exactly: b = 0, R² = 1 (nothing left unexplained) [computed by hand]", () => {
    const fit = fitLogStrengthMaturity([
      { maturity: 100, strength: 20 },
      { maturity: 1000, strength: 20 },
    ]);
    expect(fit.b).toBe(0);
    expect(fit.a).toBe(20);
    expect(fit.rSquared).toBe(1);
  });
});

import { describe, it, expect } from "vitest";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import { DEFAULT_MATURITY_SETTINGS, maturitySeries, type MaturitySettings } from "../../../lib/concrete/maturity";
import {
  calibrateFromBreaks,
  estimateWithinCalibration,
  maturityForStrength,
  standardCureMaturity,
} from "../../../lib/concrete/maturity-calibration";

const equivalentAge: MaturitySettings = { ...DEFAULT_MATURITY_SETTINGS, method: "equivalent-age" };
const start = Date.UTC(2026, 10, 2, 7, 0, 0);

describe("standardCureMaturity (ASTM C511 standard curing at 23 °C [memory])", () => {
  it("7 days at 23 °C, T0 = 0 → 23 × 168 = 3864 °C·h [computed by hand]", () => {
    expect(standardCureMaturity(7)).toBeCloseTo(3864, 9);
  });

  it("7 days at 23 °C as equivalent age at 20 °C → 199.69 h [computed: exp(5000·(1/293.15 − 1/296.15)) × 168, Q = 5000 K]", () => {
    expect(standardCureMaturity(7, equivalentAge)).toBeCloseTo(199.69, 2);
  });

  it("agrees with the temperature record of a cylinder held at 23 °C [second path through maturitySeries]", () => {
    const record = [0, 24, 72].map((h) => ({ at: new Date(start + h * 3_600_000), tempC: 23 }));
    expect(standardCureMaturity(3)).toBeCloseTo(maturitySeries(record).at(-1)!.maturity, 9);
  });
});

describe("calibrateFromBreaks (ASTM C1074 strength–maturity relationship)", () => {
  // A known synthetic curve: S = −45 + 20·log10(M) on standard-cure Nurse-Saul maturity.
  const a = -45;
  const b = 20;
  const ages = [1, 3, 7, 14, 28];
  const exact = ages.flatMap((ageDays) => {
    const s = a + b * Math.log10(23 * 24 * ageDays);
    // Two cylinders per age, ±0.5 MPa about the curve: the mean lies on it.
    return [{ ageDays, strengthMPa: s - 0.5 }, { ageDays, strengthMPa: s + 0.5 }];
  });

  it("recovers a = −45, b = 20 and R² = 1 from breaks on the curve [synthetic, computed]", () => {
    const cal = calibrateFromBreaks(exact);
    expect(cal.ok).toBe(true);
    if (!cal.ok) return;
    expect(cal.fit.a).toBeCloseTo(a, 9);
    expect(cal.fit.b).toBeCloseTo(b, 9);
    expect(cal.fit.rSquared).toBeCloseTo(1, 12);
    expect(cal.points.map((p) => p.breaks)).toEqual([2, 2, 2, 2, 2]);
    expect(cal.fit.minMaturity).toBeCloseTo(552, 9); // 1 day at 23 °C [computed by hand]
    expect(cal.fit.maxMaturity).toBeCloseTo(15_456, 9); // 28 days at 23 °C [computed by hand]
  });

  it("reports R² below 1 for scattered breaks, equal to a hand calculation [computed by hand]", () => {
    // Choose maturities 100, 1000, 10000, 100000 through maturityAtAge: x = 2, 3, 4, 5; S = 10, 22, 28, 36.
    // mean x 3.5, mean y 24; Sxx = 5, Sxy = 21 + 1 + 2 + 18 = 42, Syy = 196 + 4 + 16 + 144 = 360
    // → b = 8.4, a = 24 − 8.4·3.5 = −5.4, R² = 42²/(5·360) = 0.98
    const cal = calibrateFromBreaks(
      [1, 2, 3, 4].map((ageDays, i) => ({ ageDays, strengthMPa: [10, 22, 28, 36][i] })),
      DEFAULT_MATURITY_SETTINGS,
      (ageDays) => 10 ** (ageDays + 1),
    );
    expect(cal.ok && cal.fit.b).toBeCloseTo(8.4, 9);
    expect(cal.ok && cal.fit.a).toBeCloseTo(-5.4, 9);
    expect(cal.ok && cal.fit.rSquared).toBeCloseTo(0.98, 9);
  });

  it("gives no calibration from three ages, and says why", () => {
    const cal = calibrateFromBreaks(exact.filter((x) => x.ageDays <= 7));
    expect(cal.ok).toBe(false);
    expect(!cal.ok && cal.reason).toBe("The mix has breaks at 3 ages; a maturity calibration needs at least 4.");
  });

  it("one age is '1 age'; ages entered out of order come back in order, with the highest mean strength [computed by hand]", () => {
    const one = calibrateFromBreaks([{ ageDays: 7, strengthMPa: 20 }]);
    expect(!one.ok && one.reason).toBe("The mix has breaks at 1 age; a maturity calibration needs at least 4.");
    const cal = calibrateFromBreaks([...exact].reverse());
    expect(cal.points.map((p) => p.ageDays)).toEqual([1, 3, 7, 14, 28]);
    // The 28-day mean lies on the curve: −45 + 20·log10(15 456) = 38.78 MPa.
    expect(cal.ok && cal.maxStrengthMPa).toBeCloseTo(a + b * Math.log10(15_456), 9);
  });

  it("equal strengths at every age (b = 0) do not calibrate: strength must rise with maturity", () => {
    const flat = calibrateFromBreaks(ages.map((ageDays) => ({ ageDays, strengthMPa: 25 })));
    expect(flat).toMatchObject({ ok: false, reason: "Strength does not rise with maturity in these breaks, so they cannot calibrate the mix." });
  });

  it("refuses breaks that do not gain strength, and a bad age by name", () => {
    const flat = calibrateFromBreaks(ages.map((ageDays) => ({ ageDays, strengthMPa: 30 - ageDays / 10 })));
    expect(flat.ok).toBe(false);
    try {
      calibrateFromBreaks([{ ageDays: 0, strengthMPa: 5 }]);
      throw new Error("expected a throw");
    } catch (error) {
      expect(error).toBeInstanceOf(ConcreteInputError);
      expect((error as ConcreteInputError).field).toBe("breaks[0].ageDays");
    }
  });
});

describe("estimates never leave the calibrated range (ASTM C1074)", () => {
  const fit = { a: -40, b: 25, minMaturity: 500, maxMaturity: 10_000, rSquared: 1 };

  it("estimates inside the range: M = 1000 → −40 + 25·3 = 35 MPa [computed by hand]", () => {
    expect(estimateWithinCalibration(fit, 1000)).toEqual({ status: "estimate", strengthMPa: 35 });
  });

  it("refuses to extrapolate above the highest calibrated maturity: at least S(10 000) = 60 MPa", () => {
    expect(estimateWithinCalibration(fit, 20_000)).toEqual({ status: "above-range", atLeastMPa: 60 });
  });

  it("below the lowest calibrated maturity says only 'below S(500)' = 27.47 MPa [computed: −40 + 25·log10 500]", () => {
    const e = estimateWithinCalibration(fit, 100);
    expect(e.status).toBe("below-range");
    expect(e.status === "below-range" && e.belowMPa).toBeCloseTo(27.474, 3);
  });

  it("exactly at the ends of the calibrated range is an estimate, not out of range [computed by hand]", () => {
    expect(estimateWithinCalibration(fit, 500)).toEqual({ status: "estimate", strengthMPa: -40 + 25 * Math.log10(500) });
    expect(estimateWithinCalibration(fit, 10_000)).toEqual({ status: "estimate", strengthMPa: 60 });
  });

  it("a flat curve (b = 0) has no inverse: refused as input", () => {
    expect(() => maturityForStrength({ ...fit, b: 0 }, 30)).toThrow("The calibration curve must rise with maturity");
  });

  it("inverts the curve for a target: 35 MPa → M = 1000 [computed by hand]", () => {
    const t = maturityForStrength(fit, 35);
    expect(t.ok && t.maturity).toBeCloseTo(1000, 6);
  });

  it("refuses a target above the strongest calibrated age (60 MPa at M = 10 000)", () => {
    expect(maturityForStrength(fit, 60.5)).toEqual({
      ok: false,
      reason: "The target is above the strongest calibrated age; the estimate is not extended beyond the calibration.",
    });
    expect(maturityForStrength(fit, 60).ok).toBe(true);
  });

  it("raises a target under the weakest calibrated age to that age's maturity (conservative)", () => {
    expect(maturityForStrength(fit, 10)).toEqual({ ok: true, maturity: 500 });
  });
});

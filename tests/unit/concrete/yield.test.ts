import { describe, it, expect } from "vitest";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import { ft3ToM3, kgM3ToLbFt3, lbFt3ToKgM3, lbToKg, m3ToFt3, m3ToYd3, yd3ToM3 } from "../../../lib/concrete/units";
import { concreteYield, density, gravimetricAirPct } from "../../../lib/concrete/yield";

describe("density (ASTM C138)", () => {
  it("18.6 lb empty, 54.1 lb full, 0.250 ft³ → 142.0 lb/ft³ [src: ACI Grade I study guide worked example]", () => {
    const densityKgM3 = density({ fullMassKg: lbToKg(54.1), emptyMassKg: lbToKg(18.6), volumeM3: ft3ToM3(0.25) });
    expect(kgM3ToLbFt3(densityKgM3)).toBeCloseTo(142.0, 3);
  });

  it("7.0 L measure, 3.2 kg empty, 19.9 kg full → 2385.7 kg/m³ [computed from the formula]", () => {
    expect(density({ fullMassKg: 19.9, emptyMassKg: 3.2, volumeM3: 0.007 })).toBeCloseTo(2385.71, 2);
  });

  it("refuses a full measure lighter than the empty one, by field", () => {
    try {
      density({ fullMassKg: 3, emptyMassKg: 3.2, volumeM3: 0.007 });
      throw new Error("expected a throw");
    } catch (error) {
      expect(error).toBeInstanceOf(ConcreteInputError);
      expect((error as ConcreteInputError).field).toBe("fullMassKg");
    }
    expect(() => density({ fullMassKg: 19.9, emptyMassKg: 3.2, volumeM3: 0 })).toThrow(/Volume of the measure/);
  });
});

describe("concreteYield (ASTM C138)", () => {
  it("3886 lb at 145.0 lb/ft³ → 26.80 ft³ = 0.993 yd³, Ry 0.993 [src: ACI Grade I study guide worked example]", () => {
    const result = concreteYield({
      batchMassKg: lbToKg(3886),
      densityKgM3: lbFt3ToKgM3(145.0),
      designVolumeM3: yd3ToM3(1),
    });
    expect(m3ToFt3(result.volumeM3)).toBeCloseTo(26.8, 2);
    expect(m3ToYd3(result.volumeM3)).toBeCloseTo(0.993, 3);
    expect(result.relativeYield).toBeCloseTo(0.993, 3);
  });

  it("an 8 m³ batch of 19 200 kg at 2400 kg/m³ yields exactly its design volume [computed]", () => {
    expect(concreteYield({ batchMassKg: 19_200, densityKgM3: 2400, designVolumeM3: 8 })).toEqual({
      volumeM3: 8,
      relativeYield: 1,
    });
  });

  it("refuses zero design volume", () => {
    expect(() => concreteYield({ batchMassKg: 19_200, densityKgM3: 2400, designVolumeM3: 0 })).toThrow(ConcreteInputError);
  });
});

describe("gravimetricAirPct (ASTM C138)", () => {
  it("T 150.0, D 145.0 → 3.33 % [computed from A = (T − D)/T × 100]", () => {
    expect(gravimetricAirPct({ theoreticalDensity: 150, measuredDensity: 145 })).toBeCloseTo(3.333, 3);
  });

  it("gives the same answer in kg/m³ [computed]", () => {
    expect(
      gravimetricAirPct({ theoreticalDensity: lbFt3ToKgM3(150), measuredDensity: lbFt3ToKgM3(145) }),
    ).toBeCloseTo(3.333, 3);
  });

  it("shows a negative result rather than hiding a wrong theoretical density", () => {
    expect(gravimetricAirPct({ theoreticalDensity: 2300, measuredDensity: 2323 })).toBeCloseTo(-1, 6);
    expect(() => gravimetricAirPct({ theoreticalDensity: Number.NaN, measuredDensity: 2300 })).toThrow(ConcreteInputError);
  });
});

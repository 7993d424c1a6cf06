// The evaporation rate formulas: Uno 1998 (inch-pound and SI) and Menzel 1954, against published check values.
import { describe, it, expect } from "vitest";
import { evaporationRateIP, evaporationRateMenzelIP, evaporationRateSI } from "../../../lib/concrete/evaporation";

describe("Uno 1998, inch-pound form", () => {
  it("80 °F / 80 °F / 50 % / 15 mph → 0.2004 lb/ft²/h [src: DOMAIN check values, computed from Uno 1998 ACI Mat J 95(4)]", () => {
    expect(
      evaporationRateIP({ concreteTempF: 80, airTempF: 80, relativeHumidityPct: 50, windMph: 15 }),
    ).toBeCloseTo(0.2004, 4);
  });

  it("70 °F concrete on a 40 °F day, 50 %, 10 mph → 0.1797 lb/ft²/h [src: DOMAIN check values]", () => {
    expect(
      evaporationRateIP({ concreteTempF: 70, airTempF: 40, relativeHumidityPct: 50, windMph: 10 }),
    ).toBeCloseTo(0.1797, 4);
  });

  it("90 °F / 95 °F / 30 % / 10 mph → 0.2523 lb/ft²/h [src: DOMAIN check values]", () => {
    expect(
      evaporationRateIP({ concreteTempF: 90, airTempF: 95, relativeHumidityPct: 30, windMph: 10 }),
    ).toBeCloseTo(0.2523, 4);
  });

  it("hand check of row 1: 80^2.5 × 0.5 × 7 × 10⁻⁶ [computed from the formula]", () => {
    expect(80 ** 2.5 * 0.5 * (1 + 0.4 * 15) * 1e-6).toBeCloseTo(0.2004, 4);
  });
});

describe("Uno 1998, SI form", () => {
  it("30 °C / 25 °C / 50 % / 20 km/h → 1.1880 kg/m²/h [src: DOMAIN check values]", () => {
    expect(
      evaporationRateSI({ concreteTempC: 30, airTempC: 25, relativeHumidityPct: 50, windKmh: 20 }),
    ).toBeCloseTo(1.188, 4);
  });

  it("25 °C / 25 °C / 50 % / 20 km/h → 0.7275 kg/m²/h [src: DOMAIN check values]", () => {
    expect(
      evaporationRateSI({ concreteTempC: 25, airTempC: 25, relativeHumidityPct: 50, windKmh: 20 }),
    ).toBeCloseTo(0.7275, 4);
  });

  it("is 0, not negative, when cold concrete meets warm humid air [src: DOMAIN §1]", () => {
    expect(
      evaporationRateSI({ concreteTempC: 10, airTempC: 30, relativeHumidityPct: 90, windKmh: 20 }),
    ).toBe(0);
    expect(
      evaporationRateIP({ concreteTempF: 50, airTempF: 86, relativeHumidityPct: 90, windMph: 12 }),
    ).toBe(0);
  });

  it("stays finite below −18 °C, where the power law would take a root of a negative number", () => {
    const rate = evaporationRateSI({ concreteTempC: 5, airTempC: -30, relativeHumidityPct: 50, windKmh: 10 });
    expect(Number.isFinite(rate)).toBe(true);
    expect(rate).toBeCloseTo(5 * 23 ** 2.5 * 14 * 1e-6, 10);
  });
});

describe("Menzel 1954 with ASHRAE vapour pressures", () => {
  it("80 °F / 80 °F / 50 % / 15 mph ≈ 0.189 lb/ft²/h [computed from the formula, es(80 °F) ≈ 0.5075 psi from steam tables]", () => {
    expect(
      evaporationRateMenzelIP({ concreteTempF: 80, airTempF: 80, relativeHumidityPct: 50, windMph: 15 }),
    ).toBeCloseTo(0.44 * 0.5 * 0.5075 * (0.253 + 0.096 * 15), 3);
  });

  it("70 °F / 40 °F / 50 % / 10 mph ≈ 0.161 lb/ft²/h [computed; es 0.3633 and 0.1216 psi from steam tables]", () => {
    expect(
      evaporationRateMenzelIP({ concreteTempF: 70, airTempF: 40, relativeHumidityPct: 50, windMph: 10 }),
    ).toBeCloseTo(0.44 * (0.3633 - 0.5 * 0.1216) * (0.253 + 0.96), 3);
  });

  it("is 0 when the surface vapour pressure is below the air's [computed]", () => {
    expect(
      evaporationRateMenzelIP({ concreteTempF: 50, airTempF: 86, relativeHumidityPct: 90, windMph: 12 }),
    ).toBe(0);
  });
});

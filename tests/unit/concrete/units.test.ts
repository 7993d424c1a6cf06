import { describe, it, expect } from "vitest";
import fc from "fast-check";

import {
  KG_M2_H_PER_LB_FT2_H,
  KG_M3_PER_LB_FT3,
  KG_PER_LB,
  M2_PER_FT2,
  M3_PER_FT3,
  MPA_PER_PSI,
  cToF,
  fToC,
  formatDensity,
  formatEvaporation,
  formatLength,
  formatQuantity,
  formatSpeed,
  formatStrength,
  formatTemperature,
  formatVolume,
  formatWaterVolume,
  fromDisplay,
  galToL,
  inToMm,
  kgToLb,
  lbToKg,
  kNToLbf,
  lbfToKN,
  lbFt2hToKgM2h,
  m3ToYd3,
  mphToKmh,
  psiToMPa,
  toDisplay,
  unitLabel,
  yd3ToM3,
  type Quantity,
} from "../../../lib/concrete/units";

describe("exact conversion factors", () => {
  it("match DOMAIN's factors [src: DOMAIN Units]", () => {
    expect(lbFt2hToKgM2h(1)).toBe(4.882428);
    expect(psiToMPa(1)).toBe(0.006894757);
    expect(yd3ToM3(1)).toBe(0.764554858);
    expect(mphToKmh(1)).toBe(1.609344);
    expect(galToL(1)).toBe(3.785411784);
    expect(inToMm(1)).toBe(25.4);
    expect(lbfToKN(1)).toBe(0.00444822162);
    // The international pound: 1 lb = 0.45359237 kg exactly (NIST SP 811).
    expect(lbToKg(1)).toBe(0.45359237);
    expect(kgToLb(0.45359237)).toBe(1);
  });

  it("agree with the definitions of the pound, foot and standard gravity [computed]", () => {
    // 1 lb/ft²/h = 0.45359237 kg / 0.09290304 m² per hour
    expect(KG_M2_H_PER_LB_FT2_H).toBeCloseTo(KG_PER_LB / M2_PER_FT2, 6);
    // 1 lb/ft³ = 0.45359237 kg / 0.028316846592 m³
    expect(KG_M3_PER_LB_FT3).toBeCloseTo(KG_PER_LB / M3_PER_FT3, 5);
    // 1 psi = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)², in MPa
    expect(MPA_PER_PSI).toBeCloseTo((KG_PER_LB * 9.80665) / 0.0254 ** 2 / 1e6, 9);
  });

  it("converts temperatures at the fixed points [src: definition of the scales]", () => {
    expect(fToC(32)).toBe(0);
    expect(fToC(212)).toBe(100);
    expect(fToC(-40)).toBe(-40);
    expect(cToF(35)).toBe(95);
  });

  it("converts published pairs close to each other but not exactly [src: DOMAIN Units]", () => {
    // 150 yd³ ↔ 110 m³ and 500 psi ↔ 3.5 MPa are published pairs, not exact conversions.
    expect(yd3ToM3(150)).toBeCloseTo(114.68, 2);
    expect(psiToMPa(500)).toBeCloseTo(3.447, 3);
    expect(m3ToYd3(0.764554858)).toBeCloseTo(1, 12);
    expect(kNToLbf(lbfToKN(113_097))).toBeCloseTo(113_097, 6);
  });
});

describe("display formatting", () => {
  it("formats temperatures in either unit system [computed]", () => {
    expect(formatTemperature(29, "SI")).toBe("29 °C");
    expect(formatTemperature(29, "IP")).toBe("84 °F");
    expect(formatTemperature(-0.2, "SI")).toBe("0 °C");
    expect(formatTemperature(4.44, "IP")).toBe("40 °F");
    expect(formatTemperature(12.5, "SI", 1)).toBe("12.5 °C");
  });

  it("formats the other quantities with their labels [computed]", () => {
    expect(formatEvaporation(1.0, "SI")).toBe("1.00 kg/m²/h");
    expect(formatEvaporation(1.0, "IP")).toBe("0.20 lb/ft²/h");
    expect(formatLength(101.6, "IP")).toBe("4.0 in");
    expect(formatLength(100, "SI")).toBe("100 mm");
    expect(formatVolume(0.764554858, "IP")).toBe("1.00 yd³");
    expect(formatVolume(8, "SI")).toBe("8.00 m³");
    expect(formatStrength(27.579028, "IP")).toBe("4000 psi");
    expect(formatStrength(30, "SI")).toBe("30.0 MPa");
    expect(formatSpeed(mphToKmh(15), "IP")).toBe("15 mph");
    expect(formatSpeed(20, "SI")).toBe("20 km/h");
    expect(formatDensity(2274.6, "IP")).toBe("142.0 lb/ft³");
    expect(formatWaterVolume(galToL(10), "IP")).toBe("10.0 gal");
    expect(formatWaterVolume(38, "SI")).toBe("38 L");
  });

  it("refuses to format NaN", () => {
    expect(() => formatQuantity("temperature", Number.NaN, "SI")).toThrow("Value must be a number");
  });

  it("labels form fields", () => {
    expect(unitLabel("waterVolume", "IP")).toBe("gal");
    expect(unitLabel("density", "SI")).toBe("kg/m³");
  });
});

describe("toDisplay / fromDisplay", () => {
  const quantities: Quantity[] = [
    "temperature",
    "length",
    "volume",
    "speed",
    "strength",
    "density",
    "evaporationRate",
    "waterVolume",
  ];

  it("leaves SI values alone and converts for IP [computed]", () => {
    expect(toDisplay("temperature", 35, "SI")).toBe(35);
    expect(toDisplay("temperature", 35, "IP")).toBe(95);
    expect(fromDisplay("strength", 4000, "IP")).toBeCloseTo(27.579, 3);
    expect(fromDisplay("length", 4, "IP")).toBe(101.6);
    expect(fromDisplay("density", 145, "IP")).toBeCloseTo(2322.68, 2);
  });

  it("round-trips every quantity in both unit systems [property]", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...quantities),
        fc.constantFrom<"SI" | "IP">("SI", "IP"),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        (quantity, unitSystem, valueSI) => {
          const back = fromDisplay(quantity, toDisplay(quantity, valueSI, unitSystem), unitSystem);
          expect(Math.abs(back - valueSI)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(valueSI)));
        },
      ),
    );
  });
});

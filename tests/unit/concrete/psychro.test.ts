import { describe, it, expect } from "vitest";
import psychrolib from "psychrolib";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import {
  dewPointC,
  saturationVapourPressurePa,
  saturationVapourPressurePsi,
} from "../../../lib/concrete/psychro";

// PsychroLib's own tests accept 300 ppm against the ASHRAE table.
const withinPpm = (actual: number, expected: number, ppm: number) =>
  expect(Math.abs(actual - expected) / expected).toBeLessThanOrEqual(ppm * 1e-6);

describe("saturation vapour pressure via PsychroLib", () => {
  it("5 °C → 872.6 Pa [src: ASHRAE 2017 ch. 1 Table 3, PsychroLib tests]", () => {
    withinPpm(saturationVapourPressurePa(5), 872.6, 300);
  });

  it("25 °C → 3169.7 Pa [src: ASHRAE 2017 ch. 1 Table 3, PsychroLib tests]", () => {
    withinPpm(saturationVapourPressurePa(25), 3169.7, 300);
  });

  it("50 °C → 12 351.3 Pa [src: ASHRAE 2017 ch. 1 Table 3, PsychroLib tests]", () => {
    withinPpm(saturationVapourPressurePa(50), 12_351.3, 300);
  });

  it("77 °F → 0.45973 psi [src: ASHRAE 2017 ch. 1 Table 3 (IP), PsychroLib tests]", () => {
    withinPpm(saturationVapourPressurePsi(77), 0.45973, 300);
  });

  it("gives the same pressure in both unit systems [computed: 1 psi = 6894.757 Pa]", () => {
    withinPpm(saturationVapourPressurePsi(86) * 6894.757, saturationVapourPressurePa(30), 10);
  });
});

describe("dew point", () => {
  it("25 °C at 80 % RH → 21.3094 °C [src: PsychroLib documentation example]", () => {
    expect(dewPointC(25, 80)).toBeCloseTo(21.3094, 3);
  });

  it("equals the air temperature at 100 % RH [computed]", () => {
    expect(dewPointC(18, 100)).toBeCloseTo(18, 3);
  });

  it("is −∞ in perfectly dry air: no vapour, so no dew point [computed: log(0)]", () => {
    expect(dewPointC(25, 0)).toBe(Number.NEGATIVE_INFINITY);
  });

  it("refuses humidity outside 0–100 %", () => {
    expect(() => dewPointC(25, 101)).toThrow(ConcreteInputError);
    expect(() => dewPointC(25, -1)).toThrowError(/Relative humidity must be between 0 and 100 %/);
  });
});

describe("PsychroLib global unit system", () => {
  it("is restored after each call, so other users of the library are not disturbed", () => {
    psychrolib.SetUnitSystem(psychrolib.SI);
    saturationVapourPressurePsi(77);
    expect(psychrolib.GetUnitSystem()).toBe(psychrolib.SI);
    psychrolib.SetUnitSystem(psychrolib.IP);
    saturationVapourPressurePa(25);
    expect(psychrolib.GetUnitSystem()).toBe(psychrolib.IP);
    // Whatever someone else left set, our answers stay in our units.
    withinPpm(saturationVapourPressurePa(25), 3169.7, 300);
    psychrolib.SetUnitSystem(psychrolib.SI);
    withinPpm(saturationVapourPressurePsi(77), 0.45973, 300);
  });
});

// lib/concrete/psychro.ts writes out ASHRAE 2017 ch. 1 eqns 5 and 6 itself (so the browser does not
// load a psychrometrics library); PsychroLib (npm, the same equations) is the reference here.
import psychrolib from "psychrolib";
import { describe, expect, it } from "vitest";
import { dewPointC, saturationVapourPressurePa, saturationVapourPressurePsi } from "../../../lib/concrete/psychro";

function reference<T>(units: typeof psychrolib.SI | typeof psychrolib.IP, fn: () => T): T {
  psychrolib.SetUnitSystem(units);
  return fn();
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("psychrometrics against PsychroLib [src: PsychroLib 1.1.1, ASHRAE 2017 ch. 1 eqns 5–6]", () => {
  it("saturation vapour pressure in Pa from −60 to 120 °C, over ice and over water, within 1 ppm", () => {
    for (let c = -60; c <= 120; c += 0.37) {
      const expected = reference(psychrolib.SI, () => psychrolib.GetSatVapPres(c));
      expect(relative(saturationVapourPressurePa(c), expected)).toBeLessThan(1e-6);
    }
    // Both sides of the triple point (0.01 °C), where the equation changes.
    for (const c of [0, 0.01, 0.02]) {
      expect(relative(saturationVapourPressurePa(c), reference(psychrolib.SI, () => psychrolib.GetSatVapPres(c)))).toBeLessThan(1e-6);
    }
  });

  it("saturation vapour pressure in psi from −76 to 248 °F within 1 ppm", () => {
    for (let f = -76; f <= 248; f += 0.61) {
      const expected = reference(psychrolib.IP, () => psychrolib.GetSatVapPres(f));
      expect(relative(saturationVapourPressurePsi(f), expected)).toBeLessThan(1e-6);
    }
  });

  it("dew point within 0.002 °C over air temperatures and humidities a site sees", () => {
    for (const tempC of [-20, -5, 0, 4, 12, 25, 38, 48]) {
      for (const rh of [5, 20, 45, 70, 95, 100]) {
        const expected = reference(psychrolib.SI, () => psychrolib.GetTDewPointFromRelHum(tempC, rh / 100));
        expect(Math.abs(dewPointC(tempC, rh) - expected)).toBeLessThan(0.002);
      }
    }
  });
});

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

// The dew point solved independently: bisection on PsychroLib's saturation pressure to 1e-12 °C.
function dewPointByBisection(tempC: number, rh: number): number {
  const target = reference(psychrolib.SI, () => (rh / 100) * psychrolib.GetSatVapPres(tempC));
  let lo = -100;
  let hi = tempC + 1e-9;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (psychrolib.GetSatVapPres(mid) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

describe("the triple point and the dew point's accuracy [src: PsychroLib 1.1.1, ASHRAE 2017 ch. 1 eqns 5–6]", () => {
  it("at exactly 0.01 °C (32.018 °F) the pressure is over ice, as PsychroLib and ASHRAE eqn 5 take it (the water form differs by 6 ppb SI, 0.4 ppm IP)", () => {
    expect(relative(saturationVapourPressurePa(0.01), reference(psychrolib.SI, () => psychrolib.GetSatVapPres(0.01)))).toBeLessThan(1e-10);
    expect(relative(saturationVapourPressurePsi(32.018), reference(psychrolib.IP, () => psychrolib.GetSatVapPres(32.018)))).toBeLessThan(1e-10);
  });

  it("Newton's method converges quadratically, so the dew point is within 1e-7 °C of a bisection on PsychroLib's pressure", () => {
    for (const tempC of [-30, -20, -12, -5, 0, 4, 12, 25, 38, 48]) {
      for (const rh of [5, 20, 45, 70, 95, 100]) {
        expect(Math.abs(dewPointC(tempC, rh) - dewPointByBisection(tempC, rh))).toBeLessThan(1e-7);
      }
    }
  });
});

// Bad inputs to the evaporation formulas are refused with the field named.
import { describe, it, expect } from "vitest";
import { describeEvaporation, evaporationRateIP, evaporationRateMenzelIP, evaporationRateSI } from "../../../lib/concrete/evaporation";
import { fieldOf } from "./helpers";

describe("input validation", () => {
  const si = { concreteTempC: 25, airTempC: 25, relativeHumidityPct: 50, windKmh: 10 };
  const ip = { concreteTempF: 77, airTempF: 77, relativeHumidityPct: 50, windMph: 6 };

  it("refuses humidity outside 0–100 % with a plain message", () => {
    expect(() => evaporationRateSI({ ...si, relativeHumidityPct: 101 })).toThrow(
      "Relative humidity must be between 0 and 100 %",
    );
    expect(fieldOf(() => evaporationRateIP({ ...ip, relativeHumidityPct: -5 }))).toBe("relativeHumidityPct");
  });

  it("refuses negative wind and NaN", () => {
    expect(fieldOf(() => evaporationRateSI({ ...si, windKmh: -1 }))).toBe("windKmh");
    expect(fieldOf(() => evaporationRateMenzelIP({ ...ip, windMph: Number.NaN }))).toBe("windMph");
    expect(fieldOf(() => evaporationRateSI({ ...si, airTempC: Number.NaN }))).toBe("airTempC");
  });

  it("refuses temperatures outside −40…70 °C (−40…158 °F)", () => {
    expect(fieldOf(() => evaporationRateSI({ ...si, concreteTempC: 71 }))).toBe("concreteTempC");
    expect(fieldOf(() => evaporationRateSI({ ...si, airTempC: -41 }))).toBe("airTempC");
    expect(fieldOf(() => evaporationRateIP({ ...ip, concreteTempF: 159 }))).toBe("concreteTempF");
    expect(fieldOf(() => describeEvaporation({ unitSystem: "IP", ...ip, airTempF: -41 }))).toBe("airTempF");
    expect(evaporationRateSI({ ...si, concreteTempC: 70 })).toBeGreaterThan(0);
  });
});

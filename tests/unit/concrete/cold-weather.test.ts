import { describe, it, expect } from "vitest";

import {
  hoursAbove,
  isColdWeather,
  maxTemperatureDropC,
  minimumConcreteTempC,
  protectionPeriodDays,
} from "../../../lib/concrete/cold-weather";
import { ConcreteInputError } from "../../../lib/concrete/errors";
import { fToC, inToMm } from "../../../lib/concrete/units";

describe("minimumConcreteTempC", () => {
  it("follows the section-size table: 13 / 10 / 7 / 5 °C [src: ACI 306R Line 1 / ACI 306.1 Table 3.1, secondary quotations]", () => {
    expect(minimumConcreteTempC(200)).toBe(13);
    expect(minimumConcreteTempC(600)).toBe(10);
    expect(minimumConcreteTempC(1200)).toBe(7);
    expect(minimumConcreteTempC(2500)).toBe(5);
  });

  it("puts exactly 300, 900 and 1800 mm in the column that starts or ends there [src: DOMAIN: '12 to 36 in']", () => {
    expect(minimumConcreteTempC(299.9)).toBe(13);
    expect(minimumConcreteTempC(300)).toBe(10);
    expect(minimumConcreteTempC(900)).toBe(10);
    expect(minimumConcreteTempC(900.1)).toBe(7);
    expect(minimumConcreteTempC(1800)).toBe(7);
    expect(minimumConcreteTempC(1800.1)).toBe(5);
  });

  it("uses the published °F row and inch boundaries for IP projects [src: ACI 306R, 55/50/45/40 °F]", () => {
    expect(minimumConcreteTempC(inToMm(11.9), "IP")).toBeCloseTo(fToC(55), 10);
    expect(minimumConcreteTempC(inToMm(12), "IP")).toBeCloseTo(fToC(50), 10);
    expect(minimumConcreteTempC(inToMm(36), "IP")).toBeCloseTo(fToC(50), 10);
    expect(minimumConcreteTempC(inToMm(72), "IP")).toBeCloseTo(fToC(45), 10);
    expect(minimumConcreteTempC(inToMm(73), "IP")).toBeCloseTo(fToC(40), 10);
  });

  it("refuses a zero or negative dimension", () => {
    expect(() => minimumConcreteTempC(0)).toThrow(ConcreteInputError);
    expect(() => minimumConcreteTempC(-10)).toThrow(/Least section dimension/);
  });
});

describe("maxTemperatureDropC", () => {
  it("is 28 / 22 / 17 / 11 °C by section [memory: ACI 306R]", () => {
    expect(maxTemperatureDropC(250)).toBe(28);
    expect(maxTemperatureDropC(300)).toBe(22);
    expect(maxTemperatureDropC(1000)).toBe(17);
    expect(maxTemperatureDropC(2000)).toBe(11);
  });

  it("converts the °F drop as a difference, without the 32 °F offset [memory: 50 °F drop]", () => {
    expect(maxTemperatureDropC(inToMm(10), "IP")).toBeCloseTo(27.78, 2);
  });
});

describe("isColdWeather", () => {
  it("current ACI 306R: cold when air is expected to fall below 4 °C [src: ACI 306R current definition]", () => {
    expect(isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 3.5 }).cold).toBe(true);
    expect(isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 4 }).cold).toBe(false);
    expect(isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 8 })).toEqual({
      cold: false,
      limit: 4,
      reason: "Air temperature stays above 4 °C during the protection period",
    });
  });

  it("current ACI 306R: cold when air has fallen to 4 °C [src: ACI 306R 'has fallen to']", () => {
    const result = isColdWeather({ definition: "aci306r-current", observedAirTempsC: [9, 6, 4], forecastMinAirTempC: 7 });
    expect(result.cold).toBe(true);
    expect(result.reason).toBe("Air temperature fell to 4.0 °C, at or below 4 °C");
  });

  it("uses 40 °F for IP projects and accepts a project override [src: ACI 306R 40 °F]", () => {
    // 4.2 °C is 39.6 °F: cold by the inch-pound limit, not by the SI one.
    expect(isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 4.2, unitSystem: "IP" }).cold).toBe(true);
    expect(isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 4.2 }).cold).toBe(false);
    expect(isColdWeather({ definition: "aci306r-current", forecastMinAirTempC: 4.2, thresholdC: 5 }).cold).toBe(true);
  });

  it("1990 definition: mean below 5 °C (SI edition [memory]; 40 °F [src: ACI 306.1-90, ACI 308.1]) for more than 3 successive days ending today", () => {
    const three = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [6, 3, 2, 1] });
    expect(three.cold).toBe(false);
    expect(three.reason).toMatch(/for 3 successive days; cold weather needs more than 3/);
    const four = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [6, 4.5, 3, 2, 1] });
    expect(four.cold).toBe(true);
    expect(four.limit).toBe(5);
    expect(four.reason).toBe("Average daily temperature has been below 5 °C for 4 successive days (more than 3)");
    // Exactly 5 °C is not "below 5 °C" and breaks the run; a warm last day ends the period.
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [3, 3, 3, 5] }).cold).toBe(false);
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [3, 3, 2, 1, 0, 6] }).cold).toBe(false);
  });

  it("1990 definition, inch-pound: the published 40 °F, compared in °F [src: ACI 306.1-90]", () => {
    const f = (tempF: number) => ((tempF - 32) * 5) / 9;
    // 40 °F exactly is not below 40 °F, even though it is 4.44 °C (below the SI edition's 5 °C).
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [f(39), f(38), f(40), f(37)], unitSystem: "IP" }).cold).toBe(false);
    const cold = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [f(39), f(38), f(39.9), f(37)], unitSystem: "IP" });
    expect(cold.cold).toBe(true);
    expect(cold.limit).toBe(40);
  });

  it("1990 definition, second condition: air above 10 °C (50 °F) for more than half of a day ends cold weather [src: ACI 306R-88 definition, as quoted in the AASHTO glossary]", () => {
    const means = [2, 2, 3, 4.9];
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: means, dailyWarmHours: [0, 0, 0, 12] }).cold).toBe(true);
    const warm = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: means, dailyWarmHours: [0, 0, 0, 12.5] });
    expect(warm.cold).toBe(false);
    expect(warm.reason).toMatch(/above 10 °C for more than half of a day/);
    // A warm day earlier in the run breaks it too.
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [2, 2, 3, 4, 1], dailyWarmHours: [0, 13, 0, 0, 0] }).cold).toBe(false);
  });

  it("current definition, inch-pound: air at 40 °F has fallen to the limit [src: ACI 306R]", () => {
    const f = (tempF: number) => ((tempF - 32) * 5) / 9;
    expect(isColdWeather({ definition: "aci306r-current", observedAirTempsC: [f(40)], unitSystem: "IP" }).cold).toBe(true);
    expect(isColdWeather({ definition: "aci306r-current", observedAirTempsC: [f(40.5)], unitSystem: "IP" }).cold).toBe(false);
    expect(isColdWeather({ definition: "aci306r-current", observedAirTempsC: [f(40)], unitSystem: "IP" }).reason).toMatch(/at or below 40 °F/);
  });

  it("hours above a limit, by straight lines between readings [computed]", () => {
    const at = (h: number) => new Date(Date.UTC(2026, 0, 1, h));
    // 8 → 12 °C over 2 h crosses 10 °C half-way: 1 h above; then 12 → 12 for 3 h: 3 h; a 5 h gap is not joined.
    const readings = [
      { at: at(0), tempC: 8 },
      { at: at(2), tempC: 12 },
      { at: at(5), tempC: 12 },
      { at: at(10), tempC: 12 },
    ];
    expect(hoursAbove(readings, 10)).toBeCloseTo(4, 9);
    expect(hoursAbove([{ at: at(0), tempC: 11 }], 10)).toBe(0);
  });

  it("refuses a check with no temperatures", () => {
    expect(() => isColdWeather({ definition: "aci306r-current" })).toThrow(ConcreteInputError);
    expect(() => isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [] })).toThrow(ConcreteInputError);
    expect(() => isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [3, Number.NaN] })).toThrow(
      /Temperature must be a number/,
    );
  });
});

describe("protectionPeriodDays", () => {
  it("2 / 3 / 6 days, 1 / 2 / 4 with accelerated set [memory: ACI 306R table, air-entrained]", () => {
    expect(protectionPeriodDays({ serviceCategory: "no-load-not-exposed" })).toBe(2);
    expect(protectionPeriodDays({ serviceCategory: "no-load-not-exposed", acceleratedSet: true })).toBe(1);
    expect(protectionPeriodDays({ serviceCategory: "no-load-exposed" })).toBe(3);
    expect(protectionPeriodDays({ serviceCategory: "no-load-exposed", acceleratedSet: true })).toBe(2);
    expect(protectionPeriodDays({ serviceCategory: "partial-load-exposed" })).toBe(6);
    expect(protectionPeriodDays({ serviceCategory: "partial-load-exposed", acceleratedSet: true })).toBe(4);
  });

  it("leaves full load to a strength-based decision", () => {
    expect(protectionPeriodDays({ serviceCategory: "full-load-exposed" })).toBeNull();
  });
});

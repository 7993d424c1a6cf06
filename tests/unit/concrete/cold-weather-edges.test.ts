// Branches of the cold-weather definitions that the main file does not reach: observed-only readings, the reasons' wording, limits at their edge.
import { describe, it, expect } from "vitest";

import {
  hoursAbove,
  isColdWeather,
} from "../../../lib/concrete/cold-weather";

describe("isColdWeather, current ACI 306R definition", () => {
  it("judges observed readings alone, without a forecast [src: ACI 306R current definition, 'has fallen to']", () => {
    expect(isColdWeather({ definition: "aci306r-current", observedAirTempsC: [9, 6] })).toEqual({
      cold: false,
      limit: 4,
      reason: "Air temperature stays above 4 °C during the protection period",
    });
    const fell = isColdWeather({ definition: "aci306r-current", observedAirTempsC: [9, 3.5] });
    expect(fell.cold).toBe(true);
    expect(fell.reason).toMatch(/fell to 3\.5 °C, at or below 4 °C/);
  });

  it("says which forecast makes it cold and the limit it falls below [src: ACI 306R current definition, 'expected to fall below']", () => {
    const result = isColdWeather({ definition: "aci306r-current", observedAirTempsC: [9, 6], forecastMinAirTempC: 3.5 });
    expect(result.cold).toBe(true);
    expect(result.reason).toMatch(/forecast to fall to 3\.5 °C, below 4 °C/);
  });
});

describe("isColdWeather, ACI 306.1-90 definition", () => {
  it("says how many successive days were below the limit and that more than 3 are needed [src: ACI 306.1-90, ACI 308.1; 5 °C in SI: memory]", () => {
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [6, 3, 2, 1] }).reason).toMatch(
      /below 5 °C for 3 successive days; cold weather needs more than 3/,
    );
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [6, 1] }).reason).toBe(
      "Average daily temperature has been below 5 °C for 1 successive day; cold weather needs more than 3",
    );
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [1, 1, 1, 1] }).reason).toBe(
      "Average daily temperature has been below 5 °C for 4 successive days (more than 3)",
    );
  });

  it("the warm-day break: more than 12 h above 10 °C (50 °F) ends the run, and the reason says so [src: ACI 306R-88 as quoted in the AASHTO glossary]", () => {
    const ip = isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [-1, -1, -1, -1], dailyWarmHours: [0, 0, 0, 12.01], unitSystem: "IP" });
    expect(ip.cold).toBe(false);
    expect(ip.reason).toBe(
      "Average daily temperature has been below 40 °F for 0 successive days; cold weather needs more than 3; the air was above 50 °F for more than half of a day, which ends the run",
    );
    // Unknown warm hours (null) do not break the run.
    expect(isColdWeather({ definition: "aci306-1990", dailyMeanTempsC: [1, 1, 1, 1], dailyWarmHours: [null, null, null, null] }).cold).toBe(true);
  });
});

describe("hoursAbove: straight lines between readings [computed by hand]", () => {
  const at = (h: number) => new Date(Date.UTC(2026, 0, 1, 0, h * 60));
  it("a falling crossing counts the warm share: 12 → 8 °C over 2 h across 10 °C is 1 h; the order of the input does not matter", () => {
    expect(hoursAbove([{ at: at(0), tempC: 12 }, { at: at(2), tempC: 8 }], 10)).toBeCloseTo(1, 9);
    expect(hoursAbove([{ at: at(2), tempC: 8 }, { at: at(0), tempC: 12 }], 10)).toBeCloseTo(1, 9);
    expect(hoursAbove([{ at: at(0), tempC: 9 }, { at: at(2), tempC: 13 }], 10)).toBeCloseTo(1.5, 9);
  });

  it("exactly at the limit is not above it; two readings at one instant add nothing", () => {
    expect(hoursAbove([{ at: at(0), tempC: 10 }, { at: at(2), tempC: 10 }], 10)).toBe(0);
    expect(hoursAbove([{ at: at(0), tempC: 8 }, { at: at(0), tempC: 12 }], 10)).toBe(0);
  });

  it("readings exactly 3 h apart are joined; further apart they are not, unless the gap allowed is longer", () => {
    const pair = (h: number) => [{ at: at(0), tempC: 12 }, { at: at(h), tempC: 12 }];
    expect(hoursAbove(pair(3), 10)).toBe(3);
    expect(hoursAbove(pair(3.5), 10)).toBe(0);
    expect(hoursAbove(pair(3.5), 10, 4)).toBe(3.5);
  });
});

// Branches of the cold-weather definitions and the discharge-temperature check that the main
// file does not reach: observed-only readings, the reasons' wording, limits at their edge.
import { describe, it, expect } from "vitest";

import {
  checkConcreteTempAtDischarge,
  coldWeatherCautions,
  hotWeatherCautions,
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

describe("checkConcreteTempAtDischarge", () => {
  it("accepts concrete exactly at the section minimum and says it is within the limits [src: ACI 306.1 Table 3.1, minimum as placed]", () => {
    const result = checkConcreteTempAtDischarge({ concreteTempC: 13, leastDimensionMm: 250 });
    expect(result).toMatchObject({ ok: true, tooCold: false, tooHot: false, limitC: 35, minC: 13 });
    expect(result.message).toBe("Concrete at 13.0 °C is within the temperature limits");
  });

  it("names the section minimum when too cold [src: ACI 306.1 Table 3.1]", () => {
    const result = checkConcreteTempAtDischarge({ concreteTempC: 11, leastDimensionMm: 250 });
    expect(result.message).toBe("Concrete at 11.0 °C is below the 13.0 °C minimum for this section");
  });

  it("refers to the maximum when the concrete is not too cold, and has no minimum unless one applies [src: ACI 305.1-14 §3.3.1]", () => {
    const thick = checkConcreteTempAtDischarge({ concreteTempC: 11, leastDimensionMm: 600 });
    expect(thick).toMatchObject({ ok: true, limitC: 35, minC: 10 });
    const warm = checkConcreteTempAtDischarge({ concreteTempC: 20 });
    expect("minC" in warm).toBe(false);
    expect(warm.limitC).toBe(35);
  });
});

describe("cautions say what to do", () => {
  it("cold weather: no concrete on frozen ground or ice, remove protection gradually [memory: ACI 306R; common practice]", () => {
    const cautions = coldWeatherCautions();
    expect(cautions).toHaveLength(5);
    expect(cautions[0]).toMatch(/Vent combustion heaters.*carbon monoxide/);
    expect(cautions[1]).toMatch(/freezing until it reaches about 3\.5 MPa \(500 psi\)/);
    expect(cautions[2]).toMatch(/frozen ground or against ice/);
    expect(cautions[3]).toMatch(/Remove protection gradually/);
    expect(cautions[4]).toMatch(/engineer of record govern/);
  });

  it("hot weather: heat stress, cool materials, damp subgrade, wind and sun protection, prompt curing [memory: ACI 305R ch. 3–4; common practice]", () => {
    const cautions = hotWeatherCautions();
    expect(cautions).toHaveLength(6);
    expect(cautions[0]).toMatch(/heat stress: water, shade and rest breaks/);
    expect(cautions[1]).toMatch(/Cool the materials, use a retarder and place in the cooler hours/);
    expect(cautions[2]).toMatch(/Dampen the subgrade and forms without leaving standing water/);
    expect(cautions[3]).toMatch(/windbreaks, sunshades, fogging or an evaporation reducer/);
    expect(cautions[4]).toMatch(/curing promptly and shade the test cylinders/);
    expect(cautions[5]).toMatch(/engineer of record govern/);
  });
});

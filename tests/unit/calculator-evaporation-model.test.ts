import { describe, expect, it } from "vitest";
import { evaporationRisk } from "@/lib/concrete";
import {
  DEFAULT_DRAFTS,
  convertDraft,
  evaluate,
  formatRate,
  parseDecimal,
  riskThresholds,
  weatherCautions,
} from "@/components/calculator/evaporation-model";
import { chartSummary, rateByWind, windToReach } from "@/components/calculator/evaporation-chart-model";

describe("parseDecimal", () => {
  it("reads what site phones type", () => {
    expect(parseDecimal("12")).toBe(12);
    expect(parseDecimal(" 1,5 ")).toBe(1.5);
    expect(parseDecimal("-3.5")).toBe(-3.5);
    expect(parseDecimal("\u22125")).toBe(-5);
    expect(parseDecimal(".5")).toBe(0.5);
  });

  it("refuses what nobody means", () => {
    for (const text of ["", " ", "abc", "1e3", "0x10", "1.2.3", "-", "12 mph"]) {
      expect(parseDecimal(text)).toBeNaN();
    }
  });
});

describe("evaluate", () => {
  it("80 °F / 80 °F / 50 % / 15 mph → 0.20 lb/ft²/h, high [src: DOMAIN check values, Uno 1998 computed]", () => {
    const result = evaluate({ concreteTemp: "80", airTemp: "80", humidity: "50", wind: "15" }, "IP", false);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(formatRate(result.description.rate)).toBe("0.20");
    expect(result.description.risk).toBe("high");
  });

  it("30 °C / 25 °C / 50 % / 20 km/h → 1.19 kg/m²/h, high; 25 °C concrete → 0.73, caution [src: DOMAIN check values; high: ACI 305R; caution band: product choice, not a published limit]", () => {
    const hot = evaluate({ concreteTemp: "30", airTemp: "25", humidity: "50", wind: "20" }, "SI", false);
    const mild = evaluate({ concreteTemp: "25", airTemp: "25", humidity: "50", wind: "20" }, "SI", false);
    expect(hot.ok && formatRate(hot.description.rate)).toBe("1.19");
    expect(hot.ok && hot.description.risk).toBe("high");
    expect(mild.ok && formatRate(mild.description.rate)).toBe("0.73");
    expect(mild.ok && mild.description.risk).toBe("caution");
    // Low-bleed mixes: 0.73 is above the halved high level of 0.5.
    const lowBleed = evaluate({ concreteTemp: "25", airTemp: "25", humidity: "50", wind: "20" }, "SI", true);
    expect(lowBleed.ok && lowBleed.description.risk).toBe("high");
  });

  it("puts the library's message on every bad field at once", () => {
    const result = evaluate({ concreteTemp: "", airTemp: "80", humidity: "150", wind: "-2" }, "IP", false);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors).toEqual({
      concreteTemp: "Enter the concrete temperature",
      humidity: "Relative humidity must be between 0 and 100 %",
      wind: "Wind speed cannot be negative",
    });
  });

  it("reports 0 and why when the concrete is cooler than the dew point", () => {
    const result = evaluate({ concreteTemp: "10", airTemp: "25", humidity: "90", wind: "10" }, "SI", false);
    expect(result.ok && result.description.rate).toBe(0);
    expect(result.ok && result.description.negativeReason).toMatch(/dew point/);
  });
});

describe("convertDraft", () => {
  it("maps the untouched example to the other system's round example", () => {
    expect(convertDraft(DEFAULT_DRAFTS.IP, "IP", "SI")).toEqual(DEFAULT_DRAFTS.SI);
  });

  it("converts typed values to one decimal and keeps what cannot be read", () => {
    expect(convertDraft({ airTemp: "25", humidity: "50", wind: "20", concreteTemp: "x" }, "SI", "IP")).toEqual({
      airTemp: "77",
      humidity: "50",
      wind: "12.4",
      concreteTemp: "x",
    });
  });
});

describe("risk levels", () => {
  it("match the levels evaporationRisk applies, in both systems, with and without low bleed [computed: same function; caution bands are this product's choice]", () => {
    for (const system of ["SI", "IP"] as const) {
      for (const lowBleed of [false, true]) {
        const { cautionAt, highAt } = riskThresholds(system, lowBleed);
        expect(evaporationRisk(cautionAt * 0.999, system, { lowBleed })).toBe("low");
        expect(evaporationRisk(cautionAt, system, { lowBleed })).toBe("caution");
        expect(evaporationRisk(highAt * 0.999, system, { lowBleed })).toBe("caution");
        expect(evaporationRisk(highAt, system, { lowBleed })).toBe("high");
      }
    }
  });
});

describe("chart series", () => {
  const readings = { airTemp: 80, humidity: 50, wind: 15, concreteTemp: 80 };

  it("runs 0–25 mph and crosses 0.2 lb/ft²/h at 15 mph", () => {
    const points = rateByWind(readings, "IP");
    expect(points[0].wind).toBe(0);
    expect(points[points.length - 1].wind).toBe(25);
    expect(windToReach(points, 0.2)).toBe(15);
    expect(chartSummary(points, "IP", false)).toContain("high level (0.20) at about 15 mph");
  });

  it("says plainly when there is no evaporation at any wind", () => {
    const points = rateByWind({ airTemp: 3, humidity: 95, wind: 5, concreteTemp: 2 }, "SI");
    expect(chartSummary(points, "SI", false)).toBe(
      "For these temperatures and humidity there is no evaporation at any wind speed up to 40 km/h.",
    );
  });

  it("stretches to a wind beyond the published range", () => {
    const points = rateByWind({ airTemp: 25, humidity: 50, wind: 52, concreteTemp: 25 }, "SI");
    expect(points[points.length - 1].wind).toBe(55);
  });
});

describe("weather cautions (the rulebook's findings, lib/checks)", () => {
  it("hot air with high evaporation is ACI 305.1 hot weather, with the crew heat-stress caution [src: ACI 305.1-14; common practice]", () => {
    // 90 °F air, 88 °F concrete, 30 %, 12 mph: Uno's rate is above 0.2 lb/ft²/h, the air above 80 °F.
    const { hot, cold } = weatherCautions({ airTemp: 90, humidity: 30, wind: 12, concreteTemp: 88 }, "IP");
    expect(hot?.message).toMatch(/heat stress/);
    expect(hot?.source).toMatchObject({ document: "ACI 305.1" });
    expect(hot?.governs).toMatch(/engineer of record/);
    expect(cold).toBeNull();
  });

  it("hot air without high evaporation is not hot weather under ACI 305.1 [src: ACI 305.1-14]", () => {
    expect(weatherCautions({ airTemp: 90, humidity: 90, wind: 2, concreteTemp: 85 }, "IP").hot).toBeNull();
  });

  it("air at 4 °C / 40 °F is cold weather, with the heater venting caution [src: ACI 306R definition]", () => {
    const si = weatherCautions({ airTemp: 4, humidity: 50, wind: 10, concreteTemp: 15 }, "SI").cold;
    expect(si?.message).toMatch(/carbon monoxide/);
    expect(si?.source).toMatchObject({ document: "ACI 306R" });
    expect(weatherCautions({ airTemp: 40, humidity: 50, wind: 10, concreteTemp: 60 }, "IP").cold).not.toBeNull();
    expect(weatherCautions({ airTemp: 41, humidity: 50, wind: 10, concreteTemp: 60 }, "IP").cold).toBeNull();
  });

  it("flags concrete above 35 °C (95 °F) at discharge [src: ACI 305.1-14 §3.3.1]", () => {
    const tooHot = weatherCautions({ airTemp: 95, humidity: 30, wind: 5, concreteTemp: 97 }, "IP").tooHotConcrete;
    expect(tooHot?.title).toMatch(/maximum 95 °F/);
    expect(tooHot?.severity).toBe("warning");
    expect(weatherCautions({ airTemp: 95, humidity: 30, wind: 5, concreteTemp: 95 }, "IP").tooHotConcrete).toBeNull();
  });
});

describe("the example readings are labelled as an example (issue 17 item 9)", () => {
  it("isExample is true for the untouched example in either unit system and false once a field changes", async () => {
    const { DEFAULT_DRAFTS, isExample } = await import("@/components/calculator/evaporation-model");
    expect(isExample(DEFAULT_DRAFTS.IP, "IP")).toBe(true);
    expect(isExample(DEFAULT_DRAFTS.SI, "SI")).toBe(true);
    expect(isExample({ ...DEFAULT_DRAFTS.IP, wind: "3" }, "IP")).toBe(false);
  });
});

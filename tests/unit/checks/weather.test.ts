// The rulebook's weather checks: evaporation of bleed water in the project's own unit system and
// hot weather. Check values from ../shared DOMAIN §1 (computed from Uno's forms, ACI Materials
// Journal 95(4), 1998); thresholds from ACI 305R Fig. 2.1.5; the caution band is this product's choice.
import { describe, expect, it } from "vitest";
import { evaluate } from "@/lib/checks";
import { evaporationFinding, evaporationOf, hotWeatherFindings } from "@/lib/checks/weather";
import { fToC, input, mix, mphToKmh, project, weather } from "./fixtures";

const ip = project({ unitSystem: "IP" });
const ipWeather = (airF: number, concreteF: number | null, rh: number, mph: number) =>
  weather({ airTempC: fToC(airF), concreteTempC: concreteF === null ? null : fToC(concreteF), relativeHumidityPct: rh, windKmh: mphToKmh(mph) });

describe("evaporation on an inch-pound project (issue item 1)", () => {
  it("80 °F air and concrete, 50 %, 15 mph: 0.2004 lb/ft²/h, at the ACI 305R level of 0.2 lb/ft²/h [DOMAIN §1 check value, computed]", () => {
    const f = evaporationFinding(ipWeather(80, 80, 50, 15), ip, mix());
    expect(f.applied.value).toBeCloseTo(0.2004, 4);
    expect(f.applied.unit).toBe("lb/ft²/h");
    expect(f.severity).toBe("warning");
    // Enough digits that the rate does not read as the limit itself.
    expect(f.title).toBe("High evaporation: 0.2004 lb/ft²/h");
    expect(f.message).toContain("approaches 0.2 lb/ft²/h (ACI 305R)");
    expect(f.source).toEqual({ document: "ACI 305R", clause: "Fig. 2.1.5", basis: "published" });
  });

  it("the same reading on an SI project uses the SI form and the published 1.0 kg/m²/h: 0.94, a caution [computed; the two forms differ by ~4 %, DOMAIN §1]", () => {
    const f = evaporationFinding(ipWeather(80, 80, 50, 15), project(), mix());
    expect(f.applied.value).toBeCloseTo(0.938, 2);
    expect(f.applied.unit).toBe("kg/m²/h");
    expect(f.severity).toBe("caution");
  });

  it("70 °F concrete on a 40 °F day, 50 %, 10 mph: 0.1797 lb/ft²/h [DOMAIN §1 check value]; 90/95 °F, 30 %, 10 mph: 0.2523", () => {
    expect(evaporationOf(ipWeather(40, 70, 50, 10), "IP").rate).toBeCloseTo(0.1797, 4);
    expect(evaporationOf(ipWeather(95, 90, 30, 10), "IP").rate).toBeCloseTo(0.2523, 4);
  });

  it("a blank concrete temperature is an estimate from the air temperature, labelled as one on every surface", () => {
    const f = evaporationFinding(ipWeather(80, null, 50, 15), ip, mix());
    expect(f.applied.value).toBeCloseTo(0.2004, 4);
    expect(f.title).toContain("(estimated)");
    expect(f.message).toContain("the concrete temperature was not measured, so the air temperature stands in for it");
  });
});

describe("evaporation thresholds and their wording (issue item 10)", () => {
  it("SI check values: 30/25 °C, 50 %, 20 km/h → 1.1880 kg/m²/h, a warning; 25/25 °C → 0.7275, our caution band [DOMAIN §1]", () => {
    const high = evaporationFinding(weather({ concreteTempC: 30 }), project(), mix());
    expect(high.applied.value).toBeCloseTo(1.188, 3);
    expect(high.severity).toBe("warning");
    const band = evaporationFinding(weather(), project(), mix());
    expect(band.applied.value).toBeCloseTo(0.7275, 4);
    expect(band.severity).toBe("caution");
    // The band is ours, and says so in the finding and its source.
    expect(band.source.basis).toBe("product");
    expect(band.message).toContain("this product's own choice, not a published limit");
    expect(band.applied.limit).toBe(0.5);
    expect(band.message).toContain("half of 1.0 kg/m²/h (ACI 305R)");
  });

  it("a low-bleed mix: half the level (0.5 kg/m²/h, Silica Fume Association guidance), and the notice quotes 0.5, not 1.0", () => {
    const f = evaporationFinding(weather(), project(), mix({ lowBleed: true }));
    expect(f.severity).toBe("warning");
    expect(f.applied.limit).toBe(0.5);
    expect(f.message).toContain("0.5 kg/m²/h, half the ACI 305R level for a low-bleed mix");
    expect(f.message).not.toContain("1.0 kg/m²/h");
  });

  it("a project limit is the one quoted and applied (project specification)", () => {
    const p = project({ evaporationHighKgM2H: 0.8 });
    const band = evaporationFinding(weather(), p, mix());
    expect(band.severity).toBe("caution");
    const high = evaporationFinding(weather({ concreteTempC: 30 }), p, mix());
    expect(high.severity).toBe("warning");
    expect(high.message).toContain("the project specification's limit of 0.8 kg/m²/h");
    expect(high.source.basis).toBe("project");
    // An inch-pound project's limit reads back in lb/ft²/h as it was typed (0.15 lb/ft²/h stored in kg/m²/h).
    const ipLimit = evaporationFinding(ipWeather(80, 80, 50, 15), project({ unitSystem: "IP", evaporationHighKgM2H: 0.15 * 4.882428 }), mix());
    expect(ipLimit.applied.limit).toBe(0.15);
    expect(ipLimit.message).toContain("0.15 lb/ft²/h");
  });

  it("below the band: information only, with the advice to cure promptly", () => {
    const f = evaporationFinding(weather({ relativeHumidityPct: 90, windKmh: 5 }), project(), mix());
    expect(f.severity).toBe("info");
    expect(f.message).toContain("Start curing promptly");
  });

  it("every finding says the project specification, local codes and the engineer of record govern", () => {
    for (const f of evaluate(input({ weather: [weather(), weather({ id: "w2", concreteTempC: 30 })] }))) {
      expect(f.governs).toMatch(/project specification, local codes and the engineer of record govern/);
    }
  });
});

describe("hot weather (ACI 305.1-14: 27 °C / 80 °F with evaporation above the precaution level)", () => {
  const hot = (readings: ReturnType<typeof weather>[]) => hotWeatherFindings(input({ weather: readings }));
  it("30 °C concrete with 1.19 kg/m²/h is hot weather, once per day, with the heat-stress caution [common practice]", () => {
    const [f, ...more] = hot([weather({ concreteTempC: 30 }), weather({ id: "w2", concreteTempC: 31, observedAt: new Date("2026-07-14T21:00:00Z") })]);
    expect(more).toEqual([]);
    expect(f).toMatchObject({ severity: "caution", subject: { type: "day", id: "2026-07-14" }, applied: { value: 31, limit: 27, unit: "°C" } });
    expect(f.message).toMatch(/heat stress/);
    expect(f.source.document).toBe("ACI 305.1");
  });
  it("26 °C is not, even with high evaporation; 27 °C with low evaporation is not", () => {
    expect(hot([weather({ airTempC: 20, concreteTempC: 26, relativeHumidityPct: 10, windKmh: 40 })])).toEqual([]);
    expect(hot([weather({ airTempC: 27, concreteTempC: 27, relativeHumidityPct: 90 })])).toEqual([]);
  });
});

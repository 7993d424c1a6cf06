// Edges of the rulebook's weather checks: a rate exactly at a limit, which limit applies, the digits
// of the rate, and the wording that names the rule and tells the crew what to do. Sources as in
// ../shared DOMAIN §1–2: ACI 305R Fig. 2.1.5 (precautions when the rate approaches 1.0 kg/m²/h,
// 0.2 lb/ft²/h), half that for a low-bleed mix (Silica Fume Association guidance), our own caution
// band from half the level (this product's choice), ACI 305.1-14 hot weather (27 °C / 80 °F).
import { describe, expect, it } from "vitest";
import { evaporationFinding, evaporationLimit, evaporationOf, hotWeatherFindings, rateText } from "@/lib/checks/weather";
import { fToC, input, mix, mphToKmh, placement, project, weather } from "./fixtures";

const ip = project({ unitSystem: "IP" });
const PRECAUTIONS =
  "Fog the air above the surface, put up windbreaks and sunshades, apply an evaporation reducer between finishing passes, and start curing promptly.";
const UNCERTAINTY = "The estimate is uncertain by about ±40 % (Hover, ACI SP-338): read it as a risk level.";

describe("which evaporation limit applies", () => {
  it("published ACI 305R level without a mix (1.0 / 0.5 kg/m²/h SI; 0.2 / 0.1 lb/ft²/h IP)", () => {
    expect(evaporationLimit(project(), null)).toEqual({ highAt: 1, cautionAt: 0.5, kind: "published", source: { document: "ACI 305R", clause: "Fig. 2.1.5", basis: "published" } });
    expect(evaporationLimit(ip, null)).toMatchObject({ highAt: 0.2, cautionAt: 0.1, kind: "published" });
  });

  it("low-bleed: 0.5 kg/m²/h, and our caution band from half of that (0.25)", () => {
    expect(evaporationLimit(project(), { lowBleed: true })).toEqual({
      highAt: 0.5,
      cautionAt: 0.25,
      kind: "low-bleed",
      source: { document: "Silica Fume Association guidance for low-bleed mixes", basis: "published" },
    });
  });

  it("a project limit is named as the project specification's", () => {
    expect(evaporationLimit(project({ evaporationHighKgM2H: 0.8 }), null)).toEqual({
      highAt: 0.8,
      cautionAt: 0.4,
      kind: "project",
      source: { document: "Project specification", basis: "project" },
    });
  });
});

describe("a rate exactly at a limit (\"approaches\": reaching the level needs the precautions)", () => {
  const w = weather();
  const r = evaporationOf(w, "SI").rate;
  it("at the precaution level: a warning", () => {
    expect(evaporationFinding(w, project({ evaporationHighKgM2H: r }), mix()).severity).toBe("warning");
  });
  it("at the start of the caution band: a caution, judged against the band (this product's choice)", () => {
    const f = evaporationFinding(w, project({ evaporationHighKgM2H: 2 * r }), mix());
    expect(f.severity).toBe("caution");
    expect(f.applied.limit).toBe(r);
    expect(f.source).toEqual({ document: "Placewright caution band (half the precaution level)", basis: "product" });
  });
  it("just below the band: information, with digits enough to tell the rate from the band's start", () => {
    const f = evaporationFinding(w, project({ evaporationHighKgM2H: 2 * (r + 0.0001) }), mix());
    expect(f.severity).toBe("info");
    // 0.72746 against a band from 0.72756: "0.73" would read as the band's start.
    expect(f.title).toBe("Evaporation: 0.727 kg/m²/h");
  });
});

describe("the rate as text", () => {
  it("two decimals in kg/m²/h, three in lb/ft²/h; more only while it would read as the limit", () => {
    expect(rateText(1.1880, 1, "SI")).toBe("1.19");
    expect(rateText(0.1797, 0.2, "IP")).toBe("0.180");
    expect(rateText(1, 1, "SI")).toBe("1.00");
    expect(rateText(1.0000001, 1, "SI")).toBe("1.00000");
  });
});

describe("the evaporation wording", () => {
  it("a warning says what is needed and what to do, with the conditions and the uncertainty [src: ACI 305R; Hover, ACI SP-338]", () => {
    const f = evaporationFinding(weather({ concreteTempC: 30 }), project(), mix());
    expect(f.title).toBe("High evaporation: 1.19 kg/m²/h");
    expect(f.message).toBe(
      `Precautions against plastic-shrinkage cracking are needed when the rate approaches 1.0 kg/m²/h (ACI 305R). ${PRECAUTIONS} ` +
        `Air 25 °C, humidity 50 %, wind 20 km/h, concrete 30 °C. ${UNCERTAINTY}`,
    );
  });

  it("the caution band says it is ours and what to have ready", () => {
    const f = evaporationFinding(weather(), project(), mix());
    expect(f.title).toBe("Evaporation approaching the precaution level: 0.73 kg/m²/h");
    expect(f.message).toContain(
      "The rate is within our caution band (from 0.5 kg/m²/h, half of 1.0 kg/m²/h (ACI 305R); the band is this product's own choice, not a published limit). Have fogging, windbreaks and curing ready.",
    );
  });

  it("an estimate says so in the title and the message, without a concrete temperature in the conditions", () => {
    const f = evaporationFinding(weather({ concreteTempC: null, relativeHumidityPct: 90, windKmh: 5 }), project(), mix());
    expect(f.title).toMatch(/^Evaporation: 0\.\d+ kg\/m²\/h \(estimated\)$/);
    expect(f.message).toContain(
      "Below our caution band (from 0.5 kg/m²/h). Start curing promptly after finishing. Air 25 °C, humidity 90 %, wind 5 km/h. " +
        "Estimated: the concrete temperature was not measured, so the air temperature stands in for it. The estimate",
    );
  });
});

describe("hot weather edges (ACI 305.1-14)", () => {
  const hot = (readings: ReturnType<typeof weather>[], placements = [placement()]) => hotWeatherFindings(input({ placements, weather: readings }));
  // 27 °C air and concrete, 10 % RH, 40 km/h: well above 1.0 kg/m²/h.
  const dry = { relativeHumidityPct: 10, windKmh: 40 };

  it("exactly 27 °C with high evaporation is hot weather; the finding names the rule and what to do", () => {
    const [f] = hot([weather({ airTempC: 27, concreteTempC: 27, ...dry })]);
    expect(f.title).toBe("Hot weather: up to 27 °C with high evaporation");
    expect(f.message).toBe(
      "ACI 305.1 treats 27 °C or more with evaporation above the precaution level as hot weather: use the hot-weather checklist " +
        "(cool the materials, place in cooler hours, dampen the subgrade, shade the cylinders). Watch crews for heat stress: water, shade and rest breaks.",
    );
    expect(f.source).toEqual({ document: "ACI 305.1", edition: "14", basis: "published" });
  });

  it("inch-pound: 80 °F, in °F", () => {
    const [f] = hotWeatherFindings(input({ project: ip, weather: [weather({ airTempC: fToC(80), concreteTempC: fToC(80), relativeHumidityPct: 10, windKmh: mphToKmh(25) })] }));
    expect(f.applied).toEqual({ value: 80, limit: 80, unit: "°F" });
    expect(f.message).toContain("treats 80 °F or more");
  });

  it("evaporation exactly at the precaution level does not exceed it", () => {
    const w = weather({ airTempC: 30, concreteTempC: 30 });
    const r = evaporationOf(w, "SI").rate;
    expect(hotWeatherFindings(input({ project: project({ evaporationHighKgM2H: r }), weather: [w] }))).toEqual([]);
    expect(hotWeatherFindings(input({ project: project({ evaporationHighKgM2H: r - 0.001 }), weather: [w] }))).toHaveLength(1);
  });

  it("the precaution level of the reading's own placement: half for a low-bleed mix", () => {
    // 28 °C, 50 %, 20 km/h: about 0.85 kg/m²/h, above 0.5 but below 1.0.
    const placements = [placement({ id: "p1" }), placement({ id: "p2", mix: mix({ lowBleed: true }) })];
    const on = (placementId: string | null) => weather({ placementId, airTempC: 28, concreteTempC: 28 });
    expect(evaporationOf(on("p1"), "SI").rate).toBeGreaterThan(0.5);
    expect(evaporationOf(on("p1"), "SI").rate).toBeLessThan(1);
    expect(hot([on("p2")], placements)).toHaveLength(1);
    expect(hot([on("p1")], placements)).toEqual([]);
    expect(hot([on(null)], placements)).toEqual([]);
  });

  it("the hottest reading of the day is cited (the first of equals)", () => {
    const t = (hh: number) => new Date(`2026-07-14T${hh}:00:00Z`);
    const [f] = hot([
      weather({ id: "a", observedAt: t(18), concreteTempC: 33, ...dry }),
      weather({ id: "b", observedAt: t(19), concreteTempC: 31, ...dry }),
      weather({ id: "c", observedAt: t(20), concreteTempC: 33, ...dry }),
    ]);
    expect(f.at).toBe(t(18).toISOString());
    expect(f.applied.value).toBe(33);
  });
});

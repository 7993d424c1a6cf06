// The evaporation risk band and its description (precautions, rule, uncertainty).
import { describe, it, expect } from "vitest";
import { describeEvaporation, evaporationRisk } from "../../../lib/concrete/evaporation";
import { fieldOf } from "./helpers";

describe("evaporationRisk", () => {
  it("high from 1.0 kg/m²/h and 0.2 lb/ft²/h, each system's own published value [src: ACI 305R Fig. 2.1.5; UFGS 03300]", () => {
    expect(evaporationRisk(1.0, "SI")).toBe("high");
    expect(evaporationRisk(0.99, "SI")).toBe("caution");
    expect(evaporationRisk(0.2004, "IP")).toBe("high");
    expect(evaporationRisk(0.199, "IP")).toBe("caution");
  });

  it("caution band from 0.5 kg/m²/h (0.1 lb/ft²/h) for ordinary mixes [product choice: half the precaution level, not a published limit]", () => {
    expect(evaporationRisk(0.49, "SI")).toBe("low");
    expect(evaporationRisk(0.5, "SI")).toBe("caution");
    expect(evaporationRisk(0.09, "IP")).toBe("low");
    expect(evaporationRisk(0.1, "IP")).toBe("caution");
  });

  it("high from 0.5 kg/m²/h (0.1 lb/ft²/h) for low-bleed mixes [src: Silica Fume Association guidance]", () => {
    expect(evaporationRisk(0.5, "SI", { lowBleed: true })).toBe("high");
    expect(evaporationRisk(0.1, "IP", { lowBleed: true })).toBe("high");
  });

  it("low-bleed caution band from 0.25 kg/m²/h [product choice: half the low-bleed level, not a published limit]", () => {
    expect(evaporationRisk(0.25, "SI", { lowBleed: true })).toBe("caution");
  });

  it("lets a project override the thresholds", () => {
    expect(evaporationRisk(0.8, "SI", { cautionAt: 0.75, highAt: 0.9 })).toBe("caution");
    expect(evaporationRisk(0.8, "SI", { highAt: 0.8 })).toBe("high");
    expect(fieldOf(() => evaporationRisk(0.8, "SI", { cautionAt: 2, highAt: 1 }))).toBe("cautionAt");
    expect(fieldOf(() => evaporationRisk(-0.1, "SI"))).toBe("rate");
  });
});

describe("describeEvaporation", () => {
  it("explains a negative result instead of showing it", () => {
    const result = describeEvaporation({
      unitSystem: "SI",
      concreteTempC: 10,
      airTempC: 30,
      relativeHumidityPct: 90,
      windKmh: 20,
    });
    expect(result.rate).toBe(0);
    expect(result.risk).toBe("low");
    expect(result.negativeReason).toBe("Concrete is cooler than the dew point of the air: no evaporation");
  });

  it("lists precautions at high risk and gives the rule, uncertainty and wind height", () => {
    const result = describeEvaporation({
      unitSystem: "IP",
      concreteTempF: 80,
      airTempF: 80,
      relativeHumidityPct: 50,
      windMph: 15,
    });
    expect(result.rate).toBeCloseTo(0.2004, 4);
    expect(result.risk).toBe("high");
    expect(result.negativeReason).toBeUndefined();
    // ACI 305R Fig. 2.1.5 wording: "approaches"; the caution band is this product's own choice.
    expect(result.rule).toContain("approaches 1.0 kg/m²/h (0.2 lb/ft²/h)");
    expect(result.rule).toContain("this product's own choice, not a published limit");
    expect(result.uncertaintyNote).toMatch(/±40 %/);
    expect(result.uncertaintyNote).toMatch(/Hover 2020/);
    expect(result.windNote).toMatch(/0\.5 m/);
    expect(result.windNote).toMatch(/airport/i);
    const actions = result.actions.join("\n").toLowerCase();
    for (const word of ["fog", "windbreak", "sunshade", "evaporation reducer", "cooler hours", "curing"]) {
      expect(actions).toContain(word);
    }
  });

  it("applies the low-bleed thresholds and keeps only prompt curing when risk is low [src: Silica Fume Association guidance; caution band: product choice]", () => {
    const input = { unitSystem: "SI" as const, concreteTempC: 25, airTempC: 25, relativeHumidityPct: 50, windKmh: 20 };
    expect(describeEvaporation(input).risk).toBe("caution");
    expect(describeEvaporation({ ...input, lowBleed: true }).risk).toBe("high");
    const calm = describeEvaporation({ ...input, relativeHumidityPct: 90, windKmh: 0 });
    expect(calm.risk).toBe("low");
    expect(calm.actions).toEqual(["Start curing promptly after finishing"]);
  });
});

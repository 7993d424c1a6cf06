// Edges of the evaporation risk levels and of the "no evaporation" explanation.
import { describe, it, expect } from "vitest";

import { describeEvaporation, evaporationRisk } from "../../../lib/concrete/evaporation";

describe("project thresholds", () => {
  it("a project may set the caution level equal to the high level: no caution band [product choice: the caution band is ours, not a published limit]", () => {
    const options = { cautionAt: 0.8, highAt: 0.8 };
    expect(evaporationRisk(0.8, "SI", options)).toBe("high");
    expect(evaporationRisk(0.79, "SI", options)).toBe("low");
  });
});

describe("describeEvaporation at exactly zero", () => {
  it("concrete at air temperature in saturated air gives 0 without the 'cooler than the dew point' reason [computed: Uno 1998 with r = 1 and Tc = Ta]", () => {
    const si = describeEvaporation({ unitSystem: "SI", concreteTempC: 20, airTempC: 20, relativeHumidityPct: 100, windKmh: 10 });
    expect(si.rate).toBe(0);
    expect(si.risk).toBe("low");
    expect(si.negativeReason).toBeUndefined();
    const ip = describeEvaporation({ unitSystem: "IP", concreteTempF: 68, airTempF: 68, relativeHumidityPct: 100, windMph: 6 });
    expect(ip.rate).toBe(0);
    expect(ip.negativeReason).toBeUndefined();
  });
});

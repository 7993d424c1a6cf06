// Concrete temperature at discharge: the ACI 305.1 / ACI 301 maximum and the ACI 306R section minimum.
import { describe, it, expect } from "vitest";

import { checkConcreteTempAtDischarge } from "../../../lib/concrete/discharge-temperature";
import { ConcreteInputError } from "../../../lib/concrete/errors";

describe("checkConcreteTempAtDischarge", () => {
  it("35 °C maximum at discharge [src: ACI 305.1-14 §3.3.1; ACI 301]", () => {
    expect(checkConcreteTempAtDischarge({ concreteTempC: 35 }).ok).toBe(true);
    const hot = checkConcreteTempAtDischarge({ concreteTempC: 36 });
    expect(hot).toMatchObject({ ok: false, tooHot: true, tooCold: false, limitC: 35 });
    expect(hot.message).toBe("Concrete at 36.0 °C is above the 35.0 °C maximum at discharge");
  });

  it("takes the minimum from the section size [src: ACI 306.1 Table 3.1]", () => {
    const cold = checkConcreteTempAtDischarge({ concreteTempC: 11, leastDimensionMm: 250 });
    expect(cold).toMatchObject({ ok: false, tooHot: false, tooCold: true, limitC: 13, minC: 13 });
    expect(checkConcreteTempAtDischarge({ concreteTempC: 11, leastDimensionMm: 600 }).ok).toBe(true);
    expect(checkConcreteTempAtDischarge({ concreteTempC: 11, minC: 12 }).tooCold).toBe(true);
  });

  it("accepts a project maximum such as 32 °C for heated concrete, reported in °F for IP [src: ASTM C94 §12]", () => {
    const result = checkConcreteTempAtDischarge({ concreteTempC: 33, maxC: 32, unitSystem: "IP" });
    expect(result.tooHot).toBe(true);
    expect(result.message).toBe("Concrete at 91.4 °F is above the 89.6 °F maximum at discharge");
    expect(() => checkConcreteTempAtDischarge({ concreteTempC: Number.NaN })).toThrow(ConcreteInputError);
  });
});

describe("checkConcreteTempAtDischarge: edges", () => {
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

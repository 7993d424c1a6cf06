import { describe, it, expect } from "vitest";
import fc from "fast-check";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import {
  STRUCTURAL_ADEQUACY_NOTE,
  coreAcceptance,
  cylinderStrengthMPa,
  evaluateAcceptance,
  lengthDiameterFactor,
  requiredTests,
  requiredTestsIP,
  testsForClass,
  strengthTest,
} from "../../../lib/concrete/strength";
import { ft2ToM2, inToMm, lbfToKN, mpaToPsi, yd3ToM3 } from "../../../lib/concrete/units";
import { fieldOf } from "./helpers";

describe("cylinderStrengthMPa (ASTM C39)", () => {
  it("150 mm at 530.1 kN → 30.0 MPa [computed from f = P / (π d²/4)]", () => {
    expect(cylinderStrengthMPa({ maxLoadKN: 530.1, diameterMm: 150 })).toBeCloseTo(30.0, 2);
  });

  it("6 × 12 in at 113 097 lbf → 4000 psi [computed from f = P / (π d²/4)]", () => {
    const strengthMPa = cylinderStrengthMPa({ maxLoadKN: lbfToKN(113_097), diameterMm: inToMm(6), lengthMm: inToMm(12) });
    expect(mpaToPsi(strengthMPa)).toBeCloseTo(4000, 0);
  });

  it("corrects a short core: L/D 1.5 → × 0.96 [memory: ASTM C39/C39M correction table for L/D ≤ 1.75]", () => {
    expect(cylinderStrengthMPa({ maxLoadKN: 530.1, diameterMm: 150, lengthMm: 225 })).toBeCloseTo(30.0 * 0.96, 2);
    // L/D 2.0 needs no correction.
    expect(cylinderStrengthMPa({ maxLoadKN: 530.1, diameterMm: 150, lengthMm: 300 })).toBeCloseTo(30.0, 2);
  });

  it("refuses a zero load or a specimen shorter than its diameter", () => {
    expect(fieldOf(() => cylinderStrengthMPa({ maxLoadKN: 0, diameterMm: 150 }))).toBe("maxLoadKN");
    expect(fieldOf(() => cylinderStrengthMPa({ maxLoadKN: 500, diameterMm: 150, lengthMm: 140 }))).toBe("lengthMm");
  });
});

describe("lengthDiameterFactor", () => {
  it("0.98 / 0.96 / 0.93 / 0.87 at 1.75 / 1.50 / 1.25 / 1.00 [memory: ASTM C39/C39M correction table for L/D ≤ 1.75]", () => {
    expect(lengthDiameterFactor(1.75)).toBeCloseTo(0.98, 12);
    expect(lengthDiameterFactor(1.5)).toBeCloseTo(0.96, 12);
    expect(lengthDiameterFactor(1.25)).toBeCloseTo(0.93, 12);
    expect(lengthDiameterFactor(1.0)).toBeCloseTo(0.87, 12);
  });

  it("interpolates between table rows [computed]", () => {
    expect(lengthDiameterFactor(1.375)).toBeCloseTo(0.945, 12);
    expect(lengthDiameterFactor(1.1)).toBeCloseTo(0.894, 12);
  });

  it("is 1 above 1.75 and refuses below 1.0 [memory: correct only when L/D ≤ 1.75]", () => {
    expect(lengthDiameterFactor(1.76)).toBe(1);
    expect(lengthDiameterFactor(2)).toBe(1);
    expect(() => lengthDiameterFactor(0.99)).toThrow(ConcreteInputError);
  });
});

describe("strengthTest", () => {
  it("averages two 150 mm cylinders [src: ACI FAQ citing ACI 318, 301, 311.6]", () => {
    expect(strengthTest([31.2, 30.4])).toBeCloseTo(30.8, 12);
  });

  it("needs three 100 mm cylinders [src: ACI FAQ citing ACI 318, 301, 311.6]", () => {
    expect(() => strengthTest([31.2, 30.4], { diameterMm: 100 })).toThrow("A strength test needs at least 3 cylinders of this size");
    expect(strengthTest([31.2, 30.4, 30.6], { diameterMm: 100 })).toBeCloseTo(30.7333, 4);
    expect(strengthTest([4100, 4050], { diameterMm: inToMm(6) })).toBe(4075);
  });

  it("refuses a single 150 mm cylinder", () => {
    expect(fieldOf(() => strengthTest([31.2]))).toBe("cylinderStrengths");
  });
});

describe("evaluateAcceptance (ACI 318-19 §26.12.3.1)", () => {
  it("f'c 4000 psi: 3950, 4100, 4050, 3800 → averages 4033.3 then 3983.3, fails (a), (b) holds [src: DOMAIN example; computed verdict]", () => {
    const result = evaluateAcceptance({ fc: 4000, tests: [3950, 4100, 4050, 3800], unitSystem: "IP" });
    expect(result.ok).toBe(false);
    expect(result.individualLimit).toBe(3500);
    expect(result.averageJudged).toBe(true);
    expect(result.tests.map((test) => test.lowIndividual)).toEqual([false, false, false, false]);
    expect(result.tests[0].runningAverage).toBeUndefined();
    expect(result.tests[1].lowAverage).toBeUndefined();
    expect(result.tests[2].runningAverage).toBeCloseTo(4033.33, 2);
    expect(result.tests[2].lowAverage).toBe(false);
    expect(result.tests[3].runningAverage).toBeCloseTo(3983.33, 2);
    expect(result.tests[3].lowAverage).toBe(true);
  });

  it("f'c 6000 psi: a test of 5350 is below the 5400 psi limit [src: DOMAIN example; computed]", () => {
    const result = evaluateAcceptance({ fc: 6000, tests: [5350], unitSystem: "IP" });
    expect(result.individualLimit).toBe(5400);
    expect(result.tests[0].lowIndividual).toBe(true);
    expect(result.ok).toBe(false);
    expect(result.averageJudged).toBe(false);
  });

  it("SI keeps its own published limits: f'c − 3.5 MPa up to 35 MPa, 0.90 f'c above [src: ACI 318-19 §26.12.3.1]", () => {
    expect(evaluateAcceptance({ fc: 30, tests: [26.5], unitSystem: "SI" }).ok).toBe(true);
    expect(evaluateAcceptance({ fc: 30, tests: [26.4], unitSystem: "SI" }).ok).toBe(false);
    expect(evaluateAcceptance({ fc: 35, tests: [31.5], unitSystem: "SI" }).individualLimit).toBe(31.5);
    expect(evaluateAcceptance({ fc: 40, tests: [36], unitSystem: "SI" }).individualLimit).toBe(36);
  });

  it("judges the average from the third test on, not before [src: ACI 318-19 §26.12.3.1(a), three consecutive tests]", () => {
    expect(evaluateAcceptance({ fc: 30, tests: [31, 32], unitSystem: "SI" }).averageJudged).toBe(false);
    const three = evaluateAcceptance({ fc: 30, tests: [29, 30, 30.5], unitSystem: "SI" });
    expect(three.averageJudged).toBe(true);
    expect(three.tests[2].runningAverage).toBeCloseTo(29.8333, 4);
    expect(three.tests[2].lowAverage).toBe(true);
    expect(three.ok).toBe(false);
  });

  it("passes three tests averaging exactly f'c despite binary rounding [computed]", () => {
    expect((18.2 + 20.9 + 20.9) / 3).toBeLessThan(20); // 19.999999999999996 in binary
    expect(evaluateAcceptance({ fc: 20, tests: [18.2, 20.9, 20.9], unitSystem: "SI" }).ok).toBe(true);
  });

  it("refuses an empty list and a negative test", () => {
    expect(fieldOf(() => evaluateAcceptance({ fc: 30, tests: [], unitSystem: "SI" }))).toBe("tests");
    expect(fieldOf(() => evaluateAcceptance({ fc: 30, tests: [30, -1], unitSystem: "SI" }))).toBe("tests[1]");
  });

  it("never passes a set containing a test below the individual limit [property]", () => {
    fc.assert(
      fc.property(
        fc.constantFrom<"SI" | "IP">("SI", "IP"),
        fc.double({ min: 0.3, max: 2, noNaN: true }),
        fc.array(fc.double({ min: 0.5, max: 2, noNaN: true }), { minLength: 0, maxLength: 10 }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        fc.nat(),
        (unitSystem, fcScale, relativeTests, lowFraction, position) => {
          const specified = fcScale * (unitSystem === "SI" ? 35 : 5000);
          const limit = evaluateAcceptance({ fc: specified, tests: [specified], unitSystem }).individualLimit;
          const tests = relativeTests.map((factor) => factor * specified);
          tests.splice(position % (tests.length + 1), 0, limit * lowFraction);
          const result = evaluateAcceptance({ fc: specified, tests, unitSystem });
          expect(result.ok).toBe(false);
          expect(result.tests.some((test) => test.lowIndividual)).toBe(true);
        },
      ),
    );
  });
});

describe("requiredTests (ACI 318-19 §26.12.2.1)", () => {
  it("400 yd³ and 30 000 ft² in one day → 6 [computed from 150 yd³ / 5000 ft²]", () => {
    expect(requiredTestsIP({ volumeYd3: 400, surfaceFt2: 30_000, days: 1 })).toBe(6);
    // The same pour stored in SI and judged by the published inch-pound limits.
    expect(requiredTests({ volumeM3: yd3ToM3(400), surfaceM2: ft2ToM2(30_000), days: 1, unitSystem: "IP" })).toBe(6);
  });

  it("the same pour judged by the SI limits (110 m³ [memory of ACI 318M], 460 m²) needs 7 [computed: 2787 m² / 460 = 6.06]", () => {
    expect(requiredTests({ volumeM3: yd3ToM3(400), surfaceM2: ft2ToM2(30_000), days: 1 })).toBe(7);
  });

  it("at least once a day; volume governs for mass pours [computed from 110 m³ per test; memory of ACI 318M §26.12.2]", () => {
    expect(requiredTests({ volumeM3: 20, surfaceM2: 0, days: 3 })).toBe(3);
    // 110 m³ per test [memory of ACI 318M §26.12.2.1]: 330 m³ is 3 tests, a little more is 4.
    expect(requiredTests({ volumeM3: 330, surfaceM2: 0, days: 1 })).toBe(3);
    expect(requiredTests({ volumeM3: 330.1, surfaceM2: 0, days: 1 })).toBe(4);
    // Not the converted 114.7 m³: 115 m³ already needs 2 tests.
    expect(requiredTests({ volumeM3: 115, surfaceM2: 0, days: 1 })).toBe(2);
    // Surface governs a thin slab: 921 m² / 460 m² → 3 tests, 920 m² → 2.
    expect(requiredTests({ volumeM3: 100, surfaceM2: 920, days: 1 })).toBe(2);
    expect(requiredTests({ volumeM3: 100, surfaceM2: 921, days: 1 })).toBe(3);
  });

  it("refuses a fractional number of days", () => {
    expect(fieldOf(() => requiredTests({ volumeM3: 20, surfaceM2: 0, days: 1.5 }))).toBe("days");
    expect(fieldOf(() => requiredTestsIP({ volumeYd3: 0, surfaceFt2: 0, days: 1 }))).toBe("volumeYd3");
  });
});

describe("coreAcceptance (UFGS 03300)", () => {
  it("average ≥ 85 % f'c and none below 75 % → adequate [src: UFGS 03300]", () => {
    const result = coreAcceptance([26, 25.5, 27], 30);
    expect(result.average).toBeCloseTo(26.1667, 4);
    expect(result.averageLimit).toBe(25.5);
    expect(result.individualLimit).toBe(22.5);
    expect(result.ok).toBe(true);
    expect(result.note).toBe(STRUCTURAL_ADEQUACY_NOTE);
  });

  it("fails on the average even when every core is above 75 % [src: UFGS 03300]", () => {
    const result = coreAcceptance([25, 25, 25.4], 30);
    expect(result.averageOk).toBe(false);
    expect(result.noneLow).toBe(true);
    expect(result.ok).toBe(false);
  });

  it("fails on one core below 75 % even when the average is high [src: UFGS 03300]", () => {
    const result = coreAcceptance([2900, 4600, 4700], 4000);
    expect(result.averageOk).toBe(true);
    expect(result.noneLow).toBe(false);
    expect(result.ok).toBe(false);
  });

  it("needs three cores and says the engineer of record decides adequacy", () => {
    expect(fieldOf(() => coreAcceptance([26, 27], 30))).toBe("coreStrengths");
    expect(STRUCTURAL_ADEQUACY_NOTE).toBe(
      "These checks compare test results with the specified limits; whether the structure is adequate " +
        "is the engineer of record's decision.",
    );
  });
});

describe("testsForClass (ACI 318-19 §26.12.2.1 [memory])", () => {
  it("at least five tests per class of concrete", () => {
    expect(testsForClass({ totalVolume: 200, testsByFrequency: 2, unitSystem: "SI" })).toEqual({ required: 5, smallQuantity: false });
    expect(testsForClass({ totalVolume: 2000, testsByFrequency: 19, unitSystem: "SI" })).toEqual({ required: 19, smallQuantity: false });
  });
  it("none required under 38 m³ (50 yd³) when the building official accepts evidence of strength", () => {
    expect(testsForClass({ totalVolume: 37.9, testsByFrequency: 1, unitSystem: "SI" })).toEqual({ required: 0, smallQuantity: true });
    expect(testsForClass({ totalVolume: 38, testsByFrequency: 1, unitSystem: "SI" }).smallQuantity).toBe(false);
    expect(testsForClass({ totalVolume: 49, testsByFrequency: 1, unitSystem: "IP" }).smallQuantity).toBe(true);
    expect(testsForClass({ totalVolume: 50, testsByFrequency: 1, unitSystem: "IP" }).required).toBe(5);
  });
});

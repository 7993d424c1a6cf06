import { describe, it, expect } from "vitest";

import { ConcreteInputError } from "../../../lib/concrete/errors";
import {
  airRangePct,
  checkFieldTest,
  slumpFlowRangeMm,
  slumpRangeMm,
  withinRange,
} from "../../../lib/concrete/tolerance";
import { inToMm } from "../../../lib/concrete/units";

describe("slumpRangeMm, target slump", () => {
  it("±15 mm up to 50 mm [memory: ASTM C94 §7]", () => {
    expect(slumpRangeMm(50, "target")).toEqual({ min: 35, max: 65 });
    expect(slumpRangeMm(25, "target")).toEqual({ min: 10, max: 40 });
  });

  it("±25 mm over 50 through 100 mm [memory: ASTM C94 §7]", () => {
    expect(slumpRangeMm(75, "target")).toEqual({ min: 50, max: 100 });
    expect(slumpRangeMm(100, "target")).toEqual({ min: 75, max: 125 });
  });

  it("±40 mm over 100 mm [memory: ASTM C94 §7]", () => {
    expect(slumpRangeMm(150, "target")).toEqual({ min: 110, max: 190 });
  });

  it("never goes below zero slump", () => {
    expect(slumpRangeMm(10, "target")).toEqual({ min: 0, max: 25 });
  });

  it("uses the inch tolerances for IP projects: 4 in ± 1 in, 5 in ± 1½ in [memory: ASTM C94 §7]", () => {
    const four = slumpRangeMm(inToMm(4), "target", "IP");
    expect(four.min).toBeCloseTo(inToMm(3), 9);
    expect(four.max).toBeCloseTo(inToMm(5), 9);
    const two = slumpRangeMm(inToMm(2), "target", "IP");
    expect(two.min).toBeCloseTo(inToMm(1.5), 9);
    const five = slumpRangeMm(inToMm(5), "target", "IP");
    expect(five.max).toBeCloseTo(inToMm(6.5), 9);
  });
});

describe("slumpRangeMm, maximum (not to exceed)", () => {
  it("+0 / −40 mm up to 75 mm, +0 / −65 mm above [memory: ASTM C94 §7]", () => {
    expect(slumpRangeMm(75, "maximum")).toEqual({ min: 35, max: 75 });
    expect(slumpRangeMm(100, "maximum")).toEqual({ min: 35, max: 100 });
    expect(slumpRangeMm(30, "maximum")).toEqual({ min: 0, max: 30 });
  });

  it("+0 / −1½ in up to 3 in, +0 / −2½ in above, for IP [memory: ASTM C94 §7]", () => {
    const three = slumpRangeMm(inToMm(3), "maximum", "IP");
    expect(three.min).toBeCloseTo(inToMm(1.5), 9);
    expect(three.max).toBeCloseTo(inToMm(3), 9);
    expect(slumpRangeMm(inToMm(4), "maximum", "IP").min).toBeCloseTo(inToMm(1.5), 9);
  });

  it("refuses a negative specified slump", () => {
    expect(() => slumpRangeMm(-5, "target")).toThrow(ConcreteInputError);
  });
});

describe("airRangePct and slumpFlowRangeMm", () => {
  it("air ±1.5 percentage points [memory: ASTM C94]", () => {
    expect(airRangePct(6)).toEqual({ min: 4.5, max: 7.5 });
    expect(airRangePct(1)).toEqual({ min: 0, max: 2.5 });
  });

  it("slump flow ±50 mm below 560 mm, ±75 mm from 560 mm [memory: ASTM C94 slump-flow tolerance]", () => {
    expect(slumpFlowRangeMm(500)).toEqual({ min: 450, max: 550 });
    expect(slumpFlowRangeMm(560)).toEqual({ min: 485, max: 635 });
    expect(slumpFlowRangeMm(650)).toEqual({ min: 575, max: 725 });
    // Exactly 22 in takes the wider ±3 in, as exactly 560 mm takes ±75 mm.
    const at22 = slumpFlowRangeMm(inToMm(22), "IP");
    expect(at22.min).toBeCloseTo(inToMm(19), 9);
    expect(at22.max).toBeCloseTo(inToMm(25), 9);
    const below22 = slumpFlowRangeMm(inToMm(21), "IP");
    expect(below22.min).toBeCloseTo(inToMm(19), 9);
    expect(below22.max).toBeCloseTo(inToMm(23), 9);
    const ip = slumpFlowRangeMm(inToMm(24), "IP");
    expect(ip.min).toBeCloseTo(inToMm(21), 9);
    expect(ip.max).toBeCloseTo(inToMm(27), 9);
  });
});

describe("withinRange", () => {
  it("includes both ends and ignores a missing bound", () => {
    expect(withinRange(35, { min: 35, max: 65 })).toBe(true);
    expect(withinRange(65, { min: 35, max: 65 })).toBe(true);
    expect(withinRange(66, { min: 35, max: 65 })).toBe(false);
    expect(withinRange(-100, { max: 35 })).toBe(true);
    expect(withinRange(1000, { min: 35 })).toBe(true);
    expect(withinRange(34, { min: 35 })).toBe(false);
  });

  it("accepts a value typed in inches at an inch limit stored in mm", () => {
    const range = slumpRangeMm(inToMm(4), "target", "IP");
    expect(withinRange(inToMm(3), range)).toBe(true);
    expect(withinRange(inToMm(5), range)).toBe(true);
  });
});

describe("checkFieldTest", () => {
  const spec = { slumpType: "target" as const, specifiedSlumpMm: 100, specifiedAirPct: 6 };

  it("reports each measured property with its range", () => {
    const result = checkFieldTest({
      slumpMm: 110,
      slumpType: "target",
      specifiedSlumpMm: 100,
      airPct: 5,
      specifiedAirPct: 6,
      concreteTempC: 30,
    });
    expect(result.ok).toBe(true);
    expect(result.slump).toEqual({ value: 110, range: { min: 75, max: 125 }, ok: true });
    expect(result.air).toEqual({ value: 5, range: { min: 4.5, max: 7.5 }, ok: true });
    expect(result.temperature).toEqual({ value: 30, range: { max: 35 }, ok: true });
    expect(result.retestNote).toBeUndefined();
  });

  it("flags an out-of-range property and asks for a check test on another portion of the same sample [src: ASTM C94 slump and air tolerance clause; memory of wording]", () => {
    const result = checkFieldTest({
      slumpMm: 130,
      slumpType: "target",
      specifiedSlumpMm: 100,
      specifiedAirPct: 6,
      concreteTempC: 12,
      minConcreteTempC: 13,
    });
    expect(result.ok).toBe(false);
    expect(result.slump?.ok).toBe(false);
    expect(result.air).toBeUndefined();
    expect(result.temperature?.ok).toBe(false);
    expect(result.retestNote).toMatch(/check test at once on another portion of the same sample/);
    expect(result.retestNote).toMatch(/failed the specification/);
    expect(result.retestNote).toMatch(/purchaser's decision/);
    expect(result.retestNote).not.toMatch(/rejected/);
  });

  it("a temperature out of range alone asks for no C94 check test: the limit is the project specification's [src: ASTM C94 covers slump and air]", () => {
    const result = checkFieldTest({ slumpType: "target", specifiedSlumpMm: 100, specifiedAirPct: 6, concreteTempC: 36 });
    expect(result.ok).toBe(false);
    expect(result.temperature?.ok).toBe(false);
    expect(result.retestNote).toBeUndefined();
  });

  it("asks for a check test on air content alone, not on temperature alone [src: ASTM C94 covers slump and air; the temperature limit is the project specification's]", () => {
    const air = checkFieldTest({ ...spec, airPct: 8, concreteTempC: 30 });
    expect(air.ok).toBe(false);
    expect(air.air?.ok).toBe(false);
    expect(air.retestNote).toMatch(/check test at once on another portion of the same sample/);
    const hot = checkFieldTest({ ...spec, slumpMm: 100, airPct: 6, concreteTempC: 36 });
    expect(hot.ok).toBe(false);
    expect(hot.temperature?.ok).toBe(false);
    expect(hot.retestNote).toBeUndefined();
  });

  it("judges only what was measured, and a temperature range without a minimum has no min [computed]", () => {
    const airOnly = checkFieldTest({ ...spec, airPct: 6 });
    expect(airOnly).toStrictEqual({ ok: true, air: { value: 6, range: { min: 4.5, max: 7.5 }, ok: true } });
    const slumpOnly = checkFieldTest({ ...spec, slumpMm: 100 });
    expect(slumpOnly.ok).toBe(true);
    expect(slumpOnly.air).toBeUndefined();
    expect(slumpOnly.temperature).toBeUndefined();
    const tempOnly = checkFieldTest({ ...spec, concreteTempC: 30 });
    expect(tempOnly).toStrictEqual({ ok: true, temperature: { value: 30, range: { max: 35 }, ok: true } });
    expect(checkFieldTest({ ...spec, concreteTempC: 12, minConcreteTempC: 13 }).temperature?.range).toStrictEqual({ max: 35, min: 13 });
  });

  it("names the field of a bad measurement", () => {
    try {
      checkFieldTest({ slumpMm: Number.NaN, slumpType: "target", specifiedSlumpMm: 100, specifiedAirPct: 6 });
      throw new Error("expected a throw");
    } catch (error) {
      expect(error).toBeInstanceOf(ConcreteInputError);
      expect((error as ConcreteInputError).field).toBe("slumpMm");
    }
  });
});

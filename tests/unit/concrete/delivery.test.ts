import { describe, it, expect } from "vitest";

import { checkDischarge, checkWaterAddition } from "../../../lib/concrete/delivery";
import { ConcreteInputError } from "../../../lib/concrete/errors";

const at = (hhmm: string) => new Date(`2025-07-14T${hhmm}:00Z`);

describe("checkDischarge", () => {
  it("batched 10:00, finished 11:30 → within 90 min [src: ASTM C94 §10.7, DOMAIN check]", () => {
    expect(checkDischarge({ batchedAt: at("10:00"), dischargeFinishedAt: at("11:30") })).toEqual({
      minutes: 90,
      limitMinutes: 90,
      withinTime: true,
      withinRevolutions: null,
    });
  });

  it("batched 10:00, finished 11:31 → exceeded [src: ASTM C94 §10.7, DOMAIN check]", () => {
    const result = checkDischarge({ batchedAt: at("10:00"), dischargeFinishedAt: at("11:31") });
    expect(result.minutes).toBe(91);
    expect(result.withinTime).toBe(false);
  });

  it("accepts a shorter hot-weather limit from the specification [src: ASCC Position Statement 32]", () => {
    expect(checkDischarge({ batchedAt: at("10:00"), dischargeFinishedAt: at("11:05"), limitMinutes: 60 }).withinTime).toBe(false);
  });

  it("judges revolutions only when the order states a limit [src: ASTM C94-17a §6.1.9]", () => {
    const base = { batchedAt: at("10:00"), dischargeFinishedAt: at("11:00") };
    expect(checkDischarge({ ...base, revolutions: 320 }).withinRevolutions).toBeNull();
    expect(checkDischarge({ ...base, revolutions: 320, revolutionLimit: 300 }).withinRevolutions).toBe(false);
    expect(checkDischarge({ ...base, revolutions: 300, revolutionLimit: 300 }).withinRevolutions).toBe(true);
    expect(checkDischarge({ ...base, revolutionLimit: 300 }).withinRevolutions).toBeNull();
  });

  it("accepts a discharge that ends at the batch time (0 min), refusing only an earlier one [computed]", () => {
    expect(checkDischarge({ batchedAt: at("10:00"), dischargeFinishedAt: at("10:00") })).toMatchObject({ minutes: 0, withinTime: true });
  });

  it("refuses discharge before batching, by field", () => {
    try {
      checkDischarge({ batchedAt: at("10:00"), dischargeFinishedAt: at("09:59") });
      throw new Error("expected a throw");
    } catch (error) {
      expect(error).toBeInstanceOf(ConcreteInputError);
      expect((error as ConcreteInputError).field).toBe("dischargeFinishedAt");
      expect((error as ConcreteInputError).message).toBe("Discharge cannot finish before the concrete was batched");
    }
    expect(() => checkDischarge({ batchedAt: new Date("nope"), dischargeFinishedAt: at("10:00") })).toThrow(
      "Batch time must be a valid date and time",
    );
  });
});

describe("checkWaterAddition", () => {
  it("first 10:40, last 10:55 → within the 15-min window [src: ASTM C94, DOMAIN check]", () => {
    const result = checkWaterAddition({ firstAt: at("10:40"), lastAt: at("10:55"), addedLitres: 20, allowedLitres: 30 });
    expect(result.minutesSpan).toBe(15);
    expect(result.withinWindow).toBe(true);
    expect(result.withinAllowance).toBe(true);
    expect(result.remainingLitres).toBe(10);
    expect(result.note).toBe(
      "One addition only, all portions within 15 min of the first, then at least 30 drum revolutions " +
        "at mixing speed; never beyond the mix design's maximum water.",
    );
  });

  it("first 10:40, last 10:56 → outside the window [src: ASTM C94, DOMAIN check]", () => {
    expect(
      checkWaterAddition({ firstAt: at("10:40"), lastAt: at("10:56"), addedLitres: 20, allowedLitres: 30 }).withinWindow,
    ).toBe(false);
  });

  it("never allows more than the mix's remaining water [src: ASTM C94]", () => {
    const result = checkWaterAddition({ firstAt: at("10:40"), lastAt: at("10:45"), addedLitres: 35, allowedLitres: 30 });
    expect(result.withinAllowance).toBe(false);
    expect(result.remainingLitres).toBe(0);
    expect(checkWaterAddition({ firstAt: at("10:40"), lastAt: at("10:40"), addedLitres: 30, allowedLitres: 30 }).withinAllowance).toBe(true);
  });

  it("refuses a last portion before the first, and negative water", () => {
    expect(() => checkWaterAddition({ firstAt: at("10:40"), lastAt: at("10:39"), addedLitres: 5, allowedLitres: 30 })).toThrow(
      ConcreteInputError,
    );
    try {
      checkWaterAddition({ firstAt: at("10:40"), lastAt: at("10:45"), addedLitres: -5, allowedLitres: 30 });
      throw new Error("expected a throw");
    } catch (error) {
      expect((error as ConcreteInputError).field).toBe("addedLitres");
    }
  });
});

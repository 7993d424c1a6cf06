import { describe, it, expect } from "vitest";

import {
  ConcreteInputError,
  assertDate,
  assertFinite,
  assertNonNegative,
  assertPositive,
  assertRange,
  atLeast,
  atMost,
} from "../../../lib/concrete/errors";

function catchError(fn: () => unknown): unknown {
  try {
    fn();
  } catch (error) {
    return error;
  }
  throw new Error("expected a throw");
}

describe("ConcreteInputError", () => {
  it("is an Error with a name, a field and a site-readable message", () => {
    const error = new ConcreteInputError("relativeHumidityPct", "Relative humidity must be between 0 and 100 %");
    expect(error).toBeInstanceOf(Error);
    expect(error).toBeInstanceOf(ConcreteInputError);
    expect(error.name).toBe("ConcreteInputError");
    expect(error.field).toBe("relativeHumidityPct");
    expect(error.message).toBe("Relative humidity must be between 0 and 100 %");
  });
});

describe("assertion helpers", () => {
  it("assertRange words the bounds and unit the way the field screen shows them", () => {
    const error = catchError(() => assertRange(120, "relativeHumidityPct", "Relative humidity", 0, 100, "%"));
    expect(error).toBeInstanceOf(ConcreteInputError);
    expect((error as ConcreteInputError).field).toBe("relativeHumidityPct");
    expect((error as ConcreteInputError).message).toBe("Relative humidity must be between 0 and 100 %");
    expect(assertRange(100, "rh", "Relative humidity", 0, 100, "%")).toBe(100);
    expect(assertRange(0, "rh", "Relative humidity", 0, 100, "%")).toBe(0);
  });

  it("refuses NaN and infinities by field name", () => {
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
      const error = catchError(() => assertFinite(bad, "windKmh", "Wind speed"));
      expect(error).toMatchObject({ name: "ConcreteInputError", field: "windKmh", message: "Wind speed must be a number" });
    }
    // NaN must not slip through a range check either (NaN < min is false).
    expect(() => assertRange(Number.NaN, "airTempC", "Air temperature", -40, 70, "°C")).toThrow(ConcreteInputError);
  });

  it("separates negative from non-positive values", () => {
    expect(assertNonNegative(0, "surfaceM2", "Surface")).toBe(0);
    expect(() => assertNonNegative(-1, "surfaceM2", "Surface")).toThrow("Surface cannot be negative");
    expect(() => assertPositive(0, "volumeM3", "Volume")).toThrow("Volume must be greater than zero");
  });

  it("refuses an Invalid Date", () => {
    expect(() => assertDate(new Date("not a time"), "batchedAt", "Batch time")).toThrow(
      "Batch time must be a valid date and time",
    );
    const ok = new Date("2025-06-01T10:00:00Z");
    expect(assertDate(ok, "batchedAt", "Batch time")).toBe(ok);
  });

  it("compares with published limits without floating-point false failures [computed]", () => {
    const average = (24.4 + 39.8 + 25.8) / 3;
    expect(average).toBeLessThan(30); // the binary result really is 29.999999999999996
    expect(atLeast(average, 30)).toBe(true);
    expect(atLeast(29.99, 30)).toBe(false);
    expect(atMost(0.1 + 0.2, 0.3)).toBe(true);
    expect(atMost(0.31, 0.3)).toBe(false);
  });

  it("allows one part in 10⁹ of the limit, inclusive, and at least 10⁻⁹ near zero [computed from the tolerance rule]", () => {
    // The edge itself counts as within: the comparison is inclusive like the published "not less than".
    expect(atLeast(1 - 1e-9, 1)).toBe(true);
    expect(atMost(1 + 1e-9, 1)).toBe(true);
    // Relative: 30 MPa allows 3 × 10⁻⁸ MPa, so 30 − 10⁻⁸ passes and 30 − 10⁻⁷ does not.
    expect(atLeast(30 - 1e-8, 30)).toBe(true);
    expect(atLeast(30 - 1e-7, 30)).toBe(false);
    expect(atMost(30 + 1e-8, 30)).toBe(true);
    expect(atMost(30 + 1e-7, 30)).toBe(false);
    // Near zero the allowance does not shrink below 10⁻⁹.
    expect(atLeast(-5e-10, 0.001)).toBe(false);
    expect(atLeast(0.001 - 5e-10, 0.001)).toBe(true);
    expect(atMost(0.001 + 5e-10, 0.001)).toBe(true);
  });
});

// Input errors for the concrete calculations, worded for the person on site.

/** A value the calculation cannot use; `field` names the input so a form can mark it. */
export class ConcreteInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = "ConcreteInputError";
    this.field = field;
  }
}

// Sensor dropouts and empty form fields arrive as NaN or undefined; refuse them by name
// rather than letting NaN flow into a pass/fail verdict.
export function assertFinite(value: number, field: string, label: string): number {
  // Stryker disable next-line ConditionalExpression: equivalent, Number.isFinite also refuses a non-number
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new ConcreteInputError(field, `${label} must be a number`);
  }
  return value;
}

// Inclusive range check; `unit` is appended after the bounds ("between 0 and 100 %").
export function assertRange(
  value: number,
  field: string,
  label: string,
  min: number,
  max: number,
  unit = "",
): number {
  assertFinite(value, field, label);
  if (value < min || value > max) {
    const suffix = unit ? ` ${unit}` : "";
    throw new ConcreteInputError(field, `${label} must be between ${min} and ${max}${suffix}`);
  }
  return value;
}

export function assertNonNegative(value: number, field: string, label: string): number {
  assertFinite(value, field, label);
  if (value < 0) throw new ConcreteInputError(field, `${label} cannot be negative`);
  return value;
}

export function assertPositive(value: number, field: string, label: string): number {
  assertFinite(value, field, label);
  if (value <= 0) throw new ConcreteInputError(field, `${label} must be greater than zero`);
  return value;
}

// An Invalid Date has a NaN time; a form that lost its time picker value produces one.
export function assertDate(value: Date, field: string, label: string): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) {
    throw new ConcreteInputError(field, `${label} must be a valid date and time`);
  }
  return value;
}

// Tolerance for comparing computed values with published limits: averages such as
// (24.4 + 39.8 + 25.8) / 3 come out as 29.999999999999996 and must not fail a 30 MPa limit.
const RELATIVE_EPSILON = 1e-9;

export function atLeast(value: number, limit: number): boolean {
  return value >= limit - RELATIVE_EPSILON * Math.max(1, Math.abs(limit));
}

export function atMost(value: number, limit: number): boolean {
  return value <= limit + RELATIVE_EPSILON * Math.max(1, Math.abs(limit));
}

// Shared by the formula library's unit tests.
import { expect } from "vitest";
import { ConcreteInputError } from "../../../lib/concrete/errors";

/** The field a ConcreteInputError names (fails when `fn` does not throw one). */
export function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(ConcreteInputError);
    return (error as ConcreteInputError).field;
  }
  throw new Error("expected a ConcreteInputError");
}

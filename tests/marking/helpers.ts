import { expect } from "vitest";
import { MarkingInputError, type MarkingInputErrorCode } from "@/lib/marking/marking-input-error";

export { logRelativeError } from "./log-relative-error";

/**
 * Asserts |actual - expected| <= max(abs, rel * |expected|). Both numbers must be finite.
 * The tolerance is an argument, never an assertion message.
 */
export function expectClose(actual: number, expected: number, tolerance: { rel?: number; abs?: number }): void {
  const allowed = Math.max(tolerance.abs ?? 0, (tolerance.rel ?? 0) * Math.abs(expected));
  expect(Number.isFinite(actual), `actual value ${actual} is not finite`).toBe(true);
  expect(Number.isFinite(expected), `expected value ${expected} is not finite`).toBe(true);
  expect(Math.abs(actual - expected), `|${actual} - ${expected}| should be at most ${allowed}`).toBeLessThanOrEqual(allowed);
}

/** Runs `action` and asserts it throws MarkingInputError with the given code and a sentence. */
export function expectMarkingError(action: () => unknown, code: MarkingInputErrorCode): MarkingInputError {
  let caught: unknown;
  try {
    action();
  } catch (error) {
    caught = error;
  }
  expect(caught, `expected a MarkingInputError with code ${code}`).toBeInstanceOf(MarkingInputError);
  const error = caught as MarkingInputError;
  expect(error.code).toBe(code);
  expect(error.message.length).toBeGreaterThan(10);
  expect(error.functionName.length).toBeGreaterThan(0);
  return error;
}

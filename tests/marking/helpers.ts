import { expect } from "vitest";
import { MarkingInputError, type MarkingInputErrorCode } from "@/lib/marking/marking-input-error";

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

/**
 * Log relative error, the number of agreeing significant digits used by NIST's StRD:
 * LRE = -log10(|estimate - certified| / |certified|), or -log10(|estimate|) when the certified
 * value is 0; capped at 15; 0 for a non-finite estimate.
 */
export function logRelativeError(estimate: number, certified: number): number {
  if (!Number.isFinite(estimate)) return 0;
  const error = certified === 0 ? Math.abs(estimate) : Math.abs(estimate - certified) / Math.abs(certified);
  if (error === 0) return 15;
  return Math.max(0, Math.min(15, -Math.log10(error)));
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

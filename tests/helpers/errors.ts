import { expect } from "vitest";
import { AppError, type ErrorCode } from "@/lib/errors";

/** Runs fn and returns the AppError it throws; fails the test if it returns or throws anything else. */
export function appErrorFrom(fn: () => unknown): AppError {
  let thrown: unknown;
  try {
    fn();
  } catch (e) {
    thrown = e;
  }
  expect(thrown, "expected an AppError to be thrown").toBeInstanceOf(AppError);
  return thrown as AppError;
}

/** The async form of appErrorFrom. */
export async function appErrorFromAsync(fn: () => Promise<unknown>): Promise<AppError> {
  let thrown: unknown;
  try {
    await fn();
  } catch (e) {
    thrown = e;
  }
  expect(thrown, "expected an AppError to be thrown").toBeInstanceOf(AppError);
  return thrown as AppError;
}

/** Asserts that fn throws an AppError with the code (and so the HTTP status that goes with it). */
export function expectRefused(fn: () => unknown, code: ErrorCode): AppError {
  const err = appErrorFrom(fn);
  expect(err.code).toBe(code);
  return err;
}

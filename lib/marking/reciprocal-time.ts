import { requirePositiveNumber } from "./internal/validate";

/**
 * Rate from a time, for clock and disappearing-mark reactions: rate is proportional to 1/t
 * (common practice), so the relative rate is 1 / t.
 *
 * @param time - time taken, greater than zero, any unit (the result is per that unit)
 * @returns 1 / time
 * @throws {MarkingInputError} `not-a-number`, `not-positive`
 * @example
 * reciprocalTime(40); // => 0.025  (s^-1 for t in s)
 */
export function reciprocalTime(time: number): number {
  requirePositiveNumber(time, "time", "reciprocalTime");
  return 1 / time;
}

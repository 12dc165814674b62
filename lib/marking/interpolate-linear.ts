import { interpolateSorted, requireWithin, sortReadings } from "./internal/sorted-readings";
import { requireFiniteNumber } from "./internal/validate";

/**
 * Value of y at a chosen x by straight-line interpolation between the two nearest readings.
 *
 * Sorts the readings by x, finds x_i <= at <= x_(i+1) and returns
 * y_i + (at - x_i) (y_(i+1) - y_i) / (x_(i+1) - x_i). Never extrapolates.
 *
 * @param x - independent variable (for example time / s); all different
 * @param y - readings, same length as x
 * @param at - where to read off y, inside the range of x, same unit as x
 * @returns y at `at`, in the unit of y
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points` (n < 2),
 *   `repeated-x`, `out-of-range`
 * @example
 * interpolateLinear([0, 10, 20], [0, 30, 40], 15); // => 35
 */
export function interpolateLinear(x: readonly number[], y: readonly number[], at: number): number {
  const functionName = "interpolateLinear";
  const readings = sortReadings(x, y, { x: "x", y: "y", purpose: "Reading a value between readings" }, 2, functionName);
  requireFiniteNumber(at, "chosen x", functionName);
  requireWithin(readings, at, "value", functionName);
  return interpolateSorted(readings, at);
}

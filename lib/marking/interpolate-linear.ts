import { MarkingInputError } from "./marking-input-error";
import { requireDistinct, requireFiniteNumber, requireFiniteSeries, requireMinimumPoints, requireSameLength } from "./internal/validate";

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
  requireFiniteSeries(x, "x", functionName);
  requireFiniteSeries(y, "y", functionName);
  requireSameLength(x, y, "x", "y", functionName);
  requireMinimumPoints(x.length, 2, "Reading a value between readings", functionName);
  requireDistinct(x, "x", functionName);
  requireFiniteNumber(at, "chosen x", functionName);
  const order = x.map((_, i) => i).sort((i, j) => x[i] - x[j]);
  const low = x[order[0]];
  const high = x[order[order.length - 1]];
  if (at < low || at > high) {
    throw new MarkingInputError(
      "out-of-range",
      functionName,
      `The value ${at} is outside the readings (${low} to ${high}); choose a point between the first and last reading.`,
    );
  }
  for (let s = 1; s < order.length; s += 1) {
    const i = order[s - 1];
    const j = order[s];
    if (at <= x[j]) {
      if (at === x[j]) return y[j];
      if (at === x[i]) return y[i];
      return y[i] + ((at - x[i]) * (y[j] - y[i])) / (x[j] - x[i]);
    }
  }
  return y[order[order.length - 1]];
}

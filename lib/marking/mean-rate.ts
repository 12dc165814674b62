import { interpolateSorted, requireWithin, sortReadings } from "./internal/sorted-readings";
import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber } from "./internal/validate";

/** Options for {@link meanRate}. */
export interface MeanRateOptions {
  /** true: return the signed gradient dy/dx (negative for a falling quantity). Default false. */
  readonly signed?: boolean;
}

/**
 * Mean rate over an interval: the gradient of the chord between two times.
 *
 * rate = |y(to) - y(from)| / (to - from), where y at each end is a reading or, between readings,
 * a straight-line interpolation. A rate is reported as a positive number whether the quantity
 * rises or falls (IUPAC convention); pass `signed: true` for the signed gradient.
 *
 * @param x - times (or any independent variable), all different
 * @param y - readings, same length as x
 * @param from - start of the interval, same unit as x, inside the readings
 * @param to - end of the interval, same unit as x, inside the readings, not equal to `from`
 * @param options - `signed` to keep the sign
 * @returns mean rate in y-unit per x-unit
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points`, `repeated-x`,
 *   `out-of-range`, `x-all-equal` (from = to)
 * @example
 * meanRate([0, 10, 20], [0, 30, 40], 0, 20); // => 2
 */
export function meanRate(
  x: readonly number[],
  y: readonly number[],
  from: number,
  to: number,
  options: MeanRateOptions = {},
): number {
  requireFiniteNumber(from, "start of the interval", "meanRate");
  requireFiniteNumber(to, "end of the interval", "meanRate");
  if (from === to) {
    throw new MarkingInputError("x-all-equal", "meanRate", "The interval starts and ends at the same time; choose two different times.");
  }
  const readings = sortReadings(x, y, { x: "x", y: "y", purpose: "A mean rate" }, 2, "meanRate");
  requireWithin(readings, from, "start of the interval", "meanRate");
  requireWithin(readings, to, "end of the interval", "meanRate");
  const start = interpolateSorted(readings, from);
  const end = interpolateSorted(readings, to);
  const gradient = (end - start) / (to - from);
  return options.signed ? gradient : Math.abs(gradient);
}

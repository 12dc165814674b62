import { rateAt, type RateAt, type RateAtOptions } from "./rate-at";
import { requireFiniteSeries } from "./internal/validate";
import { MarkingInputError } from "./marking-input-error";

/**
 * Initial rate: the gradient of the fitted curve at the first reading (usually t = 0).
 *
 * The same method as {@link rateAt} at x = smallest x. With "auto" a first-order curve is
 * preferred, because polynomial tangents at the end of the readings can be well off (common
 * practice).
 *
 * @param x - times, all different, at least 3
 * @param y - readings, same length
 * @param options - model, polynomial degree, signed (as for `rateAt`)
 * @returns as for `rateAt`, at the first reading
 * @throws {MarkingInputError} as for `rateAt`
 * @example
 * const t = [0, 10, 20, 30, 40, 50, 60];
 * initialRate(t, t.map((s) => 50 * (1 - Math.exp(-0.05 * s)))).rate; // => 2.5
 */
export function initialRate(x: readonly number[], y: readonly number[], options: RateAtOptions = {}): RateAt {
  requireFiniteSeries(x, "time", "initialRate");
  if (x.length === 0) {
    throw new MarkingInputError("too-few-points", "initialRate", "An initial rate needs readings; none were given.");
  }
  return rateAt(x, y, Math.min(...x), options);
}

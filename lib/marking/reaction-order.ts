import { linearFit } from "./linear-fit";
import { MarkingInputError } from "./marking-input-error";
import { requireMinimumPoints, requirePositiveSeries, requireSameLength } from "./internal/validate";

/** Result of {@link reactionOrder}. */
export interface ReactionOrder {
  /** Gradient of log10(rate) against log10(concentration). */
  readonly order: number;
  readonly orderStdErr: number;
  /**
   * The order rounded to the nearest half (0, 0.5, 1, 1.5, 2, ...) when it lies within 0.1 of it
   * (common practice), otherwise null.
   */
  readonly roundedOrder: number | null;
  /**
   * Rate constant for this reactant: the geometric mean of rate / c^n with n the rounded order
   * (or the fitted order when it does not round), in rate-unit per concentration-unit^n.
   */
  readonly rateConstant: number;
  /** R^2 of the log-log line (1 when every rate is equal and the order is 0). */
  readonly rSquared: number;
  readonly count: number;
}

/**
 * Order of reaction with respect to one reactant, from initial rates at several concentrations
 * (other concentrations held constant).
 *
 * rate = k c^n, so log rate = log k + n log c: the least-squares gradient of log10(rate)
 * against log10(c) is the order n. With two runs this equals log(r2 / r1) / log(c2 / c1).
 *
 * @param concentrations - concentration of the reactant in each run, greater than zero, at least 2 different
 * @param rates - initial rate of each run, greater than zero, any unit
 * @returns order, its standard error, the rounded order, rate constant and R^2
 * @throws {MarkingInputError} `not-a-number`, `not-positive`, `length-mismatch`,
 *   `too-few-points`, `x-all-equal`
 * @example
 * reactionOrder([0.1, 0.2, 0.3], [0.8, 3.2, 7.2]).order; // => 2
 */
export function reactionOrder(concentrations: readonly number[], rates: readonly number[]): ReactionOrder {
  const functionName = "reactionOrder";
  requirePositiveSeries(concentrations, "concentration", functionName);
  requirePositiveSeries(rates, "rate", functionName);
  requireSameLength(concentrations, rates, "concentration", "rate", functionName);
  requireMinimumPoints(concentrations.length, 2, "An order of reaction", functionName);
  if (concentrations.every((value) => value === concentrations[0])) {
    throw new MarkingInputError(
      "x-all-equal",
      functionName,
      "The concentration is the same in every run, so the order cannot be found; change the concentration between runs.",
    );
  }
  const fit = linearFit(
    concentrations.map((value) => Math.log10(value)),
    rates.map((value) => Math.log10(value)),
  );
  const nearestHalf = Math.round(fit.slope * 2) / 2;
  const roundedOrder = Math.abs(fit.slope - nearestHalf) <= 0.1 ? nearestHalf : null;
  const exponent = roundedOrder ?? fit.slope;
  let logSum = 0;
  concentrations.forEach((value, i) => {
    logSum += Math.log(rates[i]) - exponent * Math.log(value);
  });
  return {
    order: fit.slope,
    orderStdErr: fit.slopeStdErr,
    roundedOrder: roundedOrder === 0 ? 0 : roundedOrder,
    rateConstant: Math.exp(logSum / concentrations.length),
    rSquared: fit.rSquared,
    count: fit.count,
  };
}

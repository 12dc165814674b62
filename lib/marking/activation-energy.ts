import { linearFit } from "./linear-fit";
import { physicalConstants } from "./physical-constants";
import { MarkingInputError } from "./marking-input-error";
import { requireMinimumPoints, requirePositiveSeries, requireSameLength } from "./internal/validate";

/** Result of {@link activationEnergy}. */
export interface ActivationEnergy {
  /** Activation energy, J/mol. */
  readonly ea: number;
  /** Standard error of Ea, J/mol (R times the slope's standard error). */
  readonly eaStdErr: number;
  /** Pre-exponential factor A, in the unit of the rate constants. */
  readonly preExponential: number;
  /** ln A (the intercept of ln k against 1/T). */
  readonly lnPreExponential: number;
  /** Standard error of ln A. */
  readonly lnPreExponentialStdErr: number;
  /** Gradient of ln k against 1/T, in K. */
  readonly slope: number;
  readonly slopeStdErr: number;
  readonly rSquared: number;
  readonly count: number;
}

/**
 * Activation energy and pre-exponential factor from rate constants (or 1/t) at several
 * temperatures, by the Arrhenius plot.
 *
 * ln k = ln A - Ea / (R T): a least-squares straight line of ln k against 1/T gives
 * Ea = -gradient x R and A = e^intercept, with R = 8.31446261815324 J mol^-1 K^-1 (CODATA 2018,
 * exact). For a clock reaction pass 1/t for k: the gradient, and so Ea, is the same because the
 * constant of proportionality only shifts the intercept.
 *
 * @param temperaturesK - absolute temperatures in kelvin, all greater than zero, at least 2 different
 * @param rateConstants - k (or 1/t) at each temperature, all greater than zero, any unit
 * @returns Ea in J/mol with its standard error, A and ln A, the gradient and R^2
 * @throws {MarkingInputError} `not-a-number`, `not-positive`, `length-mismatch`,
 *   `too-few-points`, `x-all-equal`
 * @example
 * activationEnergy([300, 310], [1, 2]).ea; // => about 53 600 J/mol
 */
export function activationEnergy(temperaturesK: readonly number[], rateConstants: readonly number[]): ActivationEnergy {
  const functionName = "activationEnergy";
  requirePositiveSeries(temperaturesK, "temperature in kelvin", functionName);
  requirePositiveSeries(rateConstants, "rate constant", functionName);
  requireSameLength(temperaturesK, rateConstants, "temperature", "rate constant", functionName);
  requireMinimumPoints(temperaturesK.length, 2, "An activation energy", functionName);
  if (temperaturesK.every((value) => value === temperaturesK[0])) {
    throw new MarkingInputError(
      "x-all-equal",
      functionName,
      "Every temperature is the same, so no activation energy can be found; the runs need different temperatures.",
    );
  }
  const reciprocal = temperaturesK.map((value) => 1 / value);
  const logK = rateConstants.map((value) => Math.log(value));
  const fit = linearFit(reciprocal, logK);
  const r = physicalConstants.gasConstant;
  return {
    ea: -fit.slope * r,
    eaStdErr: fit.slopeStdErr * r,
    preExponential: Math.exp(fit.intercept),
    lnPreExponential: fit.intercept,
    lnPreExponentialStdErr: fit.interceptStdErr,
    slope: fit.slope,
    slopeStdErr: fit.slopeStdErr,
    rSquared: fit.rSquared,
    count: fit.count,
  };
}

import { MarkingInputError } from "./marking-input-error";
import { physicalConstants } from "./physical-constants";
import { requirePositiveNumber } from "./internal/validate";

/** Result of {@link twoPointActivationEnergy}. */
export interface TwoPointActivationEnergy {
  /** Activation energy, J/mol. */
  readonly ea: number;
  /** Pre-exponential factor A = k1 e^(Ea / (R T1)), in the unit of k. */
  readonly preExponential: number;
}

/**
 * Activation energy from rate constants at two temperatures.
 *
 * Ea = R ln(k2 / k1) / (1/T1 - 1/T2), A = k1 e^(Ea / (R T1)), with
 * R = 8.31446261815324 J mol^-1 K^-1. Very sensitive to the temperatures when they are close.
 *
 * @param temperature1K - first temperature, K, greater than zero
 * @param rateConstant1 - k at the first temperature, greater than zero (or a rate, or 1/t)
 * @param temperature2K - second temperature, K, greater than zero, different from the first
 * @param rateConstant2 - k at the second temperature, same unit as the first
 * @returns Ea in J/mol and A in the unit of k
 * @throws {MarkingInputError} `not-a-number`, `not-positive`, `x-all-equal` (same temperature)
 * @example
 * twoPointActivationEnergy(303.15, 1, 310.15, 1.47).ea; // => about 43 030 J/mol
 */
export function twoPointActivationEnergy(
  temperature1K: number,
  rateConstant1: number,
  temperature2K: number,
  rateConstant2: number,
): TwoPointActivationEnergy {
  const functionName = "twoPointActivationEnergy";
  requirePositiveNumber(temperature1K, "first temperature in kelvin", functionName);
  requirePositiveNumber(temperature2K, "second temperature in kelvin", functionName);
  requirePositiveNumber(rateConstant1, "first rate constant", functionName);
  requirePositiveNumber(rateConstant2, "second rate constant", functionName);
  if (temperature1K === temperature2K) {
    throw new MarkingInputError("x-all-equal", functionName, "The two temperatures are the same, so no activation energy can be found.");
  }
  const r = physicalConstants.gasConstant;
  const ea = (r * Math.log(rateConstant2 / rateConstant1)) / (1 / temperature1K - 1 / temperature2K);
  return { ea, preExponential: rateConstant1 * Math.exp(ea / (r * temperature1K)) };
}

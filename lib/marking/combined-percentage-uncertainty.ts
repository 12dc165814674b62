import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber } from "./internal/validate";

/** One factor of a product or quotient: its percentage uncertainty and its power (-1 for a divisor). */
export interface UncertainFactor {
  readonly percentage: number;
  /** Power of the factor in the formula (default 1; use -1 for a divisor, 2 for a square). */
  readonly power?: number;
}

/** Result of {@link combinedPercentageUncertainty}: both rules, named. */
export interface CombinedPercentageUncertainty {
  /** School rule (worst case): add |power| x percentage for every factor. */
  readonly linearSum: number;
  /** GUM rule (JCGM 100:2008, 5.1.6): root of the sum of (power x percentage)^2. */
  readonly quadrature: number;
  readonly explanation: string;
}

/**
 * Percentage uncertainty of a product or quotient, by both the school linear-sum rule and the GUM
 * quadrature rule, saying which is which.
 *
 * For y = c x1^p1 x2^p2 ..., school: %u(y) = sum |p_i| %u(x_i); GUM: %u(y) = sqrt(sum (p_i %u(x_i))^2).
 * The linear sum is never smaller. A quotient a / b has powers 1 and -1, so both rules use the
 * two percentages as they are.
 *
 * @param factors - each factor's percentage uncertainty (zero or more) and power
 * @returns the linear sum and the quadrature value, in %
 * @throws {MarkingInputError} `too-few-points` (no factors), `not-a-number`, `not-positive` (negative percentage)
 * @example
 * combinedPercentageUncertainty([{ percentage: 3 }, { percentage: 4, power: -1 }]);
 * // => { linearSum: 7, quadrature: 5, ... }
 */
export function combinedPercentageUncertainty(factors: readonly UncertainFactor[]): CombinedPercentageUncertainty {
  const functionName = "combinedPercentageUncertainty";
  if (!Array.isArray(factors) || factors.length === 0) {
    throw new MarkingInputError("too-few-points", functionName, "Give at least one percentage uncertainty to combine.");
  }
  let linearSum = 0;
  let sumOfSquares = 0;
  for (const factor of factors) {
    requireFiniteNumber(factor.percentage, "percentage uncertainty", functionName);
    const power = factor.power ?? 1;
    requireFiniteNumber(power, "power", functionName);
    if (factor.percentage < 0) {
      throw new MarkingInputError("not-positive", functionName, "A percentage uncertainty cannot be negative.");
    }
    linearSum += Math.abs(power) * factor.percentage;
    sumOfSquares += (power * factor.percentage) ** 2;
  }
  return {
    linearSum,
    quadrature: Math.sqrt(sumOfSquares),
    explanation:
      "linearSum adds the percentage uncertainties (the rule taught in schools, a worst case); quadrature combines them as the root of the sum of squares (the GUM rule).",
  };
}

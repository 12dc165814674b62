import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber, requireFiniteSeries } from "./internal/validate";

/**
 * Value of a polynomial given by ascending coefficients, by Horner's rule:
 * p(x) = c0 + x (c1 + x (c2 + ...)).
 *
 * @param coefficients - c0, c1, c2, ... (ascending powers), as returned by `polynomialFit`
 * @param x - where to evaluate, in the x unit of the fit
 * @returns p(x), in the y unit of the fit
 * @throws {MarkingInputError} `too-few-points` for no coefficients, `not-a-number`
 * @example
 * evaluatePolynomial([1, 0, 1], 3); // => 10
 */
export function evaluatePolynomial(coefficients: readonly number[], x: number): number {
  requireFiniteSeries(coefficients, "coefficients", "evaluatePolynomial");
  requireFiniteNumber(x, "x value", "evaluatePolynomial");
  if (coefficients.length === 0) {
    throw new MarkingInputError("too-few-points", "evaluatePolynomial", "A polynomial needs at least one coefficient.");
  }
  let value = 0;
  for (let k = coefficients.length - 1; k >= 0; k -= 1) value = value * x + coefficients[k];
  return value;
}

import { MarkingInputError } from "./marking-input-error";
import { polynomialLeastSquares } from "./internal/polynomial-least-squares";

/**
 * The highest polynomial degree {@link polynomialFit} accepts.
 *
 * @example
 * maximumPolynomialDegree; // => 10
 */
export const maximumPolynomialDegree = 10;

/** Result of {@link polynomialFit}. */
export interface PolynomialFit {
  readonly degree: number;
  /** Coefficients in ascending powers: y = c0 + c1 x + c2 x^2 + ... */
  readonly coefficients: readonly number[];
  /** Standard error of each coefficient, same order. */
  readonly coefficientStdErrs: readonly number[];
  /** Covariance matrix of the coefficients (ascending powers). */
  readonly covariance: readonly (readonly number[])[];
  /** Centred R^2 = 1 - SSres / sum((y - mean y)^2); 1 when every y is equal and fitted exactly. */
  readonly rSquared: number;
  /** sqrt(SSres / (n - degree - 1)); 0 when the curve passes exactly through every point. */
  readonly residualStdDev: number;
  readonly degreesOfFreedom: number;
  readonly count: number;
}

/**
 * Least-squares polynomial of a chosen degree (1 to 10).
 *
 * Minimises sum (y_i - sum_k c_k x_i^k)^2. The design matrix is built in the centred, scaled
 * variable u = (x - centre) / scale (centre = middle of the x range, scale = a power of two) and
 * factorised by Householder QR in double-double arithmetic; the coefficients and their covariance
 * s^2 (X^T X)^-1 are then converted back to powers of x. This reproduces NIST's hardest
 * polynomial set (Filip, degree 10) to about 7 significant digits or better; the normal equations
 * fail completely there.
 *
 * @param x - independent variable, any unit
 * @param y - dependent variable, any unit; same length as x
 * @param degree - whole number from 1 to 10
 * @returns coefficients in ascending powers, their standard errors and covariance, R^2, residual SD
 * @throws {MarkingInputError} `invalid-option` (degree not 1..10), `not-a-number`, `length-mismatch`,
 *   `too-few-points` (n < degree + 1), `repeated-x` (fewer than degree + 1 different x values),
 *   `ill-conditioned`
 * @example
 * polynomialFit([0, 1, 2, 3], [1, 2, 5, 10], 2).coefficients;
 * // => [1, 0, 1]  (y = 1 + x^2)
 */
export function polynomialFit(x: readonly number[], y: readonly number[], degree: number): PolynomialFit {
  if (!Number.isInteger(degree) || degree < 1 || degree > maximumPolynomialDegree) {
    throw new MarkingInputError(
      "invalid-option",
      "polynomialFit",
      `The degree of the curve must be a whole number from 1 to ${maximumPolynomialDegree}.`,
    );
  }
  const fit = polynomialLeastSquares(x, y, degree, false, "polynomialFit");
  return {
    degree,
    coefficients: fit.coefficients,
    coefficientStdErrs: fit.coefficientStdErrs,
    covariance: fit.covariance,
    rSquared: fit.rSquared,
    residualStdDev: fit.residualStdDev,
    degreesOfFreedom: fit.degreesOfFreedom,
    count: fit.count,
  };
}

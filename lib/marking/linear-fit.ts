import { straightLineLeastSquares } from "./internal/straight-line-least-squares";

/** Options for {@link linearFit}. */
export interface LinearFitOptions {
  /** Force the line through (0, 0): y = slope * x. Default false. */
  readonly throughOrigin?: boolean;
}

/** Result of {@link linearFit}. Units: slope in y-unit per x-unit, intercept in y-unit. */
export interface LinearFit {
  readonly slope: number;
  /** 0 when the line is forced through the origin. */
  readonly intercept: number;
  /** Standard error of the slope (Type A, from the scatter about the line). */
  readonly slopeStdErr: number;
  /** Standard error of the intercept; 0 when the line is forced through the origin. */
  readonly interceptStdErr: number;
  /**
   * Coefficient of determination. With an intercept: 1 - SSres / sum((y - mean y)^2).
   * Through the origin: the uncentred 1 - SSres / sum(y^2), as NIST certifies it. 1 when every
   * y is equal and the line fits them exactly.
   */
  readonly rSquared: number;
  /** sqrt(SSres / (n - parameters)); 0 when there are no spare readings. */
  readonly residualStdDev: number;
  /** n - parameters. When 0 the line goes exactly through every point and the standard errors are 0 because the scatter cannot be estimated. */
  readonly degreesOfFreedom: number;
  readonly count: number;
  readonly throughOrigin: boolean;
}

/**
 * Least-squares straight line (ordinary least squares), with or without an intercept.
 *
 * Minimises sum (y_i - (intercept + slope * x_i))^2. Solved on centred x, where the design
 * matrix [1, x - mean x] has orthogonal columns, so its QR solution is slope =
 * sum(dx dy) / sum(dx^2) and intercept = mean y - slope x mean x; every sum is carried in
 * double-double arithmetic (about 32 digits), so that NIST's Norris and NoInt sets come out to at
 * least 12 significant digits. Standard errors:
 * s_slope = s / sqrt(sum (x - mean x)^2), s_intercept = s * sqrt(1/n + mean(x)^2 / sum (x - mean x)^2)
 * with s = sqrt(SSres / (n - 2)); through the origin s_slope = s / sqrt(sum x^2), s with n - 1.
 *
 * @param x - independent variable, any unit (for example time / s)
 * @param y - dependent variable, any unit (for example volume / cm^3); same length as x
 * @param options - `throughOrigin`: fit y = slope * x
 * @returns slope (y-unit per x-unit), intercept, their standard errors, R^2 and residual SD
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points` (n < 2, or n < 1
 *   through the origin), `x-all-equal`
 * @example
 * linearFit([0, 1, 2, 3], [1, 3, 5, 7]);
 * // => { slope: 2, intercept: 1, slopeStdErr: 0, interceptStdErr: 0, rSquared: 1, residualStdDev: 0, ... }
 */
export function linearFit(x: readonly number[], y: readonly number[], options: LinearFitOptions = {}): LinearFit {
  const throughOrigin = options.throughOrigin === true;
  return { ...straightLineLeastSquares(x, y, throughOrigin, "linearFit"), throughOrigin };
}

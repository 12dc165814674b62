import { MarkingInputError } from "./marking-input-error";

/** A model for {@link levenbergMarquardt}: values and their partial derivatives at given parameters. */
export interface NonlinearModel {
  /** Model value at each data point, for the given parameters. */
  readonly values: (parameters: readonly number[]) => number[];
  /**
   * Jacobian: one row per data point, one column per parameter (d value / d parameter). The
   * fitter reads the rows before its next call, so a model may reuse the same arrays.
   */
  readonly jacobian: (parameters: readonly number[]) => number[][];
}

/** Options for {@link levenbergMarquardt}. */
export interface LevenbergMarquardtOptions {
  /** Stop after this many iterations (default 500) and report non-convergence. */
  readonly maxIterations?: number;
  /** Relative tolerance on the step and on the fall in the sum of squares (default 1e-13). */
  readonly tolerance?: number;
}

/** Result of {@link levenbergMarquardt}. */
export interface LevenbergMarquardtResult {
  readonly parameters: readonly number[];
  readonly residualSumOfSquares: number;
  readonly iterations: number;
}

function sumOfSquares(observed: readonly number[], fitted: readonly number[]): number {
  let total = 0;
  for (let i = 0; i < observed.length; i += 1) {
    const residual = observed[i] - fitted[i];
    total += residual * residual;
  }
  return total;
}

/**
 * Non-linear least squares by the Levenberg-Marquardt method.
 *
 * Minimises S(p) = sum (y_i - f_i(p))^2. Each step solves the damped system
 * (J^T J + lambda D^2) delta = J^T r by Cholesky (J the Jacobian, r = y - f, D = running column
 * norms of J, as in More's 1978 scaling); damping keeps the system positive definite, and the
 * answer's accuracy is set by the residuals, not by the step. A step is kept only when it lowers
 * S; lambda shrinks after a good step and grows after a poor one (gain-ratio rule). Converged
 * when both the relative step and the relative fall in S are below the tolerance, or when the
 * residuals are down to rounding level (an exact fit).
 *
 * @param observed - measured values y_i, in the model's unit
 * @param model - model values and Jacobian for a parameter vector
 * @param start - starting parameters
 * @param options - iteration limit and tolerance
 * @returns fitted parameters, residual sum of squares and iterations used
 * @throws {MarkingInputError} `not-converged` when no settled answer is reached within the
 *   iteration limit, or the model stops depending on some parameter
 * @example
 * // y = p0 * x fitted to (1, 2), (2, 4)
 * levenbergMarquardt([2, 4], { values: (p) => [p[0], 2 * p[0]], jacobian: () => [[1], [2]] }, [1]).parameters;
 * // => [2]
 */
export function levenbergMarquardt(
  observed: readonly number[],
  model: NonlinearModel,
  start: readonly number[],
  options: LevenbergMarquardtOptions = {},
): LevenbergMarquardtResult {
  const maxIterations = options.maxIterations ?? 500;
  const tolerance = options.tolerance ?? 1e-13;
  const m = start.length;
  const n = observed.length;
  let parameters = start.slice();
  let fitted = model.values(parameters);
  let current = sumOfSquares(observed, fitted);
  if (!Number.isFinite(current)) {
    throw new MarkingInputError("not-converged", "levenbergMarquardt", "The curve cannot be drawn from this starting guess.");
  }
  // A fit whose residuals are at rounding level is exact: stop there rather than chase noise.
  let observedScale = 0;
  for (const value of observed) observedScale = Math.max(observedScale, Math.abs(value));
  const roundingFloor = n * (4e-16 * observedScale) ** 2;
  const scaling = new Float64Array(m);
  const gram = new Float64Array(m * m);
  const gradient = new Float64Array(m);
  const system = new Float64Array(m * m);
  const step = new Float64Array(m);
  let lambda = 1e-3;
  let quietSteps = 0;
  for (let iteration = 1; iteration <= maxIterations; iteration += 1) {
    const jacobian = model.jacobian(parameters);
    // J^T J, J^T r and More's running column scaling D.
    gram.fill(0);
    gradient.fill(0);
    for (let i = 0; i < n; i += 1) {
      const row = jacobian[i];
      const residual = observed[i] - fitted[i];
      for (let j = 0; j < m; j += 1) {
        gradient[j] += row[j] * residual;
        for (let k = j; k < m; k += 1) gram[j * m + k] += row[j] * row[k];
      }
    }
    for (let j = 0; j < m; j += 1) {
      for (let k = 0; k < j; k += 1) gram[j * m + k] = gram[k * m + j];
      scaling[j] = Math.max(scaling[j], Math.sqrt(gram[j * m + j]));
      if (!(scaling[j] > 0) || !Number.isFinite(scaling[j])) {
        throw new MarkingInputError("not-converged", "levenbergMarquardt", "The curve stopped depending on one of its settings, so the fit cannot settle.");
      }
    }
    let accepted = false;
    for (let attempt = 0; attempt < 60 && !accepted; attempt += 1) {
      // Solve (J^T J + lambda D^2) step = J^T r by Cholesky (the damped matrix is positive definite).
      for (let j = 0; j < m * m; j += 1) system[j] = gram[j];
      for (let j = 0; j < m; j += 1) system[j * m + j] += lambda * scaling[j] * scaling[j];
      if (!choleskySolve(system, gradient, step, m)) {
        lambda *= 10;
        continue;
      }
      const trial = parameters.map((value, j) => value + step[j]);
      const trialFitted = model.values(trial);
      const trialSum = sumOfSquares(observed, trialFitted);
      // Predicted S after the step: S - 2 step.g + step.(J^T J) step.
      let predictedSum = current;
      for (let j = 0; j < m; j += 1) {
        predictedSum -= 2 * step[j] * gradient[j];
        for (let k = 0; k < m; k += 1) predictedSum += step[j] * gram[j * m + k] * step[k];
      }
      const predictedFall = current - predictedSum;
      const actualFall = current - trialSum;
      const gain = predictedFall > 0 ? actualFall / predictedFall : -1;
      let stepSize = 0;
      let parameterSize = 0;
      for (let j = 0; j < m; j += 1) {
        stepSize = Math.hypot(stepSize, scaling[j] * step[j]);
        parameterSize = Math.hypot(parameterSize, scaling[j] * parameters[j]);
      }
      const tinyStep = stepSize <= tolerance * (parameterSize + tolerance);
      if (Number.isFinite(trialSum) && trialSum <= current) {
        accepted = true;
        const relativeFall = current === 0 ? 0 : (current - trialSum) / current;
        parameters = trial;
        fitted = trialFitted;
        current = trialSum;
        if (gain > 0.75) lambda = Math.max(lambda / 3, 1e-16);
        else if (gain < 0.25) lambda *= 2;
        if ((relativeFall <= tolerance && tinyStep) || current <= roundingFloor) {
          quietSteps += 1;
          if (quietSteps >= 2 || current <= roundingFloor) {
            return { parameters, residualSumOfSquares: current, iterations: iteration };
          }
        } else {
          quietSteps = 0;
        }
      } else {
        if (tinyStep) {
          // No smaller step can lower S any further: this is the minimum to working precision.
          return { parameters, residualSumOfSquares: current, iterations: iteration };
        }
        lambda *= lambda < 1 ? 4 : 10;
      }
    }
    if (!accepted) {
      throw new MarkingInputError("not-converged", "levenbergMarquardt", "The curve fit could not find a better answer and did not settle.");
    }
  }
  throw new MarkingInputError(
    "not-converged",
    "levenbergMarquardt",
    `The curve fit did not settle within ${maxIterations} steps; the readings may not follow this kind of curve.`,
  );
}

/** Solves the symmetric positive-definite system a x = b (size m, row-major) in place of x; false if not positive definite. */
function choleskySolve(a: Float64Array, b: Float64Array, x: Float64Array, m: number): boolean {
  for (let j = 0; j < m; j += 1) {
    let diagonal = a[j * m + j];
    for (let k = 0; k < j; k += 1) diagonal -= a[j * m + k] * a[j * m + k];
    if (!(diagonal > 0)) return false;
    const root = Math.sqrt(diagonal);
    a[j * m + j] = root;
    for (let i = j + 1; i < m; i += 1) {
      let value = a[i * m + j];
      for (let k = 0; k < j; k += 1) value -= a[i * m + k] * a[j * m + k];
      a[i * m + j] = value / root;
    }
  }
  for (let i = 0; i < m; i += 1) {
    let value = b[i];
    for (let k = 0; k < i; k += 1) value -= a[i * m + k] * x[k];
    x[i] = value / a[i * m + i];
  }
  for (let i = m - 1; i >= 0; i -= 1) {
    let value = x[i];
    for (let k = i + 1; k < m; k += 1) value -= a[k * m + i] * x[k];
    x[i] = value / a[i * m + i];
  }
  return Number.isFinite(x[0]);
}

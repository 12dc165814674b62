import { householderLeastSquares } from "./internal/householder-least-squares";
import { MarkingInputError } from "./marking-input-error";

/** A model for {@link levenbergMarquardt}: values and their partial derivatives at given parameters. */
export interface NonlinearModel {
  /** Model value at each data point, for the given parameters. */
  readonly values: (parameters: readonly number[]) => number[];
  /** Jacobian: one row per data point, one column per parameter (d value / d parameter). */
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
 * Minimises S(p) = sum (y_i - f_i(p))^2. Each step solves the damped linear problem
 * min || [J; sqrt(lambda) D] delta - [r; 0] || by Householder QR (J the Jacobian, r = y - f,
 * D = running column norms of J, as in More's 1978 scaling). A step is kept only when it lowers
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
  const parameterCount = start.length;
  let parameters = start.slice();
  let fitted = model.values(parameters);
  let current = sumOfSquares(observed, fitted);
  if (!Number.isFinite(current)) {
    throw new MarkingInputError("not-converged", "levenbergMarquardt", "The curve cannot be drawn from this starting guess.");
  }
  // A fit whose residuals are at rounding level is exact: stop there rather than chase noise.
  let observedScale = 0;
  for (const value of observed) observedScale = Math.max(observedScale, Math.abs(value));
  const roundingFloor = observed.length * (4e-16 * observedScale) ** 2;
  const scaling = new Array<number>(parameterCount).fill(0);
  let lambda = 1e-3;
  let quietSteps = 0;
  for (let iteration = 1; iteration <= maxIterations; iteration += 1) {
    const jacobian = model.jacobian(parameters);
    for (let j = 0; j < parameterCount; j += 1) {
      let norm = 0;
      for (const row of jacobian) norm = Math.hypot(norm, row[j]);
      scaling[j] = Math.max(scaling[j], norm);
    }
    if (scaling.some((value) => value === 0 || !Number.isFinite(value))) {
      throw new MarkingInputError("not-converged", "levenbergMarquardt", "The curve stopped depending on one of its settings, so the fit cannot settle.");
    }
    const residuals = observed.map((value, i) => value - fitted[i]);
    let accepted = false;
    for (let attempt = 0; attempt < 60 && !accepted; attempt += 1) {
      const damping = Math.sqrt(lambda);
      const augmented = jacobian.map((row) => row.slice());
      for (let j = 0; j < parameterCount; j += 1) {
        const row = new Array<number>(parameterCount).fill(0);
        row[j] = damping * scaling[j];
        augmented.push(row);
      }
      const solved = householderLeastSquares(augmented, [...residuals, ...new Array<number>(parameterCount).fill(0)]);
      if (solved === null) {
        lambda *= 10;
        continue;
      }
      const step = solved.solution;
      const trial = parameters.map((value, j) => value + step[j]);
      const trialFitted = model.values(trial);
      const trialSum = sumOfSquares(observed, trialFitted);
      let predictedSum = 0;
      for (let i = 0; i < observed.length; i += 1) {
        let change = 0;
        for (let j = 0; j < parameterCount; j += 1) change += jacobian[i][j] * step[j];
        const remaining = residuals[i] - change;
        predictedSum += remaining * remaining;
      }
      const predictedFall = current - predictedSum;
      const actualFall = current - trialSum;
      const gain = predictedFall > 0 ? actualFall / predictedFall : -1;
      let stepSize = 0;
      let parameterSize = 0;
      for (let j = 0; j < parameterCount; j += 1) {
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

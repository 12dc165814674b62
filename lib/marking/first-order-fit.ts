import { firstOrderStart, type FirstOrderKind, type FirstOrderStart } from "./first-order-start";
import { inverseGramFromR, householderLeastSquares } from "./internal/householder-least-squares";
import { levenbergMarquardt } from "./levenberg-marquardt";
import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber } from "./internal/validate";

/** Options for {@link firstOrderFit}. */
export interface FirstOrderFitOptions {
  /** "rise": y = a(1 - e^(-kt)) + c (product formed, gas collected); "decay": y = a e^(-kt) + c. */
  readonly kind: FirstOrderKind;
  /** Allow a constant c (default true). false fixes c = 0. */
  readonly offset?: boolean;
  /** Starting values; when absent they are derived from the data (see `firstOrderStart`). */
  readonly start?: { readonly a: number; readonly k: number; readonly c?: number };
  /** Iteration limit for the fitter (default 500). */
  readonly maxIterations?: number;
}

/** Result of {@link firstOrderFit}. k is in reciprocal time units of t; a and c in units of y. */
export interface FirstOrderFit {
  readonly kind: FirstOrderKind;
  readonly offset: boolean;
  readonly a: number;
  readonly k: number;
  /** 0 when `offset` is false. */
  readonly c: number;
  readonly aStdErr: number;
  readonly kStdErr: number;
  /** 0 when `offset` is false. */
  readonly cStdErr: number;
  /** Covariance of (a, k, c), or of (a, k) when `offset` is false. */
  readonly covariance: readonly (readonly number[])[];
  readonly residualSumOfSquares: number;
  readonly residualStdDev: number;
  readonly rSquared: number;
  readonly degreesOfFreedom: number;
  readonly iterations: number;
  /** The start the fit began from. */
  readonly start: FirstOrderStart;
  /** Half-life ln 2 / k, in the time unit of t. */
  readonly halfLife: number;
}

function curve(kind: FirstOrderKind, a: number, k: number, c: number, t: number): number {
  const e = Math.exp(-k * t);
  return kind === "rise" ? a * (1 - e) + c : a * e + c;
}

/** Partial derivatives with respect to (a, k, c). */
function partials(kind: FirstOrderKind, a: number, k: number, t: number): [number, number, number] {
  const e = Math.exp(-k * t);
  return kind === "rise" ? [1 - e, a * t * e, 1] : [e, -a * t * e, 1];
}

/**
 * First-order rise or decay fitted by non-linear least squares.
 *
 * Models: rise y = a(1 - e^(-kt)) + c, decay y = a e^(-kt) + c (c = 0 when `offset` is false).
 * Minimises sum (y_i - f(t_i))^2 by Levenberg-Marquardt over (a, ln k, c) so that k stays
 * positive, starting from the given start or one derived from the data. Standard errors come
 * from the Jacobian at the answer: covariance = s^2 (J^T J)^-1, s^2 = SSres / (n - p). A fit that
 * does not settle, or that settles where the curve is effectively a straight line (k times the
 * time span below 0.001) or a step (k times the smallest time gap above 50), is reported as
 * `not-converged` instead of returning a misleading curve.
 *
 * @param t - times, any time unit (k comes out per that unit)
 * @param y - readings, any unit; same length as t
 * @param options - kind, offset, optional start and iteration limit
 * @returns a, k, c with standard errors, R^2, residual SD and half-life
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points` (needs p + 1
 *   readings), `repeated-x`, `invalid-option`, `not-converged`
 * @example
 * const t = [0, 1, 2, 3, 4, 5];
 * firstOrderFit(t, t.map((s) => 40 * (1 - Math.exp(-0.5 * s))), { kind: "rise", offset: false });
 * // => { a: 40, k: 0.5, c: 0, ... }
 */
export function firstOrderFit(t: readonly number[], y: readonly number[], options: FirstOrderFitOptions): FirstOrderFit {
  const functionName = "firstOrderFit";
  const kind = options?.kind;
  if (kind !== "rise" && kind !== "decay") {
    throw new MarkingInputError("invalid-option", functionName, 'Choose the kind of curve: "rise" or "decay".');
  }
  const offset = options.offset !== false;
  let start: FirstOrderStart;
  if (options.start) {
    requireFiniteNumber(options.start.a, "starting a", functionName);
    requireFiniteNumber(options.start.k, "starting k", functionName);
    if (options.start.k <= 0) {
      throw new MarkingInputError("not-positive", functionName, "The starting rate constant k must be greater than zero.");
    }
    firstOrderStart(t, y, kind, offset); // checks the readings the same way as without a start
    start = { a: options.start.a, k: options.start.k, c: offset ? (options.start.c ?? 0) : 0 };
  } else {
    start = firstOrderStart(t, y, kind, offset);
  }
  const n = t.length;
  const values = (p: readonly number[]): number[] => {
    const k = Math.exp(p[1]);
    const c = offset ? p[2] : 0;
    return t.map((time) => curve(kind, p[0], k, c, time));
  };
  // The rows are reused from call to call: the fitter reads them before asking again.
  const jacobianRows = t.map(() => new Array<number>(offset ? 3 : 2).fill(1));
  const jacobian = (p: readonly number[]): number[][] => {
    const k = Math.exp(p[1]);
    for (let i = 0; i < n; i += 1) {
      const e = Math.exp(-k * t[i]);
      const row = jacobianRows[i];
      row[0] = kind === "rise" ? 1 - e : e;
      row[1] = (kind === "rise" ? p[0] * t[i] * e : -p[0] * t[i] * e) * k;
    }
    return jacobianRows;
  };
  const initial = offset ? [start.a, Math.log(start.k), start.c] : [start.a, Math.log(start.k)];
  const solved = levenbergMarquardt(y, { values, jacobian }, initial, { maxIterations: options.maxIterations });
  const a = solved.parameters[0];
  const k = Math.exp(solved.parameters[1]);
  const c = offset ? solved.parameters[2] : 0;

  let minT = Infinity;
  let maxT = -Infinity;
  const sorted = [...t].sort((p, q) => p - q);
  let smallestGap = Infinity;
  for (let i = 0; i < sorted.length; i += 1) {
    minT = Math.min(minT, sorted[i]);
    maxT = Math.max(maxT, sorted[i]);
    if (i > 0 && sorted[i] > sorted[i - 1]) smallestGap = Math.min(smallestGap, sorted[i] - sorted[i - 1]);
  }
  if (!Number.isFinite(k) || k * (maxT - minT) < 1e-3) {
    throw new MarkingInputError(
      "not-converged",
      functionName,
      "These readings hardly curve at all, so a first-order curve cannot be pinned down; a straight line describes them better.",
    );
  }
  if (k * smallestGap > 50) {
    throw new MarkingInputError(
      "not-converged",
      functionName,
      "The change is over before the second reading, so a first-order curve cannot be pinned down; take readings closer together at the start.",
    );
  }

  const parameterCount = offset ? 3 : 2;
  const rows = t.map((time) => {
    const [da, dk, dc] = partials(kind, a, k, time);
    return offset ? [da, dk, dc] : [da, dk];
  });
  const decomposition = householderLeastSquares(rows, new Array<number>(n).fill(0));
  if (decomposition === null) {
    throw new MarkingInputError("not-converged", functionName, "The fitted curve does not pin down all of its settings; more readings are needed.");
  }
  const degreesOfFreedom = n - parameterCount;
  const residualSumOfSquares = solved.residualSumOfSquares;
  const residualVariance = degreesOfFreedom > 0 ? residualSumOfSquares / degreesOfFreedom : 0;
  const covariance = inverseGramFromR(decomposition.r).map((row) => row.map((entry) => entry * residualVariance));
  let mean = 0;
  for (const value of y) mean += value / n;
  let totalSS = 0;
  for (const value of y) totalSS += (value - mean) ** 2;
  return {
    kind,
    offset,
    a,
    k,
    c,
    aStdErr: Math.sqrt(covariance[0][0]),
    kStdErr: Math.sqrt(covariance[1][1]),
    cStdErr: offset ? Math.sqrt(covariance[2][2]) : 0,
    covariance,
    residualSumOfSquares,
    residualStdDev: Math.sqrt(residualVariance),
    rSquared: totalSS === 0 ? 1 : 1 - residualSumOfSquares / totalSS,
    degreesOfFreedom,
    iterations: solved.iterations,
    start,
    halfLife: Math.LN2 / k,
  };
}

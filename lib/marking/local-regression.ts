import { householderLeastSquares, inverseGramFromR } from "./internal/householder-least-squares";
import { MarkingInputError } from "./marking-input-error";
import { requireDistinct, requireFiniteNumber, requireFiniteSeries, requireSameLength } from "./internal/validate";

/** Options for {@link localRegression}. */
export interface LocalRegressionOptions {
  /** Fraction of the readings used around the chosen point (default 0.75), as in LOESS. */
  readonly span?: number;
  /** Degree of the local polynomial: 1 or 2 (default 2). */
  readonly degree?: 1 | 2;
}

/** Result of {@link localRegression}. */
export interface LocalRegression {
  /** Smoothed y at the chosen point. */
  readonly value: number;
  /** Gradient dy/dx of the smooth curve at the chosen point. */
  readonly slope: number;
  /** Standard uncertainty of that gradient. */
  readonly slopeStdErr: number;
  /** Number of readings with non-zero weight. */
  readonly pointsUsed: number;
  /** Half-width of the window, in x units. */
  readonly bandwidth: number;
}

/**
 * A smooth local curve (LOESS-style local polynomial) evaluated at one point, for data that
 * follows no simple model.
 *
 * Method: take the q = max(ceil(span * n), degree + 2) readings nearest to x0; weight each by the
 * tricube w = (1 - (d / h)^3)^3, d = |x - x0|, h just beyond the q-th nearest distance; fit
 * y = b0 + b1 (x - x0) + b2 (x - x0)^2 by weighted least squares (QR). Then value = b0 and
 * slope = b1. The slope's uncertainty is the sandwich form
 * s^2 [(X^T W X)^-1 X^T W^2 X (X^T W X)^-1]_11, with s^2 = sum w r^2 / (sum w) x n_eff / (n_eff - p)
 * and n_eff = (sum w)^2 / sum w^2.
 *
 * @param x - independent variable, all different
 * @param y - readings, same length
 * @param at - where to evaluate, inside the readings' x range
 * @param options - span (0 < span <= 1) and local degree
 * @returns value, slope (y-unit per x-unit) and its standard uncertainty
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points`, `repeated-x`,
 *   `out-of-range`, `invalid-option`
 * @example
 * localRegression([0, 1, 2, 3, 4, 5], [0, 1, 4, 9, 16, 25], 2.5).slope; // => 5 (exact for a quadratic)
 */
export function localRegression(
  x: readonly number[],
  y: readonly number[],
  at: number,
  options: LocalRegressionOptions = {},
): LocalRegression {
  const functionName = "localRegression";
  requireFiniteSeries(x, "x", functionName);
  requireFiniteSeries(y, "y", functionName);
  requireSameLength(x, y, "x", "y", functionName);
  requireDistinct(x, "x", functionName);
  requireFiniteNumber(at, "chosen x", functionName);
  const degree = options.degree ?? 2;
  const span = options.span ?? 0.75;
  if (degree !== 1 && degree !== 2) {
    throw new MarkingInputError("invalid-option", functionName, "The local curve must be of degree 1 or 2.");
  }
  if (!(span > 0 && span <= 1)) {
    throw new MarkingInputError("invalid-option", functionName, "The span must be more than 0 and at most 1.");
  }
  const parameterCount = degree + 1;
  if (x.length < parameterCount + 1) {
    throw new MarkingInputError(
      "too-few-points",
      functionName,
      `A smooth local curve needs at least ${parameterCount + 1} readings; only ${x.length} ${x.length === 1 ? "was" : "were"} given.`,
    );
  }
  const low = Math.min(...x);
  const high = Math.max(...x);
  if (at < low || at > high) {
    throw new MarkingInputError("out-of-range", functionName, `The value ${at} is outside the readings (${low} to ${high}).`);
  }
  const q = Math.min(x.length, Math.max(Math.ceil(span * x.length), parameterCount + 1));
  const distances = x.map((value) => Math.abs(value - at)).sort((p, r) => p - r);
  const bandwidth = distances[q - 1] * 1.000001 || (high - low) * 1e-6;
  const rows: number[][] = [];
  const weightedRhs: number[] = [];
  const used: { w: number; row: number[]; y: number }[] = [];
  x.forEach((value, i) => {
    const d = Math.abs(value - at) / bandwidth;
    if (d >= 1) return;
    const w = (1 - d ** 3) ** 3;
    const offset = (value - at) / bandwidth;
    const row = degree === 2 ? [1, offset, offset * offset] : [1, offset];
    const root = Math.sqrt(w);
    rows.push(row.map((entry) => entry * root));
    weightedRhs.push(y[i] * root);
    used.push({ w, row, y: y[i] });
  });
  const solved = used.length >= parameterCount ? householderLeastSquares(rows, weightedRhs) : null;
  if (solved === null) {
    throw new MarkingInputError("too-few-points", functionName, "Too few readings lie near this point to draw a local curve; choose a point among the readings.");
  }
  const bread = inverseGramFromR(solved.r);
  const meat = Array.from({ length: parameterCount }, () => new Array<number>(parameterCount).fill(0));
  let sumW = 0;
  let sumW2 = 0;
  let weightedSS = 0;
  for (const point of used) {
    sumW += point.w;
    sumW2 += point.w * point.w;
    let fitted = 0;
    point.row.forEach((entry, j) => {
      fitted += entry * solved.solution[j];
    });
    weightedSS += point.w * (point.y - fitted) ** 2;
    for (let i = 0; i < parameterCount; i += 1) {
      for (let j = 0; j < parameterCount; j += 1) meat[i][j] += point.w * point.w * point.row[i] * point.row[j];
    }
  }
  const effectiveCount = (sumW * sumW) / sumW2;
  const variance = effectiveCount > parameterCount ? (weightedSS / sumW) * (effectiveCount / (effectiveCount - parameterCount)) : 0;
  let slopeVariance = 0;
  for (let i = 0; i < parameterCount; i += 1) {
    for (let j = 0; j < parameterCount; j += 1) slopeVariance += bread[1][i] * meat[i][j] * bread[j][1];
  }
  return {
    value: solved.solution[0],
    slope: solved.solution[1] / bandwidth,
    slopeStdErr: Math.sqrt(Math.max(0, slopeVariance * variance)) / bandwidth,
    pointsUsed: used.length,
    bandwidth,
  };
}

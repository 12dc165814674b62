import { MarkingInputError } from "./marking-input-error";
import { countDistinct, requireFiniteSeries, requireSameLength } from "./internal/validate";

/** The two first-order curve shapes. */
export type FirstOrderKind = "rise" | "decay";

/** Starting values for a first-order fit. */
export interface FirstOrderStart {
  readonly a: number;
  readonly k: number;
  readonly c: number;
}

/** exp(-k t) basis value for the chosen shape. */
function shape(kind: FirstOrderKind, k: number, t: number): number {
  return kind === "rise" ? 1 - Math.exp(-k * t) : Math.exp(-k * t);
}

// Result registers and scratch space for the scan, so trying many k values allocates nothing.
let projectedA = 0;
let projectedC = 0;
let projectedSS = 0;
let shapes = new Float64Array(16);

/**
 * For a fixed rate constant k the model is linear in a and c, so the best a and c follow in
 * closed form (variable projection): a = S_fy / S_ff and c = mean(y) - a mean(f), with f the
 * curve shape at each time, or a = sum(f y) / sum(f^2) without an offset. The results go to the
 * registers below (the residual sum of squares too); false when the shape does not vary.
 */
function project(kind: FirstOrderKind, offset: boolean, t: readonly number[], y: readonly number[], k: number): boolean {
  const n = t.length;
  if (shapes.length < n) shapes = new Float64Array(n);
  let shapeSum = 0;
  let ySum = 0;
  for (let i = 0; i < n; i += 1) {
    shapes[i] = shape(kind, k, t[i]);
    shapeSum += shapes[i];
    ySum += y[i];
  }
  const shapeMean = offset ? shapeSum / n : 0;
  const yMean = offset ? ySum / n : 0;
  let sff = 0;
  let sfy = 0;
  for (let i = 0; i < n; i += 1) {
    const f = shapes[i] - shapeMean;
    sff += f * f;
    sfy += f * (y[i] - yMean);
  }
  if (!(sff > 0) || !Number.isFinite(sfy)) return false;
  const a = sfy / sff;
  const c = offset ? yMean - a * shapeMean : 0;
  let residualSumOfSquares = 0;
  for (let i = 0; i < n; i += 1) {
    const residual = y[i] - a * shapes[i] - c;
    residualSumOfSquares += residual * residual;
  }
  projectedA = a;
  projectedC = c;
  projectedSS = residualSumOfSquares;
  return true;
}

/**
 * A starting guess for a first-order rise y = a(1 - e^(-kt)) + c or decay y = a e^(-kt) + c,
 * taken from the data alone.
 *
 * Method: a first k from the time taken to cover half of the observed change (k = ln 2 / t_half);
 * then, because a and c enter the model linearly, a scan of k over a wide logarithmic grid
 * (k times the time span from 0.01 to 200) solving for the best a and c at each k, keeping the k
 * with the smallest residual sum of squares. The result is a start, not the fit.
 *
 * @param t - times (any time unit), at least 3 different values
 * @param y - readings (any unit), same length as t
 * @param kind - "rise" or "decay"
 * @param offset - true to allow a constant c (default true); false fixes c = 0
 * @returns { a, k, c } with k in reciprocal time units
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points`, `repeated-x`
 * @example
 * firstOrderStart([0, 1, 2, 3, 4], [0, 6.32, 8.65, 9.50, 9.82], "rise", true);
 * // => roughly { a: 10, k: 1, c: 0 }
 */
export function firstOrderStart(
  t: readonly number[],
  y: readonly number[],
  kind: FirstOrderKind,
  offset = true,
): FirstOrderStart {
  const functionName = "firstOrderStart";
  requireFiniteSeries(t, "time", functionName);
  requireFiniteSeries(y, "reading", functionName);
  requireSameLength(t, y, "time", "reading", functionName);
  const needed = offset ? 3 : 2;
  if (t.length < needed + 1) {
    throw new MarkingInputError(
      "too-few-points",
      functionName,
      `A first-order curve needs at least ${needed + 1} readings to fit and judge; only ${t.length} ${t.length === 1 ? "was" : "were"} given.`,
    );
  }
  if (countDistinct(t) < needed + 1) {
    throw new MarkingInputError("repeated-x", functionName, `A first-order curve needs readings at ${needed + 1} or more different times.`);
  }
  const order = t.map((_, i) => i).sort((i, j) => t[i] - t[j]);
  const times = order.map((i) => t[i]);
  const values = order.map((i) => y[i]);
  const first = times[0];
  const span = times[times.length - 1] - first;
  const startValue = values[0];
  const endValue = values[values.length - 1];
  const halfway = (startValue + endValue) / 2;
  let halfTime = span / 2;
  for (let i = 1; i < values.length; i += 1) {
    const before = values[i - 1] - halfway;
    const after = values[i] - halfway;
    if (before === 0 || before * after < 0 || after === 0) {
      const fraction = before === after ? 0 : before / (before - after);
      halfTime = times[i - 1] + fraction * (times[i] - times[i - 1]) - first;
      break;
    }
  }
  const firstGuess = Math.LN2 / Math.max(halfTime, span * 1e-3);
  let bestK = 0;
  let bestA = 0;
  let bestC = 0;
  let bestSS = Infinity;
  const consider = (k: number): void => {
    if (project(kind, offset, t, y, k) && projectedSS < bestSS) {
      bestK = k;
      bestA = projectedA;
      bestC = projectedC;
      bestSS = projectedSS;
    }
  };
  consider(firstGuess);
  const steps = 32;
  for (let s = 0; s <= steps; s += 1) {
    const kTimesSpan = 0.01 * (200 / 0.01) ** (s / steps);
    consider(kTimesSpan / span);
  }
  if (bestSS === Infinity) {
    throw new MarkingInputError("not-converged", functionName, "No first-order curve could be started from these readings.");
  }
  return { a: bestA, k: bestK, c: bestC };
}

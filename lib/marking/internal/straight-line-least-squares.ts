import { MarkingInputError } from "../marking-input-error";
import { requireFiniteSeries, requireSameLength } from "./validate";

/** Least-squares straight line, in the shape `linearFit` reports. */
export interface StraightLine {
  readonly slope: number;
  readonly intercept: number;
  readonly slopeStdErr: number;
  readonly interceptStdErr: number;
  readonly rSquared: number;
  readonly residualStdDev: number;
  readonly degreesOfFreedom: number;
  readonly count: number;
}

// Double-double registers (hi + lo, about 32 significant digits): Knuth's TwoSum and Dekker's
// TwoProduct, so the sums below lose nothing to cancellation.
let hi = 0;
let lo = 0;
const SPLITTER = 134217729;

function add(aHi: number, aLo: number, bHi: number, bLo: number): void {
  const s = aHi + bHi;
  const bVirtual = s - aHi;
  let e = aHi - (s - bVirtual) + (bHi - bVirtual);
  const t = aLo + bLo;
  const tVirtual = t - aLo;
  const f = aLo - (t - tVirtual) + (bLo - tVirtual);
  e += t;
  const s2 = s + e;
  e = e - (s2 - s) + f;
  hi = s2 + e;
  lo = e - (hi - s2);
}

function multiply(aHi: number, aLo: number, bHi: number, bLo: number): void {
  const p = aHi * bHi;
  let t = SPLITTER * aHi;
  const aHigh = t - (t - aHi);
  const aLow = aHi - aHigh;
  t = SPLITTER * bHi;
  const bHigh = t - (t - bHi);
  const bLow = bHi - bHigh;
  const error = aHigh * bHigh - p + aHigh * bLow + aLow * bHigh + aLow * bLow + (aHi * bLo + aLo * bHi);
  hi = p + error;
  lo = error - (hi - p);
}

function divide(aHi: number, aLo: number, bHi: number, bLo: number): void {
  const q1 = aHi / bHi;
  multiply(bHi, bLo, q1, 0);
  add(aHi, aLo, -hi, -lo);
  const q2 = hi / bHi;
  const s = q1 + q2;
  const e = q2 - (s - q1);
  hi = s + e;
  lo = e - (hi - s);
}

/**
 * Straight line by least squares on centred data, in double-double arithmetic. With x centred,
 * the design matrix [1, x - mean x] has orthogonal columns, so its QR factorisation is just the
 * column norms and the solution is slope = sum(dx dy) / sum(dx^2), intercept = mean y - slope
 * mean x: the same answer as Householder QR, with every sum carried to about 32 digits.
 * Through the origin the one column is x itself: slope = sum(x y) / sum(x^2).
 */
export function straightLineLeastSquares(
  x: readonly number[],
  y: readonly number[],
  throughOrigin: boolean,
  functionName: string,
): StraightLine {
  requireFiniteSeries(x, "x", functionName);
  requireFiniteSeries(y, "y", functionName);
  requireSameLength(x, y, "x", "y", functionName);
  const n = x.length;
  const parameters = throughOrigin ? 1 : 2;
  if (n < parameters) {
    throw new MarkingInputError(
      "too-few-points",
      functionName,
      `A straight line needs at least ${parameters} reading${parameters === 1 ? "" : "s"}; only ${n} ${n === 1 ? "was" : "were"} given.`,
    );
  }
  let xMeanHi = 0;
  let xMeanLo = 0;
  let yMeanHi = 0;
  let yMeanLo = 0;
  let allEqual = true;
  let allZero = true;
  for (let i = 0; i < n; i += 1) {
    if (x[i] !== x[0]) allEqual = false;
    if (x[i] !== 0) allZero = false;
    if (!throughOrigin) {
      add(xMeanHi, xMeanLo, x[i], 0);
      xMeanHi = hi;
      xMeanLo = lo;
      add(yMeanHi, yMeanLo, y[i], 0);
      yMeanHi = hi;
      yMeanLo = lo;
    }
  }
  if (throughOrigin ? allZero : allEqual) {
    throw new MarkingInputError(
      "x-all-equal",
      functionName,
      throughOrigin
        ? "Every x value is zero, so a line through the origin has no gradient."
        : "Every x value is the same, so there is no gradient; the readings need different x values.",
    );
  }
  if (!throughOrigin) {
    divide(xMeanHi, xMeanLo, n, 0);
    xMeanHi = hi;
    xMeanLo = lo;
    divide(yMeanHi, yMeanLo, n, 0);
    yMeanHi = hi;
    yMeanLo = lo;
  }
  let sxxHi = 0;
  let sxxLo = 0;
  let sxyHi = 0;
  let sxyLo = 0;
  let syyHi = 0;
  let syyLo = 0;
  for (let i = 0; i < n; i += 1) {
    add(x[i], 0, -xMeanHi, -xMeanLo);
    const dxHi = hi;
    const dxLo = lo;
    add(y[i], 0, -yMeanHi, -yMeanLo);
    const dyHi = hi;
    const dyLo = lo;
    multiply(dxHi, dxLo, dxHi, dxLo);
    add(sxxHi, sxxLo, hi, lo);
    sxxHi = hi;
    sxxLo = lo;
    multiply(dxHi, dxLo, dyHi, dyLo);
    add(sxyHi, sxyLo, hi, lo);
    sxyHi = hi;
    sxyLo = lo;
    multiply(dyHi, dyLo, dyHi, dyLo);
    add(syyHi, syyLo, hi, lo);
    syyHi = hi;
    syyLo = lo;
  }
  divide(sxyHi, sxyLo, sxxHi, sxxLo);
  const slopeHi = hi;
  const slopeLo = lo;
  let ssHi = 0;
  let ssLo = 0;
  for (let i = 0; i < n; i += 1) {
    add(x[i], 0, -xMeanHi, -xMeanLo);
    multiply(hi, lo, slopeHi, slopeLo);
    const fittedHi = hi;
    const fittedLo = lo;
    add(y[i], 0, -yMeanHi, -yMeanLo);
    add(hi, lo, -fittedHi, -fittedLo);
    multiply(hi, lo, hi, lo);
    add(ssHi, ssLo, hi, lo);
    ssHi = hi;
    ssLo = lo;
  }
  multiply(slopeHi, slopeLo, xMeanHi, xMeanLo);
  add(yMeanHi, yMeanLo, -hi, -lo);
  const intercept = throughOrigin ? 0 : hi + lo;
  const slope = slopeHi + slopeLo;
  const sxx = sxxHi + sxxLo;
  const residualSS = Math.max(0, ssHi + ssLo);
  const degreesOfFreedom = n - parameters;
  const variance = degreesOfFreedom > 0 ? residualSS / degreesOfFreedom : 0;
  const xMean = xMeanHi + xMeanLo;
  let rSquared = 1;
  if (syyHi !== 0) {
    divide(ssHi, ssLo, syyHi, syyLo);
    add(1, 0, -hi, -lo);
    rSquared = hi + lo;
  }
  const result: StraightLine = {
    slope,
    intercept,
    slopeStdErr: Math.sqrt(variance / sxx),
    interceptStdErr: throughOrigin ? 0 : Math.sqrt(variance * (1 / n + (xMean * xMean) / sxx)),
    rSquared,
    residualStdDev: Math.sqrt(variance),
    degreesOfFreedom,
    count: n,
  };
  if (![result.slope, result.intercept, result.slopeStdErr, result.interceptStdErr, result.rSquared].every(Number.isFinite)) {
    throw new MarkingInputError("ill-conditioned", functionName, "The numbers are too extreme to fit; check their unit and size.");
  }
  return result;
}

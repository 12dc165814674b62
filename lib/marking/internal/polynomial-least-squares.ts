import { MarkingInputError } from "../marking-input-error";
import { countDistinct, requireFiniteSeries, requireSameLength } from "./validate";

/**
 * Result of a least-squares polynomial fit, held both in powers of x (what people read) and in
 * the centred, scaled variable u = (x - centre) / scale that the fit was solved in (what
 * derivatives and their uncertainties are computed from).
 */
export interface PolynomialLeastSquares {
  readonly powers: readonly number[];
  readonly centre: number;
  readonly scale: number;
  /** Coefficients of u^power, in the order of `powers`. */
  readonly scaledCoefficients: readonly number[];
  /** (R^T R)^-1 in the u basis; multiply by residualVariance for the covariance. */
  readonly scaledUnitCovariance: readonly (readonly number[])[];
  /** Coefficients of x^power, in the order of `powers`. */
  readonly coefficients: readonly number[];
  readonly coefficientStdErrs: readonly number[];
  readonly covariance: readonly (readonly number[])[];
  readonly residualSumOfSquares: number;
  readonly residualVariance: number;
  readonly residualStdDev: number;
  readonly rSquared: number;
  readonly degreesOfFreedom: number;
  readonly count: number;
}

// Double-double arithmetic (a number held as hi + lo, about 32 significant digits), written with
// two result registers so the inner loops allocate nothing. Error-free transformations of Knuth
// (TwoSum) and Dekker (TwoProduct by splitting with 2^27 + 1).
let resultHi = 0;
let resultLo = 0;
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
  resultHi = s2 + e;
  resultLo = e - (resultHi - s2);
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
  resultHi = p + error;
  resultLo = error - (resultHi - p);
}

function divide(aHi: number, aLo: number, bHi: number, bLo: number): void {
  const q1 = aHi / bHi;
  multiply(bHi, bLo, q1, 0);
  add(aHi, aLo, -resultHi, -resultLo);
  const q2 = resultHi / bHi;
  const rHi = resultHi;
  const rLo = resultLo;
  multiply(bHi, bLo, q2, 0);
  add(rHi, rLo, -resultHi, -resultLo);
  const q3 = resultHi / bHi;
  const s = q1 + q2;
  const e = q2 - (s - q1);
  add(s, e, q3, 0);
}

function squareRoot(aHi: number, aLo: number): void {
  if (aHi <= 0) {
    resultHi = 0;
    resultLo = 0;
    return;
  }
  const x = Math.sqrt(aHi);
  multiply(x, 0, x, 0);
  add(aHi, aLo, -resultHi, -resultLo);
  const correction = resultHi / (2 * x);
  resultHi = x + correction;
  resultLo = correction - (resultHi - x);
}

function powerOfTwoAtLeast(value: number): number {
  if (value <= 0) return 1;
  return 2 ** Math.ceil(Math.log2(value));
}

function binomial(n: number, k: number): number {
  let result = 1;
  for (let i = 1; i <= k; i += 1) result = (result * (n - k + i)) / i;
  return Math.round(result);
}

/**
 * Least squares for y = sum of b_k x^k over the given powers, by Householder QR of the design
 * matrix in u = (x - centre) / scale, carried out in double-double arithmetic. The centre is the
 * middle of the x range (0 when the fit must pass through the origin) and the scale a power of
 * two, so u is formed without rounding. Coefficients and their covariance are then mapped back
 * to powers of x, still in double-double, and rounded once.
 */
export function polynomialLeastSquares(
  x: readonly number[],
  y: readonly number[],
  degree: number,
  throughOrigin: boolean,
  functionName: string,
): PolynomialLeastSquares {
  requireFiniteSeries(x, "x", functionName);
  requireFiniteSeries(y, "y", functionName);
  requireSameLength(x, y, "x", "y", functionName);
  const powers: number[] = [];
  for (let k = throughOrigin ? 1 : 0; k <= degree; k += 1) powers.push(k);
  const p = powers.length;
  const n = x.length;
  if (n < p) {
    throw new MarkingInputError(
      "too-few-points",
      functionName,
      `This fit has ${p} unknown${p === 1 ? "" : "s"}, so it needs at least ${p} readings; only ${n} ${n === 1 ? "was" : "were"} given.`,
    );
  }
  if (throughOrigin && x.every((value) => value === 0)) {
    throw new MarkingInputError("x-all-equal", functionName, "Every x value is zero, so a line through the origin has no gradient.");
  }
  const distinct = throughOrigin ? countDistinct(x.filter((value) => value !== 0)) : countDistinct(x);
  if (!throughOrigin && distinct === 1) {
    throw new MarkingInputError(
      "x-all-equal",
      functionName,
      "Every x value is the same, so there is no gradient; the readings need different x values.",
    );
  }
  if (distinct < p) {
    throw new MarkingInputError(
      "repeated-x",
      functionName,
      `A curve with ${p} unknowns needs at least ${p} different x values; these readings have only ${distinct}.`,
    );
  }

  let min = Infinity;
  let max = -Infinity;
  for (const value of x) {
    if (value < min) min = value;
    if (value > max) max = value;
  }
  const centre = throughOrigin ? 0 : (min + max) / 2;
  let spread = 0;
  for (const value of x) spread = Math.max(spread, Math.abs(value - centre));
  const scale = powerOfTwoAtLeast(spread);
  if (!(scale ** degree > 1e-290 && scale ** degree < 1e290)) {
    throw new MarkingInputError(
      "ill-conditioned",
      functionName,
      "The x values are too extreme (too close together or too large) to fit; check their unit and size.",
    );
  }

  // Design matrix in double-double, column j at [j * n, (j + 1) * n).
  const aHi = new Float64Array(p * n);
  const aLo = new Float64Array(p * n);
  for (let i = 0; i < n; i += 1) {
    // u = (x - centre) / scale exactly: TwoSum, then division by a power of two.
    const difference = x[i] - centre;
    const virtualB = difference - x[i];
    const error = x[i] - (difference - virtualB) + (-centre - virtualB);
    const uHi = difference / scale;
    const uLo = error / scale;
    let powerHi = 1;
    let powerLo = 0;
    let current = 0;
    for (let j = 0; j < p; j += 1) {
      while (current < powers[j]) {
        multiply(powerHi, powerLo, uHi, uLo);
        powerHi = resultHi;
        powerLo = resultLo;
        current += 1;
      }
      aHi[j * n + i] = powerHi;
      aLo[j * n + i] = powerLo;
    }
  }
  const bHi = Float64Array.from(y);
  const bLo = new Float64Array(n);
  const vHi = new Float64Array(n);
  const vLo = new Float64Array(n);

  // Householder QR: the upper triangle of a becomes R; b becomes Q^T y.
  let largestDiagonal = 0;
  let smallestDiagonal = Infinity;
  const applyReflector = (targetHi: Float64Array, targetLo: Float64Array, offset: number, start: number, vNormHi: number, vNormLo: number): void => {
    let dotHi = 0;
    let dotLo = 0;
    for (let i = start; i < n; i += 1) {
      multiply(vHi[i], vLo[i], targetHi[offset + i], targetLo[offset + i]);
      add(dotHi, dotLo, resultHi, resultLo);
      dotHi = resultHi;
      dotLo = resultLo;
    }
    divide(2 * dotHi, 2 * dotLo, vNormHi, vNormLo);
    const factorHi = resultHi;
    const factorLo = resultLo;
    for (let i = start; i < n; i += 1) {
      multiply(factorHi, factorLo, vHi[i], vLo[i]);
      add(targetHi[offset + i], targetLo[offset + i], -resultHi, -resultLo);
      targetHi[offset + i] = resultHi;
      targetLo[offset + i] = resultLo;
    }
  };
  for (let j = 0; j < p; j += 1) {
    const offset = j * n;
    let normHi = 0;
    let normLo = 0;
    for (let i = j; i < n; i += 1) {
      multiply(aHi[offset + i], aLo[offset + i], aHi[offset + i], aLo[offset + i]);
      add(normHi, normLo, resultHi, resultLo);
      normHi = resultHi;
      normLo = resultLo;
    }
    squareRoot(normHi, normLo);
    if (resultHi === 0) {
      throw new MarkingInputError("ill-conditioned", functionName, "The x values do not spread out enough for this fit.");
    }
    const alphaHi = aHi[offset + j] >= 0 ? -resultHi : resultHi;
    const alphaLo = aHi[offset + j] >= 0 ? -resultLo : resultLo;
    for (let i = j; i < n; i += 1) {
      vHi[i] = aHi[offset + i];
      vLo[i] = aLo[offset + i];
    }
    add(vHi[j], vLo[j], -alphaHi, -alphaLo);
    vHi[j] = resultHi;
    vLo[j] = resultLo;
    let vNormHi = 0;
    let vNormLo = 0;
    for (let i = j; i < n; i += 1) {
      multiply(vHi[i], vLo[i], vHi[i], vLo[i]);
      add(vNormHi, vNormLo, resultHi, resultLo);
      vNormHi = resultHi;
      vNormLo = resultLo;
    }
    for (let k = j + 1; k < p; k += 1) applyReflector(aHi, aLo, k * n, j, vNormHi, vNormLo);
    applyReflector(bHi, bLo, 0, j, vNormHi, vNormLo);
    aHi[offset + j] = alphaHi;
    aLo[offset + j] = alphaLo;
    for (let i = j + 1; i < n; i += 1) {
      aHi[offset + i] = 0;
      aLo[offset + i] = 0;
    }
    largestDiagonal = Math.max(largestDiagonal, Math.abs(alphaHi));
    smallestDiagonal = Math.min(smallestDiagonal, Math.abs(alphaHi));
  }
  if (smallestDiagonal <= largestDiagonal * 1e-13) {
    throw new MarkingInputError(
      "ill-conditioned",
      functionName,
      "The x values are too bunched together for a curve of this degree; use a lower degree or more spread-out readings.",
    );
  }
  const rAt = (row: number, col: number): number => col * n + row;

  // Back substitution for the u-basis coefficients.
  const betaHi = new Float64Array(p);
  const betaLo = new Float64Array(p);
  for (let row = p - 1; row >= 0; row -= 1) {
    let sumHi = bHi[row];
    let sumLo = bLo[row];
    for (let col = row + 1; col < p; col += 1) {
      multiply(aHi[rAt(row, col)], aLo[rAt(row, col)], betaHi[col], betaLo[col]);
      add(sumHi, sumLo, -resultHi, -resultLo);
      sumHi = resultHi;
      sumLo = resultLo;
    }
    divide(sumHi, sumLo, aHi[rAt(row, row)], aLo[rAt(row, row)]);
    betaHi[row] = resultHi;
    betaLo[row] = resultLo;
  }

  // R^-1 (upper triangular), then the unit covariance (R^T R)^-1 = R^-1 R^-T.
  const invHi = new Float64Array(p * p);
  const invLo = new Float64Array(p * p);
  for (let col = 0; col < p; col += 1) {
    divide(1, 0, aHi[rAt(col, col)], aLo[rAt(col, col)]);
    invHi[col * p + col] = resultHi;
    invLo[col * p + col] = resultLo;
    for (let row = col - 1; row >= 0; row -= 1) {
      let sumHi = 0;
      let sumLo = 0;
      for (let k = row + 1; k <= col; k += 1) {
        multiply(aHi[rAt(row, k)], aLo[rAt(row, k)], invHi[k * p + col], invLo[k * p + col]);
        add(sumHi, sumLo, resultHi, resultLo);
        sumHi = resultHi;
        sumLo = resultLo;
      }
      divide(-sumHi, -sumLo, aHi[rAt(row, row)], aLo[rAt(row, row)]);
      invHi[row * p + col] = resultHi;
      invLo[row * p + col] = resultLo;
    }
  }
  const covHi = new Float64Array(p * p);
  const covLo = new Float64Array(p * p);
  for (let i = 0; i < p; i += 1) {
    for (let j = i; j < p; j += 1) {
      let sumHi = 0;
      let sumLo = 0;
      for (let k = j; k < p; k += 1) {
        multiply(invHi[i * p + k], invLo[i * p + k], invHi[j * p + k], invLo[j * p + k]);
        add(sumHi, sumLo, resultHi, resultLo);
        sumHi = resultHi;
        sumLo = resultLo;
      }
      covHi[i * p + j] = covHi[j * p + i] = sumHi;
      covLo[i * p + j] = covLo[j * p + i] = sumLo;
    }
  }

  let ssHi = 0;
  let ssLo = 0;
  for (let i = p; i < n; i += 1) {
    multiply(bHi[i], bLo[i], bHi[i], bLo[i]);
    add(ssHi, ssLo, resultHi, resultLo);
    ssHi = resultHi;
    ssLo = resultLo;
  }
  const degreesOfFreedom = n - p;
  let varianceHi = 0;
  let varianceLo = 0;
  if (degreesOfFreedom > 0) {
    divide(ssHi, ssLo, degreesOfFreedom, 0);
    varianceHi = resultHi;
    varianceLo = resultLo;
  }

  // Map to powers of x: u^j = sum_k C(j,k) x^k (-centre)^(j-k) / scale^j, so the x-basis
  // coefficients are T beta and their covariance T C T^T (T upper triangular).
  const tHi = new Float64Array(p * p);
  const tLo = new Float64Array(p * p);
  for (let r = 0; r < p; r += 1) {
    for (let c = 0; c < p; c += 1) {
      const rawPower = powers[r];
      const scaledPower = powers[c];
      if (scaledPower < rawPower) continue;
      let entryHi = binomial(scaledPower, rawPower);
      let entryLo = 0;
      for (let m = 0; m < scaledPower - rawPower; m += 1) {
        multiply(entryHi, entryLo, -centre, 0);
        entryHi = resultHi;
        entryLo = resultLo;
      }
      divide(entryHi, entryLo, scale ** scaledPower, 0);
      tHi[r * p + c] = resultHi;
      tLo[r * p + c] = resultLo;
    }
  }
  const coefficients: number[] = [];
  for (let r = 0; r < p; r += 1) {
    let sumHi = 0;
    let sumLo = 0;
    for (let c = r; c < p; c += 1) {
      multiply(tHi[r * p + c], tLo[r * p + c], betaHi[c], betaLo[c]);
      add(sumHi, sumLo, resultHi, resultLo);
      sumHi = resultHi;
      sumLo = resultLo;
    }
    coefficients.push(sumHi + sumLo);
  }
  // (T C) then (T C) T^T.
  const tcHi = new Float64Array(p * p);
  const tcLo = new Float64Array(p * p);
  for (let r = 0; r < p; r += 1) {
    for (let c = 0; c < p; c += 1) {
      let sumHi = 0;
      let sumLo = 0;
      for (let k = r; k < p; k += 1) {
        multiply(tHi[r * p + k], tLo[r * p + k], covHi[k * p + c], covLo[k * p + c]);
        add(sumHi, sumLo, resultHi, resultLo);
        sumHi = resultHi;
        sumLo = resultLo;
      }
      tcHi[r * p + c] = sumHi;
      tcLo[r * p + c] = sumLo;
    }
  }
  const covariance: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const coefficientStdErrs: number[] = [];
  for (let r = 0; r < p; r += 1) {
    for (let c = r; c < p; c += 1) {
      let sumHi = 0;
      let sumLo = 0;
      for (let k = c; k < p; k += 1) {
        multiply(tcHi[r * p + k], tcLo[r * p + k], tHi[c * p + k], tLo[c * p + k]);
        add(sumHi, sumLo, resultHi, resultLo);
        sumHi = resultHi;
        sumLo = resultLo;
      }
      multiply(sumHi, sumLo, varianceHi, varianceLo);
      covariance[r][c] = covariance[c][r] = resultHi + resultLo;
      if (r === c) {
        squareRoot(resultHi, resultLo);
        coefficientStdErrs.push(resultHi + resultLo);
      }
    }
  }

  // Goodness of fit: centred R^2, or uncentred R^2 = 1 - SSres / sum(y^2) through the origin.
  let meanHi = 0;
  let meanLo = 0;
  if (!throughOrigin) {
    for (const value of y) {
      add(meanHi, meanLo, value, 0);
      meanHi = resultHi;
      meanLo = resultLo;
    }
    divide(meanHi, meanLo, n, 0);
    meanHi = resultHi;
    meanLo = resultLo;
  }
  let totalHi = 0;
  let totalLo = 0;
  for (const value of y) {
    add(value, 0, -meanHi, -meanLo);
    multiply(resultHi, resultLo, resultHi, resultLo);
    add(totalHi, totalLo, resultHi, resultLo);
    totalHi = resultHi;
    totalLo = resultLo;
  }
  let rSquared = 1;
  if (totalHi !== 0) {
    divide(ssHi, ssLo, totalHi, totalLo);
    add(1, 0, -resultHi, -resultLo);
    rSquared = resultHi + resultLo;
  }
  const residualVariance = varianceHi + varianceLo;
  if (![...coefficients, ...coefficientStdErrs, rSquared, residualVariance].every(Number.isFinite)) {
    throw new MarkingInputError("ill-conditioned", functionName, "The numbers are too extreme to fit; check their unit and size.");
  }
  const scaledUnitCovariance: number[][] = Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_unused, j) => covHi[i * p + j] + covLo[i * p + j]),
  );
  return {
    powers,
    centre,
    scale,
    scaledCoefficients: Array.from(betaHi, (value, i) => value + betaLo[i]),
    scaledUnitCovariance,
    coefficients,
    coefficientStdErrs,
    covariance,
    residualSumOfSquares: ssHi + ssLo,
    residualVariance,
    residualStdDev: Math.sqrt(residualVariance),
    rSquared,
    degreesOfFreedom,
    count: n,
  };
}

/** Value, gradient and the gradient's standard uncertainty of a fitted polynomial at x0. */
export function polynomialValueAndSlope(
  fit: PolynomialLeastSquares,
  x0: number,
): { value: number; slope: number; slopeStdErr: number; valueStdErr: number } {
  const u0 = (x0 - fit.centre) / fit.scale;
  const valueGradient = fit.powers.map((power) => u0 ** power);
  const slopeGradient = fit.powers.map((power) => (power === 0 ? 0 : (power * u0 ** (power - 1)) / fit.scale));
  let value = 0;
  let slope = 0;
  fit.scaledCoefficients.forEach((coefficient, j) => {
    value += coefficient * valueGradient[j];
    slope += coefficient * slopeGradient[j];
  });
  const quadratic = (g: readonly number[]): number => {
    let total = 0;
    for (let i = 0; i < g.length; i += 1) {
      for (let j = 0; j < g.length; j += 1) total += g[i] * fit.scaledUnitCovariance[i][j] * g[j];
    }
    return Math.max(0, total) * fit.residualVariance;
  };
  return { value, slope, slopeStdErr: Math.sqrt(quadratic(slopeGradient)), valueStdErr: Math.sqrt(quadratic(valueGradient)) };
}

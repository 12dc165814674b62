import { MarkingInputError } from "../marking-input-error";
import {
  dd,
  ddAdd,
  ddDiv,
  ddMul,
  ddNeg,
  ddSqrt,
  ddSub,
  ddToNumber,
  ddZero,
  twoSum,
  type DoubleDouble,
} from "./double-double";
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

function powerOfTwoAtLeast(value: number): number {
  if (value <= 0) return 1;
  return 2 ** Math.ceil(Math.log2(value));
}

function binomial(n: number, k: number): number {
  let result = 1;
  for (let i = 1; i <= k; i += 1) result = (result * (n - k + i)) / i;
  return Math.round(result);
}

function ddPow(base: DoubleDouble, exponent: number): DoubleDouble {
  let result = dd(1);
  for (let i = 0; i < exponent; i += 1) result = ddMul(result, base);
  return result;
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
  const parameterCount = powers.length;
  const n = x.length;
  if (n < parameterCount) {
    throw new MarkingInputError(
      "too-few-points",
      functionName,
      `This fit has ${parameterCount} unknown${parameterCount === 1 ? "" : "s"}, so it needs at least ${parameterCount} readings; only ${n} ${n === 1 ? "was" : "were"} given.`,
    );
  }
  const distinct = countDistinct(x);
  if (throughOrigin && x.every((value) => value === 0)) {
    throw new MarkingInputError("x-all-equal", functionName, "Every x value is zero, so a line through the origin has no gradient.");
  }
  if (!throughOrigin && distinct === 1) {
    throw new MarkingInputError(
      "x-all-equal",
      functionName,
      "Every x value is the same, so there is no gradient; the readings need different x values.",
    );
  }
  const distinctNeeded = throughOrigin ? parameterCount : parameterCount;
  const distinctAvailable = throughOrigin ? countDistinct(x.filter((value) => value !== 0)) : distinct;
  if (distinctAvailable < distinctNeeded) {
    throw new MarkingInputError(
      "repeated-x",
      functionName,
      `A curve with ${parameterCount} unknowns needs at least ${distinctNeeded} different x values; these readings have only ${distinctAvailable}.`,
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

  // Design matrix, column by column, in double-double.
  const columns: DoubleDouble[][] = powers.map(() => new Array<DoubleDouble>(n));
  for (let i = 0; i < n; i += 1) {
    const shifted = twoSum(x[i], -centre);
    const u: DoubleDouble = { hi: shifted.hi / scale, lo: shifted.lo / scale };
    powers.forEach((power, j) => {
      columns[j][i] = ddPow(u, power);
    });
  }
  const rhs: DoubleDouble[] = y.map((value) => dd(value));

  // Householder QR: columns[j] becomes R's column j above the diagonal; rhs becomes Q^T y.
  const diagonal: DoubleDouble[] = new Array(parameterCount);
  for (let j = 0; j < parameterCount; j += 1) {
    const column = columns[j];
    let normSquared = ddZero;
    for (let i = j; i < n; i += 1) normSquared = ddAdd(normSquared, ddMul(column[i], column[i]));
    const norm = ddSqrt(normSquared);
    if (norm.hi === 0) {
      throw new MarkingInputError("ill-conditioned", functionName, "The x values do not spread out enough for this fit.");
    }
    const alpha = column[j].hi >= 0 ? ddNeg(norm) : norm;
    const v: DoubleDouble[] = [];
    for (let i = j; i < n; i += 1) v.push(column[i]);
    v[0] = ddSub(v[0], alpha);
    let vNormSquared = ddZero;
    for (const entry of v) vNormSquared = ddAdd(vNormSquared, ddMul(entry, entry));
    const apply = (target: DoubleDouble[]): void => {
      let dot = ddZero;
      for (let i = 0; i < v.length; i += 1) dot = ddAdd(dot, ddMul(v[i], target[j + i]));
      const factor = ddDiv(ddMul(dd(2), dot), vNormSquared);
      for (let i = 0; i < v.length; i += 1) target[j + i] = ddSub(target[j + i], ddMul(factor, v[i]));
    };
    for (let k = j + 1; k < parameterCount; k += 1) apply(columns[k]);
    apply(rhs);
    diagonal[j] = alpha;
    column[j] = alpha;
    for (let i = j + 1; i < n; i += 1) column[i] = ddZero;
  }
  const largestDiagonal = Math.max(...diagonal.map((value) => Math.abs(value.hi)));
  const smallestDiagonal = Math.min(...diagonal.map((value) => Math.abs(value.hi)));
  if (smallestDiagonal <= largestDiagonal * 1e-13) {
    throw new MarkingInputError(
      "ill-conditioned",
      functionName,
      "The x values are too bunched together for a curve of this degree; use a lower degree or more spread-out readings.",
    );
  }
  const r = (row: number, col: number): DoubleDouble => columns[col][row];

  // Back substitution for the u-basis coefficients.
  const beta: DoubleDouble[] = new Array(parameterCount);
  for (let row = parameterCount - 1; row >= 0; row -= 1) {
    let sum = rhs[row];
    for (let col = row + 1; col < parameterCount; col += 1) sum = ddSub(sum, ddMul(r(row, col), beta[col]));
    beta[row] = ddDiv(sum, r(row, row));
  }
  // Inverse of R (upper triangular), then (R^T R)^-1 = R^-1 R^-T.
  const rInverse: DoubleDouble[][] = Array.from({ length: parameterCount }, () => new Array<DoubleDouble>(parameterCount).fill(ddZero));
  for (let col = 0; col < parameterCount; col += 1) {
    rInverse[col][col] = ddDiv(dd(1), r(col, col));
    for (let row = col - 1; row >= 0; row -= 1) {
      let sum = ddZero;
      for (let k = row + 1; k <= col; k += 1) sum = ddAdd(sum, ddMul(r(row, k), rInverse[k][col]));
      rInverse[row][col] = ddDiv(ddNeg(sum), r(row, row));
    }
  }
  const unitCovariance: DoubleDouble[][] = Array.from({ length: parameterCount }, (_, i) =>
    Array.from({ length: parameterCount }, (_unused, j) => {
      let sum = ddZero;
      for (let k = Math.max(i, j); k < parameterCount; k += 1) sum = ddAdd(sum, ddMul(rInverse[i][k], rInverse[j][k]));
      return sum;
    }),
  );

  let residualSS = ddZero;
  for (let i = parameterCount; i < n; i += 1) residualSS = ddAdd(residualSS, ddMul(rhs[i], rhs[i]));
  const degreesOfFreedom = n - parameterCount;
  const residualVarianceDd = degreesOfFreedom > 0 ? ddDiv(residualSS, dd(degreesOfFreedom)) : ddZero;

  // Map to powers of x: u^j = sum_k C(j,k) x^k (-centre)^(j-k) / scale^j.
  const transform: DoubleDouble[][] = powers.map((rawPower) =>
    powers.map((scaledPower) => {
      if (scaledPower < rawPower) return ddZero;
      const shiftPower = ddPow(dd(-centre), scaledPower - rawPower);
      const entry = ddMul(dd(binomial(scaledPower, rawPower)), shiftPower);
      return ddDiv(entry, dd(scale ** scaledPower));
    }),
  );
  const rawCoefficients = transform.map((row) => {
    let sum = ddZero;
    row.forEach((entry, j) => {
      sum = ddAdd(sum, ddMul(entry, beta[j]));
    });
    return sum;
  });
  const rawCovarianceDd: DoubleDouble[][] = transform.map((rowA) =>
    transform.map((rowB) => {
      let sum = ddZero;
      for (let i = 0; i < parameterCount; i += 1) {
        if (rowA[i].hi === 0) continue;
        let inner = ddZero;
        for (let j = 0; j < parameterCount; j += 1) {
          if (rowB[j].hi === 0) continue;
          inner = ddAdd(inner, ddMul(unitCovariance[i][j], rowB[j]));
        }
        sum = ddAdd(sum, ddMul(rowA[i], inner));
      }
      return ddMul(sum, residualVarianceDd);
    }),
  );

  // Goodness of fit: centred R^2, or uncentred R^2 = 1 - SSres / sum(y^2) through the origin.
  let totalSS = ddZero;
  if (throughOrigin) {
    for (const value of y) totalSS = ddAdd(totalSS, ddMul(dd(value), dd(value)));
  } else {
    let sum = ddZero;
    for (const value of y) sum = ddAdd(sum, dd(value));
    const mean = ddDiv(sum, dd(n));
    for (const value of y) {
      const deviation = ddSub(dd(value), mean);
      totalSS = ddAdd(totalSS, ddMul(deviation, deviation));
    }
  }
  const rSquared = totalSS.hi === 0 ? 1 : ddToNumber(ddSub(dd(1), ddDiv(residualSS, totalSS)));
  const residualVariance = ddToNumber(residualVarianceDd);

  const coefficientStdErrs = rawCovarianceDd.map((row, i) => ddToNumber(ddSqrt(row[i])));
  const coefficients = rawCoefficients.map(ddToNumber);
  if (![...coefficients, ...coefficientStdErrs, rSquared, residualVariance].every(Number.isFinite)) {
    throw new MarkingInputError("ill-conditioned", functionName, "The numbers are too extreme to fit; check their unit and size.");
  }
  return {
    powers,
    centre,
    scale,
    scaledCoefficients: beta.map(ddToNumber),
    scaledUnitCovariance: unitCovariance.map((row) => row.map(ddToNumber)),
    coefficients,
    coefficientStdErrs,
    covariance: rawCovarianceDd.map((row) => row.map(ddToNumber)),
    residualSumOfSquares: ddToNumber(residualSS),
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

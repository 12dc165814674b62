import { linearRegression } from "simple-statistics";
import { PolynomialRegression, SimpleLinearRegression } from "ml-regression";
import jStat from "jstat";
import { linearFit } from "@/lib/marking/linear-fit";
import { polynomialFit } from "@/lib/marking/polynomial-fit";
import { logRelativeError } from "./log-relative-error";
import type { NistLinearDataset } from "./fixtures";

/** Coefficients (ascending powers; the slope alone through the origin) from one implementation, or null if it failed. */
export interface ImplementationFit {
  readonly implementation: string;
  readonly coefficients: readonly number[] | null;
}

function attempt(compute: () => readonly number[]): readonly number[] | null {
  try {
    const result = compute();
    return result.every((value) => Number.isFinite(value)) ? result : null;
  } catch {
    return null;
  }
}

/** Our fit of a NIST dataset, through `linearFit` for straight lines and `polynomialFit` otherwise. */
export function ourFit(data: NistLinearDataset): readonly number[] {
  if (data.degree === 1) {
    const fit = linearFit(data.x, data.y, { throughOrigin: data.throughOrigin });
    return data.throughOrigin ? [fit.slope] : [fit.intercept, fit.slope];
  }
  return polynomialFit(data.x, data.y, data.degree).coefficients;
}

/**
 * The general-purpose npm packages that can fit this dataset's model, each run on the same data:
 * simple-statistics linearRegression (straight line with intercept only), ml-regression
 * SimpleLinearRegression (straight line with intercept only) and PolynomialRegression, and jStat's
 * models.ols with the powers of x as columns.
 */
export function referenceFits(data: NistLinearDataset): ImplementationFit[] {
  const { x, y, degree, throughOrigin } = data;
  const fits: ImplementationFit[] = [];
  if (degree === 1 && !throughOrigin) {
    fits.push({
      implementation: "simple-statistics linearRegression",
      coefficients: attempt(() => {
        const { m, b } = linearRegression(x.map((value, i) => [value, y[i]]));
        return [b, m];
      }),
    });
    fits.push({
      implementation: "ml-regression SimpleLinearRegression",
      coefficients: attempt(() => {
        const fit = new SimpleLinearRegression(x, y);
        return [fit.intercept, fit.slope];
      }),
    });
  }
  fits.push({
    implementation: "ml-regression PolynomialRegression",
    coefficients: attempt(() => {
      const fit = throughOrigin ? new PolynomialRegression(x, y, [1]) : new PolynomialRegression(x, y, degree);
      return fit.coefficients;
    }),
  });
  fits.push({
    implementation: "jstat models.ols",
    coefficients: attempt(() => {
      const powers = throughOrigin ? [1] : Array.from({ length: degree + 1 }, (_, k) => k);
      const exog = x.map((value) => powers.map((power) => value ** power));
      return jStat.models.ols(y, exog).coef;
    }),
  });
  return fits;
}

/** Smallest LRE over the coefficients (0 when the implementation failed). */
export function minimumCoefficientLre(coefficients: readonly number[] | null, certified: readonly number[]): number {
  if (coefficients === null || coefficients.length !== certified.length) return 0;
  return Math.min(...coefficients.map((value, i) => logRelativeError(value, certified[i])));
}

import { describe, expect, it } from "vitest";
import { linearFit } from "@/lib/marking/linear-fit";
import { expectClose, expectMarkingError, logRelativeError } from "./helpers";
import { loadNistLinear } from "./fixtures";

describe("linearFit against NIST StRD certified values (source: NIST StRD linear regression, tests/fixtures/nist-strd)", () => {
  for (const name of ["Norris", "NoInt1", "NoInt2"] as const) {
    it(`reproduces ${name} to at least 9 significant digits (coefficients, standard errors, residual SD, R²)`, () => {
      const data = loadNistLinear(name);
      const fit = linearFit(data.x, data.y, { throughOrigin: data.throughOrigin });
      const estimates = data.throughOrigin ? [fit.slope] : [fit.intercept, fit.slope];
      const stdErrs = data.throughOrigin ? [fit.slopeStdErr] : [fit.interceptStdErr, fit.slopeStdErr];
      estimates.forEach((estimate, i) => expect(logRelativeError(estimate, data.certified.estimates[i])).toBeGreaterThanOrEqual(9));
      stdErrs.forEach((stdErr, i) => expect(logRelativeError(stdErr, data.certified.stdDevs[i])).toBeGreaterThanOrEqual(9));
      expect(logRelativeError(fit.residualStdDev, data.certified.residualStdDev)).toBeGreaterThanOrEqual(9);
      // NIST certifies the uncentred R² for the no-intercept sets, which linearFit reports through the origin.
      expect(logRelativeError(fit.rSquared, data.certified.rSquared)).toBeGreaterThanOrEqual(9);
    });
  }
});

describe("linearFit on exact and small data", () => {
  it("gives the exact line for points on y = 2x + 1 (exact arithmetic by hand)", () => {
    const fit = linearFit([0, 1, 2, 3], [1, 3, 5, 7]);
    expectClose(fit.slope, 2, { abs: 1e-15 });
    expectClose(fit.intercept, 1, { abs: 1e-15 });
    expectClose(fit.slopeStdErr, 0, { abs: 1e-15 });
    expect(fit.rSquared).toBe(1);
    expect(fit.degreesOfFreedom).toBe(2);
  });

  it("matches the textbook standard-error formulas on a small scattered set (hand calculation)", () => {
    // x = 1..5, y = 2, 4, 5, 4, 5: Sxx = 10, Sxy = 6, slope 0.6, intercept 2.2,
    // SSres = 2.4, s² = 0.8, s_slope = sqrt(0.08), s_intercept = sqrt(0.8 (1/5 + 9/10)).
    const fit = linearFit([1, 2, 3, 4, 5], [2, 4, 5, 4, 5]);
    expectClose(fit.slope, 0.6, { rel: 1e-14 });
    expectClose(fit.intercept, 2.2, { rel: 1e-14 });
    expectClose(fit.slopeStdErr, Math.sqrt(0.08), { rel: 1e-13 });
    expectClose(fit.interceptStdErr, Math.sqrt(0.8 * 1.1), { rel: 1e-13 });
    expectClose(fit.residualStdDev, Math.sqrt(0.8), { rel: 1e-13 });
    expectClose(fit.rSquared, 1 - 2.4 / 6, { rel: 1e-13 });
  });

  it("through the origin uses slope = sum(xy) / sum(x²) (hand calculation)", () => {
    const fit = linearFit([1, 2, 3], [2, 4.5, 5.5], { throughOrigin: true });
    expectClose(fit.slope, (2 + 9 + 16.5) / 14, { rel: 1e-14 });
    expect(fit.intercept).toBe(0);
    expect(fit.interceptStdErr).toBe(0);
  });

  it("with only two points passes through both and reports no scatter (degrees of freedom 0)", () => {
    const fit = linearFit([0, 10], [3, 8]);
    expectClose(fit.slope, 0.5, { rel: 1e-15 });
    expect(fit.degreesOfFreedom).toBe(0);
    expect(fit.slopeStdErr).toBe(0);
  });
});

describe("linearFit refuses input it cannot compute", () => {
  it("one point", () => expectMarkingError(() => linearFit([1], [2]), "too-few-points"));
  it("no points through the origin", () => expectMarkingError(() => linearFit([], [], { throughOrigin: true }), "too-few-points"));
  it("all x equal", () => expectMarkingError(() => linearFit([2, 2, 2], [1, 2, 3]), "x-all-equal"));
  it("all x zero through the origin", () => expectMarkingError(() => linearFit([0, 0], [1, 2], { throughOrigin: true }), "x-all-equal"));
  it("a blank (NaN) reading", () => expectMarkingError(() => linearFit([1, 2, Number.NaN], [1, 2, 3]), "not-a-number"));
  it("an infinite reading", () => expectMarkingError(() => linearFit([1, 2, 3], [1, Infinity, 3]), "not-a-number"));
  it("columns of different lengths", () => expectMarkingError(() => linearFit([1, 2, 3], [1, 2]), "length-mismatch"));
});

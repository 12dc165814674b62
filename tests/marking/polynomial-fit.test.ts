import { describe, expect, it } from "vitest";
import { polynomialFit } from "@/lib/marking/polynomial-fit";
import { evaluatePolynomial } from "@/lib/marking/evaluate-polynomial";
import { expectClose, expectMarkingError, logRelativeError } from "./helpers";
import { loadNistLinear } from "./fixtures";

function minimumLre(name: string): { coefficients: number; stdErrs: number; residualStdDev: number; rSquared: number } {
  const data = loadNistLinear(name);
  const fit = polynomialFit(data.x, data.y, data.degree);
  return {
    coefficients: Math.min(...fit.coefficients.map((value, i) => logRelativeError(value, data.certified.estimates[i]))),
    stdErrs: Math.min(...fit.coefficientStdErrs.map((value, i) => logRelativeError(value, data.certified.stdDevs[i]))),
    residualStdDev: logRelativeError(fit.residualStdDev, data.certified.residualStdDev),
    rSquared: logRelativeError(fit.rSquared, data.certified.rSquared),
  };
}

describe("polynomialFit against NIST StRD certified values (source: NIST StRD linear regression, tests/fixtures/nist-strd)", () => {
  it("Pontius (degree 2, lower difficulty): at least 9 digits everywhere", () => {
    const lre = minimumLre("Pontius");
    expect(lre.coefficients).toBeGreaterThanOrEqual(9);
    expect(lre.stdErrs).toBeGreaterThanOrEqual(9);
    expect(lre.residualStdDev).toBeGreaterThanOrEqual(9);
    expect(lre.rSquared).toBeGreaterThanOrEqual(9);
  });

  for (const name of ["Filip", "Wampler1", "Wampler2", "Wampler3"]) {
    it(`${name} (higher difficulty): at least 7 digits on every coefficient and standard error`, () => {
      const lre = minimumLre(name);
      expect(lre.coefficients).toBeGreaterThanOrEqual(7);
      expect(lre.stdErrs).toBeGreaterThanOrEqual(7);
      expect(lre.residualStdDev).toBeGreaterThanOrEqual(7);
      expect(lre.rSquared).toBeGreaterThanOrEqual(7);
    });
  }

  it("Wampler1 is an exact fit: residual SD and standard errors are zero to working precision (NIST certifies 0)", () => {
    const data = loadNistLinear("Wampler1");
    const fit = polynomialFit(data.x, data.y, 5);
    expect(fit.residualStdDev).toBeLessThan(1e-15);
    fit.coefficientStdErrs.forEach((value) => expect(value).toBeLessThan(1e-15));
    expect(fit.rSquared).toBe(1);
  });
});

describe("polynomialFit on exact data", () => {
  it("recovers y = 1 - 2x + 0.5x³ exactly (constructed data)", () => {
    const x = [-2, -1, 0, 1, 2, 3, 4];
    const y = x.map((value) => 1 - 2 * value + 0.5 * value ** 3);
    const fit = polynomialFit(x, y, 3);
    [1, -2, 0, 0.5].forEach((expected, i) => expectClose(fit.coefficients[i], expected, { abs: 1e-13 }));
    expectClose(evaluatePolynomial(fit.coefficients, 2.5), 1 - 5 + 0.5 * 15.625, { rel: 1e-13 });
  });

  it("interpolates when there are exactly degree + 1 points", () => {
    const fit = polynomialFit([0, 1, 2], [1, 2, 5], 2);
    [1, 0, 1].forEach((expected, i) => expectClose(fit.coefficients[i], expected, { abs: 1e-14 }));
    expect(fit.degreesOfFreedom).toBe(0);
  });
});

describe("polynomialFit refuses input it cannot compute", () => {
  it("degree 0, 11 or not whole", () => {
    expectMarkingError(() => polynomialFit([1, 2, 3], [1, 2, 3], 0), "invalid-option");
    expectMarkingError(() => polynomialFit([1, 2, 3], [1, 2, 3], 11), "invalid-option");
    expectMarkingError(() => polynomialFit([1, 2, 3], [1, 2, 3], 1.5), "invalid-option");
  });
  it("fewer points than coefficients", () => expectMarkingError(() => polynomialFit([1, 2], [1, 2], 2), "too-few-points"));
  it("too few different x values (repeated x)", () =>
    expectMarkingError(() => polynomialFit([1, 1, 2, 2], [1, 1.1, 2, 2.1], 2), "repeated-x"));
  it("all x equal", () => expectMarkingError(() => polynomialFit([3, 3, 3], [1, 2, 3], 1), "x-all-equal"));
  it("NaN reading", () => expectMarkingError(() => polynomialFit([1, 2, 3], [1, Number.NaN, 3], 1), "not-a-number"));
  it("mismatched lengths", () => expectMarkingError(() => polynomialFit([1, 2, 3, 4], [1, 2, 3], 1), "length-mismatch"));
});

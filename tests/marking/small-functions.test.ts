import { describe, expect, it } from "vitest";
import { interpolateLinear } from "@/lib/marking/interpolate-linear";
import { meanRate } from "@/lib/marking/mean-rate";
import { reciprocalTime } from "@/lib/marking/reciprocal-time";
import { localRegression } from "@/lib/marking/local-regression";
import { evaluatePolynomial } from "@/lib/marking/evaluate-polynomial";
import { reactionOrder } from "@/lib/marking/reaction-order";
import { activationEnergy } from "@/lib/marking/activation-energy";
import { twoPointActivationEnergy } from "@/lib/marking/two-point-activation-energy";
import { levenbergMarquardt } from "@/lib/marking/levenberg-marquardt";
import { physicalConstants } from "@/lib/marking/physical-constants";
import { expectClose, expectMarkingError } from "./helpers";

describe("interpolateLinear and meanRate", () => {
  it("reads between readings in any order", () => {
    expect(interpolateLinear([20, 0, 10], [40, 0, 30], 15)).toBe(35);
    expect(interpolateLinear([0, 10, 20], [0, 30, 40], 20)).toBe(40);
  });
  it("mean rate between interpolated times (hand calculation)", () => {
    expect(meanRate([0, 10, 20], [0, 30, 40], 5, 15)).toBe(2);
    expect(meanRate([0, 10, 20], [50, 30, 20], 0, 20)).toBe(1.5);
    expect(meanRate([0, 10, 20], [50, 30, 20], 0, 20, { signed: true })).toBe(-1.5);
  });
  it("refuses extrapolation, repeated times and a zero-length interval", () => {
    expectMarkingError(() => interpolateLinear([0, 10], [0, 1], 11), "out-of-range");
    expectMarkingError(() => interpolateLinear([0, 0, 10], [0, 1, 2], 5), "repeated-x");
    expectMarkingError(() => interpolateLinear([0], [0], 0), "too-few-points");
    expectMarkingError(() => meanRate([0, 10], [0, 1], 5, 5), "x-all-equal");
    expectMarkingError(() => meanRate([0, 10], [0, 1], Number.NaN, 5), "not-a-number");
  });
});

describe("reciprocalTime (rate ∝ 1/t, common practice)", () => {
  it("1/t", () => expect(reciprocalTime(40)).toBe(0.025));
  it("refuses zero, negative and blank times", () => {
    expectMarkingError(() => reciprocalTime(0), "not-positive");
    expectMarkingError(() => reciprocalTime(-3), "not-positive");
    expectMarkingError(() => reciprocalTime(Number.NaN), "not-a-number");
  });
});

describe("localRegression", () => {
  it("reproduces a straight line's value and slope exactly", () => {
    const x = [0, 1, 2, 3, 4, 5];
    const result = localRegression(x, x.map((value) => 2 * value + 1), 2.5, { degree: 1 });
    expectClose(result.value, 6, { rel: 1e-12 });
    expectClose(result.slope, 2, { rel: 1e-12 });
  });
  it("refuses bad options and too few points", () => {
    expectMarkingError(() => localRegression([0, 1, 2, 3], [0, 1, 2, 3], 1, { span: 0 }), "invalid-option");
    expectMarkingError(() => localRegression([0, 1, 2, 3], [0, 1, 2, 3], 1, { degree: 3 as never }), "invalid-option");
    expectMarkingError(() => localRegression([0, 1, 2], [0, 1, 2], 1), "too-few-points");
    expectMarkingError(() => localRegression([0, 1, 2, 3], [0, 1, 2, 3], 5), "out-of-range");
  });
});

describe("evaluatePolynomial", () => {
  it("Horner's rule", () => expect(evaluatePolynomial([1, 0, 1], 3)).toBe(10));
  it("refuses an empty polynomial", () => expectMarkingError(() => evaluatePolynomial([], 1), "too-few-points"));
});

describe("reactionOrder and activation energy refuse what they cannot compute", () => {
  it("two runs give log(r2/r1)/log(c2/c1)", () => {
    expectClose(reactionOrder([0.1, 0.2], [1, 4]).order, 2, { rel: 1e-12 });
    expect(reactionOrder([0.1, 0.2], [1, 3.3]).roundedOrder).toBeNull();
    expect(reactionOrder([0.1, 0.2], [1, 2.9]).roundedOrder).toBe(1.5);
  });
  it("errors", () => {
    expectMarkingError(() => reactionOrder([0.1, 0.1], [1, 2]), "x-all-equal");
    expectMarkingError(() => reactionOrder([0.1, 0], [1, 2]), "not-positive");
    expectMarkingError(() => reactionOrder([0.1], [1]), "too-few-points");
    expectMarkingError(() => activationEnergy([300, 300], [1, 2]), "x-all-equal");
    expectMarkingError(() => activationEnergy([300, -10], [1, 2]), "not-positive");
    expectMarkingError(() => activationEnergy([300, 310], [1, 0]), "not-positive");
    expectMarkingError(() => activationEnergy([300, 310, 320], [1, 2]), "length-mismatch");
    expectMarkingError(() => twoPointActivationEnergy(300, 1, 300, 2), "x-all-equal");
    expectMarkingError(() => twoPointActivationEnergy(0, 1, 300, 2), "not-positive");
  });
  it("uses R = 8.31446261815324 J/mol/K (CODATA 2018, exact)", () => {
    expect(physicalConstants.gasConstant).toBe(8.31446261815324);
    expectClose(twoPointActivationEnergy(300, 1, 400, Math.E).ea, 8.31446261815324 * 1200, { rel: 1e-12 });
  });
});

describe("levenbergMarquardt", () => {
  it("solves a one-parameter model", () => {
    const result = levenbergMarquardt([2, 4], { values: (p) => [p[0], 2 * p[0]], jacobian: () => [[1], [2]] }, [1]);
    expectClose(result.parameters[0], 2, { rel: 1e-12 });
  });
  it("reports non-convergence when the model stops depending on a parameter", () => {
    expectMarkingError(() => levenbergMarquardt([1, 2], { values: () => [0, 0], jacobian: () => [[0], [0]] }, [1]), "not-converged");
  });
});

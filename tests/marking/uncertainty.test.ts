import { describe, expect, it } from "vitest";
import { resolutionUncertainty } from "@/lib/marking/resolution-uncertainty";
import { halfRangeUncertainty } from "@/lib/marking/half-range-uncertainty";
import { percentageUncertainty } from "@/lib/marking/percentage-uncertainty";
import { combinedPercentageUncertainty } from "@/lib/marking/combined-percentage-uncertainty";
import { expectClose, expectMarkingError } from "./helpers";

describe("resolutionUncertainty (school rule, common practice; GUM F.2.2.1 rectangular value beside it)", () => {
  it("analogue: half a division; digital: the last digit; two readings double it", () => {
    expect(resolutionUncertainty(1).uncertainty).toBe(0.5);
    expect(resolutionUncertainty(0.01, { instrument: "digital" }).uncertainty).toBe(0.01);
    expect(resolutionUncertainty(1, { readings: 2 }).uncertainty).toBe(1);
    expect(resolutionUncertainty(1, { readings: 2 }).rule).toContain("two readings");
  });
  it("GUM: resolution / (2√3) per reading, √2 times that for two", () => {
    expectClose(resolutionUncertainty(0.01, { instrument: "digital" }).gumStandardUncertainty, 0.0028868, { rel: 1e-4 });
    expectClose(resolutionUncertainty(1, { readings: 2 }).gumStandardUncertainty, Math.SQRT2 / (2 * Math.sqrt(3)), { rel: 1e-15 });
  });
  it("refuses a zero resolution and unknown options", () => {
    expectMarkingError(() => resolutionUncertainty(0), "not-positive");
    expectMarkingError(() => resolutionUncertainty(1, { instrument: "laser" as never }), "invalid-option");
    expectMarkingError(() => resolutionUncertainty(1, { readings: 3 as never }), "invalid-option");
  });
});

describe("halfRangeUncertainty (school convention, common practice)", () => {
  it("half the range and its percentage of the mean", () => {
    const result = halfRangeUncertainty([45, 47, 46]);
    expect(result.uncertainty).toBe(1);
    expect(result.mean).toBe(46);
    expectClose(result.percentage, 100 / 46, { rel: 1e-15 });
  });
  it("needs two readings", () => expectMarkingError(() => halfRangeUncertainty([3]), "too-few-points"));
});

describe("percentage uncertainties", () => {
  it("uncertainty / value × 100", () => {
    expect(percentageUncertainty(0.5, 25)).toBe(2);
    expect(percentageUncertainty(0.5, -25)).toBe(2);
    expectMarkingError(() => percentageUncertainty(0.5, 0), "not-positive");
    expectMarkingError(() => percentageUncertainty(-0.5, 2), "not-positive");
  });
  it("quotient: linear sum (school) 3 % + 4 % = 7 %; quadrature (GUM 5.1.6) √(3² + 4²) = 5 %", () => {
    const result = combinedPercentageUncertainty([{ percentage: 3 }, { percentage: 4, power: -1 }]);
    expect(result.linearSum).toBe(7);
    expect(result.quadrature).toBe(5);
    expect(result.explanation).toContain("GUM");
  });
  it("powers multiply the percentage", () => {
    const result = combinedPercentageUncertainty([{ percentage: 2, power: 2 }]);
    expect(result.linearSum).toBe(4);
    expect(result.quadrature).toBe(4);
  });
  it("refuses an empty list or negative percentage", () => {
    expectMarkingError(() => combinedPercentageUncertainty([]), "too-few-points");
    expectMarkingError(() => combinedPercentageUncertainty([{ percentage: -1 }]), "not-positive");
  });
});

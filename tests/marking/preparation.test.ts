import { describe, expect, it } from "vitest";
import { solveDilution } from "@/lib/marking/solve-dilution";
import { convertPeroxideStrength } from "@/lib/marking/convert-peroxide-strength";
import { scalePrepQuantity } from "@/lib/marking/scale-prep-quantity";
import { expectClose, expectMarkingError } from "./helpers";

describe("solveDilution: c1V1 = c2V2", () => {
  it("solves for each unknown (hand calculation)", () => {
    expect(solveDilution({ c1: 2, c2: 0.5, v2: 100 }).v1).toBe(25);
    expect(solveDilution({ c1: 2, c2: 0.5, v2: 100 }).solventToAdd).toBe(75);
    expect(solveDilution({ c1: 2, v1: 25, v2: 100 }).c2).toBe(0.5);
    expect(solveDilution({ v1: 25, c2: 0.5, v2: 100 }).c1).toBe(2);
    expect(solveDilution({ c1: 2, v1: 25, c2: 0.5 }).v2).toBe(100);
    expect(solveDilution({ c1: 2, v1: 25, c2: 0.5 }).caution).toContain("competent person");
  });
  it("refuses a stronger solution than the stock, too much stock, wrong counts and non-positive values", () => {
    expectMarkingError(() => solveDilution({ c1: 1, c2: 2, v2: 100 }), "impossible-request");
    expectMarkingError(() => solveDilution({ c1: 1, v1: 200, v2: 100 }), "impossible-request");
    expectMarkingError(() => solveDilution({ c1: 1, v1: 20 }), "invalid-option");
    expectMarkingError(() => solveDilution({ c1: 1, v1: 20, c2: 0.5, v2: 40 }), "invalid-option");
    expectMarkingError(() => solveDilution({ c1: 0, v1: 20, c2: 0.5 }), "not-positive");
    expectMarkingError(() => solveDilution({ c1: Number.NaN, v1: 20, c2: 0.5 }), "not-a-number");
  });
});

describe("convertPeroxideStrength (2 H2O2 → 2 H2O + O2; Vm = 22.41396954 dm³/mol, CODATA 2018; M = 34.0147 g/mol from memory)", () => {
  it("100 volume ≈ 8.9 mol/dm³ ≈ 30 % w/v (check values, common practice)", () => {
    const result = convertPeroxideStrength({ volumeStrength: 100 });
    expectClose(result.concentration, 8.9, { rel: 0.01 });
    expectClose(result.percentWeightPerVolume, 30, { rel: 0.02 });
  });
  it("20 volume ≈ 1.8 mol/dm³ ≈ 6 % w/v (check values, common practice)", () => {
    const result = convertPeroxideStrength({ volumeStrength: 20 });
    expectClose(result.concentration, 1.8, { rel: 0.01 });
    expectClose(result.percentWeightPerVolume, 6, { rel: 0.02 });
  });
  it("exact relations: c = 2V / Vm and round trips", () => {
    expectClose(convertPeroxideStrength({ volumeStrength: 10 }).concentration, 20 / 22.41396954, { rel: 1e-15 });
    expectClose(convertPeroxideStrength({ concentration: 1.785 }).volumeStrength, (1.785 * 22.41396954) / 2, { rel: 1e-15 });
    expectClose(convertPeroxideStrength({ percentWeightPerVolume: 6 }).concentration, 60 / 34.0147, { rel: 1e-15 });
  });
  it("refuses none or two strengths, non-positive and impossible values", () => {
    expectMarkingError(() => convertPeroxideStrength({} as never), "invalid-option");
    expectMarkingError(() => convertPeroxideStrength({ volumeStrength: 20, concentration: 1 } as never), "invalid-option");
    expectMarkingError(() => convertPeroxideStrength({ volumeStrength: 0 }), "not-positive");
    expectMarkingError(() => convertPeroxideStrength({ percentWeightPerVolume: 120 }), "impossible-request");
  });
});

describe("scalePrepQuantity: per group × (groups + spare), rounded up (one spare group by default, common practice)", () => {
  it("rounds up to two significant figures by default", () => {
    const result = scalePrepQuantity({ perGroup: 25, groups: 12 });
    expect(result.exact).toBe(325);
    expect(result.total).toBe(330);
    expect(scalePrepQuantity({ perGroup: 0.31, groups: 11 }).total).toBe(3.8);
    expect(scalePrepQuantity({ perGroup: 0.37, groups: 9, spareGroups: 0 }).total).toBe(3.4);
  });
  it("never rounds an exact multiple further up", () => {
    expect(scalePrepQuantity({ perGroup: 0.1, groups: 36, spareGroups: 1 }).total).toBe(3.7);
  });
  it("rounds up to the teacher's step", () => {
    expect(scalePrepQuantity({ perGroup: 25, groups: 12, spareGroups: 2, roundUpTo: 50 }).total).toBe(350);
  });
  it("refuses bad counts and amounts", () => {
    expectMarkingError(() => scalePrepQuantity({ perGroup: 0, groups: 3 }), "not-positive");
    expectMarkingError(() => scalePrepQuantity({ perGroup: 1, groups: 2.5 }), "invalid-option");
    expectMarkingError(() => scalePrepQuantity({ perGroup: 1, groups: 2, spareGroups: -1 }), "invalid-option");
    expectMarkingError(() => scalePrepQuantity({ perGroup: 1, groups: 2, roundUpTo: 0 }), "invalid-option");
  });
});

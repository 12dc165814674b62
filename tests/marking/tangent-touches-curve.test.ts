import { describe, expect, it } from "vitest";
import { tangentTouchesCurve } from "@/lib/marking/tangent-touches-curve";
import { expectClose, expectMarkingError } from "./helpers";

describe("tangentTouchesCurve (5 % of the y range by default, common practice)", () => {
  const curve = { x: 5, y: 20, yRange: 50 };
  it("a line through the curve point touches", () => {
    const result = tangentTouchesCurve({ x1: 0, y1: 10, x2: 10, y2: 30 }, curve);
    expect(result.touches).toBe(true);
    expectClose(result.distance, 0, { abs: 1e-15 });
    expectClose(result.gradient, 2, { rel: 1e-15 });
  });
  it("a line 2 units away (4 % of the range) touches; 3.5 units (7 %) does not", () => {
    expect(tangentTouchesCurve({ x1: 0, y1: 12, x2: 10, y2: 32 }, curve).touches).toBe(true);
    const off = tangentTouchesCurve({ x1: 0, y1: 13.5, x2: 10, y2: 33.5 }, curve);
    expect(off.touches).toBe(false);
    expectClose(off.distance, 0.07, { rel: 1e-12 });
  });
  it("the teacher can change the allowance", () => {
    expect(tangentTouchesCurve({ x1: 0, y1: 13.5, x2: 10, y2: 33.5 }, curve, 10).touches).toBe(true);
  });
  it("works with points on either side of the chosen time or both beyond it", () => {
    expect(tangentTouchesCurve({ x1: 20, y1: 50, x2: 10, y2: 30 }, curve).touches).toBe(true);
  });
  it("refuses a vertical line, a flat curve and blanks", () => {
    expectMarkingError(() => tangentTouchesCurve({ x1: 3, y1: 10, x2: 3, y2: 30 }, curve), "x-all-equal");
    expectMarkingError(() => tangentTouchesCurve({ x1: 0, y1: 10, x2: 10, y2: 30 }, { ...curve, yRange: 0 }), "not-positive");
    expectMarkingError(() => tangentTouchesCurve({ x1: Number.NaN, y1: 10, x2: 10, y2: 30 }, curve), "not-a-number");
  });
});

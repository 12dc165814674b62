import { describe, expect, it } from "vitest";
import { rateAt } from "@/lib/marking/rate-at";
import { initialRate } from "@/lib/marking/initial-rate";
import { expectClose, expectMarkingError } from "./helpers";

const t = [0, 10, 20, 30, 40, 50, 60, 80, 100, 120];
const rise = t.map((s) => 50 * (1 - Math.exp(-0.04 * s)));

describe("rateAt: derivative of a fitted curve, with its uncertainty", () => {
  it("first-order: dV/dt = a k e^(-kt) exactly on exact data (constructed curve)", () => {
    const result = rateAt(t, rise, 25, { model: "first-order" });
    expectClose(result.rate, 50 * 0.04 * Math.exp(-1), { rel: 1e-8 });
    expectClose(result.valueAt, 50 * (1 - Math.exp(-1)), { rel: 1e-8 });
    expect(result.model).toBe("first-order");
    expect(result.uncertainty).toBeLessThan(1e-6);
  });

  it("auto picks the first-order curve for first-order data and says so", () => {
    const result = rateAt(t, rise, 25);
    expect(result.model).toBe("first-order");
    expect(result.reason).toContain("first-order");
  });

  it("auto falls back to a polynomial when the data are not first-order (a quadratic here) and differentiates it exactly", () => {
    const x = [0, 1, 2, 3, 4, 5, 6];
    const y = x.map((value) => 3 + 2 * value - 0.5 * value * value + 0.1 * value ** 3);
    const result = rateAt(x, y, 2.5);
    expect(result.model).toBe("polynomial");
    expectClose(result.gradient, 2 - 2.5 + 0.3 * 2.5 * 2.5, { rel: 1e-10 });
  });

  it("local curve: exact for a quadratic, and an uncertainty that grows with scatter", () => {
    const x = [0, 1, 2, 3, 4, 5, 6, 7, 8];
    const exact = rateAt(x, x.map((value) => value * value), 4, { model: "local" });
    expectClose(exact.gradient, 8, { rel: 1e-10 });
    const wobble = [0.3, -0.2, 0.25, -0.3, 0.2, -0.25, 0.3, -0.2, 0.1];
    const noisy = rateAt(x, x.map((value, i) => value * value + wobble[i]), 4, { model: "local" });
    expect(noisy.uncertainty).toBeGreaterThan(exact.uncertainty);
  });

  it("signed keeps the negative gradient of a falling quantity; rate is positive by default", () => {
    const decay = t.map((s) => 2 * Math.exp(-0.03 * s));
    expect(rateAt(t, decay, 30).rate).toBeGreaterThan(0);
    expect(rateAt(t, decay, 30, { signed: true }).rate).toBeLessThan(0);
  });

  it("gives the same answer however often it is asked, and for shuffled readings (fits are remembered by their data)", () => {
    const first = rateAt(t, rise, 33);
    expect(rateAt(t, rise, 33)).toEqual(first);
    const order = [3, 0, 9, 5, 1, 7, 2, 8, 4, 6];
    expectClose(rateAt(order.map((i) => t[i]), order.map((i) => rise[i]), 33).rate, first.rate, { rel: 1e-12 });
  });

  it("warns about a tangent at the last reading", () => {
    expect(rateAt(t, rise, 120).caution).toContain("last reading");
  });

  it("initial rate at the first reading", () => {
    expectClose(initialRate(t, rise).rate, 2, { rel: 1e-8 });
  });

  it("refuses times outside the readings, too few readings, repeated times and unknown models", () => {
    expectMarkingError(() => rateAt(t, rise, 130), "out-of-range");
    expectMarkingError(() => rateAt([0, 1], [0, 1], 0.5), "too-few-points");
    expectMarkingError(() => rateAt([0, 1, 1, 2], [0, 1, 1.1, 2], 0.5), "repeated-x");
    expectMarkingError(() => rateAt(t, rise, 10, { model: "spline" as never }), "invalid-option");
    expectMarkingError(() => rateAt(t, rise.slice(1), 10), "length-mismatch");
    expectMarkingError(() => initialRate([], []), "too-few-points");
  });

  it("reports non-convergence when a first-order curve is forced on a straight line", () => {
    expectMarkingError(() => rateAt(t, t.map((s) => 3 * s), 20, { model: "first-order" }), "not-converged");
  });
});

import { describe, expect, it } from "vitest";
import { firstOrderFit } from "@/lib/marking/first-order-fit";
import { firstOrderStart } from "@/lib/marking/first-order-start";
import { expectClose, expectMarkingError, logRelativeError } from "./helpers";
import { column, loadKineticsCsv, loadNistNonlinear } from "./fixtures";

describe("firstOrderFit against NIST StRD Misra1a, y = b1(1 - e^(-b2 x)) (source: NIST StRD non-linear, tests/fixtures/nist-strd-nonlinear)", () => {
  const data = loadNistNonlinear("Misra1a");
  const cases = [
    { label: "NIST start 1 (far)", start: { a: data.starts[0][0], k: data.starts[0][1] } },
    { label: "NIST start 2 (near)", start: { a: data.starts[1][0], k: data.starts[1][1] } },
    { label: "a start derived from the data", start: undefined },
  ];
  for (const { label, start } of cases) {
    it(`from ${label}: parameters, standard errors and residual SS to at least 6 digits`, () => {
      const fit = firstOrderFit(data.x, data.y, { kind: "rise", offset: false, start });
      expect(logRelativeError(fit.a, data.certified.estimates[0])).toBeGreaterThanOrEqual(6);
      expect(logRelativeError(fit.k, data.certified.estimates[1])).toBeGreaterThanOrEqual(6);
      expect(logRelativeError(fit.aStdErr, data.certified.stdDevs[0])).toBeGreaterThanOrEqual(6);
      expect(logRelativeError(fit.kStdErr, data.certified.stdDevs[1])).toBeGreaterThanOrEqual(6);
      expect(logRelativeError(fit.residualSumOfSquares, data.certified.residualSumOfSquares)).toBeGreaterThanOrEqual(6);
      expect(fit.c).toBe(0);
    });
  }
});

describe("firstOrderFit on published first-order series (source: OpenStax Chemistry 2e §12.4, tests/fixtures/kinetics)", () => {
  it("H2O2 at 40 °C: k = ln 2 / 6.00 h = 0.1155 h⁻¹ (published 1.155 × 10⁻¹ h⁻¹, OS1e)", () => {
    const rows = loadKineticsCsv("h2o2_openstax_first_order.csv");
    const fit = firstOrderFit(column(rows, "time_h"), column(rows, "H2O2_mol_per_L"), { kind: "decay", offset: false });
    expectClose(fit.k, Math.LN2 / 6, { rel: 1e-6 });
    expectClose(fit.halfLife, 6, { rel: 1e-6 });
    expectClose(fit.a, 1, { rel: 1e-6 });
  });

  it("SO2Cl2: k within 1 % of the published 2.20 × 10⁻⁵ s⁻¹", () => {
    const rows = loadKineticsCsv("so2cl2_openstax_first_order.csv");
    const fit = firstOrderFit(column(rows, "time_s"), column(rows, "SO2Cl2_mol_per_L"), { kind: "decay", offset: false });
    expectClose(fit.k, 2.2e-5, { rel: 0.01 });
  });
});

describe("firstOrderFit on exact and generated data", () => {
  it("recovers a rise with an offset exactly (constructed data)", () => {
    const t = [0, 15, 30, 45, 60, 90, 120, 180];
    const y = t.map((s) => 62 * (1 - Math.exp(-0.021 * s)) + 3);
    const fit = firstOrderFit(t, y, { kind: "rise" });
    expectClose(fit.a, 62, { rel: 1e-9 });
    expectClose(fit.k, 0.021, { rel: 1e-9 });
    expectClose(fit.c, 3, { rel: 1e-8 });
    expect(fit.rSquared).toBeGreaterThan(0.999999999);
  });

  it("derives a start near the answer from the data alone", () => {
    const t = [0, 1, 2, 3, 4, 6, 8];
    const start = firstOrderStart(t, t.map((s) => 10 * Math.exp(-0.4 * s) + 1), "decay", true);
    expectClose(start.k, 0.4, { rel: 0.25 });
  });

  it("reports non-convergence when the iteration limit is reached", () => {
    const data = loadNistNonlinear("Misra1a");
    expectMarkingError(
      () => firstOrderFit(data.x, data.y, { kind: "rise", offset: false, start: { a: 500, k: 1e-4 }, maxIterations: 2 }),
      "not-converged",
    );
  });

  it("reports non-convergence for readings on a straight line rather than a made-up curve", () => {
    const t = [0, 10, 20, 30, 40, 50];
    expectMarkingError(() => firstOrderFit(t, t.map((s) => 2 * s + 1), { kind: "rise" }), "not-converged");
  });
});

describe("firstOrderFit refuses input it cannot compute", () => {
  it("too few readings", () => expectMarkingError(() => firstOrderFit([0, 1, 2], [0, 5, 7], { kind: "rise" }), "too-few-points"));
  it("repeated times", () => expectMarkingError(() => firstOrderFit([0, 0, 1, 1, 2], [0, 0, 5, 5, 7], { kind: "rise" }), "repeated-x"));
  it("blank reading", () => expectMarkingError(() => firstOrderFit([0, 1, 2, 3], [0, Number.NaN, 7, 8], { kind: "rise" }), "not-a-number"));
  it("unknown kind", () =>
    expectMarkingError(() => firstOrderFit([0, 1, 2, 3], [0, 5, 7, 8], { kind: "sideways" as unknown as "rise" }), "invalid-option"));
  it("negative starting k", () =>
    expectMarkingError(() => firstOrderFit([0, 1, 2, 3], [0, 5, 7, 8], { kind: "rise", offset: false, start: { a: 8, k: -1 } }), "not-positive"));
});

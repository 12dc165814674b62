import { describe, expect, it } from "vitest";
import { activationEnergy } from "@/lib/marking/activation-energy";
import { twoPointActivationEnergy } from "@/lib/marking/two-point-activation-energy";
import { meanRate } from "@/lib/marking/mean-rate";
import { rateAt } from "@/lib/marking/rate-at";
import { initialRate } from "@/lib/marking/initial-rate";
import { reactionOrder } from "@/lib/marking/reaction-order";
import { expectClose } from "./helpers";
import { column, loadKineticsCsv } from "./fixtures";

describe("activation energy from published rate constants (tests/fixtures/kinetics)", () => {
  it("N2O5, Daniels and Johnston 1921 (k values from memory): Ea = 103.0 kJ/mol within 0.5 % (computed expectation in the data README)", () => {
    const rows = loadKineticsCsv("n2o5_daniels_johnston_1921.csv");
    const result = activationEnergy(column(rows, "temperature_K"), column(rows, "k_per_s"));
    expectClose(result.ea, 103.0e3, { rel: 0.005 });
    expectClose(result.eaStdErr, 470, { rel: 0.1 });
    expectClose(result.preExponential, 3.9e13, { rel: 0.05 });
    expect(result.rSquared).toBeGreaterThan(0.9999);
  });

  it("N2O5, NCERT (public document): Ea = 100.7 kJ/mol within 0.5 %, A about 1.5 × 10¹³ s⁻¹", () => {
    const rows = loadKineticsCsv("n2o5_ncert.csv");
    const result = activationEnergy(column(rows, "temperature_K"), column(rows, "k_per_s"));
    expectClose(result.ea, 100.7e3, { rel: 0.005 });
    expectClose(result.preExponential, 1.5e13, { rel: 0.1 });
  });

  it("HI decomposition (OpenStax Chemistry 2e §12.5): least squares 185.3 kJ/mol ± 0.5 %; the printed 180 kJ/mol within 3 % because the book rounds 1/T and the slope", () => {
    const rows = loadKineticsCsv("hi_arrhenius_openstax_example.csv");
    const result = activationEnergy(column(rows, "temperature_K"), column(rows, "k_L_per_mol_s"));
    expectClose(result.ea, 185.3e3, { rel: 0.005 });
    expectClose(result.ea, 180e3, { rel: 0.03 });
  });

  it("two-point cases (OpenStax Chemistry 2e §12.5): computed Ea within 0.1 %, published within the printed precision", () => {
    for (const row of loadKineticsCsv("arrhenius_two_point_openstax.csv")) {
      const result = twoPointActivationEnergy(row.T1_K as number, row.k1 as number, row.T2_K as number, row.k2 as number);
      expectClose(result.ea / 1000, row.computed_Ea_kJ_per_mol as number, { rel: 0.001 });
      if (typeof row.published_Ea_kJ_per_mol === "number") {
        // Published to 2 or 3 significant figures: allow half a unit in the last printed place plus 3 %.
        expectClose(result.ea / 1000, row.published_Ea_kJ_per_mol, { rel: 0.03 });
      }
    }
  });

  it("sucrose two-point case: A = 1.4 × 10⁸ s⁻¹ computed (the printed 2.0 × 10⁸ is a suspected erratum, per the data README)", () => {
    const result = twoPointActivationEnergy(300.15, 2.1e-11, 310.15, 8.5e-11);
    expectClose(result.preExponential, 1.4e8, { rel: 0.05 });
  });
});

describe("facts of the trade (common practice)", () => {
  it("a rate that doubles for a 10 K rise near room temperature means Ea ≈ 50 kJ/mol", () => {
    const result = twoPointActivationEnergy(298.15, 1, 308.15, 2);
    expectClose(result.ea, 50e3, { rel: 0.08 });
    expectClose(activationEnergy([298.15, 308.15], [1, 2]).ea, result.ea, { rel: 1e-12 });
  });

  it("in a clock reaction rate ∝ 1/t, so Ea from 1/t equals Ea from k whatever the constant of proportionality", () => {
    const temperatures = [293.15, 303.15, 313.15, 323.15];
    const k = temperatures.map((kelvin) => 5e6 * Math.exp(-52000 / (8.31446261815324 * kelvin)));
    const times = k.map((value) => 0.37 / value);
    const fromK = activationEnergy(temperatures, k);
    const fromTimes = activationEnergy(
      temperatures,
      times.map((t) => 1 / t),
    );
    expectClose(fromK.ea, 52000, { rel: 1e-10 });
    expectClose(fromTimes.ea, fromK.ea, { rel: 1e-10 });
  });
});

describe("rates from published concentration-time series (tests/fixtures/kinetics)", () => {
  it("2 A → B (OpenStax Chemistry 2e §12.1): mean rate 0–10 s = 0.0375; 10–20 s = 0.0255 (0.0265 printed is an erratum)", () => {
    const rows = loadKineticsCsv("a_openstax_mean_rates.csv");
    const t = column(rows, "time_s");
    const a = column(rows, "A_mol_per_L");
    expectClose(meanRate(t, a, 0, 10), 0.0375, { rel: 1e-12 });
    expectClose(meanRate(t, a, 10, 20), 0.0255, { rel: 1e-12 });
    expectClose(meanRate(t, a, 0, 10, { signed: true }), -0.0375, { rel: 1e-12 });
  });

  it("H2O2 (OpenStax Chemistry 2e §12.1): mean rates 0.0833, 0.0417, 0.0208, 0.0104 mol L⁻¹ h⁻¹ over successive 6 h", () => {
    const rows = loadKineticsCsv("h2o2_openstax_first_order.csv");
    const t = column(rows, "time_h");
    const c = column(rows, "H2O2_mol_per_L");
    [0.0833, 0.0417, 0.0208, 0.0104].forEach((expected, i) => expectClose(meanRate(t, c, 6 * i, 6 * (i + 1)), expected, { rel: 0.005 }));
  });

  it("H2O2: tangent at 11.1 h = 3.20 × 10⁻² mol L⁻¹ h⁻¹ (published, read from a graph) and initial rate 0.1155 (model, data README)", () => {
    const rows = loadKineticsCsv("h2o2_openstax_first_order.csv");
    const t = column(rows, "time_h");
    const c = column(rows, "H2O2_mol_per_L");
    const at = rateAt(t, c, 11.1, { model: "first-order" });
    expectClose(at.rate, 0.032, { rel: 0.02 });
    expect(at.gradient).toBeLessThan(0);
    const auto = rateAt(t, c, 11.1);
    expect(auto.model).toBe("first-order");
    expectClose(initialRate(t, c).rate, 0.1155, { rel: 0.01 });
    // Cubic least-squares tangent at an interior time is within 5 % (data README: 0.0324 at 11.1 h).
    expectClose(rateAt(t, c, 11.1, { model: "polynomial", degree: 3 }).rate, 0.0324, { rel: 0.01 });
  });

  it("C4H6 (OpenStax Chemistry 2e §12.1, computed in the data README): mean rates 3.10 × 10⁻⁶ and 1.04 × 10⁻⁶ mol L⁻¹ s⁻¹", () => {
    const rows = loadKineticsCsv("c4h6_openstax_second_order.csv");
    const t = column(rows, "time_s");
    const c = column(rows, "C4H6_mol_per_L");
    expectClose(meanRate(t, c, 0, 1600), 3.1e-6, { rel: 0.005 });
    expectClose(meanRate(t, c, 1600, 3200), 1.04e-6, { rel: 0.005 });
  });
});

describe("orders of reaction from initial-rate sets (OpenStax Chemistry 2e §12.3, tests/fixtures/kinetics)", () => {
  const rows = loadKineticsCsv("initial_rates_openstax.csv");
  const set = (name: string) => rows.filter((row) => row.set === name);
  const single: [string, number, number, number][] = [
    // set, order, published k, relative tolerance on k
    ["ch3cho", 2, 6.73e-6, 0.01],
    ["nocl", 2, 8.0e-8, 0.01],
    ["a_30C", 2, 7.88e-3, 0.01],
    ["ethanol_blood", 0, 2.0e-2, 0.01],
    ["penicillin", 1, 5.0e-5, 0.01],
  ];
  for (const [name, order, k, tolerance] of single) {
    it(`${name}: order ${order} within ±0.1 of the whole number, k within ${tolerance * 100} %`, () => {
      const result = reactionOrder(column(set(name), "conc_1_mol_per_L"), column(set(name), "rate"));
      expectClose(result.order, order, { abs: 0.1 });
      expect(result.roundedOrder).toBe(order);
      expectClose(result.rateConstant, k, { rel: tolerance });
    });
  }

  it("no_o3: first order in each reactant, from the runs where the other is held constant", () => {
    const runs = set("no_o3");
    const o3Varies = runs.filter((row) => row.conc_1_mol_per_L === 1e-6);
    const noVaries = runs.filter((row) => row.conc_2_mol_per_L === 9e-6);
    expectClose(reactionOrder(column(o3Varies, "conc_2_mol_per_L"), column(o3Varies, "rate")).order, 1, { abs: 1e-3 });
    expectClose(reactionOrder(column(noVaries, "conc_1_mol_per_L"), column(noVaries, "rate")).order, 1, { abs: 1e-3 });
  });

  it("no_cl2: second order in NO and first in Cl2, from pairs of runs", () => {
    const runs = set("no_cl2");
    expectClose(reactionOrder([0.1, 0.15], [runs[0].rate as number, runs[2].rate as number]).order, 2, { abs: 1e-9 });
    expectClose(reactionOrder([0.1, 0.15], [runs[0].rate as number, runs[1].rate as number]).order, 1, { abs: 1e-9 });
  });
});

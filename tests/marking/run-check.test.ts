import { describe, expect, it } from "vitest";
import { runCheck } from "@/lib/marking/run-check";
import type { CheckDefinition, ResultsTable } from "@/lib/marking/check-definition";
import { expectClose, expectMarkingError } from "./helpers";
import { column, loadKineticsCsv } from "./fixtures";

// Invented gas-syringe readings for the demo (a first-order rise, 52 cm³ final, k = 0.03 s⁻¹, rounded to 0.1 cm³).
const gas: ResultsTable = {
  columns: [
    { id: "t", unit: "s", significantFigures: 2 },
    { id: "v", unit: "cm3", significantFigures: 3 },
    { id: "m", unit: "g" },
  ],
  rows: [0, 10, 20, 30, 40, 50, 60, 80, 100].map((t) => [t, Number((52 * (1 - Math.exp(-0.03 * t))).toFixed(1)), 100 - 0.004 * t]),
};

describe("runCheck: mean rate", () => {
  const definition: CheckDefinition = { kind: "mean-rate", x: "t", y: "v", from: 0, to: 20 };
  it("agrees with Δy/Δx between readings, in any equivalent unit", () => {
    const result = runCheck(definition, gas, { value: "1.2", unit: "cm3/s" });
    expect(result.verdict).toBe("agrees");
    expectClose(result.expected?.value ?? Number.NaN, 23.5 / 20, { rel: 1e-12 });
    expect(result.expected?.unit).toBe("cm³ s⁻¹");
    expect(runCheck(definition, gas, { value: "70.5", unit: "cm3/min" }).verdict).toBe("agrees");
  });
  it("names the wrong interval (10–20 s instead of 0–20 s)", () => {
    const result = runCheck(definition, gas, { value: "0.98", unit: "cm3/s" });
    expect(result.verdict).toBe("disagrees");
    expect(result.answer?.likelySlip?.code).toBe("wrong-interval");
  });
  it("names an interval the teacher listed", () => {
    const otherRate = (gas.rows[7][1]! - gas.rows[4][1]!) / 40;
    const result = runCheck({ ...definition, alternativeIntervals: [[40, 80]] }, gas, { value: otherRate.toPrecision(3), unit: "cm3/s" });
    expect(result.answer?.likelySlip?.code).toBe("wrong-interval");
  });
  it("names minutes for seconds", () => {
    expect(runCheck(definition, gas, { value: "70.5", unit: "cm3/s" }).answer?.likelySlip?.code).toBe("minutes-for-seconds");
  });
  it("cannot check an interval outside the readings, and says why", () => {
    const result = runCheck({ ...definition, to: 500 }, gas, { value: "1" });
    expect(result.verdict).toBe("cannot-check");
    expect(result.problem?.source).toBe("data");
    expect(result.problem?.code).toBe("out-of-range");
  });
  it("checks significant figures against the data columns ± 1", () => {
    const policy = { significantFigures: { matchData: "columns" as const } };
    // Columns recorded to 2 and 3 figures: the smaller, 2, give or take 1.
    expect(runCheck({ ...definition, policy }, gas, { value: "1.18", unit: "cm3/s" }).answer?.significantFiguresOk).toBe(true);
    expect(runCheck({ ...definition, policy }, gas, { value: "1.17500", unit: "cm3/s" }).answer?.significantFiguresOk).toBe(false);
  });
});

describe("runCheck: gradient of the line of best fit", () => {
  it("agrees with the least-squares gradient and names a gradient of the wrong columns", () => {
    const definition: CheckDefinition = { kind: "gradient", x: "t", y: "m" };
    const right = runCheck(definition, gas, { value: "-0.0040", unit: "g/s" });
    expect(right.verdict).toBe("agrees");
    const wrongSign = runCheck(definition, gas, { value: "0.0040", unit: "g/s" });
    expect(wrongSign.answer?.likelySlip?.code).toBe("lost-minus-sign");
    const vAgainstT = runCheck({ kind: "gradient", x: "t", y: "v" }, gas, { value: "0" }).expected?.value ?? Number.NaN;
    const wrongColumns = runCheck(definition, gas, { value: vAgainstT.toPrecision(3), unit: "g/s" });
    expect(wrongColumns.answer?.likelySlip?.code).toBe("wrong-columns");
  });
});

describe("runCheck: rate at a time and initial rate", () => {
  it("rate at 30 s from a first-order fit, with a drawn tangent that touches", () => {
    const definition: CheckDefinition = { kind: "rate-at", x: "t", y: "v", at: 30 };
    // Exact rate of the generating curve: 52 × 0.03 × e^(−0.9) = 0.634 cm³/s (constructed data).
    const result = runCheck(definition, gas, { value: "0.66", unit: "cm3/s", tangent: { x1: 0, y1: 11.8, x2: 60, y2: 49.9 } });
    expect(result.verdict).toBe("agrees");
    expectClose(result.expected?.value ?? Number.NaN, 52 * 0.03 * Math.exp(-0.9), { rel: 0.01 });
    expect(result.notes.join(" ")).toContain("first-order");
    const missed = runCheck(definition, gas, { value: "0.66", unit: "cm3/s", tangent: { x1: 0, y1: 21.8, x2: 60, y2: 59.9 } });
    expect(missed.answer?.tangent?.touches).toBe(false);
    expect(missed.verdict).toBe("close");
  });
  it("initial rate: total change over total time is named", () => {
    const definition: CheckDefinition = { kind: "initial-rate", x: "t", y: "v" };
    expect(runCheck(definition, gas, { value: "1.6", unit: "cm3/s" }).verdict).toBe("agrees");
    const slip = runCheck(definition, gas, { value: "0.49", unit: "cm3/s" });
    expect(slip.answer?.likelySlip?.code).toBe("mean-rate-as-initial-rate");
  });
  it("a chord between readings instead of a tangent is named", () => {
    const definition: CheckDefinition = { kind: "rate-at", x: "t", y: "v", at: 60, model: "first-order" };
    const chord = (gas.rows[7][1]! - gas.rows[6][1]!) / 20;
    const result = runCheck(definition, gas, { value: chord.toPrecision(3), unit: "cm3/s" });
    expect(result.answer?.likelySlip?.code).toBe("chord-not-tangent");
  });
});

describe("runCheck: per-row checks", () => {
  const clock: ResultsTable = {
    columns: [
      { id: "T", unit: "°C" },
      { id: "t1", unit: "s" },
      { id: "t2", unit: "s" },
      { id: "t3", unit: "s" },
    ],
    rows: [
      [20, 120, 118, 122],
      [30, 62, 64, 80],
      [40, 33, 34, 32],
      [50, null, null, null],
    ],
  };
  it("mean of repeats leaves the anomaly out, and names it when left in", () => {
    const result = runCheck({ kind: "mean-of-repeats", repeats: ["t1", "t2", "t3"] }, clock, {
      rows: [{ value: "120", unit: "s" }, { value: "68.7", unit: "s" }, { value: "33", unit: "s" }, null],
    });
    expect(result.rows?.[1].excluded?.[0].value).toBe(80);
    expect(result.rows?.[1].result?.likelySlip?.code).toBe("anomaly-included");
    expect(result.rows?.[0].result?.verdict).toBe("agrees");
    expect(result.rows?.[3].result).toBeNull();
    expect(result.verdict).toBe("disagrees");
    expect(result.summary).toEqual({ agrees: 2, close: 0, disagrees: 1, "cannot-check": 0 });
  });
  it("1/t row by row, with a row not yet answered", () => {
    const result = runCheck({ kind: "reciprocal-time", t: "t1" }, clock, { rows: [{ value: "0.00833", unit: "s-1" }, { value: "0.0161", unit: "/s" }, null, null] });
    expect(result.rows?.[0].result?.verdict).toBe("agrees");
    expect(result.rows?.[2].result?.verdict).toBe("cannot-check");
    expect(result.verdict).toBe("cannot-check");
    const all = runCheck({ kind: "reciprocal-time", t: "t1" }, clock, {
      rows: [{ value: "0.00833", unit: "s-1" }, { value: "0.0161", unit: "s-1" }, { value: "0.0303", unit: "s-1" }, null],
    });
    expect(all.verdict).toBe("agrees");
  });
});

describe("runCheck: order and activation energy from published data (OpenStax Chemistry 2e §12.3; Daniels and Johnston 1921, k from memory)", () => {
  it("order of the CH3CHO set is 2 (published: rate = k[CH3CHO]²)", () => {
    const runs = loadKineticsCsv("initial_rates_openstax.csv").filter((row) => row.set === "ch3cho");
    const table: ResultsTable = {
      columns: [
        { id: "c", unit: "mol/dm3" },
        { id: "r", unit: "mol dm-3 s-1" },
      ],
      rows: runs.map((row) => [row.conc_1_mol_per_L as number, row.rate as number]),
    };
    expect(runCheck({ kind: "order", concentration: "c", rate: "r" }, table, { value: "2" }).verdict).toBe("agrees");
    const inverted = runCheck({ kind: "order", concentration: "c", rate: "r" }, table, { value: "0.5" });
    expect(inverted.verdict).toBe("disagrees");
    expect(inverted.answer?.likelySlip?.code).toBe("inverted-ratio");
  });

  it("activation energy of N2O5 = 103 kJ/mol from k and °C; °C used for K is named", () => {
    const rows = loadKineticsCsv("n2o5_daniels_johnston_1921.csv");
    const table: ResultsTable = {
      columns: [
        { id: "theta", unit: "°C" },
        { id: "k", unit: "s-1" },
      ],
      rows: rows.slice(1).map((row) => [row.temperature_C as number, row.k_per_s as number]),
    };
    const definition: CheckDefinition = { kind: "activation-energy", temperature: "theta", rate: "k", rateIs: "rate-constant" };
    const result = runCheck(definition, table, { value: "103", unit: "kJ/mol" });
    expect(result.verdict).toBe("agrees");
    expectClose(result.expected?.value ?? Number.NaN, 103.19, { rel: 0.005 });
    expect(runCheck(definition, table, { value: "103000", unit: "J mol-1" }).verdict).toBe("agrees");
    const thetaAsK = column(rows.slice(1), "temperature_C");
    const k = column(rows.slice(1), "k_per_s");
    // Ea a student gets by using θ/°C as if it were T/K, worked out independently here.
    const n = thetaAsK.length;
    const xs = thetaAsK.map((value) => 1 / value);
    const ys = k.map((value) => Math.log(value));
    const mx = xs.reduce((a, b) => a + b) / n;
    const my = ys.reduce((a, b) => a + b) / n;
    const slope = xs.reduce((s, x, i) => s + (x - mx) * (ys[i] - my), 0) / xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    const celsiusEa = (-slope * 8.31446261815324) / 1000;
    const slip = runCheck(definition, table, { value: celsiusEa.toPrecision(3), unit: "kJ/mol" });
    expect(slip.answer?.likelySlip?.code).toBe("celsius-for-kelvin");
    const log10 = runCheck(definition, table, { value: (103.19 / Math.LN10).toPrecision(3), unit: "kJ/mol" });
    expect(log10.answer?.likelySlip?.code).toBe("log10-for-ln");
  });

  it("activation energy from clock-reaction times (rate ∝ 1/t, common practice)", () => {
    const temperatures = [20, 30, 40, 50];
    const times = temperatures.map((theta) => 0.01 / (1e7 * Math.exp(-50000 / (8.31446261815324 * (theta + 273.15)))));
    const table: ResultsTable = {
      columns: [
        { id: "T", unit: "C" },
        { id: "t", unit: "s" },
      ],
      rows: temperatures.map((theta, i) => [theta, times[i]]),
    };
    const result = runCheck({ kind: "activation-energy", temperature: "T", rate: "t", rateIs: "time" }, table, { value: "50", unit: "kJ/mol" });
    expectClose(result.expected?.value ?? Number.NaN, 50, { rel: 1e-9 });
    expect(result.verdict).toBe("agrees");
  });
});

describe("runCheck: percentage uncertainty", () => {
  it("a gas syringe read to 1 cm³ (half a division), start and end readings, 40 cm³ → 2.5 % (school rule, common practice)", () => {
    const definition: CheckDefinition = { kind: "percentage-uncertainty", resolution: 1, reading: 40, readings: 2 };
    const result = runCheck(definition, gas, { value: "2.5", unit: "%" });
    expectClose(result.expected?.value ?? Number.NaN, 2.5, { rel: 1e-12 });
    expect(result.verdict).toBe("agrees");
    expect(runCheck(definition, gas, { value: "0.025", unit: "%" }).answer?.likelySlip?.code).toBe("percentage-as-fraction");
    expect(runCheck(definition, gas, { value: "1.25", unit: "%" }).answer?.likelySlip?.code).toBe("resolution-rule");
  });
});

describe("runCheck: problems", () => {
  it("blank rows are skipped with a note", () => {
    const table: ResultsTable = { columns: gas.columns, rows: [...gas.rows, [120, null, 99.5]] };
    const result = runCheck({ kind: "gradient", x: "t", y: "v" }, table, { value: "0.4", unit: "cm3/s" });
    expect(result.notes.join(" ")).toContain("10");
  });
  it("student data that cannot be used gives cannot-check with the reason", () => {
    const table: ResultsTable = { columns: gas.columns, rows: [[0, 1, 2]] };
    const result = runCheck({ kind: "gradient", x: "t", y: "v" }, table, { value: "1" });
    expect(result.verdict).toBe("cannot-check");
    expect(result.problem?.code).toBe("too-few-points");
    expect(result.hint).toContain("cannot be checked yet");
  });
  it("an answer given per row to a single-answer check cannot be checked", () => {
    const result = runCheck({ kind: "gradient", x: "t", y: "v" }, gas, { rows: [] });
    expect(result.problem?.source).toBe("answer");
  });
  it("a definition that does not fit the table throws for the app to fix", () => {
    expectMarkingError(() => runCheck({ kind: "gradient", x: "time", y: "v" }, gas, { value: "1" }), "unknown-column");
    expectMarkingError(() => runCheck({ kind: "mystery" } as unknown as CheckDefinition, gas, { value: "1" }), "invalid-definition");
    expectMarkingError(() => runCheck({ kind: "mean-of-repeats", repeats: ["t"] }, gas, { rows: [] }), "invalid-definition");
    expectMarkingError(
      () => runCheck({ kind: "activation-energy", temperature: "t", rate: "v", rateIs: "rate-constant" }, gas, { value: "1" }),
      "invalid-definition",
    );
    expectMarkingError(() => runCheck({ kind: "gradient", x: "t", y: "v" }, { columns: gas.columns, rows: [[1, 2]] }, { value: "1" }), "length-mismatch");
  });
  it("results are plain JSON", () => {
    const result = runCheck({ kind: "rate-at", x: "t", y: "v", at: 20 }, gas, { value: "0.9", unit: "cm3/s" });
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });
});

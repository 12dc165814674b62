import { describe, expect, it } from "vitest";
import { deriveColumn } from "@/lib/marking/derive-column";
import { expectClose, expectMarkingError } from "./helpers";

describe("deriveColumn works out derived columns row by row", () => {
  it("1/t, with blanks kept blank and a zero reported for its row", () => {
    const cells = deriveColumn([[20, null, 40, 0]], { kind: "reciprocal" });
    expect(cells.map((cell) => cell.value)).toEqual([0.05, null, 0.025, null]);
    expect(cells[3].problem?.code).toBe("not-positive");
    expect(cells[1].problem).toBeUndefined();
  });
  it("ln k and log10", () => {
    expectClose(deriveColumn([[Math.E]], { kind: "natural-log" })[0].value ?? Number.NaN, 1, { rel: 1e-15 });
    expect(deriveColumn([[1000]], { kind: "log10" })[0].value).toBe(3);
    expect(deriveColumn([[-1]], { kind: "natural-log" })[0].problem?.code).toBe("not-positive");
  });
  it("T in K and 1/T from °C (T/K = θ/°C + 273.15, exact)", () => {
    expect(deriveColumn([[25]], { kind: "kelvin", from: "°C" })[0].value).toBe(298.15);
    expectClose(deriveColumn([[25]], { kind: "reciprocal-kelvin", from: "°C" })[0].value ?? Number.NaN, 1 / 298.15, { rel: 1e-15 });
    expect(deriveColumn([[300]], { kind: "reciprocal-kelvin", from: "K" })[0].value).toBe(1 / 300);
    expect(deriveColumn([[-300]], { kind: "kelvin", from: "°C" })[0].problem?.code).toBe("not-positive");
  });
  it("mean of repeats per row, with anomalies listed", () => {
    const cells = deriveColumn(
      [
        [62, 45],
        [64, 47],
        [80, null],
      ],
      { kind: "mean-of-repeats" },
    );
    expect(cells[0].value).toBe(63);
    expect(cells[0].excluded?.[0].value).toBe(80);
    expect(cells[1].value).toBe(46);
  });
  it("dilutions: c = c_stock × V_stock / V_total, from a total or from stock and water columns", () => {
    expect(deriveColumn([[10, 25]], { kind: "dilution", stockConcentration: 2, totalVolume: 50 }).map((cell) => cell.value)).toEqual([0.4, 1]);
    expect(
      deriveColumn(
        [
          [10, 40],
          [40, 10],
        ],
        { kind: "dilution", stockConcentration: 0.15 },
      ).map((cell) => cell.value),
    ).toEqual([0.03, 0.12]);
    expect(deriveColumn([[60]], { kind: "dilution", stockConcentration: 2, totalVolume: 50 })[0].problem?.code).toBe("impossible-request");
  });
  it("refuses missing columns, uneven columns and unknown operations", () => {
    expectMarkingError(() => deriveColumn([], { kind: "reciprocal" }), "too-few-points");
    expectMarkingError(() => deriveColumn([[1, 2], [1]], { kind: "mean-of-repeats" }), "length-mismatch");
    expectMarkingError(() => deriveColumn([[1]], { kind: "square" } as never), "invalid-option");
    expectMarkingError(() => deriveColumn([[1]], { kind: "dilution", stockConcentration: -1, totalVolume: 5 }), "invalid-option");
  });
});

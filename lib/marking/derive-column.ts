import { meanOfRepeats } from "./mean-of-repeats";
import { MarkingInputError } from "./marking-input-error";
import { physicalConstants } from "./physical-constants";
import type { Anomaly } from "./find-anomalies";

/** The derived columns a results table can have, each worked out row by row. */
export type DerivedColumnOperation =
  /** Mean of the repeat columns, anomalies left out (see `meanOfRepeats`). */
  | { readonly kind: "mean-of-repeats"; readonly anomalyPercent?: number }
  /** 1 / x, for example 1/t as a rate (per unit of x). */
  | { readonly kind: "reciprocal" }
  /** ln x, for example ln k. */
  | { readonly kind: "natural-log" }
  /** log10 x, for example log(rate). */
  | { readonly kind: "log10" }
  /** Temperature in K from a column in °C or K. */
  | { readonly kind: "kelvin"; readonly from: "°C" | "K" }
  /** 1/T in K^-1 from a column in °C or K. */
  | { readonly kind: "reciprocal-kelvin"; readonly from: "°C" | "K" }
  /**
   * Concentration after dilution, c = c_stock x V_stock / V_total. With `totalVolume` the first
   * column is V_stock; without it the columns are V_stock and V_water (V_total = their sum).
   */
  | { readonly kind: "dilution"; readonly stockConcentration: number; readonly totalVolume?: number };

/** One cell of a derived column. */
export interface DerivedCell {
  /** The value, or null when the row is blank or cannot be worked out. */
  readonly value: number | null;
  /** Why the row could not be worked out, in plain words. */
  readonly problem?: { readonly code: string; readonly message: string };
  /** Repeats left out of a mean as anomalous. */
  readonly excluded?: readonly Anomaly[];
}

type Cell = number | null | undefined;

/**
 * Works out a derived column of a results table row by row: mean of repeats, 1/x, ln x, log10 x,
 * T in K, 1/T in K^-1, or a concentration after dilution.
 *
 * A blank input cell gives a blank result; a value that cannot be used (for example ln of zero)
 * gives a blank with a `problem` for that row instead of stopping the whole column. T/K = θ/°C +
 * 273.15 (exact, definition of the Celsius scale).
 *
 * @param columns - the input columns (one for most operations; the repeat columns for a mean;
 *   stock and water volumes for a dilution without a total), each with one cell per row
 * @param operation - which column to work out
 * @returns one cell per row
 * @throws {MarkingInputError} `too-few-points` (no input column), `length-mismatch`,
 *   `invalid-option` (unknown operation or bad stock settings)
 * @example
 * deriveColumn([[20, null, 40]], { kind: "reciprocal" }).map((cell) => cell.value); // => [0.05, null, 0.025]
 */
export function deriveColumn(columns: readonly (readonly Cell[])[], operation: DerivedColumnOperation): DerivedCell[] {
  const functionName = "deriveColumn";
  if (!Array.isArray(columns) || columns.length === 0) {
    throw new MarkingInputError("too-few-points", functionName, "A derived column needs at least one column to work from.");
  }
  const rowCount = columns[0].length;
  if (columns.some((column) => column.length !== rowCount)) {
    throw new MarkingInputError("length-mismatch", functionName, "The columns used have different numbers of rows.");
  }
  const problem = (code: string, message: string): DerivedCell => ({ value: null, problem: { code, message } });
  const single = (compute: (value: number, row: number) => DerivedCell): DerivedCell[] =>
    columns[0].map((value: Cell, row: number): DerivedCell => {
      if (value === null || value === undefined) return { value: null };
      if (typeof value !== "number" || !Number.isFinite(value)) return problem("not-a-number", `Row ${row + 1} is not a number.`);
      return compute(value, row);
    });
  const toKelvin = (value: number, from: "°C" | "K"): number => (from === "°C" ? value + physicalConstants.zeroCelsiusInKelvin : value);

  switch (operation?.kind) {
    case "mean-of-repeats":
      return Array.from({ length: rowCount }, (_, row) => {
        try {
          const result = meanOfRepeats(
            columns.map((column) => column[row] ?? null),
            { anomalyPercent: operation.anomalyPercent },
          );
          return result.excluded.length > 0 ? { value: result.mean, excluded: result.excluded } : { value: result.mean };
        } catch (error) {
          if (error instanceof MarkingInputError) {
            return error.code === "too-few-points" ? { value: null } : problem(error.code, error.message);
          }
          throw error;
        }
      });
    case "reciprocal":
      return single((value, row) => (value === 0 ? problem("not-positive", `Row ${row + 1} is zero, and 1 ÷ 0 has no value.`) : { value: 1 / value }));
    case "natural-log":
    case "log10":
      return single((value, row) =>
        value <= 0
          ? problem("not-positive", `Row ${row + 1} is zero or negative, and a logarithm needs a number above zero.`)
          : { value: operation.kind === "natural-log" ? Math.log(value) : Math.log10(value) },
      );
    case "kelvin":
    case "reciprocal-kelvin":
      if (operation.from !== "°C" && operation.from !== "K") {
        throw new MarkingInputError("invalid-option", functionName, 'The temperature column must be in "°C" or "K".');
      }
      return single((value, row) => {
        const kelvin = toKelvin(value, operation.from);
        if (kelvin <= 0) return problem("not-positive", `Row ${row + 1} is at or below absolute zero, which cannot be right.`);
        return { value: operation.kind === "kelvin" ? kelvin : 1 / kelvin };
      });
    case "dilution": {
      const stock = operation.stockConcentration;
      if (!(Number.isFinite(stock) && stock > 0)) {
        throw new MarkingInputError("invalid-option", functionName, "The stock concentration must be a number above zero.");
      }
      if (operation.totalVolume !== undefined && !(Number.isFinite(operation.totalVolume) && operation.totalVolume > 0)) {
        throw new MarkingInputError("invalid-option", functionName, "The total volume must be a number above zero.");
      }
      if (operation.totalVolume === undefined && columns.length < 2) {
        throw new MarkingInputError("too-few-points", functionName, "Without a total volume, give the stock and water volume columns.");
      }
      return Array.from({ length: rowCount }, (_, row) => {
        const stockVolume = columns[0][row];
        const water = operation.totalVolume === undefined ? columns[1][row] : 0;
        if (stockVolume === null || stockVolume === undefined || water === null || water === undefined) return { value: null };
        if (!Number.isFinite(stockVolume) || !Number.isFinite(water)) return problem("not-a-number", `Row ${row + 1} is not a number.`);
        const total = operation.totalVolume ?? stockVolume + water;
        if (stockVolume < 0 || water < 0 || total <= 0 || stockVolume > total) {
          return problem("impossible-request", `Row ${row + 1}: the volumes cannot be right (a volume is negative or more stock than the total).`);
        }
        return { value: (stock * stockVolume) / total };
      });
    }
    default:
      throw new MarkingInputError("invalid-option", functionName, "This kind of derived column is not known.");
  }
}

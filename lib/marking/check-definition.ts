import type { AnswerPolicy, SignificantFigureRule } from "./check-answer";
import type { RateModel } from "./rate-at";

/**
 * Types shared by the app and the engine for calculation checks. They are plain JSON shapes
 * (no classes, no functions), so the app can store them and mirror them in its own schemas.
 */

/** The id of a results-table column, as the practical defines it (for example "time"). */
export type ColumnId = string;

/** One column of a results table: its id and the unit of its cells ("s", "cm³", "°C", "" for none). */
export interface ResultsTableColumn {
  readonly id: ColumnId;
  readonly unit: string;
  /** Heading shown to people, for example "time / s" (not used in calculations). */
  readonly label?: string;
  /** Significant figures the column was recorded to, for the "match the data" rule. */
  readonly significantFigures?: number;
}

/** A student's results table: cells are numbers, or null when blank. rows[r][c] belongs to columns[c]. */
export interface ResultsTable {
  readonly columns: readonly ResultsTableColumn[];
  readonly rows: readonly (readonly (number | null)[])[];
}

/** A significant-figure rule, where "columns" means: match the data columns used (their `significantFigures`), give or take `slack` (default 1). */
export type CheckSignificantFigureRule = SignificantFigureRule | { readonly matchData: "columns"; readonly slack?: number };

/** The teacher's marking policy for one check: the answer policy, with "match the data columns" allowed. */
export interface CheckPolicy extends Omit<AnswerPolicy, "significantFigures"> {
  readonly significantFigures?: CheckSignificantFigureRule;
}

interface CheckBase {
  /** Tolerance, significant-figure and unit rules; sensible defaults per kind when absent. */
  readonly policy?: CheckPolicy;
}

/** Mean rate between two x values (interpolating between readings). */
export interface MeanRateCheck extends CheckBase {
  readonly kind: "mean-rate";
  readonly x: ColumnId;
  readonly y: ColumnId;
  /** Start of the interval, in the x column's unit. */
  readonly from: number;
  /** End of the interval, in the x column's unit. */
  readonly to: number;
  /** true: expect the signed gradient (negative when y falls); default false: a positive rate. */
  readonly signed?: boolean;
  /** Other intervals a student might wrongly use, [from, to] in x units (neighbouring ones are tried anyway). */
  readonly alternativeIntervals?: readonly (readonly [number, number])[];
}

/** Gradient of the least-squares line of y against x. */
export interface GradientCheck extends CheckBase {
  readonly kind: "gradient";
  readonly x: ColumnId;
  readonly y: ColumnId;
  /** Force the line through the origin. Default false. */
  readonly throughOrigin?: boolean;
  /** Other column pairs a student might wrongly plot (every other column against x or y is tried anyway). */
  readonly alternativeColumns?: readonly { readonly x: ColumnId; readonly y: ColumnId }[];
}

/** Rate at a time: gradient of the tangent to the fitted curve at `at`. */
export interface RateAtCheck extends CheckBase {
  readonly kind: "rate-at";
  readonly x: ColumnId;
  readonly y: ColumnId;
  /** The time of the tangent, in the x column's unit. */
  readonly at: number;
  /** Curve to take the tangent from (default "auto"). */
  readonly model?: RateModel;
  readonly signed?: boolean;
}

/** Initial rate: gradient of the tangent at the first reading. */
export interface InitialRateCheck extends CheckBase {
  readonly kind: "initial-rate";
  readonly x: ColumnId;
  readonly y: ColumnId;
  readonly model?: RateModel;
  readonly signed?: boolean;
}

/** 1/t for each row (clock and disappearing-mark reactions). The answer is one value per row. */
export interface ReciprocalTimeCheck extends CheckBase {
  readonly kind: "reciprocal-time";
  readonly t: ColumnId;
}

/** Mean of the repeat columns for each row, anomalies left out. The answer is one value per row. */
export interface MeanOfRepeatsCheck extends CheckBase {
  readonly kind: "mean-of-repeats";
  /** The repeat columns (at least 2), in compatible units; the mean is in the first one's unit. */
  readonly repeats: readonly ColumnId[];
  /** Anomaly threshold, percent from the median of the repeats (default 10, common practice). */
  readonly anomalyPercent?: number;
}

/** Order of reaction: gradient of log(rate) against log(concentration). */
export interface OrderCheck extends CheckBase {
  readonly kind: "order";
  readonly concentration: ColumnId;
  readonly rate: ColumnId;
}

/** Activation energy from ln k (or ln 1/t) against 1/T. The answer is expected in kJ mol⁻¹ (J mol⁻¹ converts). */
export interface ActivationEnergyCheck extends CheckBase {
  readonly kind: "activation-energy";
  readonly temperature: ColumnId;
  /** Unit of the temperature column; default the column's own unit, which must then be °C or K. */
  readonly temperatureUnit?: "°C" | "K";
  /** The column of rate constants k, or of times t (then 1/t is used as the rate). */
  readonly rate: ColumnId;
  readonly rateIs: "rate-constant" | "time";
}

/** Percentage uncertainty of one reading from the instrument's resolution. */
export interface PercentageUncertaintyCheck extends CheckBase {
  readonly kind: "percentage-uncertainty";
  /** Smallest division or last digit, in the reading's unit. */
  readonly resolution: number;
  /** The reading (or value from two readings), in the same unit. */
  readonly reading: number;
  /** "analogue": half a division; "digital": the last digit. Default "analogue". */
  readonly instrument?: "analogue" | "digital";
  /** 2 when the value comes from two readings (start and end). Default 1. */
  readonly readings?: 1 | 2;
}

/** A calculation check, told apart by `kind`. */
export type CheckDefinition =
  | MeanRateCheck
  | GradientCheck
  | RateAtCheck
  | InitialRateCheck
  | ReciprocalTimeCheck
  | MeanOfRepeatsCheck
  | OrderCheck
  | ActivationEnergyCheck
  | PercentageUncertaintyCheck;

/** The kind names. */
export type CheckKind = CheckDefinition["kind"];

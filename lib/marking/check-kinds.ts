import type { CheckKind } from "./check-definition";

/** How the unit of a check's answer follows from its columns. */
export type CheckUnitRule =
  /** y column's unit divided by x column's unit (for example cm³ s⁻¹). */
  | "y-per-x"
  /** One over the time column's unit (for example s⁻¹). */
  | "per-x"
  /** The unit of the repeat columns. */
  | "same-as-columns"
  /** A fixed unit, given in `unit`. */
  | "fixed";

/** One check kind, described for people and for the app. */
export interface CheckKindInfo {
  readonly kind: CheckKind;
  /** Plain-English name for menus. */
  readonly label: string;
  /** One sentence on what the engine works out. */
  readonly description: string;
  readonly unitRule: CheckUnitRule;
  /** The unit produced when `unitRule` is "fixed" ("" means no unit). */
  readonly unit?: string;
  /** True when the student gives one answer per row rather than one answer. */
  readonly perRow: boolean;
}

/**
 * Every calculation-check kind with a plain label, what it works out, the unit it produces and
 * whether it is answered row by row. The order is the order for menus.
 *
 * @example
 * checkKinds.find((info) => info.kind === "activation-energy")?.unit; // => "kJ mol⁻¹"
 */
export const checkKinds: readonly CheckKindInfo[] = [
  {
    kind: "mean-rate",
    label: "Mean rate over an interval",
    description: "Change in y divided by the change in x between two times, reading between readings where needed.",
    unitRule: "y-per-x",
    perRow: false,
  },
  {
    kind: "gradient",
    label: "Gradient of the line of best fit",
    description: "Least-squares gradient of y against x, with or without the line through the origin, with its standard error.",
    unitRule: "y-per-x",
    perRow: false,
  },
  {
    kind: "rate-at",
    label: "Rate at a time (tangent)",
    description: "Gradient of the fitted curve at the chosen time; a drawn tangent must also touch the curve there.",
    unitRule: "y-per-x",
    perRow: false,
  },
  {
    kind: "initial-rate",
    label: "Initial rate",
    description: "Gradient of the fitted curve at the first reading.",
    unitRule: "y-per-x",
    perRow: false,
  },
  {
    kind: "reciprocal-time",
    label: "Rate from a time (1/t), each row",
    description: "One divided by the time, for clock and disappearing-mark reactions.",
    unitRule: "per-x",
    perRow: true,
  },
  {
    kind: "mean-of-repeats",
    label: "Mean of repeats, each row",
    description: "Mean of the repeat readings in a row, leaving out anomalous readings by the stated rule.",
    unitRule: "same-as-columns",
    perRow: true,
  },
  {
    kind: "order",
    label: "Order of reaction",
    description: "Gradient of log(rate) against log(concentration).",
    unitRule: "fixed",
    unit: "",
    perRow: false,
  },
  {
    kind: "activation-energy",
    label: "Activation energy",
    description: "Minus the gradient of ln k (or ln 1/t) against 1/T, with T in kelvin, times R.",
    unitRule: "fixed",
    unit: "kJ mol⁻¹",
    perRow: false,
  },
  {
    kind: "percentage-uncertainty",
    label: "Percentage uncertainty",
    description: "Uncertainty of a reading from the instrument's resolution, divided by the reading, times 100.",
    unitRule: "fixed",
    unit: "%",
    perRow: false,
  },
];

import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber } from "./internal/validate";

/** Input to {@link scalePrepQuantity}. */
export interface PrepQuantityInput {
  /** Amount one group needs (any unit). */
  readonly perGroup: number;
  /** Number of groups in the class. */
  readonly groups: number;
  /** Extra groups' worth to prepare as spare (default 1, common practice). */
  readonly spareGroups?: number;
  /** Round the total up to a multiple of this (for example 50 for cm³ or a bottle size); default automatic. */
  readonly roundUpTo?: number;
}

/** Result of {@link scalePrepQuantity}. */
export interface PrepQuantity {
  /** perGroup x (groups + spareGroups), unrounded. */
  readonly exact: number;
  /** The amount to prepare, rounded up. */
  readonly total: number;
  /** The step it was rounded up to. */
  readonly step: number;
  readonly caution: string;
}

/**
 * Scales a prep-list quantity for a class: per group x (groups + spare), rounded up.
 *
 * Rounded up, never down, to `roundUpTo` if given, otherwise to two significant figures (the
 * step is a tenth of the total's leading power of ten: 337.5 -> 340, 3.72 -> 3.8).
 *
 * @param input - per-group amount (above 0), groups (whole, at least 1), spare groups (whole, 0 or more), rounding step
 * @returns the exact and rounded-up totals and the step used
 * @throws {MarkingInputError} `not-a-number`, `not-positive`, `invalid-option`
 * @example
 * scalePrepQuantity({ perGroup: 25, groups: 12 }).total; // => 330 (25 x 13 = 325, rounded up)
 */
export function scalePrepQuantity(input: PrepQuantityInput): PrepQuantity {
  const functionName = "scalePrepQuantity";
  requireFiniteNumber(input?.perGroup, "amount per group", functionName);
  requireFiniteNumber(input.groups, "number of groups", functionName);
  const spare = input.spareGroups ?? 1;
  requireFiniteNumber(spare, "number of spare groups", functionName);
  if (input.perGroup <= 0) throw new MarkingInputError("not-positive", functionName, "The amount per group must be greater than zero.");
  if (!Number.isInteger(input.groups) || input.groups < 1) {
    throw new MarkingInputError("invalid-option", functionName, "The number of groups must be a whole number, at least 1.");
  }
  if (!Number.isInteger(spare) || spare < 0) {
    throw new MarkingInputError("invalid-option", functionName, "The number of spare groups must be a whole number, 0 or more.");
  }
  if (input.roundUpTo !== undefined && !(Number.isFinite(input.roundUpTo) && input.roundUpTo > 0)) {
    throw new MarkingInputError("invalid-option", functionName, "The rounding step must be greater than zero.");
  }
  const exact = input.perGroup * (input.groups + spare);
  const step = input.roundUpTo ?? 10 ** (Math.floor(Math.log10(exact)) - 1);
  // Guard against 3.7 / 0.1 = 37.000000000000004 rounding up to 38.
  const multiples = Math.ceil(exact / step - 1e-9);
  const total = Number((multiples * step).toPrecision(12));
  return { exact, total, step, caution: "Check the totals against the practical and your school's risk assessment before preparing them." };
}

import { MarkingInputError } from "./marking-input-error";

/** Three of the four quantities in c1 V1 = c2 V2 (leave the unknown out or null). */
export interface DilutionInput {
  /** Stock concentration (any unit, same as c2). */
  readonly c1?: number | null;
  /** Volume of stock used (any unit, same as v2). */
  readonly v1?: number | null;
  /** Concentration wanted after dilution. */
  readonly c2?: number | null;
  /** Final volume after dilution. */
  readonly v2?: number | null;
}

/** Result of {@link solveDilution}. */
export interface Dilution {
  readonly c1: number;
  readonly v1: number;
  readonly c2: number;
  readonly v2: number;
  readonly solvedFor: "c1" | "v1" | "c2" | "v2";
  /** Solvent to add: v2 - v1, in the volume unit. */
  readonly solventToAdd: number;
  /** Reminder shown with any preparation quantity. */
  readonly caution: string;
}

const caution = "Check these quantities with a competent person and your school's risk assessment before preparing the solution.";

/**
 * Solves the dilution equation c1 V1 = c2 V2 for the one unknown, refusing impossible requests.
 *
 * A dilution can only weaken a solution: c2 <= c1 and V1 <= V2. Asking for a stronger solution
 * than the stock, or for less final volume than the stock volume, is refused.
 *
 * @param input - exactly three of c1, v1, c2, v2, all greater than zero (c1, c2 in one unit; v1, v2 in one unit)
 * @returns all four quantities, which was solved for and the volume of solvent to add
 * @throws {MarkingInputError} `invalid-option` (not exactly one unknown), `not-a-number`,
 *   `not-positive`, `impossible-request`
 * @example
 * solveDilution({ c1: 2, c2: 0.5, v2: 100 }).v1; // => 25
 */
export function solveDilution(input: DilutionInput): Dilution {
  const functionName = "solveDilution";
  const names = ["c1", "v1", "c2", "v2"] as const;
  const missing = names.filter((name) => input[name] === undefined || input[name] === null);
  if (missing.length !== 1) {
    throw new MarkingInputError("invalid-option", functionName, "Give exactly three of c1, V1, c2 and V2; the fourth is worked out.");
  }
  for (const name of names) {
    const value = input[name];
    if (value === undefined || value === null) continue;
    if (typeof value !== "number" || !Number.isFinite(value)) {
      throw new MarkingInputError("not-a-number", functionName, `${name} is not a number.`);
    }
    if (value <= 0) throw new MarkingInputError("not-positive", functionName, `${name} must be greater than zero.`);
  }
  const { c1, v1, c2, v2 } = input as Record<string, number>;
  const solvedFor = missing[0];
  const solved =
    solvedFor === "c1" ? { c1: (c2 * v2) / v1, v1, c2, v2 }
    : solvedFor === "v1" ? { c1, v1: (c2 * v2) / c1, c2, v2 }
    : solvedFor === "c2" ? { c1, v1, c2: (c1 * v1) / v2, v2 }
    : { c1, v1, c2, v2: (c1 * v1) / c2 };
  if (solved.c2 > solved.c1 * (1 + 1e-12)) {
    throw new MarkingInputError(
      "impossible-request",
      functionName,
      "A dilution cannot make a solution stronger than the stock; the concentration wanted is higher than the stock's.",
    );
  }
  if (solved.v1 > solved.v2 * (1 + 1e-12)) {
    throw new MarkingInputError("impossible-request", functionName, "The volume of stock is more than the final volume, which is impossible.");
  }
  return { ...solved, solvedFor, solventToAdd: Math.max(0, solved.v2 - solved.v1), caution };
}

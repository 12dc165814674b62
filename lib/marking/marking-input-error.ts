/**
 * Machine-readable reasons why the calculation engine refused its input.
 *
 * - `not-a-number`: a value is blank, NaN or infinite where a number is needed.
 * - `length-mismatch`: two columns that belong together have different lengths.
 * - `too-few-points`: fewer readings than the calculation needs.
 * - `repeated-x`: x values repeat where they must differ (or too few different x for the fit).
 * - `x-all-equal`: every x value is the same, so no gradient exists.
 * - `not-positive`: a time, temperature, concentration or rate that must be above zero is not.
 * - `out-of-range`: a time or option lies outside what the data or method allows.
 * - `ill-conditioned`: the numbers cannot give a trustworthy fit (for example a polynomial too
 *   wiggly for the spread of x).
 * - `not-converged`: a curve fit did not settle on an answer.
 * - `unknown-unit`, `incompatible-units`: a unit was not recognised, or cannot be converted.
 * - `unreadable-number`: typed text is not a number.
 * - `impossible-request`: a preparation request that cannot be made (for example a dilution to
 *   a stronger solution than the stock).
 * - `invalid-option`: an option has a value the function does not accept.
 * - `unknown-column`, `invalid-definition`: a check definition does not fit its results table.
 */
export type MarkingInputErrorCode =
  | "not-a-number"
  | "length-mismatch"
  | "too-few-points"
  | "repeated-x"
  | "x-all-equal"
  | "not-positive"
  | "out-of-range"
  | "ill-conditioned"
  | "not-converged"
  | "unknown-unit"
  | "incompatible-units"
  | "unreadable-number"
  | "impossible-request"
  | "invalid-option"
  | "unknown-column"
  | "invalid-definition";

/**
 * The one error the calculation engine throws for input it cannot compute with.
 *
 * Every function in `lib/marking` checks its input and throws this error rather than return
 * `NaN`, `Infinity` or an arbitrary number. `code` is for programs; `message` is a sentence a
 * student or teacher can act on; `functionName` says which calculation refused.
 *
 * @param code - machine-readable reason (see {@link MarkingInputErrorCode})
 * @param functionName - the exported function that refused, for example `"linearFit"`
 * @param message - a plain sentence saying what to change
 * @example
 * try { linearFit([1], [2]); } catch (error) {
 *   if (error instanceof MarkingInputError) error.code; // => "too-few-points"
 * }
 */
export class MarkingInputError extends Error {
  readonly code: MarkingInputErrorCode;
  readonly functionName: string;

  constructor(code: MarkingInputErrorCode, functionName: string, message: string) {
    super(message);
    this.name = "MarkingInputError";
    this.code = code;
    this.functionName = functionName;
  }

  /** A plain object safe to send as JSON. */
  toJSON(): { code: MarkingInputErrorCode; functionName: string; message: string } {
    return { code: this.code, functionName: this.functionName, message: this.message };
  }
}

import { parseTypedNumber } from "./parse-typed-number";

/**
 * Significant figures in a number as the student typed it.
 *
 * Leading zeros never count. With a decimal point, every digit from the first non-zero digit
 * counts, trailing zeros included ("0.0450" has 3). In scientific notation only the digits
 * before the power of ten count ("1.20e3" has 3). A whole number ending in zeros without a
 * decimal point is ambiguous; its trailing zeros are taken as not significant ("1200" has 2,
 * "1200." has 4) so that a student who wants them counted must write them so.
 *
 * @param typed - the number as typed, for example "0.0450" or "1.20 x 10^3"
 * @returns the count of significant figures
 * @throws {MarkingInputError} `unreadable-number`
 * @example
 * significantFigures("0.0450"); // => 3
 * significantFigures("1.20e3"); // => 3
 * significantFigures("1200"); // => 2
 */
export function significantFigures(typed: string): number {
  return parseTypedNumber(typed).significantFigures;
}

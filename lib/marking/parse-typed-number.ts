import { MarkingInputError } from "./marking-input-error";

/** A number read from what a student typed, with what the typing says about its precision. */
export interface TypedNumber {
  readonly value: number;
  /** Significant figures shown (see `significantFigures` for the rule). */
  readonly significantFigures: number;
  /** True for a whole number ending in zeros without a decimal point ("1200"): the count is a lower bound. */
  readonly ambiguousTrailingZeros: boolean;
  /** Decimal places of the value as written (may be negative for "1.2e3", that is -2). */
  readonly decimalPlaces: number;
  /** Any text typed after the number, for example a unit ("cm3/s"); empty if none. */
  readonly trailingText: string;
}

const superscriptDigits: Record<string, string> = {
  "⁰": "0", "¹": "1", "²": "2", "³": "3", "⁴": "4", "⁵": "5", "⁶": "6", "⁷": "7", "⁸": "8", "⁹": "9", "⁻": "-", "⁺": "+",
};

/**
 * Reads a number as a student types it and counts its significant figures.
 *
 * Accepts an optional sign (including the typographic minus), digits with one decimal point
 * (".5" and "5." too), SI-style digit groups separated by a space ("12 000"), and a power of ten
 * written as "e-3", "E-3", "x10^-3", "× 10⁻³", "*10^-3" or "x10-3". Text after the number is
 * returned as `trailingText` (often a unit). Commas are refused because "1,250" could mean
 * 1.25 or 1250.
 *
 * Significant figures: leading zeros never count; every digit from the first non-zero digit
 * counts when there is a decimal point; without a decimal point trailing zeros are taken as not
 * significant ("1200" has 2, flagged as ambiguous). Zero itself counts as 1, or as the number of
 * zeros after the decimal point when there are more ("0.00" has 2).
 *
 * @param typed - the text the student typed
 * @returns value, significant figures, decimal places and trailing text
 * @throws {MarkingInputError} `unreadable-number`
 * @example
 * parseTypedNumber("1.20 x 10^-3 mol").value; // => 0.0012
 * parseTypedNumber("0.0450").significantFigures; // => 3
 */
export function parseTypedNumber(typed: string): TypedNumber {
  const refuse = (why: string): MarkingInputError =>
    new MarkingInputError("unreadable-number", "parseTypedNumber", why);
  if (typeof typed !== "string" || typed.trim() === "") {
    throw refuse("No number was typed; type the answer as a number, for example 0.45.");
  }
  let text = typed.trim().replace(/[\u2212\u2013]/g, "-").replace(/[\u2009\u202f\u00a0]/g, " ");
  text = text.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺]+/g, (run) => `^${[...run].map((character) => superscriptDigits[character]).join("")}`);
  if (text.includes(",")) {
    throw refuse(`"${typed}" has a comma, which could be read two ways; use a decimal point and no commas, for example 1250 or 1.25.`);
  }
  const pattern =
    /^([+-]?)\s*((?:\d{1,3}(?: \d{3})+|\d+)(?:\.\d*)?|\.\d+)(?:\s*(?:[eE]\s*([+-]?\d+)|\s*[x×*·]\s*10\s*(?:\^\s*\(?\s*([+-]?\d+)\s*\)?|([+-]\d+)|(?=\s|$)))?)?(.*)$/;
  const match = pattern.exec(text);
  if (!match) {
    throw refuse(`"${typed}" could not be read as a number; type digits with a decimal point, for example 0.045 or 4.5e-2.`);
  }
  const [, sign, mantissaText, eExponent, caretExponent, bareExponent, rest] = match;
  const trailingText = rest.trim();
  if (/^[\d.]/.test(trailingText)) {
    throw refuse(`"${typed}" could not be read as one number; type a single number.`);
  }
  const exponentText = eExponent ?? caretExponent ?? bareExponent;
  const hasTimesTen = /[x×*·]\s*10/.test(text.slice(sign.length + mantissaText.length, text.length - rest.length));
  const exponent = exponentText !== undefined ? Number(exponentText) : hasTimesTen ? 1 : 0;
  const mantissa = mantissaText.replace(/ /g, "");
  const value = Number(`${sign}${mantissa}e${exponent}`);
  if (!Number.isFinite(value)) throw refuse(`"${typed}" is too large to use.`);

  const hasPoint = mantissa.includes(".");
  const [wholePart, fractionPart = ""] = mantissa.split(".");
  const digits = (wholePart + fractionPart).replace(/^0+/, "");
  let significantFigures: number;
  let ambiguousTrailingZeros = false;
  if (digits === "") {
    significantFigures = Math.max(1, fractionPart.length);
  } else if (hasPoint) {
    significantFigures = digits.length;
  } else {
    const stripped = digits.replace(/0+$/, "");
    ambiguousTrailingZeros = stripped.length < digits.length;
    significantFigures = stripped.length;
  }
  return {
    value: value === 0 ? 0 : value,
    significantFigures,
    ambiguousTrailingZeros,
    decimalPlaces: fractionPart.length - exponent,
    trailingText,
  };
}

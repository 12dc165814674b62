import { unitConversion } from "./internal/unit-conversion";
import { findLikelySlip, unitSlipCandidates, type LikelySlip, type SlipCandidate } from "./find-likely-slip";
import { MarkingInputError } from "./marking-input-error";
import { parseTypedNumber, type TypedNumber } from "./parse-typed-number";
import { parseUnit, type ParsedUnit } from "./parse-unit";
import { slipMessages } from "./slip-codes";
import { tangentTouchesCurve, type CurvePoint, type TangentLine, type TangentTouch } from "./tangent-touches-curve";

/** Our verdict words. */
export type Verdict = "agrees" | "close" | "disagrees" | "cannot-check";

/**
 * The list of verdicts, for the app's schemas (for example a zod enum).
 *
 * @example
 * verdicts; // => ["agrees", "close", "disagrees", "cannot-check"]
 */
export const verdicts: readonly Verdict[] = ["agrees", "close", "disagrees", "cannot-check"];

/** How the expected value was obtained; it sets the default tolerance. */
export type ExpectedMethod = "fitted" | "tangent" | "calculated";

/**
 * Default tolerance, in percent, for each way of getting the expected value (common practice;
 * the teacher can override it): fitted gradients 10 %, hand-drawn tangents 15 %, arithmetic on
 * the readings 2 % (plus the rounding of the typed number).
 *
 * @example
 * defaultTolerancePercent.tangent; // => 15
 */
export const defaultTolerancePercent: Readonly<Record<ExpectedMethod, number>> = {
  fitted: 10,
  tangent: 15,
  calculated: 2,
};

/** The value recomputed from the student's own data. */
export interface ExpectedAnswer {
  readonly value: number;
  /** Unit of `value` as text ("cm³ s⁻¹"); "" for a pure number. */
  readonly unit: string;
  /** Standard uncertainty of `value` from the fit's own scatter, same unit (absent or 0 if exact). */
  readonly standardUncertainty?: number;
  /** Sets the default tolerance: fitted 10 %, tangent 15 %, calculated 2 %. Default "fitted". */
  readonly method?: ExpectedMethod;
  /** Values that known slips would give, computed from the data (most specific first). */
  readonly slips?: readonly SlipCandidate[];
  /** Where the fitted curve is at the chosen time, for checking a drawn tangent. */
  readonly curve?: CurvePoint;
  /** True when the value is a rate, which is given as a positive number (changes the sign hint). */
  readonly isRate?: boolean;
}

/** What the student typed. */
export interface StudentAnswer {
  /** The number exactly as typed, for example "0.0450" or "4.5 x 10^-2". */
  readonly value: string;
  /** The unit as typed; when absent, any text after the number is used. */
  readonly unit?: string;
  /** Two points on the tangent the student drew, in graph units. */
  readonly tangent?: TangentLine;
}

/** The teacher's rule for significant figures. */
export type SignificantFigureRule =
  | { readonly min: number; readonly max: number }
  | { readonly matchData: number; readonly slack?: number };

/** The teacher's marking policy for one answer. All fields optional. */
export interface AnswerPolicy {
  /** Relative tolerance in percent; default from the expected method (10, 15 or 2). */
  readonly tolerancePercent?: number;
  /** An absolute tolerance in the expected unit, used when larger (for example 0.25 for an order). */
  readonly absoluteTolerance?: number;
  /** "close" reaches this many times the tolerance (default 2). */
  readonly closeFactor?: number;
  /** Coverage factor k applied to the fit's standard uncertainty when widening (default 2). */
  readonly coverageFactor?: number;
  /** Significant figures required; none by default. */
  readonly significantFigures?: SignificantFigureRule;
  /** Whether a unit must be given (default: when the expected unit is not empty). */
  readonly requireUnit?: boolean;
  /** Whether the sign must match (default true). */
  readonly signMatters?: boolean;
  /** Largest gap between a drawn tangent and the curve, percent of the y range (default 5). */
  readonly tangentTouchPercent?: number;
}

/** Result of {@link checkAnswer}. Safe to show to a student: it never contains the expected value. */
export interface AnswerCheck {
  readonly verdict: Verdict;
  /** (answer - expected) / |expected|, after unit conversion; null when it cannot be worked out. */
  readonly deviation: number | null;
  /** The relative tolerance applied, after widening by the fit's uncertainty; null if not checked. */
  readonly tolerance: number | null;
  /** The student's number in the expected unit (null when unreadable). */
  readonly answerValue: number | null;
  /** Significant figures typed (null when unreadable). */
  readonly significantFigures: number | null;
  /** Whether they satisfy the teacher's rule; null when there is no rule. */
  readonly significantFiguresOk: boolean | null;
  /** Whether the unit is present (when needed), recognised and fits the quantity. */
  readonly unitOk: boolean;
  /** The student's unit in tidy form, when recognised. */
  readonly unitTyped: string | null;
  readonly likelySlip?: LikelySlip;
  readonly tangent?: TangentTouch;
  /** Plain sentences for the student; never the expected number. */
  readonly hint: string;
}

function describeRule(rule: SignificantFigureRule): { min: number; max: number } {
  if ("matchData" in rule) {
    const slack = rule.slack ?? 1;
    return { min: Math.max(1, rule.matchData - slack), max: rule.matchData + slack };
  }
  return { min: rule.min, max: rule.max };
}

function validatePolicy(policy: AnswerPolicy): void {
  const positive = (value: number | undefined, what: string): void => {
    if (value !== undefined && !(Number.isFinite(value) && value >= 0)) {
      throw new MarkingInputError("invalid-option", "checkAnswer", `The ${what} must be a number of zero or more.`);
    }
  };
  positive(policy.tolerancePercent, "tolerance");
  positive(policy.absoluteTolerance, "absolute tolerance");
  positive(policy.coverageFactor, "coverage factor");
  positive(policy.tangentTouchPercent, "tangent tolerance");
  if (policy.closeFactor !== undefined && !(policy.closeFactor >= 1)) {
    throw new MarkingInputError("invalid-option", "checkAnswer", "The close band must be at least 1 times the tolerance.");
  }
  if (policy.significantFigures) {
    const { min, max } = describeRule(policy.significantFigures);
    if (!(Number.isInteger(min) && Number.isInteger(max) && min >= 1 && max >= min)) {
      throw new MarkingInputError("invalid-option", "checkAnswer", "The significant-figure rule needs whole numbers with the smallest at least 1.");
    }
  }
}

/**
 * Compares a student's typed answer with the value recomputed from their own data.
 *
 * Method: read the number and unit as typed; convert the number to the expected unit (a missing,
 * unknown or unsuitable unit leaves it as typed and marks the unit wrong). Allowed gap =
 * max(t x |E|, absolute tolerance) + half a unit in the last place the student typed (at most
 * half of t x |E|), where
 * t = sqrt(t0^2 + (k u / |E|)^2) widens the teacher's tolerance t0 by the fit's standard
 * uncertainty u (k = 2). |A - E| within the gap "agrees", within closeFactor (2) gaps "close",
 * otherwise "disagrees"; an unreadable answer is "cannot-check". A correct number with a missing
 * or wrong unit, or with a drawn tangent that does not touch the curve, is "close". When the answer
 * is not agreed, known slips are tried (data slips from `expected.slips` first, then sign,
 * inverted ratio, minutes/seconds, cm³/dm³, J/kJ, fraction/percentage, powers of ten) and the
 * best match is named.
 *
 * @param expected - value, unit, standard uncertainty, method, slip values and curve point
 * @param answer - typed number, unit and optional tangent points
 * @param policy - the teacher's tolerance, significant-figure and unit rules
 * @returns verdict, deviation, significant-figure and unit flags, likely slip and a hint
 * @throws {MarkingInputError} `not-a-number` (expected value), `invalid-option` (policy)
 * @example
 * checkAnswer({ value: 0.5, unit: "cm3/s" }, { value: "30", unit: "cm3/min" }, {}).verdict; // => "agrees"
 */
export function checkAnswer(expected: ExpectedAnswer, answer: StudentAnswer, policy: AnswerPolicy = {}): AnswerCheck {
  if (typeof expected?.value !== "number" || !Number.isFinite(expected.value)) {
    throw new MarkingInputError("not-a-number", "checkAnswer", "The expected value could not be worked out, so the answer cannot be checked.");
  }
  validatePolicy(policy);
  const expectedUnit = expected.unit ?? "";
  let parsedExpected: ParsedUnit | null = null;
  try {
    parsedExpected = parseUnit(expectedUnit);
  } catch {
    parsedExpected = null;
  }
  const unitNeeded = policy.requireUnit ?? (parsedExpected ? parsedExpected.display !== "" : expectedUnit.trim() !== "");

  let typed: TypedNumber;
  try {
    typed = parseTypedNumber(answer?.value ?? "");
  } catch (error) {
    if (!(error instanceof MarkingInputError)) throw error;
    return {
      verdict: "cannot-check",
      deviation: null,
      tolerance: null,
      answerValue: null,
      significantFigures: null,
      significantFiguresOk: null,
      unitOk: false,
      unitTyped: null,
      hint: error.message,
    };
  }

  // Unit: convert when it fits, otherwise keep the number as typed and say what is wrong.
  const unitText = (answer.unit ?? "").trim() || typed.trailingText;
  let answerValue = typed.value;
  let unitOk = true;
  let unitTyped: string | null = null;
  let unitHint = "";
  let unitScale = 1;
  if (unitText === "") {
    if (unitNeeded) {
      unitOk = false;
      unitHint = "Add the unit of your answer.";
    }
  } else {
    let parsedAnswer: ParsedUnit | null = null;
    try {
      parsedAnswer = parseUnit(unitText);
      unitTyped = parsedAnswer.display;
    } catch {
      unitOk = false;
      unitHint = `The unit "${unitText}" was not recognised; write it like cm3/s or mol dm-3.`;
    }
    if (parsedAnswer && parsedExpected) {
      try {
        const toExpected = unitConversion(unitText, expectedUnit, "checkAnswer");
        answerValue = toExpected(typed.value);
        unitScale = Math.abs(toExpected(1) - toExpected(0));
      } catch {
        unitOk = false;
        unitHint = "The unit you gave does not fit this quantity; think about what was divided by what.";
      }
    }
  }

  const signMatters = policy.signMatters !== false;
  const method = expected.method ?? "fitted";
  const baseTolerance = (policy.tolerancePercent ?? defaultTolerancePercent[method]) / 100;
  const magnitude = Math.abs(expected.value);
  const uncertainty = Math.abs(expected.standardUncertainty ?? 0);
  const widening = magnitude > 0 ? ((policy.coverageFactor ?? 2) * uncertainty) / magnitude : 0;
  const tolerance = Math.sqrt(baseTolerance ** 2 + widening ** 2);
  // Half a unit in the last typed place, capped at half the tolerance so that a one-figure answer
  // does not double the allowed gap.
  const roundingAllowance = Math.min(0.5 * 10 ** -typed.decimalPlaces * unitScale, 0.5 * tolerance * magnitude || Infinity);
  const allowed =
    Math.max(tolerance * magnitude, policy.absoluteTolerance ?? 0, magnitude === 0 ? (policy.coverageFactor ?? 2) * uncertainty : 0) +
    roundingAllowance;
  const compared = signMatters ? answerValue : Math.abs(answerValue);
  const target = signMatters ? expected.value : magnitude;
  const gap = Math.abs(compared - target);
  const closeFactor = policy.closeFactor ?? 2;
  let verdict: Verdict = gap <= allowed ? "agrees" : gap <= closeFactor * allowed ? "close" : "disagrees";
  const deviation = magnitude > 0 ? (compared - target) / magnitude : null;

  // Significant figures.
  let significantFiguresOk: boolean | null = null;
  let sigFigHint = "";
  if (policy.significantFigures) {
    const { min, max } = describeRule(policy.significantFigures);
    significantFiguresOk = typed.significantFigures >= min && typed.significantFigures <= max;
    if (!significantFiguresOk) {
      const wanted = min === max ? `${min}` : `${min} to ${max}`;
      const zeros = typed.ambiguousTrailingZeros ? " Zeros at the end of a whole number do not count unless you write a decimal point or use standard form." : "";
      sigFigHint = `Give your answer to ${wanted} significant figures; you gave ${typed.significantFigures}.${zeros}`;
    }
  }

  // A drawn tangent: does it touch, and does the typed number match its gradient?
  let tangent: TangentTouch | undefined;
  let likelySlip: LikelySlip | undefined;
  if (answer.tangent && expected.curve) {
    try {
      tangent = tangentTouchesCurve(answer.tangent, expected.curve, policy.tangentTouchPercent ?? 5);
    } catch (error) {
      if (!(error instanceof MarkingInputError)) throw error;
      tangent = undefined;
    }
    if (tangent) {
      const typedAgainstLine = Math.abs(typed.value) - Math.abs(tangent.gradient);
      if (Math.abs(typedAgainstLine) > 0.05 * Math.abs(tangent.gradient) + 0.5 * 10 ** -typed.decimalPlaces) {
        likelySlip = { code: "tangent-gradient-misread", message: slipMessages["tangent-gradient-misread"] };
      }
      if (!tangent.touches) {
        likelySlip = { code: "tangent-not-touching", message: slipMessages["tangent-not-touching"] };
        if (verdict === "agrees") verdict = "close";
      }
    }
  }
  if (verdict === "agrees" && !unitOk) verdict = "close";

  if (verdict !== "agrees" && !likelySlip && gap > allowed) {
    const candidates = [...(expected.slips ?? []), ...unitSlipCandidates(expected.value, expectedUnit, signMatters, expected.isRate === true)];
    const found = findLikelySlip(answerValue, candidates, tolerance, roundingAllowance);
    if (found) likelySlip = found;
  }

  const sentences: string[] = [];
  if (verdict === "agrees") sentences.push("Your answer agrees with the value worked out from your own results.");
  else if (verdict === "close" && gap <= allowed) sentences.push("Your number agrees with your results, but something else needs fixing.");
  else if (verdict === "close") sentences.push("Your answer is close to the value from your results but just outside what is allowed. Check your reading of the graph and your rounding.");
  else sentences.push("Your answer is quite different from the value worked out from your own results.");
  if (likelySlip) sentences.push(likelySlip.message);
  else if (verdict === "disagrees") sentences.push("Go through your working one step at a time.");
  if (unitHint) sentences.push(unitHint);
  if (sigFigHint) sentences.push(sigFigHint);

  return {
    verdict,
    deviation,
    tolerance,
    answerValue,
    significantFigures: typed.significantFigures,
    significantFiguresOk,
    unitOk,
    unitTyped,
    ...(likelySlip ? { likelySlip } : {}),
    ...(tangent ? { tangent } : {}),
    hint: sentences.join(" "),
  };
}

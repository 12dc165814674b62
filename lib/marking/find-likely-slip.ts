import { parseUnit } from "./parse-unit";
import { slipMessages, type SlipCode } from "./slip-codes";

/** A value the answer would have if the student had made a particular slip (in the expected unit). */
export interface SlipCandidate {
  readonly code: SlipCode;
  readonly value: number;
}

/** The slip judged most likely, with the sentence for the student. */
export interface LikelySlip {
  readonly code: SlipCode;
  readonly message: string;
}

/**
 * Slip values that follow from the expected value and its unit alone: sign (a minus sign lost,
 * a negative rate when `isRate`, or a wrong sign otherwise), inverted ratio,
 * minutes for seconds (when the unit involves time), cm³ for dm³ (volume), J for kJ (energy),
 * a fraction for a percentage, and finally any power of ten from 10^-3 to 10^3.
 *
 * @param expectedValue - the value worked out from the student's data
 * @param expectedUnit - its unit ("" for none); decides which unit slips are possible
 * @param signMatters - false leaves out the sign slips
 * @param isRate - true when a positive rate is expected (changes which sign slip is named)
 * @returns slip values in the expected unit, most specific first (none when the value is 0)
 * @example
 * unitSlipCandidates(0.5, "cm3/s", true, true).find((slip) => slip.code === "minutes-for-seconds")?.value;
 * // => 30
 */
export function unitSlipCandidates(
  expectedValue: number,
  expectedUnit: string,
  signMatters: boolean,
  isRate = false,
): SlipCandidate[] {
  const candidates: SlipCandidate[] = [];
  if (expectedValue === 0) return candidates;
  let dimensions: readonly number[] = [0, 0, 0, 0, 0, 0];
  let isPercent = false;
  try {
    const parsed = parseUnit(expectedUnit);
    dimensions = parsed.dimensions;
    isPercent = parsed.display === "%";
  } catch {
    // An unknown expected unit still allows the unit-free slips below.
  }
  if (signMatters) {
    const code = expectedValue < 0 ? "lost-minus-sign" : isRate ? "negative-rate" : "wrong-sign";
    candidates.push({ code, value: -expectedValue });
  }
  candidates.push({ code: "inverted-ratio", value: 1 / expectedValue });
  const timePower = dimensions[2];
  if (timePower !== 0) {
    candidates.push({ code: "minutes-for-seconds", value: expectedValue * 60 ** timePower });
    candidates.push({ code: "minutes-for-seconds", value: expectedValue * 60 ** -timePower });
  }
  const lengthPower = dimensions[0];
  const isEnergy = dimensions[0] === 2 && dimensions[1] === 1 && dimensions[2] === -2;
  if (isEnergy) {
    candidates.push({ code: "joules-for-kilojoules", value: expectedValue * 1000 }, { code: "joules-for-kilojoules", value: expectedValue / 1000 });
  } else if (Math.abs(lengthPower) >= 3) {
    candidates.push({ code: "cm3-for-dm3", value: expectedValue * 1000 }, { code: "cm3-for-dm3", value: expectedValue / 1000 });
  }
  if (isPercent) candidates.push({ code: "percentage-as-fraction", value: expectedValue / 100 });
  for (const power of [1, 2, 3, -1, -2, -3]) {
    candidates.push({ code: "power-of-ten", value: expectedValue * 10 ** power });
  }
  return candidates;
}

/**
 * Picks the slip whose value the answer matches best.
 *
 * A candidate matches when |answer - candidate| <= relativeTolerance x |candidate| + allowance;
 * among matches the closest (relative distance) wins, and on a tie the one listed first. Data
 * slips (wrong interval, wrong columns, °C for K...) should be listed before unit slips so that
 * the more specific explanation wins.
 *
 * @param answer - the student's value, in the expected unit
 * @param candidates - slip values, most specific first
 * @param relativeTolerance - fraction, for example 0.1
 * @param allowance - extra absolute allowance for the rounding of the typed number (default 0)
 * @returns the likely slip with its sentence, or null when none fits
 * @example
 * findLikelySlip(30, [{ code: "minutes-for-seconds", value: 30 }], 0.05)?.code; // => "minutes-for-seconds"
 */
export function findLikelySlip(
  answer: number,
  candidates: readonly SlipCandidate[],
  relativeTolerance: number,
  allowance = 0,
): LikelySlip | null {
  let best: { code: SlipCode; distance: number } | null = null;
  for (const candidate of candidates) {
    if (!Number.isFinite(candidate.value)) continue;
    const gap = Math.abs(answer - candidate.value);
    if (gap > relativeTolerance * Math.abs(candidate.value) + allowance) continue;
    const distance = candidate.value === 0 ? gap : gap / Math.abs(candidate.value);
    if (best === null || distance < best.distance - 1e-12) best = { code: candidate.code, distance };
  }
  return best === null ? null : { code: best.code, message: slipMessages[best.code] };
}

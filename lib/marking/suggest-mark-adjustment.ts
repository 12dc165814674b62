import { linearFit } from "./linear-fit";
import { MarkingInputError } from "./marking-input-error";

/** Result of {@link suggestMarkAdjustment}. */
export interface MarkAdjustment {
  /** moderator total ≈ intercept + slope × teacher total. */
  readonly slope: number;
  readonly intercept: number;
  readonly rSquared: number | null;
  /** The fit's own standard error of the slope (null for two points). */
  readonly slopeStdErr: number | null;
  /** Every piece of work in the cohort with its total before and after, rounded to whole marks within 0..maxTotal. */
  readonly changes: readonly { readonly id: string; readonly before: number; readonly after: number }[];
}

/**
 * Suggests how to adjust a whole cohort's totals from a moderation sample.
 *
 * Method: least-squares straight line of the moderator's totals on the teacher's totals over the
 * sampled work (linearFit), then each cohort total t becomes round(intercept + slope × t),
 * kept within 0 and the maximum mark. When every sampled teacher total is the same, the line
 * cannot be fitted and the shift is the mean difference instead (slope 1).
 *
 * @param sample - pairs of teacher and moderator totals from the sample (at least two)
 * @param cohort - every piece of work to adjust, with its teacher total
 * @param maxTotal - the most marks available
 * @returns the line and the before/after table
 * @throws {MarkingInputError} `too-few-points` for fewer than two pairs; `not-a-number`
 * @example
 * suggestMarkAdjustment([{ teacher: 4, moderator: 5 }, { teacher: 8, moderator: 9 }], [{ id: "a", total: 6 }], 10).changes[0].after; // => 7
 */
export function suggestMarkAdjustment(sample: readonly { readonly teacher: number; readonly moderator: number }[], cohort: readonly { readonly id: string; readonly total: number }[], maxTotal: number): MarkAdjustment {
  const fn = "suggestMarkAdjustment";
  if (sample.length < 2) throw new MarkingInputError("too-few-points", fn, "At least two pieces of second-marked work are needed to suggest an adjustment.");
  if (!(maxTotal > 0) || !Number.isFinite(maxTotal)) throw new MarkingInputError("invalid-option", fn, "The maximum mark must be more than zero.");
  for (const s of [...sample.map((p) => p.teacher), ...sample.map((p) => p.moderator), ...cohort.map((c) => c.total)]) {
    if (!Number.isFinite(s)) throw new MarkingInputError("not-a-number", fn, "Every total must be a number.");
  }
  const xs = sample.map((p) => p.teacher);
  const ys = sample.map((p) => p.moderator);
  let slope = 1;
  let intercept = ys.reduce((s, y) => s + y, 0) / ys.length - xs.reduce((s, x) => s + x, 0) / xs.length;
  let rSquared: number | null = null;
  let slopeStdErr: number | null = null;
  if (new Set(xs).size >= 2) {
    const fit = linearFit(xs, ys);
    slope = fit.slope;
    intercept = fit.intercept;
    rSquared = Number.isFinite(fit.rSquared) ? fit.rSquared : null;
    slopeStdErr = sample.length > 2 && Number.isFinite(fit.slopeStdErr) ? fit.slopeStdErr : null;
  }
  const changes = cohort.map((c) => ({ id: c.id, before: c.total, after: Math.min(maxTotal, Math.max(0, Math.round(intercept + slope * c.total))) }));
  return { slope, intercept, rSquared, slopeStdErr, changes };
}

import { MarkingInputError } from "./marking-input-error";
import { weightedKappa } from "./weighted-kappa";

/** One criterion of the rubric, for agreement: how many levels it has. */
export interface AgreementCriterion {
  readonly id: string;
  readonly levelCount: number;
}

/** One piece of work marked by the teacher and by the moderator. */
export interface MarkedPair {
  readonly id: string;
  /** Level index per criterion id (0 = lowest) and the total, from the teacher. */
  readonly teacher: { readonly levels: Readonly<Record<string, number>>; readonly total: number };
  /** The same from the moderator. */
  readonly moderator: { readonly levels: Readonly<Record<string, number>>; readonly total: number };
}

export interface CriterionAgreement {
  readonly id: string;
  readonly count: number;
  /** Share of pieces where both chose the same level. */
  readonly exactShare: number;
  /** Share within one level. */
  readonly withinOneLevelShare: number;
  /** Mean of (moderator level − teacher level): positive means the teacher marked lower. */
  readonly meanLevelDifference: number;
  /** Cohen's weighted kappa with linear weights; null with fewer than two pieces. */
  readonly kappa: number | null;
}

export interface MarkingAgreement {
  readonly count: number;
  readonly criteria: readonly CriterionAgreement[];
  readonly totals: {
    /** Mean of (moderator total − teacher total). */
    readonly meanDifference: number;
    readonly meanAbsoluteDifference: number;
    readonly largestDifference: number;
    /** Share of pieces whose totals differ by no more than the tolerance. */
    readonly withinToleranceShare: number;
  };
  readonly verdict: "confirmed" | "review-needed";
  /** Plain sentences explaining the verdict. */
  readonly reasons: readonly string[];
}

/**
 * How well a teacher's marking agrees with a moderator's on a sample.
 *
 * Per criterion: exact and within-one-level agreement, the mean level difference, and Cohen's
 * weighted kappa (linear weights; see weightedKappa). On totals: mean and mean absolute
 * difference, the largest difference and the share within `toleranceMarks`.
 * Verdict (common practice, from memory; thresholds are parameters): "marks confirmed" when at
 * least `requiredShare` (80 %) of totals are within tolerance and the mean difference is no more
 * than the tolerance (no consistent lean); otherwise "review needed", with the reasons.
 *
 * @param pairs - the sampled work, each with both markers' levels and totals
 * @param criteria - rubric criteria with their number of levels
 * @param toleranceMarks - largest difference in totals that still counts as agreement
 * @param requiredShare - share of totals that must be within tolerance (default 0.8)
 * @returns per-criterion and total agreement and a verdict with reasons
 * @throws {MarkingInputError} `too-few-points` with no pairs; `invalid-option` for a bad tolerance
 * @example
 * markingAgreement([{ id: "a", teacher: { levels: {}, total: 5 }, moderator: { levels: {}, total: 5 } }], [], 1).verdict; // => "confirmed"
 */
export function markingAgreement(pairs: readonly MarkedPair[], criteria: readonly AgreementCriterion[], toleranceMarks: number, requiredShare = 0.8): MarkingAgreement {
  const fn = "markingAgreement";
  if (pairs.length === 0) throw new MarkingInputError("too-few-points", fn, "No sampled work has been second-marked yet.");
  if (!(toleranceMarks >= 0) || !Number.isFinite(toleranceMarks)) throw new MarkingInputError("invalid-option", fn, "The tolerance must be zero or more marks.");
  const perCriterion: CriterionAgreement[] = criteria.map((c) => {
    const both = pairs.filter((p) => p.teacher.levels[c.id] !== undefined && p.moderator.levels[c.id] !== undefined);
    const t = both.map((p) => p.teacher.levels[c.id]!);
    const m = both.map((p) => p.moderator.levels[c.id]!);
    const diffs = both.map((_, i) => m[i]! - t[i]!);
    const count = both.length;
    return {
      id: c.id,
      count,
      exactShare: count ? diffs.filter((d) => d === 0).length / count : 0,
      withinOneLevelShare: count ? diffs.filter((d) => Math.abs(d) <= 1).length / count : 0,
      meanLevelDifference: count ? diffs.reduce((s, d) => s + d, 0) / count : 0,
      kappa: count >= 2 ? weightedKappa(t, m, c.levelCount, "linear").kappa : null,
    };
  });
  const d = pairs.map((p) => p.moderator.total - p.teacher.total);
  const n = pairs.length;
  const meanDifference = d.reduce((s, x) => s + x, 0) / n;
  const meanAbsoluteDifference = d.reduce((s, x) => s + Math.abs(x), 0) / n;
  const largestDifference = d.reduce((a, x) => (Math.abs(x) > Math.abs(a) ? x : a), 0);
  const withinToleranceShare = d.filter((x) => Math.abs(x) <= toleranceMarks + 1e-9).length / n;
  const reasons: string[] = [];
  if (withinToleranceShare < requiredShare) {
    reasons.push(`${Math.round(withinToleranceShare * 100)} % of totals are within ${toleranceMarks} mark${toleranceMarks === 1 ? "" : "s"} of the moderator's; at least ${Math.round(requiredShare * 100)} % should be.`);
  }
  if (Math.abs(meanDifference) > toleranceMarks) {
    reasons.push(`The moderator's totals are on average ${Math.abs(meanDifference).toFixed(1)} marks ${meanDifference > 0 ? "higher" : "lower"}: the marking leans ${meanDifference > 0 ? "severe" : "generous"}.`);
  }
  const verdict = reasons.length ? "review-needed" : "confirmed";
  if (verdict === "confirmed") {
    reasons.push(`${Math.round(withinToleranceShare * 100)} % of totals agree within ${toleranceMarks} mark${toleranceMarks === 1 ? "" : "s"}, with no consistent lean (mean difference ${meanDifference.toFixed(1)}).`);
  }
  return { count: n, criteria: perCriterion, totals: { meanDifference, meanAbsoluteDifference, largestDifference, withinToleranceShare }, verdict, reasons };
}

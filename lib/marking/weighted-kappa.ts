import { MarkingInputError } from "./marking-input-error";

/** Result of {@link weightedKappa}. */
export interface WeightedKappa {
  /** Chance-corrected agreement: 1 perfect, 0 no better than chance, below 0 worse than chance. */
  readonly kappa: number;
  /** Weighted share of agreement observed. */
  readonly observed: number;
  /** Weighted share of agreement expected by chance from the two markers' own level counts. */
  readonly expected: number;
  readonly count: number;
}

/**
 * Cohen's weighted kappa for two markers' levels on the same pieces of work.
 *
 * Method (Cohen 1968, "Weighted kappa: nominal scale agreement with provision for scaled
 * disagreement or partial credit", Psychological Bulletin 70, 213–220 — cited from memory):
 * with k ordered levels, agreement weights w(i, j) = 1 − |i − j| / (k − 1) ("linear") or
 * 1 − ((i − j) / (k − 1))² ("quadratic"); observed p_o = Σ w(i, j) p(i, j) over the table of
 * pairs; expected p_e = Σ w(i, j) p(i·) p(·j) from each marker's own level shares;
 * kappa = (p_o − p_e) / (1 − p_e). With weights "none" (w = 1 on the diagonal, 0 elsewhere) it is
 * Cohen's 1960 kappa. Levels are 0-based indexes, lowest level 0.
 *
 * @param first - level index given by the first marker, one per piece of work
 * @param second - level index given by the second marker, same order
 * @param levelCount - number of levels k (at least 2)
 * @param weights - "linear" (default), "quadratic" or "none"
 * @returns kappa with the observed and chance agreement
 * @throws {MarkingInputError} `length-mismatch`, `too-few-points` (none), `out-of-range` (a level
 *   outside 0..k−1), `invalid-option` (k < 2)
 * @example
 * weightedKappa([0, 1, 1, 0], [0, 1, 1, 0], 2).kappa; // => 1
 */
export function weightedKappa(first: readonly number[], second: readonly number[], levelCount: number, weights: "linear" | "quadratic" | "none" = "linear"): WeightedKappa {
  const fn = "weightedKappa";
  if (!Number.isInteger(levelCount) || levelCount < 2) throw new MarkingInputError("invalid-option", fn, "There must be at least two levels.");
  if (first.length !== second.length) throw new MarkingInputError("length-mismatch", fn, "Both markers must mark the same pieces of work.");
  const n = first.length;
  if (n === 0) throw new MarkingInputError("too-few-points", fn, "There is no work marked by both markers yet.");
  const k = levelCount;
  const table = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  for (let i = 0; i < n; i++) {
    const a = first[i]!;
    const b = second[i]!;
    if (!Number.isInteger(a) || !Number.isInteger(b) || a < 0 || b < 0 || a >= k || b >= k) {
      throw new MarkingInputError("out-of-range", fn, `Pair ${i + 1} has a level outside 0 to ${k - 1}.`);
    }
    table[a]![b]! += 1;
  }
  const w = (i: number, j: number) => (weights === "none" ? (i === j ? 1 : 0) : weights === "linear" ? 1 - Math.abs(i - j) / (k - 1) : 1 - ((i - j) / (k - 1)) ** 2);
  const rowShare = table.map((row) => row.reduce((s, x) => s + x, 0) / n);
  const colShare = Array.from({ length: k }, (_, j) => table.reduce((s, row) => s + row[j]!, 0) / n);
  let observed = 0;
  let expected = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      observed += w(i, j) * (table[i]![j]! / n);
      expected += w(i, j) * rowShare[i]! * colShare[j]!;
    }
  }
  // Both markers used one and the same level for everything: agreement is perfect, but chance
  // agreement is too, and kappa is undefined; report perfect agreement as 1.
  const kappa = expected >= 1 - 1e-12 ? (observed >= 1 - 1e-12 ? 1 : 0) : (observed - expected) / (1 - expected);
  return { kappa, observed, expected, count: n };
}

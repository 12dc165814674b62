import { seededRandom } from "./internal/seeded-random";
import { MarkingInputError } from "./marking-input-error";

/** One piece of marked work that could be sampled. */
export interface MarkedWork {
  readonly id: string;
  /** The teacher's total mark. */
  readonly total: number;
  /** Who marked it. */
  readonly markerId: string;
}

/** How big a sample is and what it must contain. */
export interface SampleRuleInput {
  /** At least this many pieces of work (default 5). */
  readonly minCount?: number;
  /** At least this percentage of the cohort (default 10). */
  readonly percent?: number;
  /** Always include the highest and the lowest marked work (default true). */
  readonly includeExtremes?: boolean;
  /** Include at least one piece from every marker (default true). */
  readonly everyMarker?: boolean;
}

/** Result of {@link drawModerationSample}. */
export interface ModerationSampleDraw {
  /** The ids drawn, lowest total first. */
  readonly ids: readonly string[];
  /** The size the rule asked for (the whole cohort when it is smaller). */
  readonly targetSize: number;
  /** Why each id is in the sample, in plain words. */
  readonly reasons: Readonly<Record<string, string>>;
}

/** The default rule, common practice in school moderation (from memory): at least five or 10 %, whichever is larger. */
export const defaultSampleRule: Required<SampleRuleInput> = { minCount: 5, percent: 10, includeExtremes: true, everyMarker: true };

/**
 * Draws a moderation sample from a cohort of marked work.
 *
 * Rule (common practice, from memory; every number is a parameter): the sample holds
 * max(minCount, ceil(percent % of the cohort)) pieces, or the whole cohort when that is smaller.
 * It always includes the lowest and the highest total, then one piece from every marker not yet
 * represented, then one piece from each of equal-sized bands across the mark range until the
 * size is reached. Choices within a band are random but seeded, and the cohort is sorted by
 * (total, id) first, so the same cohort and seed always give the same sample whatever order the
 * work is listed in.
 *
 * @param cohort - marked work: id, teacher's total, marker id
 * @param rule - sample size and contents (defaults: 5, 10 %, extremes, every marker)
 * @param seed - a whole number; record it so the draw can be repeated
 * @returns ids drawn, the target size and a reason for each id
 * @throws {MarkingInputError} `invalid-option` for a bad rule or seed, `not-a-number` for a total
 *   that is not finite, `repeated-x` for duplicate ids
 * @example
 * drawModerationSample([{ id: "a", total: 3, markerId: "t" }, { id: "b", total: 9, markerId: "t" }], {}, 1).ids; // => ["a", "b"]
 */
export function drawModerationSample(cohort: readonly MarkedWork[], rule: SampleRuleInput, seed: number): ModerationSampleDraw {
  const fn = "drawModerationSample";
  const r = { ...defaultSampleRule, ...rule };
  if (!Number.isInteger(r.minCount) || r.minCount < 1) throw new MarkingInputError("invalid-option", fn, "The smallest sample size must be a whole number of at least 1.");
  if (!(r.percent > 0 && r.percent <= 100)) throw new MarkingInputError("invalid-option", fn, "The sample percentage must be more than 0 and at most 100.");
  if (!Number.isInteger(seed)) throw new MarkingInputError("invalid-option", fn, "The seed must be a whole number.");
  const seen = new Set<string>();
  for (const w of cohort) {
    if (!Number.isFinite(w.total)) throw new MarkingInputError("not-a-number", fn, `The total for ${w.id} is not a number.`);
    if (seen.has(w.id)) throw new MarkingInputError("repeated-x", fn, `The work ${w.id} is listed twice.`);
    seen.add(w.id);
  }
  const sorted = [...cohort].sort((a, b) => a.total - b.total || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const n = sorted.length;
  const targetSize = Math.min(n, Math.max(r.minCount, Math.ceil((r.percent / 100) * n)));
  const rand = seededRandom(seed);
  const chosen = new Map<string, string>();
  const take = (w: MarkedWork | undefined, reason: string) => {
    if (w && !chosen.has(w.id)) chosen.set(w.id, reason);
  };
  if (n === 0) return { ids: [], targetSize: 0, reasons: {} };
  if (r.includeExtremes) {
    take(sorted[0], "lowest mark in the cohort");
    take(sorted[n - 1], "highest mark in the cohort");
  }
  if (r.everyMarker) {
    const markers = [...new Set(sorted.map((w) => w.markerId))].sort();
    for (const m of markers) {
      if ([...chosen.keys()].some((id) => sorted.find((w) => w.id === id)!.markerId === m)) continue;
      const theirs = sorted.filter((w) => w.markerId === m);
      take(theirs[Math.floor(rand() * theirs.length)], "every marker is represented");
    }
  }
  // Fill the rest from equal bands across the mark range, one from each band.
  let guard = 0;
  while (chosen.size < targetSize && guard++ < n * 4) {
    const remaining = targetSize - chosen.size;
    const bands = Math.max(1, remaining);
    let added = false;
    for (let b = 0; b < bands && chosen.size < targetSize; b++) {
      const start = Math.floor((b * n) / bands);
      const end = Math.floor(((b + 1) * n) / bands);
      const band = sorted.slice(start, Math.max(end, start + 1)).filter((w) => !chosen.has(w.id));
      if (!band.length) continue;
      take(band[Math.floor(rand() * band.length)], "spread across the mark range");
      added = true;
    }
    if (!added) {
      const left = sorted.filter((w) => !chosen.has(w.id));
      if (!left.length) break;
      take(left[Math.floor(rand() * left.length)], "spread across the mark range");
    }
  }
  const ids = sorted.filter((w) => chosen.has(w.id)).map((w) => w.id);
  return { ids, targetSize, reasons: Object.fromEntries(ids.map((id) => [id, chosen.get(id)!])) };
}

// Demo marks: the teachers' marking of handed-in work, with the level each criterion got, some
// feedback, and a moderation sample part-way through second marking. Invented throughout.
import { suggestLevel } from "@/lib/checks/prefill";
import type { Verdict } from "@/lib/checks/types";
import type { PracticalContent } from "@/lib/validation/practicals";
import type { CriterionMark, StoredCheckResults } from "../schema";
import { seededRandom } from "./people";

const FEEDBACK = [
  "Clear table with units in the headings. Next time, draw your tangent with a longer ruler line so the gradient is easier to read.",
  "Good, careful readings. Check your units when you calculate a rate: the time was in seconds.",
  "Your evaluation names real sources of error. Explain how each one would change your result.",
  "Well organised. Give your answers to the same number of significant figures as your data.",
  "A solid write-up. Your conclusion should use numbers from your own results.",
];

/** Levels for a submitted write-up: criteria linked to checks follow the check results; the rest vary. */
export function seedMarkFor(content: PracticalContent, checkResults: StoredCheckResults, index: number, generous: boolean) {
  const rand = seededRandom(5000 + index * 131);
  const rubric = content.rubric!;
  const verdicts: Record<string, Verdict> = Object.fromEntries(Object.entries(checkResults).map(([k, v]) => [k, v.outcome.verdict]));
  const criteria: Record<string, CriterionMark> = {};
  for (const c of rubric.criteria) {
    const suggestion = suggestLevel(c, verdicts);
    let idx = suggestion ? c.levels.findIndex((l) => l.id === suggestion.levelId) : Math.min(c.levels.length - 1, Math.floor(rand() * c.levels.length + (rand() < 0.5 ? 0.5 : 0)));
    let overrideReason: string | null = null;
    if (generous && idx < c.levels.length - 1 && rand() < 0.5) {
      idx += 1;
      if (suggestion) overrideReason = "The method was right even though the final answer slipped.";
    }
    const level = c.levels[idx]!;
    criteria[c.id] = { levelId: level.id, marks: level.marks, fromChecks: !!suggestion && !overrideReason, overrideReason };
  }
  const total = Object.values(criteria).reduce((s, c) => s + c.marks, 0);
  return { criteria, total, feedback: FEEDBACK[index % FEEDBACK.length]!, comments: (index % 3 === 0 ? { evaluation: "Say which error had the biggest effect." } : {}) as Record<string, string> };
}

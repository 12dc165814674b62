import type { CriterionChoice, Rubric, TeacherMarkJson } from "./types";

/** The teacher's marks as they stand on screen, saved or not. */
export type MarkDraft = { criteria: Record<string, CriterionChoice>; comments: Record<string, string>; feedback: string };

/**
 * The marks to start from: what was saved; for criteria not yet marked, the level the calculation
 * checks suggest (pre-filled, still to be saved).
 */
export function draftFrom(mark: Pick<TeacherMarkJson, "criteria" | "comments" | "feedback"> | null, suggestions: Record<string, { levelId: string }>, rubric: Rubric | null): MarkDraft {
  const criteria: Record<string, CriterionChoice> = {};
  for (const c of rubric?.criteria ?? []) {
    const saved = mark?.criteria[c.id];
    if (saved) criteria[c.id] = { levelId: saved.levelId, overrideReason: saved.overrideReason ?? "" };
    else if (suggestions[c.id]) criteria[c.id] = { levelId: suggestions[c.id]!.levelId, overrideReason: "" };
  }
  return { criteria, comments: { ...(mark?.comments ?? {}) }, feedback: mark?.feedback ?? "" };
}

/** A stable text form of a draft, to tell whether anything changed since the last save. */
export function draftKey(d: MarkDraft): string {
  const sorted = (o: Record<string, unknown>) => Object.fromEntries(Object.entries(o).sort(([a], [b]) => a.localeCompare(b)));
  const comments = Object.fromEntries(Object.entries(d.comments).filter(([, v]) => v.trim() !== ""));
  const criteria = Object.fromEntries(Object.entries(d.criteria).map(([k, v]) => [k, { levelId: v.levelId, overrideReason: v.overrideReason.trim() }]));
  return JSON.stringify({ criteria: sorted(criteria), comments: sorted(comments), feedback: d.feedback.trim() });
}

/** Marks and how many criteria have a level, for the running total. */
export function totalOf(d: MarkDraft, rubric: Rubric | null): { total: number; chosen: number; criteria: number } {
  let total = 0;
  let chosen = 0;
  for (const c of rubric?.criteria ?? []) {
    const level = c.levels.find((l) => l.id === d.criteria[c.id]?.levelId);
    if (level) {
      total += level.marks;
      chosen++;
    }
  }
  return { total, chosen, criteria: rubric?.criteria.length ?? 0 };
}

/** The body of PUT /api/write-ups/[id]/mark for a draft. */
export function markRequest(d: MarkDraft, revision: number, suggestions: Record<string, { levelId: string }>) {
  return {
    revision,
    criteria: Object.fromEntries(
      Object.entries(d.criteria).map(([id, c]) => {
        const overridden = !!suggestions[id] && suggestions[id]!.levelId !== c.levelId;
        return [id, { levelId: c.levelId, overrideReason: overridden ? c.overrideReason.trim() || null : null }];
      }),
    ),
    comments: Object.fromEntries(Object.entries(d.comments).filter(([, v]) => v.trim() !== "")),
    feedback: d.feedback,
  };
}

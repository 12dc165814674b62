import type { Verdict } from "./types";

type Criterion = { id: string; checkIds: string[]; levels: { id: string; label: string; marks: number }[] };

/**
 * The level the marking bench suggests for a rubric criterion linked to calculation checks
 * (our own rule, stated to the teacher): every linked check agrees → the top level; at least half
 * agree, or the rest are only close → a middle level; otherwise the lowest level. Nothing is
 * suggested until at least one linked check has run. The teacher can always choose another level,
 * with a reason.
 */
export function suggestLevel(criterion: Criterion, verdicts: Record<string, Verdict | undefined>): { levelId: string; reason: string } | null {
  if (!criterion.checkIds.length || criterion.levels.length === 0) return null;
  const ran = criterion.checkIds.map((id) => verdicts[id]).filter((v): v is Verdict => !!v);
  if (!ran.length) return null;
  const levels = criterion.levels;
  const top = levels[levels.length - 1]!;
  const bottom = levels[0]!;
  const middle = levels[Math.floor((levels.length - 1) / 2)]!;
  const agrees = ran.filter((v) => v === "agrees").length;
  const close = ran.filter((v) => v === "close").length;
  const notRun = criterion.checkIds.length - ran.length;
  const counts = `${agrees} of ${criterion.checkIds.length} linked check${criterion.checkIds.length === 1 ? "" : "s"} agree${notRun ? `, ${notRun} not run` : ""}`;
  if (agrees === criterion.checkIds.length) return { levelId: top.id, reason: `${counts}: ${top.label}.` };
  if (levels.length > 2 && (agrees * 2 >= criterion.checkIds.length || agrees + close === ran.length)) return { levelId: middle.id, reason: `${counts}: ${middle.label}.` };
  return { levelId: bottom.id, reason: `${counts}: ${bottom.label}.` };
}

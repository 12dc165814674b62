import type { PracticalContent } from "@/lib/validation/practicals";

/** The most marks a practical's rubric gives. */
export function rubricMaxOf(content: PracticalContent): number {
  return content.rubric ? content.rubric.criteria.reduce((s, c) => s + Math.max(...c.levels.map((l) => l.marks)), 0) : 0;
}

import { rubricBodySchema, type RubricBody } from "@/lib/validation/practicals";

export type LevelValues = { id: string; label: string; marks: string; descriptor: string };
export type CriterionValues = { id: string; title: string; description: string; checkIds: string[]; levels: LevelValues[] };
export type RubricStyle = "marks" | "competence";
export type RubricFormValues = { title: string; style: RubricStyle; criteria: CriterionValues[] };

export const MAX_CRITERIA = 15;
export const MAX_LEVELS = 8;
export const MIN_LEVELS = 2;

/** A short id for a new criterion or level, unique enough within one rubric. */
export function newPartId(prefix: string, taken: Iterable<string> = []): string {
  const used = new Set(taken);
  for (;;) {
    const id = `${prefix}${Math.random().toString(36).slice(2, 8)}`;
    if (!used.has(id)) return id;
  }
}

/** The two levels of a competence record: "not yet" then "shown". */
export function competenceLevels(descriptors: { notYet?: string; shown?: string } = {}, ids?: [string, string]): LevelValues[] {
  return [
    { id: ids?.[0] ?? newPartId("l"), label: "Not yet", marks: "0", descriptor: descriptors.notYet ?? "" },
    { id: ids?.[1] ?? newPartId("l"), label: "Shown", marks: "1", descriptor: descriptors.shown ?? "" },
  ];
}

export function newCriterion(style: RubricStyle, taken: Iterable<string> = []): CriterionValues {
  const levels: LevelValues[] =
    style === "competence"
      ? competenceLevels()
      : [
          { id: newPartId("l"), label: "Not yet", marks: "0", descriptor: "" },
          { id: newPartId("l"), label: "Partly", marks: "1", descriptor: "" },
          { id: newPartId("l"), label: "Secure", marks: "2", descriptor: "" },
        ];
  return { id: newPartId("c", taken), title: "", description: "", checkIds: [], levels };
}

export function emptyRubric(): RubricFormValues {
  return { title: "", style: "marks", criteria: [newCriterion("marks")] };
}

export function valuesFromBody(body: RubricBody): RubricFormValues {
  return {
    title: body.title,
    style: body.style,
    criteria: body.criteria.map((c) => ({
      id: c.id,
      title: c.title,
      description: c.description,
      checkIds: [...c.checkIds],
      levels: c.levels.map((l) => ({ id: l.id, label: l.label, marks: String(l.marks), descriptor: l.descriptor })),
    })),
  };
}

/** True when switching these criteria to "shown / not yet" would drop levels or marks. */
export function competenceSwitchLoses(values: RubricFormValues): boolean {
  return values.criteria.some((c) => c.levels.length !== 2 || c.levels[0]!.marks.trim() !== "0" || c.levels[1]!.marks.trim() !== "1");
}

/**
 * Changes the style. To "competence" every criterion keeps its lowest and highest levels'
 * descriptors as "not yet" and "shown"; to "marks" the two levels stay, worth 0 and 1, to be
 * edited and added to.
 */
export function switchStyle(values: RubricFormValues, style: RubricStyle): RubricFormValues {
  if (style === values.style) return values;
  if (style === "marks") return { ...values, style };
  return {
    ...values,
    style,
    criteria: values.criteria.map((c) => {
      const first = c.levels[0];
      const last = c.levels[c.levels.length - 1];
      return { ...c, levels: competenceLevels({ notYet: first?.descriptor, shown: c.levels.length > 1 ? last?.descriptor : "" }, first && last && first !== last ? [first.id, last.id] : undefined) };
    }),
  };
}

/** The most marks a rubric can give: the top level of each criterion, added up. Unreadable marks count as 0. */
export function totalMarks(values: RubricFormValues): number {
  return values.criteria.reduce((sum, c) => {
    const top = Number(c.levels[c.levels.length - 1]?.marks ?? "0");
    return sum + (Number.isInteger(top) && top > 0 ? top : 0);
  }, 0);
}

export type ToBodyResult = { ok: true; body: RubricBody } | { ok: false; errors: Record<string, string> };

/**
 * Checks the form with the schema the server uses and turns it into the rubric body. Messages
 * are keyed by field path, as the server keys them (`criteria.0.levels.1.marks`).
 */
export function toBody(values: RubricFormValues): ToBodyResult {
  const errors: Record<string, string> = {};
  const criteria = values.criteria.map((c, ci) => ({
    id: c.id,
    title: c.title,
    description: c.description,
    checkIds: c.checkIds,
    levels: c.levels.map((l, li) => {
      const text = l.marks.trim();
      const n = Number(text);
      if (!text) errors[`criteria.${ci}.levels.${li}.marks`] = "Enter the marks for this level.";
      else if (!Number.isFinite(n)) errors[`criteria.${ci}.levels.${li}.marks`] = "Marks are whole numbers, for example 2.";
      return { id: l.id, label: l.label, marks: text && Number.isFinite(n) ? n : 0, descriptor: l.descriptor };
    }),
  }));
  const parsed = rubricBodySchema.safeParse({ title: values.title, style: values.style, criteria });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.path.join(".") || "title";
      errors[key] ??= issue.message;
    }
  }
  if (!parsed.success || Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, body: parsed.data };
}

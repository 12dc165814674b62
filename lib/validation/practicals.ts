import { z } from "zod";
import { EYE_PROTECTION, GHS_CODES, SIGNAL_WORDS } from "@/lib/ghs";
import { richTextSchema, richTextToPlain, type RichTextDoc } from "./rich-text";

/** Stable ids for parts of a practical (columns, checks, criteria…), made in the browser. */
export const partId = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9_-]{1,40}$/, "An internal id is malformed.");

const text = (max: number, what: string) => z.string().trim().max(max, `${what} can be at most ${max} characters.`);
const finite = (what: string) => z.number({ error: `${what} must be a number.` }).refine(Number.isFinite, `${what} must be a finite number.`);

export const COLUMN_ROLES = ["independent", "dependent", "repeat", "mean", "derived"] as const;
export const COLUMN_ROLE_LABELS: Record<(typeof COLUMN_ROLES)[number], string> = {
  independent: "Independent variable (you choose it)",
  dependent: "Dependent variable (you measure it)",
  repeat: "Repeat reading",
  mean: "Mean of repeats",
  derived: "Calculated from other columns",
};

export const DERIVED_FORMULAS = ["reciprocal", "ln", "log10", "celsius-to-kelvin", "reciprocal-kelvin-from-celsius", "reciprocal-kelvin"] as const;
export const DERIVED_FORMULA_LABELS: Record<(typeof DERIVED_FORMULAS)[number], string> = {
  reciprocal: "1 ÷ value (for example 1/t)",
  ln: "Natural log, ln(value)",
  log10: "log₁₀(value)",
  "celsius-to-kelvin": "°C to K (add 273.15)",
  "reciprocal-kelvin-from-celsius": "1/T in K⁻¹, from a °C column",
  "reciprocal-kelvin": "1/T in K⁻¹, from a K column",
};

export const columnSchema = z.object({
  id: partId,
  quantity: text(60, "A quantity name").min(1, "Name the quantity, for example “time”."),
  symbol: text(12, "A symbol").default(""),
  unit: text(24, "A unit").default(""),
  role: z.enum(COLUMN_ROLES),
  /** Smallest step the instrument reads, in the column's unit (0.01 for a balance in g). */
  resolution: finite("The resolution").positive("The resolution must be more than zero.").max(1e6).nullable().default(null),
  decimalPlaces: z.number().int().min(0, "Decimal places cannot be negative.").max(6, "At most 6 decimal places.").nullable().default(null),
  /** The instrument's range; readings outside it are flagged. */
  rangeMin: finite("The lowest reading").nullable().default(null),
  rangeMax: finite("The highest reading").nullable().default(null),
  /** Repeat and mean columns: the columns averaged (for mean) or the measured quantity they repeat. */
  meanOf: z.array(partId).max(10).default([]),
  /** Derived columns: how the value is calculated, and from which column. */
  derivedFrom: partId.nullable().default(null),
  formula: z.enum(DERIVED_FORMULAS).nullable().default(null),
});
export type ColumnTemplate = z.infer<typeof columnSchema>;

export const tableSchema = z.object({
  id: partId,
  title: text(80, "A table title").min(1, "Give the table a title."),
  columns: z.array(columnSchema).min(1, "A table needs at least one column.").max(14, "A table can have at most 14 columns."),
  rowCount: z.number().int().min(1, "At least one row.").max(60, "At most 60 rows."),
  /** Values students see already filled in (for example the planned times), by column id. */
  presetRows: z.array(z.record(z.string(), z.number().nullable())).max(60).default([]),
});
export type TableTemplate = z.infer<typeof tableSchema>;

export const graphSchema = z.object({
  id: partId,
  title: text(80, "A graph title").min(1, "Give the graph a title."),
  tableId: partId,
  xColumn: partId,
  yColumn: partId,
  fit: z.enum(["line", "curve", "none"]).default("curve"),
  throughOrigin: z.boolean().default(false),
  tangents: z.boolean().default(false),
});
export type GraphSpec = z.infer<typeof graphSchema>;

export const CHECK_KINDS = [
  "mean-rate",
  "gradient",
  "rate-at",
  "initial-rate",
  "reciprocal-time",
  "mean-of-repeats",
  "order",
  "activation-energy",
  "percentage-uncertainty",
] as const;
export type CheckKind = (typeof CHECK_KINDS)[number];

export const CHECK_VISIBILITY = ["verdict", "hint", "expected-after-marking"] as const;

const checkBase = {
  id: partId,
  label: text(120, "A check name").min(1, "Say what the student calculates, for example “Mean rate from 0 to 30 s”."),
  tableId: partId,
  tolerancePercent: z.number().min(0.5, "Tolerance must be at least 0.5 %.").max(60, "Tolerance can be at most 60 %."),
  sigFigs: z
    .object({ min: z.number().int().min(1).max(8), max: z.number().int().min(1).max(8) })
    .refine((s) => s.min <= s.max, { message: "The fewest significant figures cannot be more than the most.", path: ["max"] })
    .nullable()
    .default(null),
  expectedUnit: text(40, "A unit").default(""),
  show: z.enum(CHECK_VISIBILITY).default("hint"),
};

export const checkSchema = z.discriminatedUnion("kind", [
  z.object({ ...checkBase, kind: z.literal("mean-rate"), x: partId, y: partId, from: finite("The start of the interval"), to: finite("The end of the interval") }),
  z.object({ ...checkBase, kind: z.literal("gradient"), x: partId, y: partId, throughOrigin: z.boolean().default(false) }),
  z.object({ ...checkBase, kind: z.literal("rate-at"), x: partId, y: partId, at: finite("The time"), model: z.enum(["auto", "first-order", "polynomial", "local"]).default("auto") }),
  z.object({ ...checkBase, kind: z.literal("initial-rate"), x: partId, y: partId }),
  z.object({ ...checkBase, kind: z.literal("reciprocal-time"), t: partId, answerColumn: partId }),
  z.object({ ...checkBase, kind: z.literal("mean-of-repeats"), repeats: z.array(partId).min(2, "Choose at least two repeat columns.").max(10), answerColumn: partId }),
  z.object({ ...checkBase, kind: z.literal("order"), concentration: partId, rate: partId }),
  z.object({
    ...checkBase,
    kind: z.literal("activation-energy"),
    temperature: partId,
    temperatureUnit: z.enum(["°C", "K"]),
    rate: partId,
    rateIs: z.enum(["rate-constant", "time"]),
  }),
  z.object({ ...checkBase, kind: z.literal("percentage-uncertainty"), resolution: finite("The resolution").positive("The resolution must be more than zero."), reading: partId, readingsPerValue: z.union([z.literal(1), z.literal(2)]).default(1) }),
]);
export type CheckSpec = z.infer<typeof checkSchema>;

export const levelSchema = z.object({
  id: partId,
  label: text(40, "A level name").min(1, "Name the level, for example “Secure”."),
  marks: z.number().int("Marks are whole numbers.").min(0, "Marks cannot be negative.").max(100, "At most 100 marks for one level."),
  descriptor: text(600, "A descriptor").default(""),
});

export const criterionSchema = z
  .object({
    id: partId,
    title: text(80, "A criterion title").min(1, "Name the criterion, for example “Recording results”."),
    description: text(400, "A description").default(""),
    /** Calculation checks whose results pre-fill this criterion on the marking bench. */
    checkIds: z.array(partId).max(10).default([]),
    levels: z.array(levelSchema).min(2, "A criterion needs at least two levels.").max(8, "At most 8 levels."),
  })
  .superRefine((c, ctx) => {
    for (let i = 1; i < c.levels.length; i++) {
      if (c.levels[i]!.marks <= c.levels[i - 1]!.marks) {
        ctx.addIssue({ code: "custom", path: ["levels", i, "marks"], message: "List levels from lowest to highest: each level must be worth more marks than the one before." });
      }
    }
  });

export const rubricBodySchema = z.object({
  title: text(100, "A rubric title").min(1, "Give the rubric a title."),
  style: z.enum(["marks", "competence"]).default("marks"),
  criteria: z.array(criterionSchema).min(1, "A rubric needs at least one criterion.").max(15, "At most 15 criteria."),
});
export type RubricBody = z.infer<typeof rubricBodySchema>;

export const hazardSchema = z.object({
  id: partId,
  substance: text(120, "A substance or activity").min(1, "Name the substance or activity, for example “hydrochloric acid, 1.0 mol/dm³”."),
  pictograms: z.array(z.enum(GHS_CODES)).max(9).default([]),
  signalWord: z.enum(SIGNAL_WORDS).default("None"),
  hazardStatements: text(500, "Hazard statements").default(""),
  controls: text(800, "Control measures").min(1, "Say how the risk is controlled."),
});

export const safetySchema = z.object({
  hazards: z.array(hazardSchema).max(30).default([]),
  eyeProtection: z.enum(EYE_PROTECTION.map((e) => e.value) as ["safety-spectacles", "goggles", "face-shield"]).nullable().default(null),
  otherPpe: z.array(text(60, "Protective equipment").min(1)).max(10).default([]),
  emergency: text(1200, "What to do if something goes wrong").default(""),
  /** The teacher has checked this practical against the school's risk assessment. */
  riskAssessmentRef: text(200, "The risk assessment reference").default(""),
});

export const REAGENT_UNITS = ["cm³", "dm³", "g", "mg", "pieces", "cm"] as const;
export const CONCENTRATION_UNITS = ["mol/dm³", "g/dm³", "% w/v", "volume"] as const;

export const reagentSchema = z
  .object({
    id: partId,
    name: text(120, "A reagent name").min(1, "Name the reagent."),
    concentration: finite("The concentration").positive("A concentration must be more than zero.").nullable().default(null),
    concentrationUnit: z.enum(CONCENTRATION_UNITS).default("mol/dm³"),
    amountPerGroup: finite("The amount per group").positive("The amount per group must be more than zero."),
    amountUnit: z.enum(REAGENT_UNITS),
    notes: text(200, "Notes").default(""),
  })
  .superRefine((r, ctx) => {
    const limits: Record<string, number> = { "mol/dm³": 20, "g/dm³": 2000, "% w/v": 100, volume: 130 };
    if (r.concentration != null && r.concentration > limits[r.concentrationUnit]!) {
      ctx.addIssue({ code: "custom", path: ["concentration"], message: `${r.concentration} ${r.concentrationUnit} is not a possible concentration for a school lab (at most ${limits[r.concentrationUnit]} ${r.concentrationUnit}).` });
    }
    const amountLimits: Record<string, number> = { "cm³": 5000, "dm³": 5, g: 1000, mg: 1_000_000, pieces: 200, cm: 500 };
    if (r.amountPerGroup > amountLimits[r.amountUnit]!) {
      ctx.addIssue({ code: "custom", path: ["amountPerGroup"], message: `${r.amountPerGroup} ${r.amountUnit} per group is more than a school practical uses (at most ${amountLimits[r.amountUnit]} ${r.amountUnit}).` });
    }
  });

export const prepSchema = z.object({
  reagents: z.array(reagentSchema).max(30).default([]),
  apparatus: z.array(z.object({ id: partId, name: text(120, "An apparatus name").min(1, "Name the apparatus."), perGroup: z.number().int().min(1, "At least 1 per group.").max(100) })).max(40).default([]),
  spareMarginPercent: z.number().min(0, "The spare margin cannot be negative.").max(100, "A spare margin above 100 % is not sensible.").default(10),
  technicianNotes: text(1500, "Notes for the technician").default(""),
});

export const variablesSchema = z.object({
  independent: text(200, "The independent variable").default(""),
  dependent: text(200, "The dependent variable").default(""),
  controlled: z.array(text(200, "A controlled variable").min(1)).max(12).default([]),
});

/** Everything a practical says, as stored in one version. */
export const practicalContentSchema = z
  .object({
    aim: text(1000, "The aim").default(""),
    introduction: richTextSchema,
    method: richTextSchema,
    variables: variablesSchema.default({ independent: "", dependent: "", controlled: [] }),
    apparatus: z.array(text(160, "An apparatus item").min(1)).max(40).default([]),
    safety: safetySchema.default({ hazards: [], eyeProtection: null, otherPpe: [], emergency: "", riskAssessmentRef: "" }),
    prep: prepSchema.default({ reagents: [], apparatus: [], spareMarginPercent: 10, technicianNotes: "" }),
    tables: z.array(tableSchema).max(4, "At most 4 results tables.").default([]),
    graphs: z.array(graphSchema).max(6, "At most 6 graphs.").default([]),
    checks: z.array(checkSchema).max(12, "At most 12 calculation checks.").default([]),
    rubric: rubricBodySchema.extend({ sourceRubricId: z.string().max(64).nullable().default(null) }).nullable().default(null),
  })
  .superRefine((c, ctx) => {
    const tables = new Map(c.tables.map((t) => [t.id, t]));
    const ids = new Set<string>();
    c.tables.forEach((t, ti) => {
      if (ids.has(t.id)) ctx.addIssue({ code: "custom", path: ["tables", ti, "id"], message: "Two tables share an id." });
      ids.add(t.id);
      const cols = new Set(t.columns.map((col) => col.id));
      if (cols.size !== t.columns.length) ctx.addIssue({ code: "custom", path: ["tables", ti, "columns"], message: "Two columns share an id." });
      t.columns.forEach((col, ci) => {
        if (col.role === "mean") {
          if (col.meanOf.length < 2) ctx.addIssue({ code: "custom", path: ["tables", ti, "columns", ci, "meanOf"], message: "Choose the repeat columns this mean is taken from (at least two)." });
          for (const m of col.meanOf) if (!cols.has(m)) ctx.addIssue({ code: "custom", path: ["tables", ti, "columns", ci, "meanOf"], message: "This mean refers to a column that is not in the table." });
        }
        if (col.role === "derived") {
          if (!col.formula) ctx.addIssue({ code: "custom", path: ["tables", ti, "columns", ci, "formula"], message: "Choose how this column is calculated." });
          if (!col.derivedFrom || !cols.has(col.derivedFrom)) ctx.addIssue({ code: "custom", path: ["tables", ti, "columns", ci, "derivedFrom"], message: "Choose the column this one is calculated from." });
        }
        if (col.rangeMin != null && col.rangeMax != null && col.rangeMin >= col.rangeMax) {
          ctx.addIssue({ code: "custom", path: ["tables", ti, "columns", ci, "rangeMax"], message: "The highest reading must be above the lowest." });
        }
      });
    });
    c.graphs.forEach((g, gi) => {
      const t = tables.get(g.tableId);
      if (!t) return ctx.addIssue({ code: "custom", path: ["graphs", gi, "tableId"], message: "This graph uses a table that does not exist." });
      const cols = new Set(t.columns.map((col) => col.id));
      if (!cols.has(g.xColumn)) ctx.addIssue({ code: "custom", path: ["graphs", gi, "xColumn"], message: "Choose a column from the table for the x-axis." });
      if (!cols.has(g.yColumn)) ctx.addIssue({ code: "custom", path: ["graphs", gi, "yColumn"], message: "Choose a column from the table for the y-axis." });
    });
    const checkIds = new Set<string>();
    c.checks.forEach((chk, ki) => {
      if (checkIds.has(chk.id)) ctx.addIssue({ code: "custom", path: ["checks", ki, "id"], message: "Two checks share an id." });
      checkIds.add(chk.id);
      const t = tables.get(chk.tableId);
      if (!t) return ctx.addIssue({ code: "custom", path: ["checks", ki, "tableId"], message: "This check uses a table that does not exist." });
      const cols = new Set(t.columns.map((col) => col.id));
      for (const [field, value] of Object.entries(checkColumnRefs(chk))) {
        for (const v of value) {
          if (!cols.has(v)) ctx.addIssue({ code: "custom", path: ["checks", ki, field], message: `This check is bound to a column that is not in “${t.title}”. Choose one of its columns.` });
        }
      }
      if (chk.kind === "mean-rate" && chk.from >= chk.to) ctx.addIssue({ code: "custom", path: ["checks", ki, "to"], message: "The end of the interval must come after the start." });
    });
    c.rubric?.criteria.forEach((cr, ci) => {
      for (const id of cr.checkIds) if (!checkIds.has(id)) ctx.addIssue({ code: "custom", path: ["rubric", "criteria", ci, "checkIds"], message: "This criterion is linked to a check that does not exist." });
    });
  });
export type PracticalContent = z.infer<typeof practicalContentSchema>;

/** The column ids a check reads, by field name. */
export function checkColumnRefs(chk: CheckSpec): Record<string, string[]> {
  switch (chk.kind) {
    case "mean-rate":
    case "gradient":
    case "rate-at":
    case "initial-rate":
      return { x: [chk.x], y: [chk.y] };
    case "reciprocal-time":
      return { t: [chk.t], answerColumn: [chk.answerColumn] };
    case "mean-of-repeats":
      return { repeats: chk.repeats, answerColumn: [chk.answerColumn] };
    case "order":
      return { concentration: [chk.concentration], rate: [chk.rate] };
    case "activation-energy":
      return { temperature: [chk.temperature], rate: [chk.rate] };
    case "percentage-uncertainty":
      return { reading: [chk.reading] };
  }
}

export const practicalMetaSchema = z.object({
  title: text(120, "A title").min(1, "Give the practical a title."),
  topic: text(60, "A topic").min(1, "Give a topic, for example “Rates of reaction”."),
  yearGroup: z.number().int().min(7, "Year groups run from 7 to 13.").max(13, "Year groups run from 7 to 13."),
  subject: text(40, "A subject").default("Chemistry"),
});

export const practicalDraftSchema = practicalMetaSchema.extend({
  content: practicalContentSchema,
  /** The revision the editor started from; a save from an older one is refused (409). */
  revision: z.number().int().min(0),
});
export type PracticalDraftInput = z.infer<typeof practicalDraftSchema>;

export const practicalCreateSchema = practicalMetaSchema;

/**
 * What must be true before a version can be published, as field errors. Drafts may be
 * incomplete; published versions are what students work from.
 */
export function publishProblems(meta: { title: string }, c: PracticalContent): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  const add = (k: string, m: string) => (out[k] ??= []).push(m);
  if (!c.aim.trim()) add("content.aim", "Write the aim before publishing.");
  if (!richTextToPlain(c.method as RichTextDoc).trim()) add("content.method", "Write the method before publishing.");
  const s = c.safety;
  if (s.hazards.length === 0) add("content.safety.hazards", "A practical cannot be published without a safety section: list at least one hazard and how it is controlled.");
  if (!s.eyeProtection) add("content.safety.eyeProtection", "Say what eye protection is needed.");
  if (!s.emergency.trim()) add("content.safety.emergency", "Say what to do if something goes wrong (spills, splashes, burns).");
  if (c.tables.length === 0) add("content.tables", "Add at least one results table.");
  if (!c.rubric || c.rubric.criteria.length === 0) add("content.rubric", "Add a rubric with at least one criterion.");
  if (!meta.title.trim()) add("title", "Give the practical a title.");
  return out;
}

export const labSessionSchema = z
  .object({
    classId: z.string().min(1, "Choose a class.").max(64),
    practicalVersionId: z.string().min(1, "Choose a published practical.").max(64),
    opensAt: z.coerce.date({ error: "Choose when the lab session opens." }),
    dueAt: z.coerce.date({ error: "Choose when write-ups are due." }),
    grouping: z.enum(["individual", "groups"]).default("individual"),
    groups: z
      .array(z.object({ id: partId, name: text(40, "A group name").min(1, "Name the group."), studentIds: z.array(z.string().max(64)).min(1, "A group needs at least one student.").max(6, "At most 6 students in a group.") }))
      .max(20)
      .default([]),
    lateWork: z.enum(["accept", "accept-flagged", "refuse"]).default("accept-flagged"),
    lateDays: z.number().int().min(0).max(60).default(7),
    notes: text(600, "Notes for students").default(""),
  })
  .superRefine((s, ctx) => {
    if (s.dueAt.getTime() <= s.opensAt.getTime()) ctx.addIssue({ code: "custom", path: ["dueAt"], message: "The due date must be after the opening date." });
    if (s.grouping === "groups") {
      if (s.groups.length === 0) ctx.addIssue({ code: "custom", path: ["groups"], message: "Make at least one group, or choose individual data." });
      const seen = new Set<string>();
      s.groups.forEach((g, gi) =>
        g.studentIds.forEach((id) => {
          if (seen.has(id)) ctx.addIssue({ code: "custom", path: ["groups", gi, "studentIds"], message: "A student can only be in one group." });
          seen.add(id);
        }),
      );
    }
  });
export type LabSessionInput = z.infer<typeof labSessionSchema>;

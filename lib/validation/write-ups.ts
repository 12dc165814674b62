import { z } from "zod";
import { richTextSchema, type RichTextDoc } from "./rich-text";

export const MAX_TABLE_ROWS = 60;
export const MAX_CELL_CHARS = 24;

/** One cell as typed: text (so decimal places survive), a number, or blank. */
export const cellSchema = z.union([
  z.string().max(MAX_CELL_CHARS, `A cell can hold at most ${MAX_CELL_CHARS} characters.`),
  z.number().refine(Number.isFinite, "A cell must hold a finite number."),
  z.null(),
]);

export const tableRowsSchema = z
  .array(z.record(z.string().max(40), cellSchema).refine((r) => Object.keys(r).length <= 20, "A row has too many columns."))
  .max(MAX_TABLE_ROWS, `A table can have at most ${MAX_TABLE_ROWS} rows.`);

const coordinate = z.number().refine(Number.isFinite, "Tangent points must be finite numbers.");

export const checkAnswerSchema = z.object({
  value: z.string().trim().max(40, "An answer can be at most 40 characters."),
  unit: z.string().trim().max(40, "A unit can be at most 40 characters.").default(""),
  tangent: z.object({ x1: coordinate, y1: coordinate, x2: coordinate, y2: coordinate }).nullable().optional(),
});


export const WRITE_UP_SECTIONS = ["plan", "observations", "conclusion", "evaluation"] as const;
export type WriteUpSection = (typeof WRITE_UP_SECTIONS)[number];
export const SECTION_LABELS: Record<WriteUpSection, string> = {
  plan: "Plan",
  observations: "Observations",
  conclusion: "Conclusion",
  evaluation: "Evaluation",
};

/** A student's filled-in results table: rows of typed cells, and readings left out with the reason. */
export const filledTableSchema = z.object({
  rows: tableRowsSchema,
  /** Readings the student chose to leave out (or keep in) against the anomaly rule, keyed "row:column", with why. */
  decisions: z
    .record(z.string().regex(/^\d{1,2}:[A-Za-z0-9_-]{1,40}$/, "A reading reference is malformed."), z.object({ include: z.boolean(), reason: z.string().trim().min(1, "Say why.").max(300, "Keep the reason under 300 characters.") }))
    .default({}),
});
export type FilledTable = z.infer<typeof filledTableSchema>;

export const groupTablesSchema = z.record(z.string().regex(/^[A-Za-z0-9_-]{1,40}$/), filledTableSchema).refine((t) => Object.keys(t).length <= 6, "Too many tables.");
export type GroupTables = z.infer<typeof groupTablesSchema>;

export const tangentSchema = z.object({ at: z.number().refine(Number.isFinite), x1: z.number().refine(Number.isFinite), y1: z.number().refine(Number.isFinite), x2: z.number().refine(Number.isFinite), y2: z.number().refine(Number.isFinite) });

export const answerSchema = checkAnswerSchema.extend({ working: richTextSchema.nullable().default(null) });
export type StoredAnswer = z.infer<typeof answerSchema>;

export const writeUpContentSchema = z.object({
  sections: z
    .object({ plan: richTextSchema, observations: richTextSchema, conclusion: richTextSchema, evaluation: richTextSchema })
    .default({ plan: { type: "doc", content: [] }, observations: { type: "doc", content: [] }, conclusion: { type: "doc", content: [] }, evaluation: { type: "doc", content: [] } } as never),
  /** The student's own tables (individual data). In a lab session that shares data by group, the group's tables are used instead. */
  tables: groupTablesSchema.default({}),
  /** Tangents drawn on graphs, by graph id. */
  graphs: z.record(z.string().regex(/^[A-Za-z0-9_-]{1,40}$/), z.object({ tangent: tangentSchema.nullable().default(null) })).default({}),
  answers: z.record(z.string().regex(/^[A-Za-z0-9_-]{1,40}$/), answerSchema).default({}),
});
export type WriteUpContent = z.infer<typeof writeUpContentSchema>;

export const writeUpSaveSchema = z.object({ revision: z.number().int().min(0), content: writeUpContentSchema });
export const groupTablesSaveSchema = z.object({ revision: z.number().int().min(0), tables: groupTablesSchema });

export type { RichTextDoc };

import { z } from "zod";

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

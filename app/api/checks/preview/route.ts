import { z } from "zod";
import { runPracticalCheck, studentView } from "@/lib/checks/run";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";
import { checkColumnRefs, checkSchema, tableSchema } from "@/lib/validation/practicals";
import { checkAnswerSchema, tableRowsSchema } from "@/lib/validation/write-ups";

const previewSchema = z.object({ check: checkSchema, table: tableSchema, rows: tableRowsSchema, answer: checkAnswerSchema });

/**
 * Live preview for the practical editor: runs a check on sample data the teacher typed and
 * returns the full outcome and exactly what a student would see.
 */
export const POST = handle(async (req) => {
  await requireApiRole("teacher", "admin");
  const { check, table, rows, answer } = await readJson(req, previewSchema);
  const cols = new Set(table.columns.map((c) => c.id));
  for (const [field, ids] of Object.entries(checkColumnRefs(check))) {
    if (ids.some((id) => !cols.has(id))) throw new AppError("bad_request", "This check is bound to a column that is not in the table.", { fieldErrors: { [`check.${field}`]: ["Choose a column from this table."] } });
  }
  const outcome = runPracticalCheck(check, table, rows, answer);
  return ok({ outcome, studentView: studentView(outcome, check.show, false) });
});

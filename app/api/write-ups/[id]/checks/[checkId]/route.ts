import { z } from "zod";
import { runWriteUpCheck } from "@/db/queries/write-ups";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { checkAnswerSchema } from "@/lib/validation/write-ups";

/** Runs one calculation check on the saved data; returns only what the teacher lets the student see. */
export const POST = handle<{ id: string; checkId: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id, checkId } = await ctx.params;
  const { answer } = await readJson(req, z.object({ answer: checkAnswerSchema }));
  return ok(runWriteUpCheck({ actor, writeUpId: id, checkId, answer: { value: answer.value, unit: answer.unit, tangent: answer.tangent ?? null } }));
});

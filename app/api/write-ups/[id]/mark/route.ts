import { saveMark } from "@/db/queries/marking";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { markSaveSchema } from "@/lib/validation/marking";

/** Saves marks; 409 with the current marks if someone saved since `revision`. */
export const PUT = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiRole("teacher");
  const { id } = await ctx.params;
  const input = await readJson(req, markSaveSchema);
  return ok(saveMark({ actor, writeUpId: id, input }));
});

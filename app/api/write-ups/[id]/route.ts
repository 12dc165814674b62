import { getWriteUp, saveWriteUp } from "@/db/queries/write-ups";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { writeUpSaveSchema } from "@/lib/validation/write-ups";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(getWriteUp({ actor, writeUpId: id }));
});

/** Autosave: refused with 409 (and the saved version) if the revision is not the latest, or once locked. */
export const PUT = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { revision, content } = await readJson(req, writeUpSaveSchema);
  return ok(saveWriteUp({ actor, writeUpId: id, revision, content }));
});

import { getPracticalVersion, saveDraft } from "@/db/queries/practicals";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { practicalDraftSchema } from "@/lib/validation/practicals";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(getPracticalVersion({ actor, versionId: id }));
});

/** Saves a draft; refused with 409 if it is published or someone saved since `revision`. */
export const PUT = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const input = await readJson(req, practicalDraftSchema);
  return ok(saveDraft({ actor, versionId: id, input }));
});

import { deleteEvidence, updateCaption } from "@/db/queries/evidence";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { captionSchema } from "@/lib/validation/evidence";

export const PATCH = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { caption } = await readJson(req, captionSchema);
  return ok(updateCaption({ actor, evidenceId: id, caption }));
});

export const DELETE = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  await deleteEvidence({ actor, evidenceId: id });
  return ok({ deleted: true });
});

import { startNewDraft } from "@/db/queries/practicals";
import { handle, ok } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

/** Opens a draft for editing: the existing one, or a copy of the newest published version. */
export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const res = startNewDraft({ actor, practicalId: id });
  return ok(res, { status: res.created ? 201 : 200 });
});

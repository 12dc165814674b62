import { confirmUpload } from "@/db/queries/evidence";
import { handle, ok } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

/** Checks, cleans and stores an uploaded photo; refused with the reason if it is not a usable photo. */
export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(await confirmUpload({ actor, evidenceId: id }));
});

import { duplicatePractical } from "@/db/queries/practicals";
import { handle, ok } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(duplicatePractical({ actor, practicalId: id }), { status: 201 });
});

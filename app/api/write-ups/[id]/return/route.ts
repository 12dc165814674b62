import { returnWriteUp } from "@/db/queries/marking";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("teacher");
  const { id } = await ctx.params;
  return ok(await returnWriteUp({ actor, writeUpId: id }));
});

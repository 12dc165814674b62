import { getMarkingItem } from "@/db/queries/marking";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("teacher", "admin");
  const { id } = await ctx.params;
  return ok(getMarkingItem({ actor, writeUpId: id }));
});

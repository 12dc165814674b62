import { acknowledgeSafety } from "@/db/queries/write-ups";
import { handle, ok } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  acknowledgeSafety({ actor, writeUpId: id });
  return ok({ acknowledged: true });
});

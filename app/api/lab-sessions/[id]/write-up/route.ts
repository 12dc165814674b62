import { openWriteUp } from "@/db/queries/write-ups";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

/** A student opens (or starts) their write-up for this lab session. */
export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("student");
  const { id } = await ctx.params;
  return ok(openWriteUp({ actor, labSessionId: id }));
});

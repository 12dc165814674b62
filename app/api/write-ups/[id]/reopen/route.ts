import { reopenWriteUp } from "@/db/queries/write-ups";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("teacher", "admin");
  const { id } = await ctx.params;
  reopenWriteUp({ actor, writeUpId: id });
  return ok({ reopened: true });
});

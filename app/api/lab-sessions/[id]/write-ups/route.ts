import { listSessionWriteUps } from "@/db/queries/write-ups";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

/** Every student's write-up state for a lab session (the class's teachers and admins). */
export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("teacher", "admin");
  const { id } = await ctx.params;
  return ok(listSessionWriteUps({ actor, labSessionId: id }).rows);
});

import { cancelLabSession, getLabSession, updateLabSession } from "@/db/queries/lab-sessions";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { labSessionSchema } from "@/lib/validation/practicals";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(getLabSession({ actor, labSessionId: id }));
});

export const PUT = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  updateLabSession({ actor, labSessionId: id, input: await readJson(req, labSessionSchema) });
  return ok(getLabSession({ actor, labSessionId: id }));
});

/** Cancels a lab session (kept for the record; students no longer see it). */
export const DELETE = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  cancelLabSession({ actor, labSessionId: id });
  return ok({ cancelled: true });
});

import { getModerationItem, saveModerationMark } from "@/db/queries/moderation";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { moderationMarkSchema } from "@/lib/validation/marking";

export const GET = handle<{ id: string; writeUpId: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("moderator", "admin");
  const { id, writeUpId } = await ctx.params;
  return ok(getModerationItem({ actor, sampleId: id, writeUpId }));
});

export const PUT = handle<{ id: string; writeUpId: string }>(async (req, ctx) => {
  const actor = await requireApiRole("moderator", "admin");
  const { id, writeUpId } = await ctx.params;
  return ok(saveModerationMark({ actor, sampleId: id, writeUpId, input: await readJson(req, moderationMarkSchema) }));
});

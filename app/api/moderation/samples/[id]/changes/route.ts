import { changeSample, getSample } from "@/db/queries/moderation";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { sampleChangeSchema } from "@/lib/validation/marking";

/** Adds or swaps work in a sample, with a reason. */
export const POST = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiRole("moderator", "admin");
  const { id } = await ctx.params;
  changeSample({ actor, sampleId: id, change: await readJson(req, sampleChangeSchema) });
  return ok(getSample({ actor, sampleId: id }));
});

import { decideAdjustment } from "@/db/queries/moderation";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { adjustmentDecisionSchema } from "@/lib/validation/marking";

/** Accepts (applies to the cohort, keeping the previous marks) or rejects the suggested adjustment; once only. */
export const POST = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiRole("moderator", "admin");
  const { id } = await ctx.params;
  const { decision, reason } = await readJson(req, adjustmentDecisionSchema);
  return ok(decideAdjustment({ actor, sampleId: id, decision, reason }));
});

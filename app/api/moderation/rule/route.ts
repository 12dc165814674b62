import { readSampleRule, setSampleRule } from "@/db/queries/moderation";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { sampleRuleSchema } from "@/lib/validation/marking";

export const GET = handle(async () => {
  const actor = await requireApiRole("moderator", "admin");
  return ok(readSampleRule({ actor }));
});

/** The admin changes the school's sampling rule (default: at least 5 or 10 %, extremes, every marker). */
export const PUT = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const rule = await readJson(req, sampleRuleSchema);
  setSampleRule({ actor, rule });
  return ok(rule);
});

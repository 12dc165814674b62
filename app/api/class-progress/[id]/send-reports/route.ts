import { emailTermReports } from "@/db/queries/progress";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

/** E-mails each family in the class their child's term report (PDF attached). */
export const POST = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("teacher", "admin");
  const { id } = await ctx.params;
  return ok(await emailTermReports({ actor, classId: id }));
});

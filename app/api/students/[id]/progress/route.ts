import { getStudentProgress } from "@/db/queries/progress";
import { handle, ok } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

/** A student's progress: for the student, their parents, their teachers and admins (404 for anyone else). */
export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(getStudentProgress({ actor, studentId: id }));
});

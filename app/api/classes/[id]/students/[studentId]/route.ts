import { removeStudent } from "@/db/queries/classes";
import { handle, ok, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

type Params = { id: string; studentId: string };

/** Takes a student out of the class. Their account and work are kept. */
export const DELETE = handle<Params>(async (_req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id, studentId } = await ctx.params;
  removeStudent({ actor, classId: id, studentId });
  return ok({ removed: true });
});

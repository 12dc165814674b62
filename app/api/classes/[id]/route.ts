import { getClassDetail, updateClass } from "@/db/queries/classes";
import { handle, ok, readJson, type RouteContext } from "@/lib/api";
import { requireApiRole, requireApiUser } from "@/lib/auth/guards";
import { classPatchSchema } from "@/lib/validation/classes";

type Params = { id: string };

/** One class; the roster is included for admins and the class's teachers only. */
export const GET = handle<Params>(async (_req, ctx: RouteContext<Params>) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok({ class: getClassDetail({ actor, classId: id }) });
});

/** Edits the class, its teachers (when teacherIds is given) or archives it. */
export const PATCH = handle<Params>(async (req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  const input = await readJson(req, classPatchSchema);
  updateClass({ actor, classId: id, input });
  return ok({ class: getClassDetail({ actor, classId: id }) });
});

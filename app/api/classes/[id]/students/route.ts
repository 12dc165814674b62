import { enrolStudents } from "@/db/queries/classes";
import { handle, ok, readJson, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { enrolSchema } from "@/lib/validation/classes";

type Params = { id: string };

/** Adds existing students of the school to the class; ones already in it are left as they are. */
export const POST = handle<Params>(async (req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  const { studentIds } = await readJson(req, enrolSchema);
  const added = enrolStudents({ actor, classId: id, studentIds });
  return ok({ added, alreadyInClass: new Set(studentIds).size - added });
});

import { createClass, listClasses } from "@/db/queries/classes";
import { handle, ok, readJson, readQuery } from "@/lib/api";
import { requireApiRole, requireApiUser } from "@/lib/auth/guards";
import { classesQuerySchema } from "@/lib/validation/admin";
import { classCreateSchema } from "@/lib/validation/classes";

/** The classes the signed-in person may see (all of them for an admin); ?archived=include adds archived ones. */
export const GET = handle(async (req) => {
  const actor = await requireApiUser();
  const { archived } = readQuery(req, classesQuerySchema);
  return ok({ classes: listClasses({ actor, includeArchived: archived === "include" }) });
});

export const POST = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const input = await readJson(req, classCreateSchema);
  const id = createClass({ actor, input });
  return ok({ id }, { status: 201 });
});

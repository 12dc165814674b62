import { getUserDetail, updateUser } from "@/db/queries/users";
import { handle, ok, readJson, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { userUpdateSchema } from "@/lib/validation/users";
import { personJson } from "./person-json";

type Params = { id: string };

/** One person with their roles, invitation status, classes and family links. */
export const GET = handle<Params>(async (_req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  return ok({ person: personJson(getUserDetail({ actor, userId: id })) });
});

/** Changes details or roles, or deactivates / reactivates (`active`). Answers with the person as saved. */
export const PATCH = handle<Params>(async (req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  const input = await readJson(req, userUpdateSchema);
  updateUser({ actor, userId: id, input });
  return ok({ person: personJson(getUserDetail({ actor, userId: id })) });
});

import { getOutboxMessage } from "@/db/queries/outbox";
import { handle, ok, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

type Params = { id: string };

/** One caught message: headers and the plain-text body (the HTML body is never sent to the page). */
export const GET = handle<Params>(async (_req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  return ok({ message: getOutboxMessage({ actor, id }) });
});

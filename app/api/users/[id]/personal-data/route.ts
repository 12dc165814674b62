import { z } from "zod";
import { eraseLeaverData } from "@/db/queries/privacy";
import { handle, ok, readJson, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

type Params = { id: string };

const eraseSchema = z.object({ confirmName: z.string().trim().min(1, "Type the person's full name to confirm.").max(200) });

/**
 * Deletes a leaver's data (a student or parent): their work, photos, links and account. Cannot
 * be undone; an audit entry keeps who did it and when, with the id only.
 */
export const DELETE = handle<Params>(async (req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  const { confirmName } = await readJson(req, eraseSchema);
  return ok(await eraseLeaverData({ actor, userId: id, confirmName }));
});

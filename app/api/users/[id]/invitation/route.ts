import { sendInvitation } from "@/db/queries/invitations";
import { handle, ok, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";

type Params = { id: string };

/**
 * Sends (or sends again) the invitation e-mail. A new link replaces any earlier one. The link
 * itself goes only to the person's inbox, never into this answer.
 */
export const POST = handle<Params>(async (_req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  try {
    const { expiresAt } = await sendInvitation({ actor, userId: id });
    return ok({ sent: true, expiresAt });
  } catch (e) {
    if (e instanceof AppError) throw e;
    console.error("[meniscus] invitation e-mail failed", e);
    throw new AppError("unavailable", "The invitation e-mail could not be sent just now, and any earlier link has stopped working. Try again in a few minutes.");
  }
});

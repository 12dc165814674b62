import { listChildrenProgress } from "@/db/queries/progress";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

/** A parent's linked children with their progress (only returned work). */
export const GET = handle(async () => {
  const actor = await requireApiRole("parent");
  return ok({ children: listChildrenProgress({ actor }) });
});

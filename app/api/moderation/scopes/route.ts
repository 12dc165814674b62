import { listSampleScopes } from "@/db/queries/moderation";
import { handle, ok } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

export const GET = handle(async () => {
  const actor = await requireApiRole("moderator", "admin");
  return ok(listSampleScopes({ actor }));
});

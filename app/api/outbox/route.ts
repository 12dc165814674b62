import { listOutbox } from "@/db/queries/outbox";
import { handle, ok, readQuery } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { outboxQuerySchema } from "@/lib/validation/admin";

/** Messages the built-in mail catcher received for this school, newest first; ?to= filters by recipient. */
export const GET = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { to } = readQuery(req, outboxQuerySchema);
  return ok({ messages: listOutbox({ actor, to }) });
});

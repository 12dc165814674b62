import { listPeopleWithRole } from "@/db/queries/users";
import { handle, ok, readQuery } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { pickerQuerySchema } from "@/lib/validation/users";

/** Active people holding a role, for the pickers on the admin screens; ?q= searches name and e-mail. */
export const GET = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { role, q, limit } = readQuery(req, pickerQuerySchema);
  const needle = q?.toLowerCase();
  const all = listPeopleWithRole({ actor, role });
  const matches = needle ? all.filter((p) => p.name.toLowerCase().includes(needle) || p.email.includes(needle)) : all;
  return ok({ people: matches.slice(0, limit), total: matches.length });
});

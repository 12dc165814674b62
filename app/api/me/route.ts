import { getOwnAccount, updateOwnPreferences } from "@/db/queries/users";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { preferencesSchema } from "@/lib/validation/users";

export const GET = handle(async () => {
  const actor = await requireApiUser();
  return ok(getOwnAccount(actor));
});

export const PATCH = handle(async (req) => {
  const actor = await requireApiUser();
  const input = await readJson(req, preferencesSchema);
  updateOwnPreferences({ actor, emailNotifications: input.emailNotifications });
  return ok(getOwnAccount(actor));
});

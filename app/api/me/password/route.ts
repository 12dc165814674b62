import { changeOwnPassword } from "@/db/queries/users";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { changePasswordSchema } from "@/lib/validation/users";

export const POST = handle(async (req) => {
  const actor = await requireApiUser();
  const input = await readJson(req, changePasswordSchema);
  await changeOwnPassword({ actor, current: input.current, password: input.password });
  return ok({ message: "Your password has been changed." });
});

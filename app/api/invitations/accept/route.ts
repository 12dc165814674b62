import { redeemToken } from "@/db/queries/invitations";
import { handle, ok, readJson } from "@/lib/api";
import { newPasswordSchema } from "@/lib/validation/users";

/** Accepts an invitation: sets the first password. Public: the single-use token is the proof. */
export const POST = handle(async (req) => {
  const input = await readJson(req, newPasswordSchema);
  const { email } = await redeemToken({ token: input.token, kind: "invitation", password: input.password });
  return ok({ email });
});

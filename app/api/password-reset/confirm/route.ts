import { redeemToken } from "@/db/queries/invitations";
import { handle, ok, readJson } from "@/lib/api";
import { newPasswordSchema } from "@/lib/validation/users";

export const POST = handle(async (req) => {
  const input = await readJson(req, newPasswordSchema);
  const { email } = await redeemToken({ token: input.token, kind: "password-reset", password: input.password });
  return ok({ email });
});

import { requestPasswordReset } from "@/db/queries/invitations";
import { handle, ok, readJson } from "@/lib/api";
import { assertResetAllowed, RateLimited } from "@/lib/auth/rate-limit";
import { AppError } from "@/lib/errors";
import { passwordResetRequestSchema } from "@/lib/validation/users";

/** Sends a reset link if the address has an account; the answer is the same either way. */
export const POST = handle(async (req) => {
  const { email } = await readJson(req, passwordResetRequestSchema);
  try {
    await assertResetAllowed(email);
  } catch (e) {
    if (e instanceof RateLimited) throw new AppError("rate_limited", "Too many reset e-mails for this address. Wait an hour, or ask your school's admin.");
    throw e;
  }
  try {
    await requestPasswordReset({ email });
  } catch (e) {
    console.error("[meniscus] password reset mail failed", e);
    throw new AppError("unavailable", "We could not send the e-mail just now. Please try again in a few minutes.");
  }
  return ok({ message: "If that address has a Meniscus account, a link to choose a new password is on its way. It works for one hour." });
});

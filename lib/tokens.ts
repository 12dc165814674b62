import "server-only";
import { createHash, randomBytes } from "node:crypto";

/** A random URL-safe token for single-use links (256 bits). */
export function newToken(): string {
  return randomBytes(32).toString("base64url");
}

/** Only this hash is stored; the token itself exists only in the e-mail. */
export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

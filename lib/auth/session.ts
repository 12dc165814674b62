import "server-only";
import { cookies } from "next/headers";
import { LRUCache } from "lru-cache";
import { decode } from "next-auth/jwt";
import { authOptions } from "./options";

/** Tokens already decrypted in this process: a token's text is authenticated, so the same text always names the same person until its expiry. */
const decoded = new LRUCache<string, { sub: string; exp: number }>({ max: 10_000 });
/** next-auth's own allowance for clocks that differ, in seconds. */
const CLOCK_TOLERANCE = 15;

/**
 * The id of the person the session cookie names, or null when there is no cookie or it is not
 * valid (tampered, another server's key, or past its 12 hours). Reads the cookie next-auth
 * wrote at sign-in and nothing more: it does not re-issue the cookie or run next-auth's
 * callbacks, which `getServerSession` would do on every request; a token seen before is not
 * decrypted again. Whether the person is still active, and their roles, come fresh from the
 * database in `currentActor`.
 */
export async function sessionUserId(): Promise<string | null> {
  const options = authOptions();
  const name = options.cookies?.sessionToken?.name;
  if (!name || !options.secret) return null;
  const jar = await cookies();
  // next-auth splits a token too large for one cookie into name.0, name.1, ...
  const token =
    jar.get(name)?.value ??
    jar
      .getAll()
      .filter((c) => c.name.startsWith(`${name}.`))
      .sort((a, b) => Number(a.name.slice(name.length + 1)) - Number(b.name.slice(name.length + 1)))
      .map((c) => c.value)
      .join("");
  if (!token) return null;
  const now = Date.now() / 1000;
  const known = decoded.get(token);
  if (known) {
    if (known.exp + CLOCK_TOLERANCE > now) return known.sub;
    decoded.delete(token);
    return null;
  }
  try {
    const payload = await decode({ token, secret: options.secret });
    if (typeof payload?.sub !== "string" || !payload.sub) return null;
    if (typeof payload.exp === "number") decoded.set(token, { sub: payload.sub, exp: payload.exp });
    return payload.sub;
  } catch {
    return null;
  }
}

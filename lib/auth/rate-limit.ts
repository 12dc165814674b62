import "server-only";
import type Database from "better-sqlite3";
import { lt } from "drizzle-orm";
import { RateLimiterRes, RateLimiterSQLite } from "rate-limiter-flexible";
import { getDb, getHandle } from "@/db/client";
import { rateLimits } from "@/db/schema";

type Limiters = { perAccount: RateLimiterSQLite; perAddress: RateLimiterSQLite; resetRequests: RateLimiterSQLite };
const byDatabase = new WeakMap<Database.Database, Limiters>();

/**
 * The counters live in the database's rate_limits table (db/schema/rate-limits.ts), so every
 * server worker counts together and a restart does not reset them. Made on first use, for the
 * database this process is using.
 */
function limiters(): Limiters {
  const { sqlite } = getHandle();
  let found = byDatabase.get(sqlite);
  if (!found) {
    const store = (keyPrefix: string, points: number, duration: number) =>
      new RateLimiterSQLite({ storeClient: sqlite, storeType: "better-sqlite3", tableName: "rate_limits", tableCreated: true, clearExpiredByTimeout: false, keyPrefix, points, duration });
    found = {
      // Sign-in: 5 wrong tries per account per 15 minutes, and 30 per network address, then a pause.
      perAccount: store("signin-account", Number(process.env.SIGNIN_LIMIT_PER_ACCOUNT || 5), 15 * 60),
      perAddress: store("signin-ip", Number(process.env.SIGNIN_LIMIT_PER_IP || 30), 15 * 60),
      // Password-reset e-mails: 3 per address per hour.
      resetRequests: store("reset", 3, 60 * 60),
    };
    byDatabase.set(sqlite, found);
  }
  return found;
}

export class RateLimited extends Error {
  constructor(readonly retryAfterSeconds: number) {
    super(`Too many attempts. Try again in ${Math.max(1, Math.ceil(retryAfterSeconds / 60))} minute(s).`);
  }
}

async function blocked(limiter: RateLimiterSQLite, key: string): Promise<number> {
  const res = await limiter.get(key);
  return res && res.consumedPoints >= limiter.points ? Math.ceil(res.msBeforeNext / 1000) : 0;
}

/** Throws RateLimited if either counter is exhausted; does not count the attempt. */
export async function assertSignInAllowed(email: string, ip: string): Promise<void> {
  const { perAccount, perAddress } = limiters();
  const wait = Math.max(await blocked(perAccount, email), await blocked(perAddress, ip));
  if (wait > 0) throw new RateLimited(wait);
}

export async function recordFailedSignIn(email: string, ip: string): Promise<void> {
  const { perAccount, perAddress } = limiters();
  await Promise.allSettled([perAccount.consume(email), perAddress.consume(ip)]);
}

export async function clearSignInFailures(email: string): Promise<void> {
  // Best effort: a database in read-only maintenance mode still lets people sign in.
  await limiters()
    .perAccount.delete(email)
    .catch(() => undefined);
}

export async function assertResetAllowed(email: string): Promise<void> {
  try {
    await limiters().resetRequests.consume(email);
  } catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e;
    throw new RateLimited(Math.ceil(e.msBeforeNext / 1000));
  }
}

/** Removes counters that ran out more than an hour ago (they hold e-mail addresses). Run by the server's housekeeping. */
export function forgetExpiredRateLimits(now = Date.now()): number {
  return getDb()
    .delete(rateLimits)
    .where(lt(rateLimits.expire, now - 60 * 60 * 1000))
    .run().changes;
}

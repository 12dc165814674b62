import "server-only";
import { RateLimiterMemory } from "rate-limiter-flexible";

// Sign-in: 5 wrong tries per account per 15 minutes, and 30 per network address, then a pause.
// One process serves a school, so counters in memory are enough.
const perAccount = new RateLimiterMemory({ keyPrefix: "signin-account", points: Number(process.env.SIGNIN_LIMIT_PER_ACCOUNT || 5), duration: 15 * 60 });
const perAddress = new RateLimiterMemory({ keyPrefix: "signin-ip", points: Number(process.env.SIGNIN_LIMIT_PER_IP || 30), duration: 15 * 60 });
// Password-reset e-mails: 3 per address per hour.
const resetRequests = new RateLimiterMemory({ keyPrefix: "reset", points: 3, duration: 60 * 60 });

export class RateLimited extends Error {
  constructor(readonly retryAfterSeconds: number) {
    super(`Too many attempts. Try again in ${Math.max(1, Math.ceil(retryAfterSeconds / 60))} minute(s).`);
  }
}

async function blocked(limiter: RateLimiterMemory, key: string): Promise<number> {
  const res = await limiter.get(key);
  return res && res.consumedPoints >= limiter.points ? Math.ceil(res.msBeforeNext / 1000) : 0;
}

/** Throws RateLimited if either counter is exhausted; does not count the attempt. */
export async function assertSignInAllowed(email: string, ip: string): Promise<void> {
  const wait = Math.max(await blocked(perAccount, email), await blocked(perAddress, ip));
  if (wait > 0) throw new RateLimited(wait);
}

export async function recordFailedSignIn(email: string, ip: string): Promise<void> {
  await Promise.allSettled([perAccount.consume(email), perAddress.consume(ip)]);
}

export async function clearSignInFailures(email: string): Promise<void> {
  await perAccount.delete(email);
}

export async function assertResetAllowed(email: string): Promise<void> {
  try {
    await resetRequests.consume(email);
  } catch (e) {
    const ms = (e as { msBeforeNext?: number }).msBeforeNext ?? 60_000;
    throw new RateLimited(Math.ceil(ms / 1000));
  }
}

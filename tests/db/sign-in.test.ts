import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { users } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { authOptions, SIGN_IN_ERRORS } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { assertSignInAllowed, clearSignInFailures, RateLimited, recordFailedSignIn } from "@/lib/auth/rate-limit";
import { freshDatabase, makeSchool, makeUser, testDb } from "../helpers/db";

// The limits are read when lib/auth/rate-limit.ts loads, so fix them before any import runs.
const env = vi.hoisted(() => {
  const saved = { account: process.env.SIGNIN_LIMIT_PER_ACCOUNT, ip: process.env.SIGNIN_LIMIT_PER_IP, secret: process.env.NEXTAUTH_SECRET };
  process.env.SIGNIN_LIMIT_PER_ACCOUNT = "5";
  process.env.SIGNIN_LIMIT_PER_IP = "30";
  process.env.NEXTAUTH_SECRET = "test-secret-for-sign-in-tests-only";
  return saved;
});
const PER_ACCOUNT = 5;
const PER_IP = 30;

afterAll(() => {
  for (const [key, value] of [["SIGNIN_LIMIT_PER_ACCOUNT", env.account], ["SIGNIN_LIMIT_PER_IP", env.ip], ["NEXTAUTH_SECRET", env.secret]] as const) {
    if (value === undefined) delete process.env[key];
    else process.env[key] = value;
  }
});

// Counters live in the database (rate_limits); one in-memory database serves these tests, so each
// uses its own e-mails and addresses.
let n = 0;
const freshEmail = () => `rate-${++n}@test.example`;
const freshIp = () => {
  const k = ++n;
  return `10.${(k >> 16) & 255}.${(k >> 8) & 255}.${k & 255}`;
};

async function isBlocked(email: string, ip: string): Promise<boolean> {
  try {
    await assertSignInAllowed(email, ip);
    return false;
  } catch (e) {
    expect(e).toBeInstanceOf(RateLimited);
    return true;
  }
}

describe("sign-in rate limiting", () => {
  beforeAll(() => {
    freshDatabase();
  });

  it(`blocks an account after ${PER_ACCOUNT} failures, for up to 15 minutes`, async () => {
    const email = freshEmail();
    const ip = freshIp();
    for (let i = 0; i < PER_ACCOUNT - 1; i++) await recordFailedSignIn(email, ip);
    expect(await isBlocked(email, ip)).toBe(false);
    await recordFailedSignIn(email, ip);
    const err = await assertSignInAllowed(email, ip).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(RateLimited);
    expect((err as RateLimited).retryAfterSeconds).toBeGreaterThan(14 * 60);
    expect((err as RateLimited).retryAfterSeconds).toBeLessThanOrEqual(15 * 60);
    expect((err as RateLimited).message).toBe("Too many attempts. Try again in 15 minute(s).");
    // The block follows the account to any other address.
    expect(await isBlocked(email, freshIp())).toBe(true);
    // Other accounts are not affected.
    expect(await isBlocked(freshEmail(), ip)).toBe(false);
  });

  it("forgets an account's failures after a successful sign-in", async () => {
    const email = freshEmail();
    const ip = freshIp();
    for (let i = 0; i < PER_ACCOUNT - 1; i++) await recordFailedSignIn(email, ip);
    await clearSignInFailures(email);
    for (let i = 0; i < PER_ACCOUNT - 1; i++) await recordFailedSignIn(email, ip);
    expect(await isBlocked(email, ip)).toBe(false);
    await recordFailedSignIn(email, ip);
    expect(await isBlocked(email, ip)).toBe(true);
  });

  it(`blocks a network address after ${PER_IP} failures across many accounts`, async () => {
    const ip = freshIp();
    for (let i = 0; i < PER_IP; i++) await recordFailedSignIn(freshEmail(), ip);
    expect(await isBlocked(freshEmail(), ip)).toBe(true);
    expect(await isBlocked(freshEmail(), freshIp())).toBe(false);
  });

  describe("after the window", () => {
    beforeEach(() => {
      vi.useFakeTimers({ toFake: ["Date", "setTimeout", "clearTimeout"] });
    });
    afterEach(() => {
      vi.useRealTimers();
    });

    it("lets the account try again once 15 minutes have passed", async () => {
      const email = freshEmail();
      const ip = freshIp();
      for (let i = 0; i < PER_ACCOUNT; i++) await recordFailedSignIn(email, ip);
      expect(await isBlocked(email, ip)).toBe(true);
      vi.advanceTimersByTime(14 * 60_000);
      expect(await isBlocked(email, ip)).toBe(true);
      vi.advanceTimersByTime(60_000 + 1_000);
      expect(await isBlocked(email, ip)).toBe(false);
    });
  });
});

type Authorize = (credentials: Record<string, string> | undefined, req: { headers?: Record<string, string> }) => Promise<{ id: string; name?: string | null; email?: string | null } | null>;

describe("the credentials provider's authorize()", () => {
  const password = "correct horse battery";
  let authorize: Authorize;
  let hash: string;
  let schoolId: string;
  let person: Actor;

  beforeAll(async () => {
    hash = await hashPassword(password);
    const provider = authOptions().providers[0] as unknown as { id: string; options: { authorize: Authorize } };
    expect(provider.id).toBe("credentials");
    authorize = provider.options.authorize;
  });

  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    person = makeUser(schoolId, ["teacher"], { name: "Cass Dalton", email: freshEmail(), passwordHash: hash });
  });

  const req = (ip = freshIp()) => ({ headers: { "x-forwarded-for": `${ip}, 10.0.0.1` } });
  const lastSignIn = (id: string) => testDb().select({ at: users.lastSignInAt }).from(users).where(eq(users.id, id)).get()!.at;

  it("accepts the right password, whatever the e-mail's case, and records the sign-in", async () => {
    expect(await authorize({ email: `  ${person.email.toUpperCase()} `, password }, req())).toEqual({ id: person.userId, name: "Cass Dalton", email: person.email });
    expect(lastSignIn(person.userId)).toBeInstanceOf(Date);
  });

  it("refuses a wrong password, an unknown e-mail and malformed input", async () => {
    expect(await authorize({ email: person.email, password: "incorrect horse battery" }, req())).toBeNull();
    expect(await authorize({ email: "nobody@test.example", password }, req())).toBeNull();
    expect(await authorize({ email: "not an e-mail", password }, req())).toBeNull();
    expect(await authorize({ email: person.email, password: "" }, req())).toBeNull();
    expect(await authorize(undefined, req())).toBeNull();
    expect(lastSignIn(person.userId)).toBeNull();
  });

  it("refuses a deactivated account even with the right password", async () => {
    const closed = makeUser(schoolId, ["student"], { email: freshEmail(), passwordHash: hash, active: false });
    expect(await authorize({ email: closed.email, password }, req())).toBeNull();
    expect(lastSignIn(closed.userId)).toBeNull();
  });

  it("refuses an account that has not chosen a password yet", async () => {
    const pending = makeUser(schoolId, ["parent"], { email: freshEmail() });
    expect(await authorize({ email: pending.email, password: "" }, req())).toBeNull();
    expect(await authorize({ email: pending.email, password: "anything at all" }, req())).toBeNull();
  });

  it(`stops even the right password after ${PER_ACCOUNT} wrong ones, from any address`, async () => {
    for (let i = 0; i < PER_ACCOUNT; i++) expect(await authorize({ email: person.email, password: `wrong guess ${i}` }, req())).toBeNull();
    await expect(authorize({ email: person.email, password }, req())).rejects.toThrow(SIGN_IN_ERRORS.rateLimited);
    expect(lastSignIn(person.userId)).toBeNull();
  });

  it("counts a deactivated account's attempts like any other", async () => {
    const closed = makeUser(schoolId, ["student"], { email: freshEmail(), passwordHash: hash, active: false });
    for (let i = 0; i < PER_ACCOUNT; i++) await authorize({ email: closed.email, password }, req());
    await expect(authorize({ email: closed.email, password }, req())).rejects.toThrow(SIGN_IN_ERRORS.rateLimited);
  });

  it("clears the failures when the right password is given before the limit", async () => {
    for (let i = 0; i < PER_ACCOUNT - 1; i++) await authorize({ email: person.email, password: `wrong guess ${i}` }, req());
    expect(await authorize({ email: person.email, password }, req())).not.toBeNull();
    for (let i = 0; i < PER_ACCOUNT - 1; i++) await authorize({ email: person.email, password: `wrong again ${i}` }, req());
    expect(await authorize({ email: person.email, password }, req())).not.toBeNull();
  });

  it("puts the roles and school into the token and the session", async () => {
    const { jwt, session } = authOptions().callbacks!;
    const token = await jwt!({ token: {}, user: { id: person.userId, name: person.name, email: person.email }, account: null, trigger: "signIn" } as Parameters<NonNullable<typeof jwt>>[0]);
    expect(token).toMatchObject({ sub: person.userId, roles: ["teacher"], schoolId, name: "Cass Dalton" });
    const s = await session!({ session: { user: { name: person.name, email: person.email }, expires: "" }, token } as unknown as Parameters<NonNullable<typeof session>>[0]);
    expect(s.user).toMatchObject({ id: person.userId, roles: ["teacher"], schoolId });
  });
});

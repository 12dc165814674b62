import { encode } from "next-auth/jwt";
import { beforeEach, describe, expect, it, vi } from "vitest";

// The session cookie as next-auth writes it at sign-in, read back the way every page, route
// handler and action reads it (lib/auth/session.ts). The token format is next-auth's own: its
// `encode` makes the cookies these tests send.
const jar = new Map<string, string>();
vi.mock("next/headers", () => ({
  cookies: async () => ({
    get: (name: string) => (jar.has(name) ? { name, value: jar.get(name)! } : undefined),
    getAll: () => [...jar].map(([name, value]) => ({ name, value })),
  }),
}));

process.env.NEXTAUTH_SECRET = "test-secret-for-session-cookie-reading-0123456789";
const { sessionUserId } = await import("@/lib/auth/session");
const { authOptions } = await import("@/lib/auth/options");
const NAME = authOptions().cookies!.sessionToken!.name;
const SECRET = authOptions().secret!;

beforeEach(() => jar.clear());

describe("reading the session cookie", () => {
  it("names the signed-in person", async () => {
    jar.set(NAME, await encode({ token: { sub: "user-123", name: "Ada" }, secret: SECRET, maxAge: 60 }));
    expect(await sessionUserId()).toBe("user-123");
  });

  it("is nobody without a cookie, or with an empty one", async () => {
    expect(await sessionUserId()).toBeNull();
    jar.set(NAME, "");
    expect(await sessionUserId()).toBeNull();
  });

  it("refuses a cookie made with another key", async () => {
    jar.set(NAME, await encode({ token: { sub: "user-123" }, secret: "some-other-server's-secret-0123456789", maxAge: 60 }));
    expect(await sessionUserId()).toBeNull();
  });

  it("refuses a tampered cookie", async () => {
    const token = await encode({ token: { sub: "user-123" }, secret: SECRET, maxAge: 60 });
    const parts = token.split(".");
    const ciphertext = parts[3]!;
    parts[3] = (ciphertext[0] === "A" ? "B" : "A") + ciphertext.slice(1);
    jar.set(NAME, parts.join("."));
    expect(await sessionUserId()).toBeNull();
    jar.set(NAME, "not-a-token");
    expect(await sessionUserId()).toBeNull();
  });

  it("refuses a cookie past its lifetime (beyond next-auth's 15 s clock tolerance)", async () => {
    jar.set(NAME, await encode({ token: { sub: "user-123" }, secret: SECRET, maxAge: -60 }));
    expect(await sessionUserId()).toBeNull();
  });

  it("stops naming the person once the token has expired, even though it was read before", async () => {
    jar.set(NAME, await encode({ token: { sub: "user-789" }, secret: SECRET, maxAge: 60 }));
    expect(await sessionUserId()).toBe("user-789");
    expect(await sessionUserId()).toBe("user-789"); // the second read comes from the cache
    vi.useFakeTimers({ toFake: ["Date"] });
    try {
      vi.setSystemTime(Date.now() + 60_000 + 16_000); // past expiry and next-auth's 15 s tolerance
      expect(await sessionUserId()).toBeNull();
    } finally {
      vi.useRealTimers();
    }
  });

  it("refuses a token without a person in it", async () => {
    jar.set(NAME, await encode({ token: { name: "nobody" }, secret: SECRET, maxAge: 60 }));
    expect(await sessionUserId()).toBeNull();
  });

  it("puts a token split across numbered cookies back together, in order", async () => {
    const token = await encode({ token: { sub: "user-456" }, secret: SECRET, maxAge: 60 });
    const third = Math.ceil(token.length / 3);
    jar.set(`${NAME}.2`, token.slice(2 * third));
    jar.set(`${NAME}.0`, token.slice(0, third));
    jar.set(`${NAME}.1`, token.slice(third, 2 * third));
    expect(await sessionUserId()).toBe("user-456");
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { hashPassword } from "@/lib/auth/password";
import { freshDatabase, makeSchool, makeUser } from "../helpers/db";
import { sessionCookie } from "./next-auth-flow";

// Real sign-ins through the next-auth route handler (no mocked session here).
const PASSWORD = "Plum-Tree-Glassware-93!";
const ORIGINAL_ENV = { ...process.env };

async function freshApp(env: Record<string, string | undefined> = {}) {
  vi.resetModules();
  process.env = { ...ORIGINAL_ENV, NEXTAUTH_SECRET: "test-only-session-key", NEXTAUTH_URL: "http://localhost:3000", APP_URL: "http://localhost:3000", MENISCUS_ENV: undefined, ...env };
  for (const [k, v] of Object.entries(env)) if (v === undefined) delete process.env[k];
  const flow = await import("./next-auth-flow");
  const options = await import("@/lib/auth/options");
  return { ...flow, options };
}

let email: string;
beforeEach(async () => {
  freshDatabase();
  email = `sign.in.${Math.random().toString(36).slice(2, 8)}@test.example`;
  makeUser(makeSchool(), ["student"], { email, passwordHash: await hashPassword(PASSWORD) });
});
afterEach(() => {
  process.env = { ...ORIGINAL_ENV };
  vi.restoreAllMocks();
});

describe("session cookies", () => {
  it("are httpOnly and SameSite=Lax, and not Secure on a plain-http development address", async () => {
    const app = await freshApp();
    const res = await app.signIn(email, PASSWORD);
    expect(res.status).toBe(200);
    const cookie = app.sessionCookie(res)!;
    expect(cookie).toMatch(/^next-auth\.session-token=[^;]+;/);
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
    expect(app.options.secureCookies()).toBe(false);
  });

  it("are Secure, with the __Secure- prefix, when MENISCUS_ENV=production", async () => {
    const app = await freshApp({ MENISCUS_ENV: "production" });
    const res = await app.signIn(email, PASSWORD);
    expect(res.status).toBe(200);
    const cookie = app.sessionCookie(res)!;
    expect(cookie).toMatch(/^__Secure-next-auth\.session-token=[^;]+;/);
    expect(cookie).toMatch(/;\s*Secure/i);
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
  });

  it("are Secure when the app's address is https, even outside production", async () => {
    const app = await freshApp({ APP_URL: "https://lab.school.example", NEXTAUTH_URL: "https://lab.school.example" });
    const res = await app.signIn(email, PASSWORD);
    expect(res.status).toBe(200);
    expect(app.sessionCookie(res)).toMatch(/^__Secure-next-auth\.session-token=.*;\s*Secure/i);
    expect(app.options.secureCookies()).toBe(true);
  });

  it("are not set for a wrong password", async () => {
    const app = await freshApp();
    const res = await app.signIn(email, "not-the-password");
    expect(res.status).toBe(401);
    expect(sessionCookie(res)).toBeUndefined();
  });
});

describe("sign-in over HTTP", () => {
  it("is rate limited: after 5 wrong passwords even the right one is refused, with the rate-limit code", async () => {
    const app = await freshApp();
    for (let i = 0; i < 5; i++) expect((await app.signIn(email, `wrong-${i}`)).status).toBe(401);
    const res = await app.signIn(email, PASSWORD);
    expect(res.status).toBe(401);
    expect(JSON.parse(await res.text()).url).toMatch(/error=RateLimited/);
    expect(app.sessionCookie(res)).toBeUndefined();
  });

  it("limits one network address across many accounts (30 failures)", async () => {
    const app = await freshApp();
    const ip = { "x-forwarded-for": "203.0.113.7" };
    for (let i = 0; i < 30; i++) await app.signIn(`nobody${i}@test.example`, "guess", ip);
    const res = await app.signIn(email, PASSWORD, ip);
    expect(JSON.parse(await res.text()).url).toMatch(/error=RateLimited/);
    // Another address is not affected.
    expect((await app.signIn(email, PASSWORD, { "x-forwarded-for": "198.51.100.4" })).status).toBe(200);
  });

  it("never writes a password to the log: wrong, rate-limited, malformed and hostile sign-ins", async () => {
    const app = await freshApp();
    const written: string[] = [];
    const capture = (...args: unknown[]) => void written.push(args.map((a) => (a instanceof Error ? `${a.message}\n${a.stack}` : typeof a === "string" ? a : JSON.stringify(a))).join(" "));
    for (const m of ["log", "info", "warn", "error", "debug", "trace"] as const) vi.spyOn(console, m).mockImplementation(capture);
    const out = vi.spyOn(process.stdout, "write").mockImplementation((chunk: string | Uint8Array) => (written.push(String(chunk)), true));
    const err = vi.spyOn(process.stderr, "write").mockImplementation((chunk: string | Uint8Array) => (written.push(String(chunk)), true));
    const secrets = ["Wrong-Secret-Passphrase-1", "Another-Secret-2", "'; DROP TABLE users; --secret3", "x".repeat(500) + "secret4"];
    try {
      for (const pw of secrets) await app.signIn(email, pw);
      for (let i = 0; i < 5; i++) await app.signIn(email, `Rate-Limited-Secret-${i}`);
      await app.signIn(email, PASSWORD); // refused while limited
      await app.signIn("not an e-mail", "Malformed-Secret-5");
      await app.signIn(email, PASSWORD.repeat(1)); // still limited
    } finally {
      out.mockRestore();
      err.mockRestore();
    }
    const log = written.join("\n");
    for (const pw of [...secrets, "Rate-Limited-Secret-0", "Malformed-Secret-5", PASSWORD]) expect(log).not.toContain(pw);
  });

  it("answers hostile e-mails and passwords with a refusal, never a server error", async () => {
    const app = await freshApp();
    for (const [e, p] of [
      ["' OR '1'='1", "' OR '1'='1"],
      [`${email}' --`, "x"],
      ["<script>alert(1)</script>@test.example", "x"],
      [email, "p".repeat(10_000)],
      ["a".repeat(5000) + "@test.example", "x"],
      ["", ""],
    ]) {
      const res = await app.signIn(e!, p!);
      expect(res.status, `${e.slice(0, 30)}`).toBe(401);
      expect(app.sessionCookie(res)).toBeUndefined();
    }
  });
});

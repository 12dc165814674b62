import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import type { NextConfig } from "next";
import { proxy } from "@/proxy";
import { API_CONTENT_SECURITY_POLICY, contentSecurityPolicy, securityHeaders, storageOrigins } from "@/lib/security-headers.mjs";

const directive = (csp: string, name: string) => csp.split("; ").find((d) => d.startsWith(`${name} `)) ?? "";

describe("content security policy for pages", () => {
  it("allows only nonce-carrying scripts (and what they load), no eval, no framing, no plugins", () => {
    const csp = contentSecurityPolicy({ nonce: "abc123", env: {}, dev: false });
    expect(directive(csp, "script-src")).toBe("script-src 'self' 'nonce-abc123' 'strict-dynamic'");
    expect(csp).not.toContain("unsafe-eval");
    expect(directive(csp, "script-src")).not.toContain("unsafe-inline");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("base-uri 'self'");
    expect(csp).toContain("form-action 'self'");
    // Styles: React, TipTap, KaTeX and Chart.js set style attributes.
    expect(directive(csp, "style-src")).toBe("style-src 'self' 'unsafe-inline'");
    expect(directive(csp, "font-src")).toBe("font-src 'self' data:");
  });

  it("lets the browser reach the S3 service for presigned uploads and images: the public endpoint, else the endpoint, else the local server", () => {
    const pub = contentSecurityPolicy({ env: { S3_ENDPOINT: "http://minio:9000", S3_PUBLIC_ENDPOINT: "https://files.school.example/meniscus/" } });
    expect(directive(pub, "img-src")).toBe("img-src 'self' blob: data: https://files.school.example");
    expect(directive(pub, "connect-src")).toBe("connect-src 'self' https://files.school.example");
    expect(pub).not.toContain("minio");
    expect(storageOrigins({ S3_ENDPOINT: "https://s3.eu-west-2.amazonaws.com" })).toEqual(["https://s3.eu-west-2.amazonaws.com"]);
    expect(storageOrigins({})).toEqual(["http://127.0.0.1:4569"]);
    expect(storageOrigins({ S3_FAKE_PORT: "9100" })).toEqual(["http://127.0.0.1:9100"]);
    // Port 0: the local server picks a free port when it starts, so any port on 127.0.0.1.
    expect(storageOrigins({ S3_FAKE_PORT: "0" })).toEqual(["http://127.0.0.1:*"]);
  });

  it("adds eval only in development, and upgrade-insecure-requests only on an https address", () => {
    expect(directive(contentSecurityPolicy({ env: {}, dev: true }), "script-src")).toContain("'unsafe-eval'");
    expect(contentSecurityPolicy({ env: { APP_URL: "https://lab.school.example" } })).toContain("upgrade-insecure-requests");
    expect(contentSecurityPolicy({ env: { APP_URL: "http://localhost:3000" } })).not.toContain("upgrade-insecure-requests");
  });
});

describe("headers on every response", () => {
  it("are set for all paths in next.config.mjs, with a policy for route handlers that runs nothing", async () => {
    const file = "../../next.config.mjs";
    const nextConfig = (await import(/* @vite-ignore */ file)).default as NextConfig;
    const rules = await nextConfig.headers!();
    const all = rules.find((r) => r.source === "/:path*")!.headers;
    const get = (k: string) => all.find((h) => h.key === k)?.value;
    expect(get("X-Content-Type-Options")).toBe("nosniff");
    expect(get("Referrer-Policy")).toBe("same-origin");
    expect(get("X-Frame-Options")).toBe("DENY");
    expect(get("Permissions-Policy")).toMatch(/(^|, )camera=\(self\)/);
    expect(get("Permissions-Policy")).toMatch(/microphone=\(\)/);
    expect(get("Permissions-Policy")).toMatch(/geolocation=\(\)/);
    const api = rules.find((r) => r.source === "/api/:path*")!.headers;
    expect(api).toEqual([{ key: "Content-Security-Policy", value: API_CONTENT_SECURITY_POLICY }]);
    expect(API_CONTENT_SECURITY_POLICY).toMatch(/^default-src 'none'.*frame-ancestors 'none'/);
  });

  it("add HSTS only when served over https", () => {
    expect(securityHeaders({ APP_URL: "https://lab.school.example" }).some((h) => h.key === "Strict-Transport-Security")).toBe(true);
    expect(securityHeaders({ APP_URL: "http://localhost:3000" }).some((h) => h.key === "Strict-Transport-Security")).toBe(false);
  });
});

describe("proxy.ts", () => {
  const page = (path: string, cookie?: string) => new NextRequest(`http://localhost:3000${path}`, { headers: cookie ? { cookie } : {} });
  const nonceOf = (csp: string | null) => csp?.match(/'nonce-([^']+)'/)?.[1];

  it("gives every page response a policy with a fresh nonce, and passes it to the render in the request", () => {
    const a = proxy(page("/sign-in"));
    const b = proxy(page("/sign-in"));
    const nonceA = nonceOf(a.headers.get("content-security-policy"));
    expect(nonceA).toMatch(/^[A-Za-z0-9+/=]{40,}$/);
    expect(nonceOf(b.headers.get("content-security-policy"))).not.toBe(nonceA);
    // NextResponse.next({ request: { headers } }) hands the changed request headers to the render.
    expect(a.headers.get("x-middleware-request-content-security-policy")).toBe(a.headers.get("content-security-policy"));
  });

  it("keeps sending signed-out visitors of other pages to sign in, with the policy too", () => {
    const res = proxy(page("/practicals"));
    expect(res.status).toBe(307);
    expect(res.headers.get("location")).toBe("http://localhost:3000/sign-in?callbackUrl=%2Fpracticals");
    expect(res.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
    const signedIn = proxy(page("/practicals", "next-auth.session-token=x"));
    expect(signedIn.headers.get("location")).toBeNull();
    expect(nonceOf(signedIn.headers.get("content-security-policy"))).toBeTruthy();
  });
});

describe("zod in the browser", () => {
  it("reads its jitless setting from the global that instrumentation-client.ts sets, so it never probes eval", async () => {
    const { z } = await import("zod");
    const g = globalThis as unknown as { __zod_globalConfig?: Record<string, unknown> };
    expect(g.__zod_globalConfig).toBe(z.config());
    const before = { ...g.__zod_globalConfig };
    await import("@/instrumentation-client");
    try {
      expect(z.config().jitless).toBe(true);
    } finally {
      for (const k of Object.keys(g.__zod_globalConfig!)) delete g.__zod_globalConfig![k];
      Object.assign(g.__zod_globalConfig!, before);
    }
  });
});

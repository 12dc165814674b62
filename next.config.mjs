import { API_CONTENT_SECURITY_POLICY, securityHeaders } from "./lib/security-headers.mjs";

/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate build folder lets the browser tests build without touching a running demo.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["better-sqlite3", "s3rver", "smtp-server", "mailparser", "@node-rs/argon2", "@napi-rs/canvas", "sharp"],
  poweredByHeader: false,
  reactStrictMode: true,
  experimental: { authInterrupts: true },
  // Security headers on every response (lib/security-headers.mjs). Pages get their
  // Content-Security-Policy, with a fresh nonce for each response, from proxy.ts.
  async headers() {
    return [
      { source: "/:path*", headers: securityHeaders() },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: API_CONTENT_SECURITY_POLICY }] },
    ];
  },
};

export default nextConfig;

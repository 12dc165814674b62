/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate build folder lets the browser tests build without touching a running demo.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["better-sqlite3", "s3rver", "smtp-server", "mailparser", "@node-rs/argon2", "@napi-rs/canvas", "sharp"],
  poweredByHeader: false,
  reactStrictMode: true,
  experimental: { authInterrupts: true },
};

export default nextConfig;

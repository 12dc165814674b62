import "server-only";
import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { isProductionDeployment } from "../config";

let cached: string | undefined;

/**
 * The key that signs session cookies. NEXTAUTH_SECRET (or AUTH_SECRET) in production; for the
 * demo and development, a random key made once for this machine and kept in the data folder.
 */
export function authSecret(): string {
  if (cached) return cached;
  const fromEnv = process.env.NEXTAUTH_SECRET || process.env.AUTH_SECRET;
  if (fromEnv) return (cached = fromEnv);
  if (isProductionDeployment()) {
    throw new Error("NEXTAUTH_SECRET is not set. A production deployment (MENISCUS_ENV=production) must set it: `openssl rand -base64 32`.");
  }
  const dir = process.env.DATABASE_PATH ? path.dirname(process.env.DATABASE_PATH) : path.join(process.cwd(), "data");
  const file = path.join(dir, ".auth-secret");
  try {
    cached = fs.readFileSync(file, "utf8").trim();
  } catch {
    fs.mkdirSync(dir, { recursive: true });
    cached = randomBytes(32).toString("base64url");
    fs.writeFileSync(file, cached, { mode: 0o600 });
  }
  return cached;
}

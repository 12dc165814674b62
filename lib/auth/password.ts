import "server-only";
import { hash, verify } from "@node-rs/argon2";

// argon2id with the OWASP-recommended minimum (19 MiB memory, 2 passes, 1 lane).
const OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(hashed: string | null | undefined, password: string): Promise<boolean> {
  if (!hashed) return false;
  try {
    return await verify(hashed, password);
  } catch {
    return false;
  }
}

/** A hash to verify against when no account matches, so timing does not reveal which e-mails exist. */
let dummy: Promise<string> | undefined;
export function dummyHash(): Promise<string> {
  dummy ??= hash("not a real password", OPTIONS);
  return dummy;
}

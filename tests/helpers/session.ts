import { vi } from "vitest";
import type { Actor } from "@/lib/auth/actor";

/**
 * Route-handler tests sign people in by controlling whom the session cookie names
 * (lib/auth/session.ts); the real guards then load the person from the test database as they
 * would in production. Call `vi.mock("@/lib/auth/session", ...)` with `mockSession` at the top
 * of the test file.
 */
export const sessionState: { actor: Actor | null } = { actor: null };

export function signInAs(actor: Actor | null) {
  sessionState.actor = actor;
}

export function mockSession() {
  return { sessionUserId: vi.fn(async () => sessionState.actor?.userId ?? null) };
}

/** A JSON request as a browser on the same origin would send it. */
export function jsonRequest(url: string, method: string, body?: unknown, headers: Record<string, string> = {}) {
  return new Request(`http://localhost:3000${url}`, {
    method,
    headers: { host: "localhost:3000", ...(body !== undefined ? { "content-type": "application/json" } : {}), ...headers },
    body: body !== undefined ? (typeof body === "string" ? body : JSON.stringify(body)) : undefined,
  });
}

export const params = <P>(p: P) => ({ params: Promise.resolve(p) });

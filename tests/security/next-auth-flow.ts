import { createRequire } from "node:module";
import { NextRequest } from "next/server";
import * as authRoute from "@/app/api/auth/[...nextauth]/route";

/**
 * next-auth's route handler reads the request's cookies and headers through next/headers, which
 * only works inside Next's own request scope. Tests call handlers directly, so the two functions
 * are pointed at the request being handled (set with `setCurrentRequest`).
 */
let current: NextRequest | null = null;
const nextHeaders = createRequire(import.meta.url)("next/headers") as Record<string, unknown>;
nextHeaders.cookies = async () => ({ getAll: () => current?.cookies.getAll() ?? [], get: (name: string) => current?.cookies.get(name), has: (name: string) => !!current?.cookies.has(name) });
nextHeaders.headers = async () => current?.headers ?? new Headers();

export function setCurrentRequest(req: NextRequest | null) {
  current = req;
}

/**
 * The browser's sign-in as next-auth's own client does it, against the real route handler:
 * fetch a CSRF token (and its cookie), then post the credentials form with both.
 */
export const ORIGIN = "http://localhost:3000";

export function authParams(...segments: string[]) {
  return { params: Promise.resolve({ nextauth: segments }) };
}

export async function csrf(): Promise<{ csrfToken: string; cookie: string }> {
  const req = new NextRequest(`${ORIGIN}/api/auth/csrf`, { headers: { host: "localhost:3000" } });
  setCurrentRequest(req);
  const res = await authRoute.GET(req, authParams("csrf"));
  const { csrfToken } = (await res.json()) as { csrfToken: string };
  const cookie = res.headers
    .getSetCookie()
    .map((c: string) => c.split(";")[0])
    .join("; ");
  return { csrfToken, cookie };
}

export async function signInRequest(email: string, password: string, headers: Record<string, string> = {}): Promise<NextRequest> {
  const { csrfToken, cookie } = await csrf();
  const body = new URLSearchParams({ csrfToken, email, password, json: "true", callbackUrl: `${ORIGIN}/` });
  return new NextRequest(`${ORIGIN}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { host: "localhost:3000", "content-type": "application/x-www-form-urlencoded", cookie, ...headers },
    body: body.toString(),
  });
}

/** Posts the sign-in form; returns the response (200 with a session cookie when it worked). */
export async function signIn(email: string, password: string, headers: Record<string, string> = {}): Promise<Response> {
  const req = await signInRequest(email, password, headers);
  setCurrentRequest(req);
  return authRoute.POST(req, authParams("callback", "credentials"));
}

/** The session cookie a response set, if any, with its attributes. */
export function sessionCookie(res: Response): string | undefined {
  return res.headers.getSetCookie().find((c: string) => /next-auth\.session-token=/.test(c));
}

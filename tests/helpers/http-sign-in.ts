import http from "node:http";

/**
 * Signing in to a running server over HTTP, as the sign-in form does: fetch a CSRF token from
 * next-auth, then post the e-mail and password to its credentials callback. Each request goes on
 * a new connection, so with several server workers consecutive requests reach different workers.
 * Used by the browser-test files that start their own server and by the load bench.
 */

type Reply = { status: number; setCookies: string[]; location: string | null; body: string };

function request(url: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: init.method ?? "GET", headers: init.headers, agent: false }, (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (chunk: string) => (body += chunk));
      res.on("end", () => {
        const setCookie = res.headers["set-cookie"] ?? [];
        resolve({ status: res.statusCode ?? 0, setCookies: setCookie, location: typeof res.headers.location === "string" ? res.headers.location : null, body });
      });
    });
    req.on("error", reject);
    req.end(init.body);
  });
}

export type SignInAttempt = {
  /** The Cookie header to send as the signed-in person ("" if the sign-in was refused). */
  cookie: string;
  /** next-auth's error code when refused: "CredentialsSignin" (wrong e-mail or password) or "RateLimited". */
  error: string | null;
};

export async function trySignIn(base: string, email: string, password: string): Promise<SignInAttempt> {
  const jar = new Map<string, string>();
  const keep = (reply: Reply) => {
    for (const c of reply.setCookies) {
      const [pair] = c.split(";");
      const i = pair!.indexOf("=");
      jar.set(pair!.slice(0, i), pair!.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await request(`${base}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = JSON.parse(csrf.body) as { csrfToken: string };
  const reply = await request(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie(), origin: base },
    body: new URLSearchParams({ csrfToken, email, password, json: "true", callbackUrl: `${base}/` }).toString(),
  });
  keep(reply);
  if ([...jar.keys()].some((k) => k.includes("session-token"))) return { cookie: cookie(), error: null };
  let error: string | null = `HTTP ${reply.status}`;
  const url = reply.location ?? (reply.body.startsWith("{") ? ((JSON.parse(reply.body) as { url?: string }).url ?? null) : null);
  if (url) error = new URL(url, base).searchParams.get("error") ?? error;
  return { cookie: "", error };
}

/** Signs in and returns the Cookie header to send; throws if the sign-in is refused. */
export async function signInOverHttp(base: string, email: string, password: string): Promise<string> {
  const attempt = await trySignIn(base, email, password);
  if (!attempt.cookie) throw new Error(`Could not sign in ${email}: ${attempt.error}`);
  return attempt.cookie;
}

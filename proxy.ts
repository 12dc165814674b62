import { NextResponse, type NextRequest } from "next/server";
import { contentSecurityPolicy } from "./lib/security-headers.mjs";

// Two jobs for pages. (1) Every page gets a Content-Security-Policy with a fresh nonce: Next
// reads it from the request and puts it on its own scripts, so no other script can run.
// (2) An early convenience only: send signed-out visitors to the sign-in page. Every page, route
// handler and server action checks the session and permissions itself.
const PUBLIC_PAGES = ["/", "/sign-in", "/forgot-password", "/reset-password", "/invitation"];
const SESSION_COOKIES = ["next-auth.session-token", "__Secure-next-auth.session-token"];

export function proxy(request: NextRequest) {
  const nonce = btoa(crypto.randomUUID());
  const csp = contentSecurityPolicy({ nonce });
  const { pathname, search } = request.nextUrl;
  let response: NextResponse;
  if (PUBLIC_PAGES.includes(pathname) || SESSION_COOKIES.some((name) => request.cookies.has(name))) {
    const headers = new Headers(request.headers);
    headers.set("content-security-policy", csp);
    response = NextResponse.next({ request: { headers } });
  } else {
    const url = request.nextUrl.clone();
    url.pathname = "/sign-in";
    url.search = `?callbackUrl=${encodeURIComponent(pathname + search)}`;
    response = NextResponse.redirect(url);
  }
  response.headers.set("content-security-policy", csp);
  return response;
}

export const config = {
  // Pages only: API routes answer 401 themselves (their policy is in next.config.mjs); static
  // files and images pass through.
  matcher: ["/((?!api/|_next/|favicon\\.ico|icon\\.svg|logo\\.svg|fonts/|.*\\.(?:png|jpg|jpeg|svg|webp|woff2?|txt|css|js)$).*)"],
};

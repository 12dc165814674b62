import { NextResponse, type NextRequest } from "next/server";

// An early convenience only: send signed-out visitors to the sign-in page. Every page, route
// handler and server action checks the session and permissions itself.
const PUBLIC_PAGES = ["/", "/sign-in", "/forgot-password", "/reset-password", "/invitation"];
const SESSION_COOKIES = ["next-auth.session-token", "__Secure-next-auth.session-token"];

export function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  if (PUBLIC_PAGES.includes(pathname)) return NextResponse.next();
  const hasSession = SESSION_COOKIES.some((name) => request.cookies.has(name));
  if (hasSession) return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = `?callbackUrl=${encodeURIComponent(pathname + search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  // Pages only: API routes answer 401 themselves; static files and images pass through.
  matcher: ["/((?!api/|_next/|favicon\\.ico|icon\\.svg|logo\\.svg|fonts/|.*\\.(?:png|jpg|jpeg|svg|webp|woff2?|txt|css|js)$).*)"],
};

import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { findUserForSignIn, loadActor, recordSignIn } from "@/db/queries/users";
import { signInSchema } from "@/lib/validation/users";
import { dummyHash, verifyPassword } from "./password";
import { assertSignInAllowed, clearSignInFailures, recordFailedSignIn } from "./rate-limit";
import { appUrl, isProductionDeployment } from "@/lib/config";
import { authSecret } from "./secret";

/** Error codes the sign-in page turns into messages. */
export const SIGN_IN_ERRORS = {
  invalid: "CredentialsSignin",
  rateLimited: "RateLimited",
} as const;

function clientIp(headers: Record<string, unknown> | undefined): string {
  const fwd = headers?.["x-forwarded-for"];
  const first = typeof fwd === "string" ? fwd.split(",")[0]!.trim() : "";
  return first || String(headers?.["x-real-ip"] ?? "local");
}

/**
 * Session cookies are Secure (sent only over HTTPS, with the __Secure- name prefix) on a real
 * deployment or whenever the app's address is https; always httpOnly and SameSite=Lax.
 */
export function secureCookies(): boolean {
  return isProductionDeployment() || appUrl().startsWith("https://");
}

export const SESSION_COOKIE = { plain: "next-auth.session-token", secure: "__Secure-next-auth.session-token" } as const;

let options: NextAuthOptions | undefined;

export function authOptions(): NextAuthOptions {
  if (options) return options;
  options = {
    secret: authSecret(),
    session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
    useSecureCookies: secureCookies(),
    cookies: {
      sessionToken: {
        name: secureCookies() ? SESSION_COOKIE.secure : SESSION_COOKIE.plain,
        options: { httpOnly: true, sameSite: "lax", path: "/", secure: secureCookies() },
      },
    },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "E-mail and password",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        async authorize(credentials, req) {
          const parsed = signInSchema.safeParse(credentials);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          const ip = clientIp(req?.headers as Record<string, unknown> | undefined);
          try {
            await assertSignInAllowed(email, ip);
          } catch {
            throw new Error(SIGN_IN_ERRORS.rateLimited);
          }
          const user = findUserForSignIn(email);
          const ok = user ? await verifyPassword(user.passwordHash, password) : (await verifyPassword(await dummyHash(), password), false);
          if (!user || !ok || !user.active) {
            await recordFailedSignIn(email, ip);
            return null;
          }
          await clearSignInFailures(email);
          recordSignIn(user.id);
          return { id: user.id, name: user.name, email: user.email };
        },
      }),
    ],
    callbacks: {
      // Runs at sign-in and whenever next-auth's own session endpoint is asked; pages, route
      // handlers and actions read the cookie through lib/auth/session.ts and load the person
      // fresh from the database themselves.
      async jwt({ token, user }) {
        if (user) {
          token.sub = user.id;
          const actor = loadActor(user.id);
          if (actor) {
            token.roles = [...actor.roles];
            token.schoolId = actor.schoolId;
            token.name = actor.name;
          }
        }
        return token;
      },
      async session({ session, token }) {
        if (session.user && token.sub) {
          session.user.id = token.sub;
          session.user.roles = (token.roles as string[] | undefined) ?? [];
          session.user.schoolId = (token.schoolId as string | undefined) ?? "";
        }
        return session;
      },
    },
  };
  return options;
}

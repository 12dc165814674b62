import "server-only";
import { cache } from "react";
import { forbidden as forbiddenPage, redirect } from "next/navigation";
import { loadActor } from "@/db/queries/users";
import type { Role } from "@/lib/roles";
import { AppError, unauthorized } from "@/lib/errors";
import { hasRole, type Actor } from "./actor";
import { sessionUserId } from "./session";

/**
 * The signed-in person for this request, loaded fresh from the database (so a deactivated
 * account or a removed role takes effect at once), or null. Cached per request.
 */
export const currentActor = cache(async (): Promise<Actor | null> => {
  const id = await sessionUserId();
  return id ? loadActor(id) : null;
});

/** Pages: the signed-in person, or a redirect to the sign-in page. */
export async function requirePageUser(returnTo?: string): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) redirect(returnTo ? `/sign-in?callbackUrl=${encodeURIComponent(returnTo)}` : "/sign-in");
  return actor;
}

/** Pages: the signed-in person holding one of the roles, or the 403 page. */
export async function requirePageRole(roles: Role[], returnTo?: string): Promise<Actor> {
  const actor = await requirePageUser(returnTo);
  if (!hasRole(actor, ...roles)) forbiddenPage();
  return actor;
}

/** Route handlers and server actions: the signed-in person, or a 401 error. */
export async function requireApiUser(): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) throw unauthorized();
  return actor;
}

/** Route handlers and server actions: the signed-in person holding one of the roles, or a 403 error. */
export async function requireApiRole(...roles: Role[]): Promise<Actor> {
  const actor = await requireApiUser();
  if (!hasRole(actor, ...roles)) throw new AppError("forbidden", "Your role does not allow this.");
  return actor;
}

import "server-only";
import type { getUserDetail } from "@/db/queries/users";

type Detail = ReturnType<typeof getUserDetail>;

/** Where a person's invitation stands, as the admin screens show it. */
export function invitationState(person: Pick<Detail, "hasPassword" | "lastInvitation">, now = new Date()) {
  if (person.hasPassword) return { state: "set-up" as const, expiresAt: null, sentAt: person.lastInvitation?.createdAt ?? null };
  const last = person.lastInvitation;
  if (!last) return { state: "not-invited" as const, expiresAt: null, sentAt: null };
  if (last.expiresAt.getTime() > now.getTime() && !last.usedAt) return { state: "invited" as const, expiresAt: last.expiresAt, sentAt: last.createdAt };
  return { state: "expired" as const, expiresAt: last.expiresAt, sentAt: last.createdAt };
}

/** The person as the admin page receives them: chosen fields only, never a password or token hash. */
export function personJson(person: Detail) {
  return {
    id: person.id,
    name: person.name,
    email: person.email,
    roles: person.roles,
    active: person.active,
    yearGroup: person.yearGroup,
    emailNotifications: person.emailNotifications,
    lastSignInAt: person.lastSignInAt,
    createdAt: person.createdAt,
    invitation: invitationState(person),
    teaches: person.teaches,
    studiesIn: person.studiesIn,
    children: person.children,
    guardians: person.guardians,
  };
}

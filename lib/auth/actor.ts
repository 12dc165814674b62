import type { Role } from "@/lib/roles";

/** The signed-in person a request acts for, loaded fresh from the database on every request. */
export type Actor = {
  userId: string;
  schoolId: string;
  roles: readonly Role[];
  name: string;
  email: string;
};

export function hasRole(actor: Actor, ...roles: Role[]): boolean {
  return roles.some((r) => actor.roles.includes(r));
}

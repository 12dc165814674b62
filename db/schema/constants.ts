export { ROLES, ROLE_LABELS, type Role } from "@/lib/roles";

export const INVITATION_KINDS = ["invitation", "password-reset"] as const;
export type InvitationKind = (typeof INVITATION_KINDS)[number];

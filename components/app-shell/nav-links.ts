import type { Role } from "@/lib/roles";

export type NavLink = { href: string; label: string; roles: Role[] };

/** The main menu; each person sees the links their roles use. */
export const NAV_LINKS: NavLink[] = [
  { href: "/", label: "Home", roles: ["admin", "teacher", "student", "moderator", "parent"] },
  { href: "/classes", label: "Classes", roles: ["teacher", "student"] },
  { href: "/practicals", label: "Practicals", roles: ["teacher", "admin", "moderator"] },
  { href: "/lab-sessions", label: "Lab sessions", roles: ["teacher", "student", "admin"] },
  { href: "/marking", label: "Marking", roles: ["teacher"] },
  { href: "/moderation", label: "Moderation", roles: ["moderator", "admin"] },
  { href: "/progress", label: "Progress", roles: ["student"] },
  { href: "/progress/classes", label: "Progress", roles: ["teacher", "admin"] },
  { href: "/rubrics", label: "Rubrics", roles: ["teacher"] },
  { href: "/tools", label: "Calculators", roles: ["teacher"] },
  { href: "/admin/people", label: "People", roles: ["admin"] },
  { href: "/admin/classes", label: "All classes", roles: ["admin"] },
  { href: "/admin/outbox", label: "Outbox", roles: ["admin"] },
  { href: "/admin/audit", label: "Audit trail", roles: ["admin"] },
];

export function linksFor(roles: readonly Role[]): NavLink[] {
  return NAV_LINKS.filter((l) => l.roles.some((r) => roles.includes(r)));
}

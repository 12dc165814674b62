/** Roles a person may hold in a school. One person may hold several. */
export const ROLES = ["admin", "teacher", "student", "moderator", "parent"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin",
  teacher: "Teacher",
  student: "Student",
  moderator: "Moderator",
  parent: "Parent or guardian",
};

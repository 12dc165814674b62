/** A group of students sharing one set of results in a lab session. */
export type LabGroupDraft = { id: string; name: string; studentIds: string[] };

export const MIN_GROUP_SIZE = 2;
export const MAX_GROUP_SIZE = 4;

/**
 * Splits students, in the order given, into groups of about `size`: as many groups as a class
 * of that size needs, with sizes differing by at most one, so nobody is left on their own
 * (7 students make 3 + 2 + 2, never 3 + 3 + 1).
 */
export function makeGroups(studentIds: readonly string[], size = 3): LabGroupDraft[] {
  if (!Number.isInteger(size) || size < 1) throw new Error("Group size must be a whole number, at least 1.");
  const n = studentIds.length;
  if (n === 0) return [];
  const count = Math.ceil(n / size);
  const base = Math.floor(n / count);
  const bigger = n % count;
  const out: LabGroupDraft[] = [];
  let at = 0;
  for (let g = 0; g < count; g++) {
    const take = base + (g < bigger ? 1 : 0);
    out.push({ id: `g${g + 1}`, name: `Group ${g + 1}`, studentIds: studentIds.slice(at, at + take) });
    at += take;
  }
  return out;
}

/** A fresh id for a new group that does not clash with the ones already made. */
export function nextGroupId(groups: readonly LabGroupDraft[]): string {
  const used = new Set(groups.map((g) => g.id));
  let i = groups.length + 1;
  while (used.has(`g${i}`)) i++;
  return `g${i}`;
}

/** A name for a new group, "Group N", that no other group has. */
export function nextGroupName(groups: readonly LabGroupDraft[]): string {
  const used = new Set(groups.map((g) => g.name.trim().toLowerCase()));
  let i = groups.length + 1;
  while (used.has(`group ${i}`)) i++;
  return `Group ${i}`;
}

/** Moves one student into a group (or out of every group when `groupId` is null). */
export function assignStudent(groups: readonly LabGroupDraft[], studentId: string, groupId: string | null): LabGroupDraft[] {
  return groups.map((g) => {
    const without = g.studentIds.filter((id) => id !== studentId);
    return g.id === groupId ? { ...g, studentIds: [...without, studentId] } : without.length === g.studentIds.length ? g : { ...g, studentIds: without };
  });
}

/**
 * What is wrong with the groups before they are sent: a message per group (keyed as the server
 * keys them, `groups.0.studentIds`) for groups outside 2–4 students or with a blank name, and the
 * students in the class who are in no group.
 */
export function groupProblems(groups: readonly LabGroupDraft[], rosterIds: readonly string[]): { errors: Record<string, string>; unassigned: string[] } {
  const errors: Record<string, string> = {};
  if (groups.length === 0) errors.groups = "Make at least one group, or choose individual data.";
  groups.forEach((g, i) => {
    if (!g.name.trim()) errors[`groups.${i}.name`] = "Name the group.";
    if (g.studentIds.length < MIN_GROUP_SIZE) {
      errors[`groups.${i}.studentIds`] = g.studentIds.length === 0 ? "This group is empty: put 2 to 4 students in it, or remove it." : "Put at least 2 students in this group, or remove it.";
    } else if (g.studentIds.length > MAX_GROUP_SIZE) errors[`groups.${i}.studentIds`] = `At most ${MAX_GROUP_SIZE} students in a group: move ${g.studentIds.length - MAX_GROUP_SIZE} to another group.`;
  });
  const placed = new Set(groups.flatMap((g) => g.studentIds));
  return { errors, unassigned: rosterIds.filter((id) => !placed.has(id)) };
}

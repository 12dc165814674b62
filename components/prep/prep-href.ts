/** The usual number of working groups for a class: threes, rounded up (common practice). */
export function defaultGroupCount(studentCount: number): number {
  return Math.max(1, Math.ceil(studentCount / 3));
}

/** A link to a practical's prep list, set up for one class, number of groups and date. */
export function prepListHref({ practicalId, versionId, classId, groups, date }: { practicalId: string; versionId?: string; classId?: string; groups?: number; date?: string }): string {
  const q = new URLSearchParams();
  if (versionId) q.set("version", versionId);
  if (classId) q.set("class", classId);
  if (groups) q.set("groups", String(groups));
  if (date) q.set("date", date);
  const s = q.toString();
  return `/practicals/${encodeURIComponent(practicalId)}/prep${s ? `?${s}` : ""}`;
}

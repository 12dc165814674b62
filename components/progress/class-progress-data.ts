import type { ClassProgressRow } from "./types";

export type ClassFilter = "all" | "missing" | "struggling" | "below-half";
export type ClassSort = "name" | "average-low" | "average-high" | "handed-in";

export const FILTER_LABELS: Record<ClassFilter, string> = {
  all: "Everyone",
  missing: "Work not handed in",
  struggling: "Finding a calculation hard",
  "below-half": "Average mark below 50%",
};

export const SORT_LABELS: Record<ClassSort, string> = {
  name: "Name (A to Z)",
  "average-low": "Average mark (lowest first)",
  "average-high": "Average mark (highest first)",
  "handed-in": "Handed in (fewest first)",
};

/**
 * The rows a teacher asked for: matching the name search (any part of the name, ignoring case
 * and accents), the filter, in the chosen order. Students with no marked work yet (no average)
 * come last in either average order, since there is nothing to compare.
 */
export function selectRows(rows: readonly ClassProgressRow[], { search = "", filter = "all", sort = "name" }: { search?: string; filter?: ClassFilter; sort?: ClassSort }): ClassProgressRow[] {
  const fold = (s: string) => s.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();
  const needle = fold(search.trim());
  const kept = rows.filter((r) => {
    if (needle && !fold(r.name).includes(needle)) return false;
    if (filter === "missing") return r.notHandedIn.length > 0;
    if (filter === "struggling") return r.struggling.length > 0;
    if (filter === "below-half") return r.averagePercent != null && r.averagePercent < 50;
    return true;
  });
  const byName = (a: ClassProgressRow, b: ClassProgressRow) => a.name.localeCompare(b.name, "en-GB");
  const byAverage = (dir: 1 | -1) => (a: ClassProgressRow, b: ClassProgressRow) => {
    if (a.averagePercent == null || b.averagePercent == null) return (a.averagePercent == null ? 1 : 0) - (b.averagePercent == null ? 1 : 0) || byName(a, b);
    return dir * (a.averagePercent - b.averagePercent) || byName(a, b);
  };
  const order = sort === "average-low" ? byAverage(1) : sort === "average-high" ? byAverage(-1) : sort === "handed-in" ? (a: ClassProgressRow, b: ClassProgressRow) => a.handedIn - a.due - (b.handedIn - b.due) || byName(a, b) : byName;
  return [...kept].sort(order);
}

/** Class-wide figures: the mean of the students' averages, how many have work missing, and the slip that is most students' most common one. */
export function classSummary(rows: readonly ClassProgressRow[]): { averagePercent: number | null; withMissing: number; struggling: number; commonSlip: { message: string; students: number } | null } {
  const averages = rows.map((r) => r.averagePercent).filter((a): a is number => a != null);
  const slips = new Map<string, number>();
  for (const r of rows) if (r.commonSlip) slips.set(r.commonSlip, (slips.get(r.commonSlip) ?? 0) + 1);
  const top = [...slips.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))[0];
  return {
    averagePercent: averages.length ? averages.reduce((s, a) => s + a, 0) / averages.length : null,
    withMissing: rows.filter((r) => r.notHandedIn.length > 0).length,
    struggling: rows.filter((r) => r.struggling.length > 0).length,
    commonSlip: top ? { message: top[0], students: top[1] } : null,
  };
}

/** For each lab session past its due date: who has not handed in (by name). */
export function missingBySession<S extends { title: string }>(sessions: readonly S[], rows: readonly ClassProgressRow[]): (S & { missing: string[] })[] {
  return sessions.map((s) => ({ ...s, missing: rows.filter((r) => r.notHandedIn.includes(s.title)).map((r) => r.name) }));
}

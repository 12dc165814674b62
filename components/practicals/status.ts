/** How far a practical has got, in the words of the library: "Published v2 · draft v3 open". */
export function practicalStatusParts(p: { latestVersion: number; latestStatus: "draft" | "published"; publishedVersion: number | null }): { label: string; tone: "good" | "warn" | "neutral" }[] {
  const out: { label: string; tone: "good" | "warn" | "neutral" }[] = [];
  if (p.publishedVersion != null) out.push({ label: `Published v${p.publishedVersion}`, tone: "good" });
  if (p.latestStatus === "draft") out.push({ label: p.publishedVersion != null ? `Draft v${p.latestVersion} in progress` : `Draft v${p.latestVersion}`, tone: p.publishedVersion != null ? "neutral" : "warn" });
  return out;
}

export function sessionsLabel(n: number): string {
  if (n === 0) return "Not used by any lab session yet";
  return `Used by ${n} lab session${n === 1 ? "" : "s"}`;
}

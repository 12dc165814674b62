import type { TableRows } from "@/lib/checks/types";
import type { FilledTable } from "@/lib/validation/write-ups";

/**
 * The rows a check reads: the student's typed cells, with readings they chose to leave out
 * (a decision with include: false) turned into blanks, so the check follows their decision.
 */
export function rowsForCheck(t: FilledTable | undefined): TableRows {
  const rows: TableRows = (t?.rows ?? []).map((r) => ({ ...r }));
  for (const [key, d] of Object.entries(t?.decisions ?? {})) {
    if (d.include) continue;
    const [row, col] = key.split(":");
    const r = rows[Number(row)];
    if (r && col) r[col] = null;
  }
  return rows;
}

/** Readings the student chose to keep in against the anomaly rule (with a reason), as "row:column". */
export function keptInReadings(t: FilledTable | undefined): Set<string> {
  return new Set(Object.entries(t?.decisions ?? {}).filter(([, d]) => d.include).map(([k]) => k));
}

import type { CheckSpec } from "@/lib/validation/practicals";
import type { FilledTable, StoredAnswer } from "@/lib/validation/write-ups";

/** JSON with object keys sorted, so equal data always give equal text. */
export function stableStringify(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableStringify(v)}`).join(",")}}`;
}

/** FNV-1a 32-bit hash as hex: small, fast, the same in the browser and on the server. */
export function fingerprint(value: unknown): string {
  const text = stableStringify(value);
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0).toString(16).padStart(8, "0");
}

/** The part of a student's data a check depends on: its table's rows and reading decisions. */
export function checkDataFingerprint(spec: Pick<CheckSpec, "tableId">, tables: Record<string, FilledTable | undefined>): string {
  const t = tables[spec.tableId];
  return fingerprint({ rows: t?.rows ?? [], decisions: t?.decisions ?? {} });
}

/** The part of an answer a check depends on (working is for the teacher, not the check). */
export function answerFingerprint(answer: Pick<StoredAnswer, "value" | "unit" | "tangent"> | undefined): string {
  return fingerprint({ value: answer?.value?.trim() ?? "", unit: answer?.unit?.trim() ?? "", tangent: answer?.tangent ?? null });
}

/**
 * A check result goes stale when the data or the answer it was run on has changed since:
 * the student sees that the verdict no longer describes their work until it runs again.
 */
export function isStale(stored: { dataHash: string; answerHash: string } | undefined, current: { dataHash: string; answerHash: string }): boolean {
  if (!stored) return false;
  return stored.dataHash !== current.dataHash || stored.answerHash !== current.answerHash;
}

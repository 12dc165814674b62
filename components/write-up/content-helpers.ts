import type { TableTemplate } from "@/lib/validation/practicals";
import type { RichTextDoc } from "@/lib/validation/rich-text";
import type { FilledTable, GroupTables, WriteUpContent } from "@/lib/validation/write-ups";
import { stableStringify } from "@/lib/write-ups/stale";

const isRecord = (v: unknown): v is Record<string, unknown> => !!v && typeof v === "object" && !Array.isArray(v);

/** A light check of a write-up's content read back from this device (the server checks it fully on save). */
export function isWriteUpContent(v: unknown): v is WriteUpContent {
  return isRecord(v) && isRecord(v.sections) && isRecord(v.tables) && isRecord(v.graphs) && isRecord(v.answers);
}

/** A light check of a group's tables read back from this device. */
export function isGroupTables(v: unknown): v is GroupTables {
  return isRecord(v) && Object.values(v).every((t) => isRecord(t) && Array.isArray(t.rows));
}

export const EMPTY_TABLE: FilledTable = { rows: [], decisions: {} };

/** A document with no words, formulas or structure: what a new editor holds. */
export function isEmptyDoc(doc: RichTextDoc | null | undefined): boolean {
  const nodes = doc?.content ?? [];
  return nodes.every((n) => n.type === "paragraph" && !(n.content?.length));
}

/**
 * Whether two documents hold the same thing. An editor turns an empty stored document into one
 * empty paragraph when it opens; that is not a change worth saving.
 */
export function sameDoc(a: RichTextDoc | null | undefined, b: RichTextDoc | null | undefined): boolean {
  if (isEmptyDoc(a) && isEmptyDoc(b)) return true;
  return stableStringify(a ?? null) === stableStringify(b ?? null);
}

/** Whether a table row has any reading the student typed (the teacher's preset values do not count). */
export function rowHasReading(template: Pick<TableTemplate, "presetRows"> | undefined, t: FilledTable | undefined, index: number): boolean {
  const r = t?.rows?.[index];
  if (!r) return false;
  const preset = template?.presetRows[index] ?? {};
  return Object.entries(r).some(([col, v]) => typeof preset[col] !== "number" && v !== null && !(typeof v === "string" && !v.trim()));
}

import { parseTypedNumber } from "@/lib/marking";
import type { Tangent } from "@/lib/write-ups/graph-data";

/** The tangent's five numbers as typed in their boxes. */
export type TangentDraft = { at: string; x1: string; y1: string; x2: string; y2: string };
export const DRAFT_FIELDS = ["at", "x1", "y1", "x2", "y2"] as const;

/** A typed coordinate as a number: null when blank or not a plain number. */
export function draftNumber(text: string): number | null {
  if (!text.trim()) return null;
  try {
    const typed = parseTypedNumber(text);
    return typed.trailingText === "" && Number.isFinite(typed.value) ? typed.value : null;
  } catch {
    return null;
  }
}

export function toDraft(t: Tangent | null, at?: number): TangentDraft {
  if (!t) return { at: at !== undefined && Number.isFinite(at) ? String(at) : "", x1: "", y1: "", x2: "", y2: "" };
  return { at: String(t.at), x1: String(t.x1), y1: String(t.y1), x2: String(t.x2), y2: String(t.y2) };
}

/** The tangent a draft describes, or null until all five numbers are there and the points differ in x. */
export function fromDraft(d: TangentDraft): Tangent | null {
  const [at, x1, y1, x2, y2] = DRAFT_FIELDS.map((f) => draftNumber(d[f]));
  if (at == null || x1 == null || y1 == null || x2 == null || y2 == null || x1 === x2) return null;
  return { at, x1, y1, x2, y2 };
}

export function sameTangent(a: Tangent | null, b: Tangent | null): boolean {
  if (a === b) return true;
  if (!a || !b) return false;
  return a.at === b.at && a.x1 === b.x1 && a.y1 === b.y1 && a.x2 === b.x2 && a.y2 === b.y2;
}

/** A value read off the graph, rounded to a step that suits the axis (about a thousandth of its span). */
export function roundToAxis(value: number, span: number): number {
  if (!Number.isFinite(value)) return value;
  if (!(span > 0)) return value;
  const step = 10 ** (Math.floor(Math.log10(span)) - 2);
  return Number((Math.round(value / step) * step).toPrecision(12));
}

import type { RichTextDoc } from "@/lib/validation/rich-text";

/**
 * Readings of one results table: one object per row, keyed by column id. A cell is the text the
 * student typed (so decimal places and significant figures survive), a number, or null/"" when blank.
 */
export type TableRows = Record<string, string | number | null>[];

/** What a student types for one calculation check. */
export type CheckAnswer = {
  /** The number exactly as typed ("0.0450", "1.2e-3"): significant figures are counted from it. */
  value: string;
  unit: string;
  working?: RichTextDoc | null;
  /** For tangent checks: the two points of the student's drawn line, in the graph's units. */
  tangent?: { x1: number; y1: number; x2: number; y2: number } | null;
  /** Per-row checks (1/t, mean of repeats) read the student's own answer column instead. */
};

export type Verdict = "agrees" | "close" | "disagrees" | "cannot-check";

export const VERDICT_LABELS: Record<Verdict, string> = {
  agrees: "Agrees",
  close: "Close",
  disagrees: "Does not agree",
  "cannot-check": "Cannot check yet",
};

/** The full result of one check, as the teacher sees it. */
export type CheckOutcome = {
  checkId: string;
  verdict: Verdict;
  /** One plain sentence for the student, never containing the expected number. */
  hint: string;
  /** The whole reason, for the teacher (may mention the expected value). */
  reason: string;
  expected: { value: number; unit: string; uncertainty: number | null; method: string } | null;
  deviationPercent: number | null;
  sigFigs: { typed: number | null; ok: boolean | null; message: string | null };
  unit: { ok: boolean | null; message: string | null };
  likelySlip: { code: string; message: string } | null;
  tangent: { touches: boolean; message: string } | null;
  /** Per-row checks: the verdict for each row the student filled. */
  rows: { index: number; verdict: Verdict; expected: number | null; typed: number | null }[] | null;
};

/** What the student is allowed to see of an outcome, according to the teacher's setting. */
export type StudentCheckView = {
  checkId: string;
  verdict: Verdict;
  hint: string | null;
  expected: { value: number; unit: string } | null;
  rows: { index: number; verdict: Verdict }[] | null;
};

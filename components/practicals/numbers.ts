/**
 * Reading numbers typed by a teacher. Blank means "no value" (null); anything that is not a
 * number gives NaN, which the practical's schema refuses with a message at the field, so what was
 * typed stays on screen until it is corrected.
 */
export function parseTypedNumber(text: string): number | null {
  const t = normaliseNumberText(text);
  if (t === "") return null;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return Number.NaN;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/**
 * A typed number in the plain form every reader accepts, keeping its digits (so significant
 * figures and decimal places survive): typographic minus signs become "-", spaces go, and
 * "2.5×10^-3" becomes "2.5e-3".
 */
export function normaliseNumberText(text: string): string {
  return text
    .trim()
    .replace(/[\u2212\u2012\u2013]/g, "-")
    .replace(/\s+/g, "")
    .replace(/[×x]10\^?(-?\d+)$/i, "e$1");
}

/** Whether a typed text already stands for this value (so the field need not be rewritten). */
export function textMatchesValue(text: string, value: number | null | undefined): boolean {
  const parsed = parseTypedNumber(text);
  if (value == null) return parsed === null;
  if (Number.isNaN(value)) return parsed !== null && Number.isNaN(parsed);
  return parsed === value;
}

/** A stored value as the field shows it. */
export function formatStoredNumber(value: number | null | undefined): string {
  if (value == null || Number.isNaN(value)) return "";
  return String(value);
}

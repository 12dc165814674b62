import { MarkingInputError, parseTypedNumber } from "@/lib/marking";

export type ReadNumber = { ok: true; value: number } | { ok: false; message: string };

/**
 * A quantity typed into a calculator: blank, unreadable, with a unit typed in, zero or negative
 * are refused with a message for the field. `what` names it in the message ("the stock
 * concentration").
 */
export function readPositive(typed: string, what: string): ReadNumber {
  const text = typed.trim();
  if (!text) return { ok: false, message: `Enter ${what}.` };
  let value: number;
  try {
    const parsed = parseTypedNumber(text);
    if (parsed.trailingText.trim()) return { ok: false, message: "Type only the number here; the unit is chosen from the list." };
    value = parsed.value;
  } catch (e) {
    if (e instanceof MarkingInputError) return { ok: false, message: e.message };
    throw e;
  }
  if (!Number.isFinite(value)) return { ok: false, message: `Enter ${what} as a number.` };
  if (value <= 0) return { ok: false, message: `${what.charAt(0).toUpperCase()}${what.slice(1)} must be more than zero.` };
  return { ok: true, value };
}

/** A calculated quantity to three significant figures, or to the unit for 1000 and above. */
export function formatResult(value: number): string {
  if (Math.abs(value) >= 1000) return new Intl.NumberFormat("en-GB", { maximumFractionDigits: 0, useGrouping: false }).format(value);
  return new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3, useGrouping: false }).format(value);
}

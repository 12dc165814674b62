import type { ColumnTemplate } from "@/lib/validation/practicals";

/** Units a teacher reaches for most, offered as suggestions (any unit may be typed). */
export const COMMON_UNITS = ["s", "min", "cm³", "dm³", "g", "mol/dm³", "°C", "K", "s⁻¹", "cm³/s", "g/s", "V", "A", "Ω", "m/s"] as const;

/**
 * A column header as the recording convention writes it: "quantity / unit", or the quantity
 * alone when it has no unit (a count, a ratio).
 */
export function columnHeader(col: Pick<ColumnTemplate, "quantity" | "unit">): string {
  const quantity = col.quantity.trim() || "(unnamed quantity)";
  const unit = col.unit.trim();
  return unit ? `${quantity} / ${unit}` : quantity;
}

/** The unit of a rate or gradient of y against x, as a suggestion ("cm³/s"). */
export function ratioUnit(yUnit: string, xUnit: string): string {
  const y = yUnit.trim();
  const x = xUnit.trim();
  if (!y && !x) return "";
  if (!x) return y;
  if (!y) return x === "s" ? "s⁻¹" : `1/${x}`;
  return `${y}/${x}`;
}

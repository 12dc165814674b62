import { clsx, type ClassValue } from "clsx";
import { twMerge } from "tailwind-merge";

export function cn(...inputs: ClassValue[]) {
  return twMerge(clsx(inputs));
}

/** Dates as a teacher writes them: 3 Dec 2026, 14:05 (UK style, the school's time zone). */
export function formatDateTime(d: Date | string | number | null | undefined): string {
  if (d == null) return "—";
  return new Date(d).toLocaleString("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
}

export function formatDate(d: Date | string | number | null | undefined): string {
  if (d == null) return "—";
  return new Date(d).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" });
}

import { clsx, type ClassValue } from "clsx";
import { twMerge } from "tailwind-merge";

export function cn(...inputs: ClassValue[]) {
  return twMerge(clsx(inputs));
}

// Made once: `toLocaleString` with options builds a new formatter on every call, which a page
// listing many dates pays for again and again.
const dateTimeFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric" });

/** Dates as a teacher writes them: 3 Dec 2026, 14:05 (UK style, the school's time zone). */
export function formatDateTime(d: Date | string | number | null | undefined): string {
  const date = d == null ? null : new Date(d);
  return date && !Number.isNaN(date.getTime()) ? dateTimeFormat.format(date) : "—";
}

export function formatDate(d: Date | string | number | null | undefined): string {
  const date = d == null ? null : new Date(d);
  return date && !Number.isNaN(date.getTime()) ? dateFormat.format(date) : "—";
}

import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError } from "@/lib/fetch-json";

/**
 * Puts each field message from a refused request beside its field, and returns what is left to
 * show above the form (the general message, or messages for fields the form does not have).
 */
export function showServerErrors<T extends FieldValues>(error: unknown, fields: readonly Path<T>[], setError: UseFormSetError<T>): string | null {
  if (!(error instanceof ApiError)) return "Something went wrong. Please try again.";
  const fieldErrors = error.fieldErrors;
  let placed = 0;
  const leftover: string[] = [];
  for (const [key, messages] of Object.entries(fieldErrors)) {
    const field = fields.find((f) => key === f || key.startsWith(`${f}.`));
    if (field) {
      setError(field, { type: "server", message: messages.join(" ") }, { shouldFocus: placed === 0 });
      placed++;
    } else leftover.push(...messages);
  }
  if (placed === 0) return error.message;
  return leftover.length ? leftover.join(" ") : null;
}

import { get, type FieldErrors } from "react-hook-form";

/**
 * The message for a field in react-hook-form's nested errors. A list with both its own message
 * and messages for its items keeps its own under `root`, so that is looked at too.
 */
export function messageAt(errors: FieldErrors, key: string): string | undefined {
  const at = get(errors, key) as { message?: unknown; root?: { message?: unknown } } | undefined;
  const m = at?.message ?? at?.root?.message;
  return typeof m === "string" ? m : undefined;
}

/** Every message in nested errors with its dotted field key, in the order the form lists them. */
export function flattenErrors(errors: FieldErrors, prefix = ""): [string, string][] {
  const out: [string, string][] = [];
  for (const [key, value] of Object.entries(errors)) {
    if (!value || typeof value !== "object" || key === "ref") continue;
    const path = key === "root" ? prefix : prefix ? `${prefix}.${key}` : key;
    const message = (value as { message?: unknown }).message;
    if (typeof message === "string") out.push([path, message]);
    else out.push(...flattenErrors(value as FieldErrors, path));
  }
  return out;
}

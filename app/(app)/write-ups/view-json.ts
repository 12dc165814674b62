import "server-only";
import type { WriteUpViewJson } from "@/components/write-up/types";
import type { WriteUpView } from "@/db/queries/write-ups";

/** A value as it comes out of JSON: dates become ISO text, everything else keeps its shape. */
type Jsonified<T> = T extends Date ? string : T extends readonly (infer U)[] ? Jsonified<U>[] : T extends object ? { [K in keyof T]: Jsonified<T[K]> } : T;

/**
 * The write-up view as the browser receives it from the route handlers, so a page that loads it
 * on the server hands its client components exactly the same shape. The assignment below fails
 * to compile if the data layer's view and the components' type drift apart.
 */
export function toViewJson(view: WriteUpView): WriteUpViewJson {
  const json: Jsonified<WriteUpView> = JSON.parse(JSON.stringify(view));
  return json;
}

/** "Tue 8 Dec 2026, 16:00", in the school's time (the server's). */
export function formatWhen(d: Date | string): string {
  return new Date(d).toLocaleString("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
}

import "server-only";
import { forbidden, notFound } from "next/navigation";
import { AppError } from "@/lib/errors";

/** Runs a data-access call for a page, turning "not found" and "not allowed" into those pages. */
export function orPageError<T>(fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof AppError && e.code === "not_found") notFound();
    if (e instanceof AppError && e.code === "forbidden") forbidden();
    throw e;
  }
}

/** A value as it comes out of JSON: dates become ISO text, everything else keeps its shape. */
export type Jsonified<T> = T extends Date ? string : T extends readonly (infer U)[] ? Jsonified<U>[] : T extends object ? { [K in keyof T]: Jsonified<T[K]> } : T;

/**
 * Data loaded on the server, shaped exactly as the route handlers send it to the browser, so a
 * client component can start from it and refresh from the API without a second shape.
 */
export function asJson<T>(value: T): Jsonified<T> {
  return JSON.parse(JSON.stringify(value)) as Jsonified<T>;
}

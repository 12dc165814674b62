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

"use client";

import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/fetch-json";

/** Shown while a first load is on its way. */
export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <p className="py-6 text-muted" role="status" aria-live="polite">
      {label}
    </p>
  );
}

/** A failed load, with the server's message and a way to try again. */
export function LoadError({ error, onRetry, what = "this" }: { error: unknown; onRetry?: () => void; what?: string }) {
  const message = error instanceof ApiError ? error.message : `Meniscus could not load ${what}. Check your connection and try again.`;
  const gone = error instanceof ApiError && error.status === 404;
  return (
    <Alert tone="bad" title={gone ? "Not found" : `Could not load ${what}`}>
      <p>{message}</p>
      {onRetry && !gone ? (
        <Button variant="secondary" size="sm" className="mt-2" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </Alert>
  );
}

/** The message of any error from fetchJson, for an alert. */
export function errorMessage(error: unknown): string {
  return error instanceof ApiError ? error.message : "Something went wrong. Please try again.";
}

import type { SaveStatusKind } from "@/lib/write-ups/autosave";
import { cn } from "@/lib/utils";

const TONE: Record<SaveStatusKind, string> = {
  saved: "text-good",
  pending: "text-muted",
  saving: "text-brand",
  offline: "text-warn",
  error: "text-bad",
  conflict: "text-bad",
  locked: "text-bad",
  closed: "text-bad",
};

/** A small shape for each save state, so the state reads without colour. */
export function SaveStatusIcon({ kind }: { kind: SaveStatusKind }) {
  const common = { fill: "none", stroke: "currentColor", strokeWidth: 2, strokeLinecap: "round" as const, strokeLinejoin: "round" as const };
  return (
    <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="shrink-0">
      {kind === "saved" ? (
        <path d="M4 10.5 8 14.5 16 6" {...common} />
      ) : kind === "pending" ? (
        <>
          <circle cx="10" cy="10" r="7.5" {...common} />
          <path d="M10 5.5V10l3 2" {...common} />
        </>
      ) : kind === "saving" ? (
        <path d="M10 2.5a7.5 7.5 0 1 1-7.5 7.5" {...common} />
      ) : kind === "offline" ? (
        <>
          <path d="M2.5 8a11 11 0 0 1 15 0M5.3 11a7 7 0 0 1 9.4 0M8 14a3 3 0 0 1 4 0" {...common} />
          <path d="M3 3l14 14" {...common} />
        </>
      ) : kind === "locked" || kind === "closed" ? (
        <>
          <rect x="4" y="9" width="12" height="8.5" rx="1.5" {...common} />
          <path d="M7 9V6.5a3 3 0 0 1 6 0V9" {...common} />
        </>
      ) : kind === "conflict" ? (
        <>
          <rect x="2.5" y="2.5" width="9" height="11" rx="1" {...common} />
          <rect x="8.5" y="6.5" width="9" height="11" rx="1" {...common} />
        </>
      ) : (
        <>
          <path d="M10 2.5 18 17H2z" {...common} />
          <path d="M10 8v4" {...common} />
          <circle cx="10" cy="14.5" r="0.6" fill="currentColor" stroke="currentColor" />
        </>
      )}
    </svg>
  );
}

/** The save status line: icon and words, announced politely to screen readers as it changes. */
export function SaveStatus({ kind, text, className, id }: { kind: SaveStatusKind; text: string; className?: string; id?: string }) {
  return (
    <p id={id} role="status" aria-live="polite" className={cn("flex min-w-0 items-center gap-2 font-semibold", TONE[kind], className)} data-save-status={kind}>
      <SaveStatusIcon kind={kind} />
      {/* The time in "Saved at 10:42" is the browser's clock time; the server's rendering may differ. */}
      <span className="min-w-0" suppressHydrationWarning>
        {text}
      </span>
    </p>
  );
}

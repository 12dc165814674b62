import { VERDICT_LABELS, type Verdict } from "@/lib/checks/types";
import { cn } from "@/lib/utils";
import type { BenchStatus } from "./types";

/** Where a student's work stands, in the words a teacher uses. */
export const STATUS_LABELS: Record<BenchStatus, string> = {
  "not-started": "Not started",
  draft: "Draft",
  submitted: "Handed in",
  late: "Late",
  marked: "Marked",
  returned: "Returned",
};

/** The order a teacher works through: what needs marking first, then what is done, then the rest. */
export const STATUS_ORDER: Record<BenchStatus, number> = { submitted: 0, late: 1, marked: 2, returned: 3, draft: 4, "not-started": 5 };

/** Handed in (on time or late) and not marked yet. */
export const needsMarking = (s: BenchStatus) => s === "submitted" || s === "late";

const STATUS_TONE: Record<BenchStatus, string> = {
  "not-started": "border-line bg-paper text-muted",
  draft: "border-line bg-sunken text-ink",
  submitted: "border-brand/40 bg-brand-soft text-brand-strong",
  late: "border-warn/40 bg-warn-soft text-warn",
  marked: "border-good/40 bg-good-soft text-good",
  returned: "border-good/40 bg-surface text-good",
};

/**
 * A small mark for each status, so the column reads without colour: an empty ring (not started),
 * a half-filled ring (draft), a tray with an arrow in (handed in), a clock (late), a tick (marked)
 * and an arrow going back (returned).
 */
function StatusShape({ status }: { status: BenchStatus }) {
  const common = { fill: "none", stroke: "currentColor", strokeWidth: 1.8, strokeLinecap: "round" as const, strokeLinejoin: "round" as const };
  return (
    <svg width="14" height="14" viewBox="0 0 16 16" aria-hidden="true" focusable="false" className="shrink-0" data-status-shape={status}>
      {status === "not-started" ? <circle cx="8" cy="8" r="5.5" {...common} strokeDasharray="2 2" /> : null}
      {status === "draft" ? (
        <>
          <circle cx="8" cy="8" r="5.5" {...common} />
          <path d="M8 2.5a5.5 5.5 0 0 1 0 11z" fill="currentColor" />
        </>
      ) : null}
      {status === "submitted" ? <path d="M2.5 9.5v4h11v-4M8 2.5v7M5 6.8 8 9.8l3-3" {...common} /> : null}
      {status === "late" ? <path d="M8 2.3a5.7 5.7 0 1 0 0 11.4A5.7 5.7 0 0 0 8 2.3zM8 5v3.3l2.2 1.4" {...common} /> : null}
      {status === "marked" ? <path d="M2.8 8.6 6.3 12 13.2 4.2" {...common} strokeWidth={2.2} /> : null}
      {status === "returned" ? <path d="M6 3.5 2.8 6.7 6 9.9M3 6.7h6.5a3.8 3.8 0 0 1 0 7.6H7" {...common} /> : null}
    </svg>
  );
}

export function StatusBadge({ status, className }: { status: BenchStatus; className?: string }) {
  return (
    <span className={cn("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold whitespace-nowrap", STATUS_TONE[status], className)}>
      <StatusShape status={status} />
      {STATUS_LABELS[status]}
    </span>
  );
}

const VERDICT_TONE: Record<Verdict, string> = {
  agrees: "text-good",
  close: "text-warn",
  disagrees: "text-bad",
  "cannot-check": "text-muted",
};

/**
 * A verdict as a shape and a word, never colour alone: a ring with a tick (agrees), a diamond with
 * "about equal" waves (close), a square with a cross (does not agree), a dashed ring with a
 * question mark (cannot check yet).
 */
export function VerdictShape({ verdict, size = 16 }: { verdict: Verdict; size?: number }) {
  const s = { fill: "none", stroke: "currentColor", strokeLinecap: "round" as const, strokeLinejoin: "round" as const };
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="shrink-0" data-verdict-shape={verdict}>
      {verdict === "agrees" ? (
        <>
          <circle cx="10" cy="10" r="8.3" {...s} strokeWidth="2" />
          <path d="M6 10.4 8.8 13.2 14.2 7.2" {...s} strokeWidth="2.4" />
        </>
      ) : verdict === "close" ? (
        <>
          <path d="M10 1.4 18.6 10 10 18.6 1.4 10z" {...s} strokeWidth="2" />
          <path d="M6.4 8.7q1.8-1.5 3.6 0t3.6 0M6.4 11.9q1.8-1.5 3.6 0t3.6 0" {...s} strokeWidth="1.7" />
        </>
      ) : verdict === "disagrees" ? (
        <>
          <rect x="2" y="2" width="16" height="16" rx="2" {...s} strokeWidth="2" />
          <path d="M6.5 6.5 13.5 13.5M13.5 6.5 6.5 13.5" {...s} strokeWidth="2.4" />
        </>
      ) : (
        <>
          <circle cx="10" cy="10" r="8.3" {...s} strokeWidth="1.7" strokeDasharray="3 2.2" />
          <path d="M7.6 7.6a2.5 2.5 0 1 1 3.3 2.4c-.6.3-.9.7-.9 1.4v.6" {...s} strokeWidth="1.9" />
          <circle cx="10" cy="14.6" r="1.1" fill="currentColor" />
        </>
      )}
    </svg>
  );
}

/** A verdict for a table cell or a line of text: its shape and its words. */
export function VerdictMark({ verdict, stale = false, className }: { verdict: Verdict; stale?: boolean; className?: string }) {
  return (
    <span className={cn("inline-flex items-center gap-1 text-sm font-semibold whitespace-nowrap", VERDICT_TONE[verdict], className)}>
      <VerdictShape verdict={verdict} />
      {VERDICT_LABELS[verdict]}
      {stale ? <span className="font-normal text-muted">(out of date)</span> : null}
    </span>
  );
}

/** A total as a teacher writes it: whole marks as they are, anything else to one decimal place. */
export function formatMarks(n: number): string {
  return Number.isInteger(n) ? String(n) : n.toFixed(1);
}

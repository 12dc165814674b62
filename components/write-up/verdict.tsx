import { VERDICT_LABELS, type Verdict } from "@/lib/checks/types";
import { cn } from "@/lib/utils";

const TONE: Record<Verdict, string> = {
  agrees: "border-good/40 bg-good-soft text-good",
  close: "border-warn/40 bg-warn-soft text-warn",
  disagrees: "border-bad/40 bg-bad-soft text-bad",
  "cannot-check": "border-line bg-sunken text-ink",
};

/**
 * Each verdict has its own shape as well as its colour and word, so it reads the same in
 * greyscale or to someone who cannot tell the colours apart: a circle with a tick, a diamond
 * with a wavy "about equal", a square with a cross, and a dashed circle with a question mark.
 */
export function VerdictIcon({ verdict, size = 20, className }: { verdict: Verdict; size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true" focusable="false" className={cn("shrink-0", className)} data-verdict-shape={verdict}>
      {verdict === "agrees" ? (
        <>
          <circle cx="10" cy="10" r="8.5" fill="none" stroke="currentColor" strokeWidth="1.8" />
          <path d="M6 10.4 8.8 13.2 14.2 7.2" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
        </>
      ) : verdict === "close" ? (
        <>
          <path d="M10 1.3 18.7 10 10 18.7 1.3 10z" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
          <path d="M6.2 8.6q1.9-1.6 3.8 0t3.8 0M6.2 12q1.9-1.6 3.8 0t3.8 0" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        </>
      ) : verdict === "disagrees" ? (
        <>
          <rect x="2" y="2" width="16" height="16" rx="2" fill="none" stroke="currentColor" strokeWidth="1.8" />
          <path d="M6.5 6.5 13.5 13.5M13.5 6.5 6.5 13.5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        </>
      ) : (
        <>
          <circle cx="10" cy="10" r="8.5" fill="none" stroke="currentColor" strokeWidth="1.6" strokeDasharray="3 2.2" />
          <path d="M7.6 7.6a2.5 2.5 0 1 1 3.3 2.4c-.6.3-.9.7-.9 1.4v.6" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
          <circle cx="10" cy="14.6" r="1.1" fill="currentColor" />
        </>
      )}
    </svg>
  );
}

/** A verdict in our own words with its icon: "Agrees", "Close", "Does not agree", "Cannot check yet". */
export function VerdictBadge({ verdict, muted = false, className }: { verdict: Verdict; muted?: boolean; className?: string }) {
  return (
    <span className={cn("inline-flex items-center gap-1.5 rounded-full border px-2.5 py-0.5 font-semibold whitespace-nowrap", TONE[verdict], muted && "opacity-70", className)}>
      <VerdictIcon verdict={verdict} size={18} />
      {VERDICT_LABELS[verdict]}
    </span>
  );
}

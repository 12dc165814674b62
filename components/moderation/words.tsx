import { cn } from "@/lib/utils";
import type { SampleItemJson, SampleRule } from "@/components/marking/types";

/** The sampling rule in a sentence a teacher reads at once. */
export function ruleInWords(rule: SampleRule): string {
  const parts = [`At least ${rule.minCount} piece${rule.minCount === 1 ? "" : "s"} of work or ${rule.percent} % of the cohort, whichever is larger`];
  if (rule.includeExtremes) parts.push("always including the highest and lowest marks");
  parts.push(rule.everyMarker ? "spread across the mark range and every marker" : "spread across the mark range");
  return `${parts.join(", ")} — common practice.`;
}

export const ORIGIN_WORDS: Record<SampleItemJson["origin"], string> = {
  drawn: "Drawn by the rule",
  added: "Added by the moderator",
  "swapped-in": "Swapped in by the moderator",
};

/** "Marks confirmed" and "Review needed", each with its own shape as well as its colour. */
export function AgreementVerdict({ verdict, className }: { verdict: "confirmed" | "review-needed"; className?: string }) {
  const confirmed = verdict === "confirmed";
  return (
    <span
      className={cn(
        "inline-flex items-center gap-2 rounded-md border-2 px-3 py-1 text-lg font-bold",
        confirmed ? "border-good/50 bg-good-soft text-good" : "border-warn/60 bg-warn-soft text-warn",
        className,
      )}
    >
      <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true" focusable="false" data-agreement-shape={verdict}>
        {confirmed ? (
          <>
            <path d="M11 1.8 19 5v6c0 4.6-3.4 8-8 9.2C6.4 19 3 15.6 3 11V5z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
            <path d="M7 11.2 9.8 14 15.2 8" fill="none" stroke="currentColor" strokeWidth="2.3" strokeLinecap="round" strokeLinejoin="round" />
          </>
        ) : (
          <>
            <path d="M11 2 20.5 19H1.5z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
            <path d="M11 8v5" stroke="currentColor" strokeWidth="2.3" strokeLinecap="round" />
            <circle cx="11" cy="16" r="1.3" fill="currentColor" />
          </>
        )}
      </svg>
      {confirmed ? "Marks confirmed" : "Review needed"}
    </span>
  );
}

/** A share as a whole percentage. */
export const percent = (share: number) => `${Math.round(share * 100)} %`;

/** A signed number with a real minus sign, to one decimal place. */
export function signed(n: number, digits = 1): string {
  const s = Math.abs(n).toFixed(digits);
  return n > 0 ? `+${s}` : n < 0 ? `−${s}` : s;
}

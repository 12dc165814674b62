import { STANDING_CAUTION } from "@/lib/ghs";
import { cn } from "@/lib/utils";

/** The standing caution, shown wherever a practical is read or its safety section is written. */
export function StandingCaution({ className }: { className?: string }) {
  return (
    <aside aria-label="Safety caution" className={cn("flex gap-3 rounded-lg border border-accent/40 border-l-4 border-l-accent bg-accent-soft p-3 text-ink", className)}>
      <svg width="24" height="24" viewBox="0 0 24 24" aria-hidden="true" className="mt-0.5 shrink-0 text-accent" focusable="false">
        <path d="M12 2.5 2 20.5h20z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
        <path d="M12 9v5.5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        <circle cx="12" cy="17.4" r="1.3" fill="currentColor" />
      </svg>
      <p className="text-[0.97rem]">
        <strong>Check against your risk assessment. </strong>
        {STANDING_CAUTION}
      </p>
    </aside>
  );
}

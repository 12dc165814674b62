import { Badge } from "@/components/ui/badge";
import { cn } from "@/lib/utils";
import type { CheckHistoryView, Reader } from "./types";
import { calculationWords, rightFirstTimeWords, timesWords } from "./words";

const BAR: Record<"good" | "brand" | "warn", string> = { good: "bg-good", brand: "bg-brand", warn: "bg-accent" };

/**
 * Which kinds of calculation come out right first time (a small bar and "x of y right first time"
 * per kind), and which slips keep coming up, each with its plain sentence.
 */
export function CalculationHistory({ history, reader }: { history: CheckHistoryView; reader: Reader }) {
  const you = reader === "student";
  const kinds = [...history.kinds].sort((a, b) => b.share - a.share || a.label.localeCompare(b.label));
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-2">
        <h3 className="text-lg font-bold">{you ? "Right first time" : "Right first time, by kind of calculation"}</h3>
        <p className="text-muted">
          {you
            ? "Meniscus checks each calculation against your own results. This is how often your first try agreed. Getting there after a hint still counts as learning."
            : "Each calculation is checked against the student's own results; this counts the first try at each one."}
        </p>
        {kinds.length ? (
          <ul className="flex flex-col gap-3">
            {kinds.map((k) => {
              const words = calculationWords(k, reader);
              return (
                <li key={k.kind} className="rounded-lg border border-line bg-surface p-3">
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <span className="font-semibold">{k.label}</span>
                    <Badge tone={words.tone}>{words.headline}</Badge>
                  </div>
                  <div className="mt-2 flex items-center gap-3">
                    <span className="h-3 w-full max-w-xs overflow-hidden rounded-full bg-sunken" aria-hidden="true">
                      <span className={cn("block h-full rounded-full", BAR[words.tone])} style={{ width: `${Math.round(100 * k.share)}%` }} />
                    </span>
                    <span className="text-sm whitespace-nowrap">{rightFirstTimeWords(k)}</span>
                  </div>
                </li>
              );
            })}
          </ul>
        ) : (
          <p className="text-muted">{you ? "Once you check a calculation in a write-up, it shows up here." : "No calculations checked yet."}</p>
        )}
      </div>
      <div className="flex flex-col gap-2">
        <h3 className="text-lg font-bold">{you ? "Slips to watch for" : "Slips that came up"}</h3>
        {history.slips.length ? (
          <>
            <p className="text-muted">{you ? "Everyone makes slips. Knowing your usual ones is the quickest way to stop making them." : "Most frequent first."}</p>
            <ul className="flex flex-col gap-2">
              {history.slips.map((s) => (
                <li key={s.code} className="rounded-lg border border-line border-l-4 border-l-accent bg-surface p-3">
                  <p>{s.message}</p>
                  <p className="text-sm text-muted">This {timesWords(s.count)}.</p>
                </li>
              ))}
            </ul>
          </>
        ) : (
          <p className="text-muted">{you ? "No slips so far. Nice work." : "No slips so far."}</p>
        )}
      </div>
    </div>
  );
}

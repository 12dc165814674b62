import { Badge } from "@/components/ui/badge";
import type { ComingPractical, MissedPractical } from "./types";
import { dayWords, dueWords, writeUpWords } from "./words";

/** Open, coming and past-due practicals with their dates and where the write-up stands, soonest first. */
export function ComingList({ items, emptyText }: { items: ComingPractical[]; emptyText: string }) {
  if (!items.length) return <p className="text-muted">{emptyText}</p>;
  return (
    <ul className="flex flex-col divide-y divide-line rounded-lg border border-line bg-surface">
      {items.map((c) => {
        const status = writeUpWords(c.writeUp, c.state);
        return (
        <li key={c.id} className="flex flex-col gap-1 p-3 sm:flex-row sm:items-center sm:justify-between sm:gap-3">
          <div>
            <p className="font-semibold">{c.title}</p>
            <p className="text-sm text-muted">
              {dueWords(c, dayWords)}
              {c.className ? ` · ${c.className}` : ""}
            </p>
          </div>
          <Badge tone={status.tone} className="self-start sm:self-center">
            {status.text}
          </Badge>
        </li>
        );
      })}
    </ul>
  );
}

/** Practicals that closed without a write-up handed in. */
export function MissedList({ items, emptyText }: { items: MissedPractical[]; emptyText: string }) {
  if (!items.length) return <p className="text-muted">{emptyText}</p>;
  return (
    <ul className="flex flex-col divide-y divide-line rounded-lg border border-bad/40 bg-surface">
      {items.map((m) => (
        <li key={m.id} className="flex flex-col gap-1 p-3 sm:flex-row sm:items-center sm:justify-between">
          <span className="font-semibold">{m.title}</span>
          <span className="text-sm text-muted">Was due {dayWords(m.dueAt)}</span>
        </li>
      ))}
    </ul>
  );
}

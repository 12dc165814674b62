import Link from "next/link";
import { buttonClasses } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { formatDate } from "@/lib/utils";
import { StatusBadge } from "./status";

/** One lab session on the marking list, with how much of its work is where. */
export type MarkingSessionSummary = {
  id: string;
  title: string;
  className: string;
  dueAt: string;
  state: "upcoming" | "open" | "late" | "closed" | "cancelled";
  counts: { submitted: number; late: number; marked: number; returned: number; draft: number; notStarted: number };
  students: number;
};

const STATE_WORDS: Record<MarkingSessionSummary["state"], string> = {
  upcoming: "Not open yet",
  open: "Open",
  late: "Taking late work",
  closed: "Closed",
  cancelled: "Cancelled",
};

function SessionCard({ s }: { s: MarkingSessionSummary }) {
  const toMark = s.counts.submitted + s.counts.late;
  const headingId = `session-${s.id}`;
  return (
    <li>
      <Card className="flex flex-col gap-3 sm:flex-row sm:items-center sm:justify-between">
        <div className="min-w-0">
          <h3 id={headingId} className="text-lg font-bold">
            <Link href={`/marking/${s.id}`} className="text-ink underline-offset-4 hover:underline">
              {s.title}
            </Link>
          </h3>
          <p className="text-muted">
            {s.className} · due {formatDate(s.dueAt)} · {STATE_WORDS[s.state]}
          </p>
          <ul className="mt-2 flex flex-wrap gap-2" aria-label={`Work in ${s.className}`}>
            {s.counts.submitted ? (
              <li>
                <StatusBadge status="submitted" /> <span className="font-semibold">{s.counts.submitted}</span>
              </li>
            ) : null}
            {s.counts.late ? (
              <li>
                <StatusBadge status="late" /> <span className="font-semibold">{s.counts.late}</span>
              </li>
            ) : null}
            <li>
              <StatusBadge status="marked" /> <span className="font-semibold">{s.counts.marked}</span>
            </li>
            <li>
              <StatusBadge status="returned" /> <span className="font-semibold">{s.counts.returned}</span>
            </li>
            {s.counts.draft + s.counts.notStarted ? (
              <li className="text-muted">
                {s.counts.draft + s.counts.notStarted} of {s.students} not handed in
              </li>
            ) : null}
          </ul>
        </div>
        <Link
          href={`/marking/${s.id}`}
          aria-describedby={headingId}
          className={buttonClasses(toMark ? "primary" : "secondary", "md", "shrink-0")}
        >
          {toMark ? `Mark ${toMark} write-up${toMark === 1 ? "" : "s"}` : "Open the marking bench"}
        </Link>
      </Card>
    </li>
  );
}

/**
 * The teacher's lab sessions for marking: those with handed-in work waiting first (the longest
 * waiting at the top), then the rest, most recent first.
 */
export function MarkingSessionList({ sessions }: { sessions: MarkingSessionSummary[] }) {
  const waiting = sessions.filter((s) => s.counts.submitted + s.counts.late > 0).sort((a, b) => a.dueAt.localeCompare(b.dueAt));
  const rest = sessions.filter((s) => s.counts.submitted + s.counts.late === 0).sort((a, b) => b.dueAt.localeCompare(a.dueAt));
  if (!sessions.length) {
    return <EmptyState title="No lab sessions to mark yet">When a class you teach has a lab session, its work appears here.</EmptyState>;
  }
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="waiting-heading" className="flex flex-col gap-3">
        <h2 id="waiting-heading" className="text-xl font-bold">
          Waiting to be marked
        </h2>
        {waiting.length ? (
          <ul className="flex flex-col gap-3">
            {waiting.map((s) => (
              <SessionCard key={s.id} s={s} />
            ))}
          </ul>
        ) : (
          <p className="text-muted">Nothing handed in is waiting: you are up to date.</p>
        )}
      </section>
      {rest.length ? (
        <section aria-labelledby="rest-heading" className="flex flex-col gap-3">
          <h2 id="rest-heading" className="text-xl font-bold">
            Other lab sessions
          </h2>
          <ul className="flex flex-col gap-3">
            {rest.map((s) => (
              <SessionCard key={s.id} s={s} />
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

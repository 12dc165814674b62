"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Badge, type Tone } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Table, Td, Th } from "@/components/ui/table";
import { VERDICT_LABELS, type Verdict } from "@/lib/checks/types";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { SessionWriteUpRowJson } from "./types";
import { VerdictIcon } from "./verdict";

const STATUS: Record<SessionWriteUpRowJson["status"], { label: string; tone: Tone }> = {
  "not-started": { label: "Not started", tone: "neutral" },
  draft: { label: "Writing", tone: "brand" },
  submitted: { label: "Handed in", tone: "good" },
  marked: { label: "Marked", tone: "accent" },
  returned: { label: "Returned", tone: "accent" },
};

const VERDICT_ORDER: Verdict[] = ["agrees", "close", "disagrees", "cannot-check"];

const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" }) : "—");

/** Handed-in time for handed-in work; otherwise when it last changed (a reopened write-up is being worked on again). */
function lastChange(r: SessionWriteUpRowJson): string {
  if (r.status !== "draft" && r.status !== "not-started" && r.submittedAt) return `Handed in ${when(r.submittedAt)}`;
  return r.updatedAt ? `Saved ${when(r.updatedAt)}` : "—";
}

function StatusBadges({ row }: { row: SessionWriteUpRowJson }) {
  const status = STATUS[row.status];
  return (
    <span className="flex flex-wrap gap-1">
      <Badge tone={status.tone}>{status.label}</Badge>
      {row.late && row.status !== "draft" ? <Badge tone="warn">Late</Badge> : null}
    </span>
  );
}

function CheckSummary({ checks }: { checks: SessionWriteUpRowJson["checks"] }) {
  const list = Object.values(checks);
  if (!list.length) return <span className="text-muted">None run</span>;
  const stale = list.filter((c) => c.stale).length;
  return (
    <ul className="flex flex-wrap items-center gap-x-3 gap-y-1">
      {VERDICT_ORDER.map((v) => {
        const n = list.filter((c) => c.verdict === v).length;
        return n ? (
          <li key={v} className="inline-flex items-center gap-1" title={VERDICT_LABELS[v]}>
            <VerdictIcon verdict={v} size={18} className={v === "agrees" ? "text-good" : v === "close" ? "text-warn" : v === "disagrees" ? "text-bad" : "text-muted"} />
            <span>
              {n}
              <span className="sr-only"> {VERDICT_LABELS[v]}</span>
            </span>
          </li>
        ) : null;
      })}
      {stale ? <li className="text-sm text-warn">{stale} stale</li> : null}
    </ul>
  );
}

/**
 * "Students' write-ups" for a lab session (teachers and admins): every student in the class,
 * where their write-up stands, a summary of their calculation checks, and a link to read it.
 */
export function SessionWriteUps({ labSessionId }: { labSessionId: string }) {
  const q = useQuery({ queryKey: ["lab-session-write-ups", labSessionId], queryFn: () => fetchJson<SessionWriteUpRowJson[]>(`/api/lab-sessions/${labSessionId}/write-ups`) });
  return (
    <section aria-labelledby="session-write-ups-title" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="session-write-ups-title" className="text-lg font-bold">
          Students&apos; write-ups
        </h2>
        {q.data ? (
          <p className="text-sm text-muted">
            {q.data.filter((r) => r.status !== "draft" && r.status !== "not-started").length} of {q.data.length} handed in
          </p>
        ) : null}
      </div>
      {q.isPending ? (
        <p role="status" className="text-muted">
          Loading the write-ups…
        </p>
      ) : q.isError ? (
        <div role="alert" className="flex flex-col gap-2">
          <p className="font-semibold text-bad">{q.error instanceof ApiError ? q.error.message : "Could not load the write-ups."}</p>
          <div>
            <Button variant="secondary" size="sm" onClick={() => void q.refetch()}>
              Try again
            </Button>
          </div>
        </div>
      ) : q.data.length === 0 ? (
        <p className="text-muted">There are no students in this class yet.</p>
      ) : (
        <>
          {/* Phones: one card per student; wider screens: a table. */}
          <ul className="flex flex-col gap-2 sm:hidden">
            {q.data.map((r) => (
              <li key={r.studentId} className="flex flex-col gap-1 rounded-lg border border-line bg-surface p-3">
                <span className="font-semibold">{r.writeUpId ? <Link href={`/write-ups/${r.writeUpId}`}>{r.studentName}</Link> : r.studentName}</span>
                <StatusBadges row={r} />
                {r.writeUpId ? <CheckSummary checks={r.checks} /> : null}
                {r.writeUpId ? <span className="text-sm text-muted">{lastChange(r)}</span> : null}
              </li>
            ))}
          </ul>
          <div className="hidden sm:block">
            <Table>
              <thead>
                <tr>
                  <Th>Student</Th>
                  <Th>Write-up</Th>
                  <Th>Calculation checks</Th>
                  <Th>Last change</Th>
                </tr>
              </thead>
              <tbody>
                {q.data.map((r) => (
                  <tr key={r.studentId}>
                    <Td className="font-semibold">{r.writeUpId ? <Link href={`/write-ups/${r.writeUpId}`}>{r.studentName}</Link> : r.studentName}</Td>
                    <Td>
                      <StatusBadges row={r} />
                    </Td>
                    <Td>{r.writeUpId ? <CheckSummary checks={r.checks} /> : <span className="text-muted">—</span>}</Td>
                    <Td className="whitespace-nowrap">{lastChange(r)}</Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          </div>
        </>
      )}
    </section>
  );
}

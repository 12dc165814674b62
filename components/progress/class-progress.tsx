"use client";

import Link from "next/link";
import { useId, useMemo, useState } from "react";
import { useMutation } from "@tanstack/react-query";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { Table, Td, Th } from "@/components/ui/table";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { chartDate } from "./chart-data";
import { classSummary, FILTER_LABELS, missingBySession, selectRows, SORT_LABELS, type ClassFilter, type ClassSort } from "./class-progress-data";
import type { ClassProgressView } from "./types";

type SendResult = { sent: number; skipped: number; failed: number };

function plural(n: number, one: string, many = `${one}s`) {
  return `${n} ${n === 1 ? one : many}`;
}

/** Sends every family in the class their child's term report, after a clear question; then says what happened. */
function SendReports({ classId, className, families }: { classId: string; className: string; families: number }) {
  const send = useMutation({ mutationFn: () => fetchJson<SendResult>(`/api/class-progress/${encodeURIComponent(classId)}/send-reports`, { method: "POST" }) });
  return (
    <div className="flex flex-col gap-2">
      <ConfirmButton
        variant="secondary"
        tone="danger"
        label={send.isPending ? "Sending the reports…" : "E-mail term reports to families"}
        question={`E-mail this term's progress report (PDF) to the parents and guardians of ${plural(families, "student")} in ${className}? Families who turned e-mails off are skipped. Sent e-mails cannot be taken back.`}
        confirmLabel="Yes, e-mail the reports"
        backOutLabel="Not now"
        busy={send.isPending}
        onConfirm={() => send.mutate()}
      />
      <div aria-live="polite">
        {send.isSuccess ? (
          <Alert tone={send.data.failed ? "warn" : "good"} title="Term reports e-mailed">
            <p>
              Sent: {send.data.sent}. Skipped (e-mails turned off or account closed): {send.data.skipped}. Failed: {send.data.failed}.
            </p>
            {send.data.failed ? <p>Some messages could not be sent. Try again later; families who already have theirs will get a second copy.</p> : null}
          </Alert>
        ) : null}
        {send.isError ? (
          <Alert tone="bad" title="The reports were not sent">
            {send.error instanceof ApiError ? send.error.message : "Something went wrong. Please try again."}
          </Alert>
        ) : null}
      </div>
    </div>
  );
}

/**
 * A class's progress across its practicals for its teachers: class figures, who has not handed in
 * what, each student's average mark, the kinds of calculation they find hard and their most
 * common slip, with search, filter and sort; CSV export and e-mailing term reports to families.
 */
export function ClassProgress({ data }: { data: ClassProgressView }) {
  const ids = { search: useId(), filter: useId(), sort: useId(), count: useId() };
  const [search, setSearch] = useState("");
  const [filter, setFilter] = useState<ClassFilter>("all");
  const [sort, setSort] = useState<ClassSort>("name");
  const rows = useMemo(() => selectRows(data.rows, { search, filter, sort }), [data.rows, search, filter, sort]);
  const summary = useMemo(() => classSummary(data.rows), [data.rows]);
  const bySession = useMemo(() => missingBySession(data.sessions, data.rows), [data.sessions, data.rows]);
  const sortedColumn = sort === "name" ? "name" : sort === "handed-in" ? "handed" : "average";
  const ariaSort = (col: string) => (col === sortedColumn ? (sort === "average-high" ? "descending" : "ascending") : undefined);

  return (
    <div className="flex flex-col gap-8">
      <div className="flex flex-wrap items-start gap-3">
        <a href={`/api/class-progress/${encodeURIComponent(data.class.id)}?format=csv`} download className={buttonClasses("secondary")}>
          Export CSV
        </a>
        <SendReports classId={data.class.id} className={data.class.name} families={data.rows.length} />
      </div>

      <section aria-labelledby="class-figures" className="flex flex-col gap-3">
        <h2 id="class-figures" className="text-xl font-bold">
          The class at a glance
        </h2>
        <dl className="grid grid-cols-2 gap-3 lg:grid-cols-3">
          <div className="rounded-lg border border-line bg-surface p-3">
            <dt className="text-sm text-muted">Average mark</dt>
            <dd className="text-2xl font-bold">{summary.averagePercent == null ? "No marks yet" : `${Math.round(summary.averagePercent)}%`}</dd>
          </div>
          <div className="rounded-lg border border-line bg-surface p-3">
            <dt className="text-sm text-muted">Students with work not handed in</dt>
            <dd className="text-2xl font-bold">
              {summary.withMissing} <span className="text-base font-normal text-muted">of {data.rows.length}</span>
            </dd>
          </div>
          <div className="rounded-lg border border-line bg-surface p-3">
            <dt className="text-sm text-muted">Finding a calculation hard</dt>
            <dd className="text-2xl font-bold">
              {summary.struggling} <span className="text-base font-normal text-muted">of {data.rows.length}</span>
            </dd>
          </div>
          <div className="col-span-full rounded-lg border border-line bg-surface p-3">
            <dt className="text-sm text-muted">Most common slip</dt>
            <dd>{summary.commonSlip ? `${summary.commonSlip.message} (most common for ${plural(summary.commonSlip.students, "student")})` : "None yet"}</dd>
          </div>
        </dl>
      </section>

      <section aria-labelledby="class-missing" className="flex flex-col gap-3">
        <h2 id="class-missing" className="text-xl font-bold">
          Not handed in, by practical
        </h2>
        {bySession.length ? (
          <ul className="flex flex-col gap-2">
            {bySession.map((s) => (
              <li key={s.id} className="rounded-lg border border-line bg-surface p-3">
                <p className="font-semibold">
                  {s.title}{" "}
                  <span className="font-normal text-muted">
                    · due {chartDate(new Date(s.dueAt).getTime())} · handed in by {data.rows.length - s.missing.length} of {data.rows.length}
                  </span>
                </p>
                {s.missing.length ? <p>Not handed in: {s.missing.join(", ")}</p> : <p className="text-good">Everyone handed in.</p>}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-muted">No lab session for this class has passed its due date yet.</p>
        )}
      </section>

      <section aria-labelledby="class-students" className="flex flex-col gap-3">
        <h2 id="class-students" className="text-xl font-bold">
          Students
        </h2>
        <div className="grid gap-3 sm:grid-cols-3">
          <Field id={ids.search} label="Find a student">
            {(p) => <Input {...p} type="search" value={search} onChange={(e) => setSearch(e.target.value)} autoComplete="off" />}
          </Field>
          <Field id={ids.filter} label="Show">
            {(p) => (
              <Select {...p} value={filter} onChange={(e) => setFilter(e.target.value as ClassFilter)}>
                {(Object.keys(FILTER_LABELS) as ClassFilter[]).map((f) => (
                  <option key={f} value={f}>
                    {FILTER_LABELS[f]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field id={ids.sort} label="Sort by">
            {(p) => (
              <Select {...p} value={sort} onChange={(e) => setSort(e.target.value as ClassSort)}>
                {(Object.keys(SORT_LABELS) as ClassSort[]).map((s) => (
                  <option key={s} value={s}>
                    {SORT_LABELS[s]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
        <p id={ids.count} aria-live="polite" className="text-muted">
          Showing {rows.length} of {plural(data.rows.length, "student")}.
        </p>
        {rows.length ? (
          <Table aria-describedby={ids.count}>
            <caption className="sr-only">Progress of each student in {data.class.name}</caption>
            <thead>
              <tr>
                <Th aria-sort={ariaSort("name")}>Student</Th>
                <Th aria-sort={ariaSort("handed")}>Handed in</Th>
                <Th>Not handed in</Th>
                <Th aria-sort={ariaSort("average")}>Average mark</Th>
                <Th>Calculations to practise</Th>
                <Th>Most common slip</Th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.studentId}>
                  <Th scope="row" className="min-w-44 bg-transparent whitespace-normal">
                    <Link href={`/children/${encodeURIComponent(r.studentId)}`}>{r.name}</Link>
                  </Th>
                  <Td className="whitespace-nowrap">
                    {r.handedIn} of {r.due}
                  </Td>
                  <Td>{r.notHandedIn.length ? r.notHandedIn.join("; ") : <span className="text-muted">Nothing</span>}</Td>
                  <Td className="whitespace-nowrap">{r.averagePercent == null ? <span className="text-muted">No marks yet</span> : `${Math.round(r.averagePercent)}%`}</Td>
                  <Td>
                    {r.struggling.length ? (
                      <span className="flex flex-wrap gap-1">
                        {r.struggling.map((k) => (
                          <Badge key={k} tone="warn">
                            {k}
                          </Badge>
                        ))}
                      </span>
                    ) : (
                      <span className="text-muted">None</span>
                    )}
                  </Td>
                  <Td className="min-w-64 text-sm">{r.commonSlip ?? <span className="text-muted">None</span>}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        ) : (
          <p className="rounded-lg border border-dashed border-line bg-surface p-4 text-center">No student matches. Clear the search or choose “Everyone”.</p>
        )}
      </section>
    </div>
  );
}

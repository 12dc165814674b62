"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Badge, type Tone } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Field, Textarea } from "@/components/ui/field";
import { Table, Td, Th } from "@/components/ui/table";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { ROLE_LABELS } from "@/lib/roles";
import { cn } from "@/lib/utils";
import type { RosterImportResult, RosterPreview, RosterPreviewRow } from "./api-types";
import { downloadExampleRoster } from "./example-roster";
import { errorMessage } from "./query-state";

/** Largest file the page will read; the server refuses anything bigger too. */
const MAX_FILE_BYTES = 500 * 1024;

const STUDENT_OUTCOME: Record<NonNullable<RosterPreviewRow["student"]>, { label: string; tone: Tone }> = {
  new: { label: "New student", tone: "brand" },
  existing: { label: "Existing student", tone: "neutral" },
  "already-in-class": { label: "Already in class", tone: "neutral" },
};
const PARENT_OUTCOME: Record<NonNullable<RosterPreviewRow["parent"]>, { label: string; tone: Tone }> = {
  new: { label: "New parent", tone: "brand" },
  existing: { label: "Existing parent", tone: "neutral" },
  "already-linked": { label: "Already linked", tone: "neutral" },
};

function plural(n: number, one: string, many = `${one}s`) {
  return `${n} ${n === 1 ? one : many}`;
}

/** "Year group: Year group must be…" reads better as "Year group must be…". */
function tidyProblem(problem: string): string {
  const m = problem.match(/^([^:]+): (.*)$/);
  return m && m[2]!.toLowerCase().startsWith(m[1]!.toLowerCase()) ? m[2]! : problem;
}

function PreviewSummary({ preview }: { preview: RosterPreview }) {
  const s = preview.summary;
  const parts = [plural(s.newStudents, "new student"), plural(s.existingStudents, "student already at the school", "students already at the school"), plural(s.newParents, "new parent or guardian", "new parents or guardians")];
  return (
    <p>
      <strong>{plural(s.rows, "line")}</strong>: {parts.join(", ")}.{s.withErrors ? <strong className="text-bad"> {plural(s.withErrors, "line has", "lines have")} problems.</strong> : null}
    </p>
  );
}

function PreviewTable({ rows, onlyProblems }: { rows: RosterPreviewRow[]; onlyProblems: boolean }) {
  const shown = onlyProblems ? rows.filter((r) => r.errors.length) : rows;
  return (
    <Table>
      <caption className="sr-only">What importing each line of the file would do</caption>
      <thead>
        <tr>
          <Th>Line</Th>
          <Th>Student</Th>
          <Th>Year</Th>
          <Th>Student outcome</Th>
          <Th>Parent or guardian</Th>
          <Th>Parent outcome</Th>
          <Th>Problems</Th>
        </tr>
      </thead>
      <tbody>
        {shown.map((r) => (
          <tr key={r.line} className={cn(r.errors.length && "bg-bad-soft")}>
            <Td>{r.line}</Td>
            <Td className="min-w-48">
              <span className="block font-semibold">{r.name || "—"}</span>
              <span className="block text-sm whitespace-nowrap text-muted">{r.email || "no e-mail"}</span>
            </Td>
            <Td>{r.yearGroup ?? "—"}</Td>
            <Td className="whitespace-nowrap">{r.student ? <Badge tone={STUDENT_OUTCOME[r.student].tone}>{STUDENT_OUTCOME[r.student].label}</Badge> : "—"}</Td>
            <Td className="min-w-48">
              {r.parentName || r.parentEmail ? (
                <>
                  <span className="block">
                    {r.parentName ?? "—"}
                    {r.relationship ? <span className="text-muted"> ({r.relationship})</span> : null}
                  </span>
                  <span className="block text-sm text-muted">{r.parentEmail}</span>
                </>
              ) : (
                <span className="text-muted">None given</span>
              )}
            </Td>
            <Td className="whitespace-nowrap">{r.parent ? <Badge tone={PARENT_OUTCOME[r.parent].tone}>{PARENT_OUTCOME[r.parent].label}</Badge> : "—"}</Td>
            <Td className="min-w-64">
              {r.errors.length ? (
                <ul className="flex flex-col gap-0.5 font-semibold text-bad">
                  {r.errors.map((e) => (
                    <li key={e}>{tidyProblem(e)}</li>
                  ))}
                </ul>
              ) : (
                <span className="text-good">OK</span>
              )}
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

function ImportReport({ result, className }: { result: RosterImportResult; className: string }) {
  const { imported, invitations } = result;
  const students = imported.created.filter((p) => p.roles.includes("student"));
  const parents = imported.created.filter((p) => p.roles.includes("parent"));
  return (
    <Alert tone={invitations.failed.length ? "warn" : "good"} title="The roster has been imported.">
      <ul className="mt-1 list-disc pl-5">
        <li>{plural(imported.rows, "line")} read.</li>
        <li>
          {plural(imported.enrolled, "student")} added to {className}
          {imported.rows > imported.enrolled ? `; ${plural(imported.rows - imported.enrolled, "was", "were")} already in it` : ""}.
        </li>
        <li>
          New accounts: {plural(students.length, "student")}, {plural(parents.length, "parent or guardian", "parents or guardians")}.
        </li>
        <li>
          {!invitations.requested
            ? "No invitations were sent. Send them from each person's page when you are ready."
            : imported.created.length === 0
              ? "Nobody new, so no invitations were needed."
              : `${plural(invitations.sent, "invitation")} sent.`}
        </li>
      </ul>
      {invitations.failed.length ? (
        <div className="mt-2">
          <p className="font-semibold">
            {plural(invitations.failed.length, "invitation")} could not be sent. The import is kept; send these again from each person&apos;s page:
          </p>
          <ul className="list-disc pl-5">
            {invitations.failed.map((f) => (
              <li key={f.id}>
                <Link href={`/admin/people/${f.id}`}>{f.name || f.email}</Link> — {f.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {imported.created.length ? (
        <details className="mt-2">
          <summary className="cursor-pointer font-semibold">Show the new accounts</summary>
          <ul className="mt-1 list-disc pl-5">
            {imported.created.map((p) => (
              <li key={p.id}>
                <Link href={`/admin/people/${p.id}`}>{p.name}</Link> ({p.roles.map((r) => ROLE_LABELS[r]).join(", ")}, {p.email})
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </Alert>
  );
}

/**
 * Roster CSV import for one class: choose or paste a file, check it (nothing is written), read the
 * outcome of every line, and import only when no line has a problem. The server imports every
 * line or none.
 */
export function RosterImport({ classId, className }: { classId: string; className: string }) {
  const queryClient = useQueryClient();
  const fileInput = useRef<HTMLInputElement>(null);
  const [csv, setCsv] = useState("");
  const [fileName, setFileName] = useState<string | null>(null);
  const [fileProblem, setFileProblem] = useState<string | null>(null);
  const [checked, setChecked] = useState<{ csv: string; preview: RosterPreview } | null>(null);
  const [refusal, setRefusal] = useState<string | null>(null);
  const [onlyProblems, setOnlyProblems] = useState(false);
  const [sendInvitations, setSendInvitations] = useState(true);
  const [result, setResult] = useState<RosterImportResult | null>(null);
  const [requestError, setRequestError] = useState<string | null>(null);

  const post = <T,>(commit: boolean) => fetchJson<T>(`/api/classes/${classId}/roster`, { method: "POST", json: { csv, commit, sendInvitations } });

  const check = useMutation({
    mutationFn: () => post<{ preview: RosterPreview }>(false),
    onMutate: () => {
      setRequestError(null);
      setRefusal(null);
      setResult(null);
    },
    onSuccess: ({ preview }) => {
      setChecked({ csv, preview });
      setOnlyProblems(false);
    },
    onError: (e) => setRequestError(errorMessage(e)),
  });

  const commit = useMutation({
    mutationFn: () => post<RosterImportResult>(true),
    onMutate: () => {
      setRequestError(null);
      setRefusal(null);
    },
    onSuccess: async (res) => {
      setResult(res);
      setChecked(null);
      setCsv("");
      setFileName(null);
      if (fileInput.current) fileInput.current.value = "";
      await queryClient.invalidateQueries({ queryKey: ["class", classId] });
      await queryClient.invalidateQueries({ queryKey: ["classes"] });
      await queryClient.invalidateQueries({ queryKey: ["people"] });
    },
    onError: (e) => {
      const preview = e instanceof ApiError ? (e.body.preview as RosterPreview | undefined) : undefined;
      if (preview) {
        // Something changed since the check (for example an address now taken): show the new outcome.
        setChecked({ csv, preview });
        setRefusal(`Nothing was imported. ${e instanceof ApiError ? e.message : ""}`);
      } else setRequestError(errorMessage(e));
    },
  });

  async function readFile(file: File | undefined) {
    setFileProblem(null);
    setResult(null);
    if (!file) return;
    if (file.size > MAX_FILE_BYTES) {
      setFileProblem(`${file.name} is ${Math.ceil(file.size / 1024)} kB; a roster file can be at most 500 kB. Split it into smaller files.`);
      return;
    }
    const text = await file.text();
    if (text.includes("\u0000")) {
      setFileProblem(`${file.name} does not look like a CSV file. Save the spreadsheet as “CSV (comma separated)” and choose that file.`);
      return;
    }
    setFileName(file.name);
    setCsv(text);
    setChecked(null);
  }

  const preview = checked?.preview;
  const stale = !!checked && checked.csv !== csv;
  const importable = !!preview && !stale && preview.fileErrors.length === 0 && preview.summary.withErrors === 0 && preview.rows.length > 0;
  const busy = check.isPending || commit.isPending;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-2 text-[0.97rem]">
        <p>
          Use a CSV file (a spreadsheet saved as “CSV”) with one student per line. The first line names the columns: <strong>name</strong> and <strong>email</strong> are
          needed; <strong>year group</strong>, <strong>parent name</strong>, <strong>parent email</strong> and <strong>relationship</strong> are optional.
        </p>
        <p>
          Meniscus checks the whole file first and shows what it would do. It imports only when every line is right, and then imports all of them: never part of a
          file.
        </p>
        <div>
          <Button variant="secondary" size="sm" onClick={downloadExampleRoster}>
            Download an example file
          </Button>
        </div>
      </div>

      <div className="flex flex-col gap-1">
        <label htmlFor="roster-file" className="font-semibold">
          Choose a CSV file
        </label>
        <input
          ref={fileInput}
          id="roster-file"
          type="file"
          accept=".csv,text/csv,text/plain"
          aria-describedby={fileProblem ? "roster-file-problem" : undefined}
          className="w-full max-w-full rounded-md border border-line bg-surface p-2 file:mr-3 file:min-h-9 file:rounded-md file:border file:border-line file:bg-sunken file:px-3 file:font-semibold"
          onChange={(e) => void readFile(e.target.files?.[0])}
        />
        <div aria-live="polite">
          {fileProblem ? (
            <p id="roster-file-problem" className="text-sm font-semibold text-bad">
              {fileProblem}
            </p>
          ) : fileName ? (
            <p className="text-sm text-muted">Read {fileName}. Its text is in the box below, where you can correct it.</p>
          ) : null}
        </div>
      </div>

      <Field id="roster-text" label="…or paste the rows here" hint="Include the first line with the column names.">
        {(p) => (
          <Textarea
            {...p}
            className="min-h-40 font-mono text-sm"
            wrap="off"
            spellCheck={false}
            value={csv}
            onChange={(e) => {
              setCsv(e.target.value);
              setResult(null);
            }}
          />
        )}
      </Field>

      <div>
        <Button variant={importable ? "secondary" : "primary"} disabled={!csv.trim() || busy} onClick={() => check.mutate()}>
          {check.isPending ? "Checking…" : checked && !stale ? "Check again" : "Check the file"}
        </Button>
      </div>

      <div aria-live="polite" className="flex flex-col gap-3">
        {requestError ? <Alert tone="bad">{requestError}</Alert> : null}
        {result ? <ImportReport result={result} className={className} /> : null}
        {stale ? <Alert tone="warn">The text has changed since it was checked. Check it again before importing.</Alert> : null}
        {preview && !stale ? (
          <>
            {refusal ? <Alert tone="bad">{refusal}</Alert> : null}
            {preview.fileErrors.length ? (
              <Alert tone="bad" title="This file cannot be imported. Nothing has been changed.">
                <ul className="list-disc pl-5">
                  {preview.fileErrors.map((e) => (
                    <li key={e}>{e}</li>
                  ))}
                </ul>
              </Alert>
            ) : (
              <>
                <PreviewSummary preview={preview} />
                {preview.summary.withErrors ? (
                  <Alert tone="bad" title="Nothing can be imported until every line is right.">
                    Fix the lines marked below, in your file or in the box above, and check again. Meniscus never imports part of a file, so nothing has been changed.
                  </Alert>
                ) : (
                  <Alert tone="good">Every line is ready to import.</Alert>
                )}
              </>
            )}
            {preview.ignoredColumns.length ? (
              <p className="text-sm text-muted">
                Columns not used: {preview.ignoredColumns.join(", ")}. Only the columns named above are read.
              </p>
            ) : null}
          </>
        ) : null}
      </div>

      {preview && !stale && preview.rows.length ? (
        <div className="flex flex-col gap-2">
          {preview.summary.withErrors ? (
            <label htmlFor="roster-only-problems" className="flex min-h-11 cursor-pointer items-center gap-2">
              <input id="roster-only-problems" type="checkbox" className="size-5 accent-brand" checked={onlyProblems} onChange={(e) => setOnlyProblems(e.target.checked)} />
              Show only the lines with problems
            </label>
          ) : null}
          <PreviewTable rows={preview.rows} onlyProblems={onlyProblems} />
        </div>
      ) : null}

      {importable ? (
        <div className="flex flex-col gap-3 rounded-md border border-brand/40 bg-brand-soft p-3">
          <label htmlFor="roster-invite" className="flex min-h-11 cursor-pointer items-start gap-3">
            <input id="roster-invite" type="checkbox" className="mt-1 size-5 accent-brand" checked={sendInvitations} onChange={(e) => setSendInvitations(e.target.checked)} />
            <span>
              <span className="block font-semibold">Send invitations to the new people</span>
              <span className="block text-sm text-muted">Each new student and parent gets an e-mail with a link to choose a password. People who already have accounts get nothing.</span>
            </span>
          </label>
          <div>
            <Button disabled={busy} onClick={() => commit.mutate()}>
              {commit.isPending ? "Importing…" : `Import ${plural(preview!.rows.length, "line")}`}
            </Button>
          </div>
        </div>
      ) : null}
    </div>
  );
}

"use client";

import { createContext, useContext, useId, useState } from "react";
import { Badge, type Tone } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { VERDICT_LABELS, type CheckAnswer, type CheckOutcome, type StudentCheckView, type Verdict } from "@/lib/checks/types";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { checkSchema, tableSchema, type CheckSpec, type TableTemplate } from "@/lib/validation/practicals";
import { cn } from "@/lib/utils";
import { parseTypedNumber } from "../numbers";
import { emptyGrid, gridToRows, pasteIntoGrid, type GridText } from "../sample-grid";
import { columnHeader } from "../units";

/** What the teacher typed into one check's preview, kept while they move between sections. */
export type PreviewInput = { tableId: string; grid: GridText; value: string; unit: string; tangent: { x1: string; y1: string; x2: string; y2: string } };

type PreviewStore = { get: (checkId: string) => PreviewInput | undefined; set: (checkId: string, input: PreviewInput) => void };
export const PreviewStoreContext = createContext<PreviewStore>({ get: () => undefined, set: () => {} });

export const VERDICT_TONES: Record<Verdict, Tone> = { agrees: "good", close: "warn", disagrees: "bad", "cannot-check": "neutral" };

const PER_ROW: CheckSpec["kind"][] = ["reciprocal-time", "mean-of-repeats"];

type PreviewResult = { outcome: CheckOutcome; studentView: StudentCheckView };

function VerdictBadge({ verdict }: { verdict: Verdict }) {
  const icon = verdict === "agrees" ? "✓" : verdict === "close" ? "≈" : verdict === "disagrees" ? "✗" : "?";
  return (
    <Badge tone={VERDICT_TONES[verdict]}>
      <span aria-hidden="true">{icon}</span> {VERDICT_LABELS[verdict]}
    </Badge>
  );
}

function fmt(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  const abs = Math.abs(n);
  return abs !== 0 && (abs < 1e-3 || abs >= 1e6) ? n.toExponential(3) : String(Number(n.toPrecision(4)));
}

/** The outcome as the student sees it, and the full reason for the teacher. */
export function PreviewOutcome({ result }: { result: PreviewResult }) {
  const { outcome, studentView } = result;
  return (
    <div className="grid gap-3 lg:grid-cols-2">
      <section aria-label="What the student sees" className="flex flex-col gap-2 rounded-md border border-line bg-surface p-3">
        <h5 className="font-bold">What the student sees</h5>
        <div>
          <VerdictBadge verdict={studentView.verdict} />
        </div>
        {studentView.hint ? <p>{studentView.hint}</p> : <p className="text-sm text-muted">No hint is shown with this setting.</p>}
        {studentView.expected ? (
          <p>
            Expected value: <strong>{fmt(studentView.expected.value)}</strong> {studentView.expected.unit}
          </p>
        ) : null}
        {studentView.rows?.length ? (
          <ul className="flex flex-wrap gap-1.5 text-sm">
            {studentView.rows.map((r) => (
              <li key={r.index}>
                Row {r.index + 1}: <VerdictBadge verdict={r.verdict} />
              </li>
            ))}
          </ul>
        ) : null}
      </section>
      <section aria-label="The full reason, for you" className="flex flex-col gap-1.5 rounded-md border border-line bg-surface p-3">
        <h5 className="font-bold">The full reason (for you)</h5>
        <p>{outcome.reason}</p>
        {outcome.expected ? (
          <p className="text-sm">
            Meniscus’s value: <strong>{fmt(outcome.expected.value)}</strong> {outcome.expected.unit}
            {outcome.expected.uncertainty != null ? ` ± ${fmt(outcome.expected.uncertainty)}` : ""} — {outcome.expected.method}
          </p>
        ) : null}
        {outcome.deviationPercent != null ? <p className="text-sm">The answer is {fmt(Math.abs(outcome.deviationPercent))} % away from it.</p> : null}
        {outcome.sigFigs.message ? <p className="text-sm">Significant figures: {outcome.sigFigs.message}</p> : null}
        {outcome.unit.message ? <p className="text-sm">Unit: {outcome.unit.message}</p> : null}
        {outcome.likelySlip ? <p className="text-sm">Likely slip: {outcome.likelySlip.message}</p> : null}
        {outcome.tangent ? <p className="text-sm">Tangent: {outcome.tangent.message}</p> : null}
        {outcome.rows?.length ? (
          <div className="overflow-x-auto">
            <table className="mt-1 w-full text-left text-sm">
              <thead>
                <tr>
                  <th scope="col" className="pr-3">Row</th>
                  <th scope="col" className="pr-3">Typed</th>
                  <th scope="col" className="pr-3">Expected</th>
                  <th scope="col">Verdict</th>
                </tr>
              </thead>
              <tbody>
                {outcome.rows.map((r) => (
                  <tr key={r.index}>
                    <td className="pr-3">{r.index + 1}</td>
                    <td className="pr-3">{r.typed ?? "—"}</td>
                    <td className="pr-3">{r.expected != null ? fmt(r.expected) : "—"}</td>
                    <td>{VERDICT_LABELS[r.verdict]}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : null}
      </section>
    </div>
  );
}

function initialInput(table: TableTemplate, check: CheckSpec): PreviewInput {
  return { tableId: table.id, grid: emptyGrid(table.columns, Math.min(table.rowCount, 12), table.presetRows), value: "", unit: check.expectedUnit, tangent: { x1: "", y1: "", x2: "", y2: "" } };
}

/**
 * Trying a check before students do: sample readings for its table (typed, or pasted from a
 * spreadsheet), a sample answer, and the outcome exactly as a student would see it, with the
 * teacher's full reason.
 */
export function CheckPreview({ check, table, index }: { check: CheckSpec; table: TableTemplate | undefined; index: number }) {
  const store = useContext(PreviewStoreContext);
  const baseId = useId();
  const [result, setResult] = useState<PreviewResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (!table) return <p className="text-sm text-muted">Choose a table above to try this check.</p>;
  const stored = store.get(check.id);
  const input = stored && stored.tableId === table.id && stored.grid[0]?.length === table.columns.length ? stored : initialInput(table, check);
  const update = (patch: Partial<PreviewInput>) => store.set(check.id, { ...input, ...patch });
  const { rows, problems } = gridToRows(input.grid, table.columns);
  const perRow = PER_ROW.includes(check.kind);
  const maxRows = Math.min(60, table.rowCount);

  const setCell = (r: number, c: number, value: string) => update({ grid: input.grid.map((row, ri) => (ri === r ? row.map((cell, ci) => (ci === c ? value : cell)) : row)) });

  const run = async () => {
    setError(null);
    setResult(null);
    if (problems.length) {
      setError(problems.map((p) => p.message).join(" "));
      return;
    }
    const parsedCheck = checkSchema.safeParse(check);
    const parsedTable = tableSchema.safeParse(table);
    if (!parsedCheck.success || !parsedTable.success) {
      setError("Finish this check's settings and its table first: the fields marked above say what is missing.");
      return;
    }
    const t = input.tangent;
    const tangentNumbers = [t.x1, t.y1, t.x2, t.y2].map((v) => parseTypedNumber(v));
    const tangentGiven = check.kind === "rate-at" && tangentNumbers.some((v) => v !== null);
    if (tangentGiven && tangentNumbers.some((v) => v === null || Number.isNaN(v))) {
      setError("Give all four numbers of the tangent's two points, or leave them all blank.");
      return;
    }
    const answer: CheckAnswer = {
      value: perRow ? "" : input.value.trim(),
      unit: input.unit.trim(),
      tangent: tangentGiven ? { x1: tangentNumbers[0]!, y1: tangentNumbers[1]!, x2: tangentNumbers[2]!, y2: tangentNumbers[3]! } : null,
    };
    setBusy(true);
    try {
      setResult(await fetchJson<PreviewResult>("/api/checks/preview", { method: "POST", json: { check: parsedCheck.data, table: parsedTable.data, rows, answer } }));
    } catch (e) {
      if (e instanceof ApiError) {
        const details = Object.entries(e.fieldErrors).map(([k, m]) => `${k}: ${m.join(" ")}`);
        setError([e.message, ...details].join(" "));
      } else setError("Could not run the check. Please try again.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <details className="rounded-md border border-line bg-paper">
      <summary className="cursor-pointer px-3 py-2 font-semibold">Try this check with sample data</summary>
      <div className="flex flex-col gap-3 p-3 pt-1">
        <p className="text-sm text-muted">
          Type readings, or copy cells from a spreadsheet and paste them into the first cell. Then type an answer as a student would, and press “Check this answer”.
        </p>
        <div className="overflow-x-auto rounded-md border border-line bg-surface">
          <table className="border-collapse text-left text-sm">
            <caption className="sr-only">Sample readings for {table.title || "the table"}</caption>
            <thead>
              <tr>
                <th scope="col" className="border-b border-line bg-sunken px-2 py-1 text-muted">
                  Row
                </th>
                {table.columns.map((c) => (
                  <th key={c.id} scope="col" className="border-b border-line bg-sunken px-2 py-1 font-semibold whitespace-nowrap">
                    {columnHeader(c)}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {input.grid.map((row, r) => (
                <tr key={r}>
                  <th scope="row" className="px-2 text-muted">
                    {r + 1}
                  </th>
                  {table.columns.map((c, ci) => {
                    const bad = problems.some((p) => p.row === r && p.col === ci);
                    return (
                      <td key={c.id} className="p-0.5">
                        <input
                          aria-label={`Row ${r + 1}, ${columnHeader(c)}`}
                          aria-invalid={bad ? true : undefined}
                          inputMode="decimal"
                          value={row[ci] ?? ""}
                          className={cn("w-24 rounded border border-line bg-surface px-2 py-1.5", bad && "border-bad bg-bad-soft")}
                          onChange={(e) => setCell(r, ci, e.target.value)}
                          onPaste={(e) => {
                            const pasted = pasteIntoGrid(input.grid, e.clipboardData.getData("text/plain"), { row: r, col: ci }, table.columns.length, maxRows);
                            if (!pasted) return;
                            e.preventDefault();
                            update({ grid: pasted.grid });
                            setNote(pasted.note);
                          }}
                        />
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button size="sm" variant="secondary" disabled={input.grid.length >= maxRows} onClick={() => update({ grid: [...input.grid, table.columns.map(() => "")] })}>
            Add a row
          </Button>
          <Button
            size="sm"
            variant="ghost"
            onClick={() => {
              update({ grid: emptyGrid(table.columns, Math.min(table.rowCount, 12), table.presetRows) });
              setResult(null);
              setNote(null);
            }}
          >
            Clear the readings
          </Button>
        </div>
        <div aria-live="polite" className="text-sm">
          {note ? <p className="text-muted">{note}</p> : null}
          {problems.length ? <p className="font-semibold text-bad">{problems.map((p) => p.message).join(" ")}</p> : null}
        </div>
        <fieldset className="flex flex-col gap-2">
          <legend className="font-semibold">A student’s answer</legend>
          {perRow ? <p className="text-sm text-muted">For this check each row is checked: type the student’s answers in the answer column of the readings above.</p> : null}
          <div className="grid gap-3 sm:grid-cols-2">
            {perRow ? null : (
              <div className="flex flex-col gap-1">
                <label htmlFor={`${baseId}-value`} className="text-sm font-semibold">
                  Value, as typed
                </label>
                <Input id={`${baseId}-value`} inputMode="decimal" value={input.value} onChange={(e) => update({ value: e.target.value })} placeholder="for example 0.45" />
              </div>
            )}
            <div className="flex flex-col gap-1">
              <label htmlFor={`${baseId}-unit`} className="text-sm font-semibold">
                Unit, as typed
              </label>
              <Input id={`${baseId}-unit`} value={input.unit} onChange={(e) => update({ unit: e.target.value })} placeholder="for example cm³/s" />
            </div>
          </div>
          {check.kind === "rate-at" ? (
            <fieldset className="flex flex-col gap-1">
              <legend className="text-sm font-semibold">The student’s tangent (optional): two points on the drawn line</legend>
              <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
                {(["x1", "y1", "x2", "y2"] as const).map((k) => (
                  <div key={k} className="flex flex-col gap-1">
                    <label htmlFor={`${baseId}-${k}`} className="text-sm">
                      {k[0]}
                      <sub>{k[1]}</sub>
                    </label>
                    <Input id={`${baseId}-${k}`} inputMode="decimal" value={input.tangent[k]} onChange={(e) => update({ tangent: { ...input.tangent, [k]: e.target.value } })} />
                  </div>
                ))}
              </div>
            </fieldset>
          ) : null}
        </fieldset>
        <div>
          <Button size="sm" onClick={run} disabled={busy} aria-describedby={`${baseId}-outcome`}>
            {busy ? "Checking…" : "Check this answer"}
          </Button>
        </div>
        <div id={`${baseId}-outcome`} aria-live="polite" className="flex flex-col gap-2" data-testid={`check-preview-${index}`}>
          {error ? <p className="font-semibold text-bad">{error}</p> : null}
          {result ? <PreviewOutcome result={result} /> : null}
        </div>
      </div>
    </details>
  );
}

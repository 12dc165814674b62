"use client";

import type { ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import type { CheckSpec, GraphSpec, TableTemplate } from "@/lib/validation/practicals";
import { answerFingerprint, isStale } from "@/lib/write-ups/stale";
import { cn } from "@/lib/utils";
import { checkInstructions, isPerRowCheck, isTangentCheck } from "./check-words";
import type { CheckStateJson } from "./types";
import { VerdictBadge } from "./verdict";

export type TangentPoints = { x1: number; y1: number; x2: number; y2: number };

/**
 * A check result with the fingerprints of the data and answer it was run on. `basis` is null
 * when the server already said the result was stale when the page loaded (it stays stale until
 * the check runs again).
 */
export type CheckResultEntry = { state: CheckStateJson; basis: { dataHash: string; answerHash: string } | null };

/** Whether a result no longer describes the work: the same rule the server applies, run here as the student types. */
export function resultIsStale(entry: CheckResultEntry | null | undefined, dataHash: string, answer: { value: string; unit: string; tangent?: TangentPoints | null }): boolean {
  if (!entry) return false;
  if (!entry.basis) return true;
  return isStale(entry.basis, { dataHash, answerHash: answerFingerprint(answer) });
}

const fmt = (n: number) => String(Number(n.toPrecision(4)));

/** Common units offered as suggestions while typing (any unit may be typed). */
const UNIT_SUGGESTIONS = ["cm³/s", "cm³ s⁻¹", "g/s", "s⁻¹", "mol/dm³/s", "kJ/mol", "J/mol", "%", "Ω", "m/s²"];

/**
 * One calculation check: what to work out, the answer and its unit, the working, a Check
 * button, and the latest verdict in words with its icon. The verdict is marked "needs checking
 * again" the moment the data or the answer differ from what it was run on.
 */
export function CheckPanel({
  spec,
  table,
  graph,
  answer,
  tangent,
  dataHash,
  result,
  readOnly = false,
  busy = false,
  error = null,
  onAnswerChange,
  onCheck,
  working,
  rowHasData,
}: {
  spec: CheckSpec;
  table: TableTemplate | undefined;
  /** The graph a tangent check reads its tangent from. */
  graph: GraphSpec | null;
  answer: { value: string; unit: string };
  /** The tangent drawn on the bound graph (tangent checks only). */
  tangent: TangentPoints | null;
  /** Fingerprint of the data this check reads, as they are now. */
  dataHash: string;
  result: CheckResultEntry | null;
  readOnly?: boolean;
  busy?: boolean;
  error?: string | null;
  onAnswerChange?: (next: { value: string; unit: string }) => void;
  onCheck?: () => void;
  /** The working, written in the rich editor (or shown read-only). */
  working?: ReactNode;
  /** Per-row checks: whether a row of the table has any reading, so empty rows are not listed. */
  rowHasData?: (index: number) => boolean;
}) {
  const base = `check-${spec.id}`;
  const perRow = isPerRowCheck(spec);
  const tangentCheck = isTangentCheck(spec);
  const sent = perRow ? { value: "", unit: "" } : { value: answer.value, unit: answer.unit, tangent: tangentCheck ? tangent : undefined };
  const stale = resultIsStale(result, dataHash, sent);
  const state = result?.state ?? null;
  const rows = state?.rows?.filter((r) => r.verdict !== "cannot-check" || !rowHasData || rowHasData(r.index)) ?? null;

  return (
    <section aria-labelledby={`${base}-title`} className="flex flex-col gap-3 rounded-lg border border-line bg-surface p-4" data-check-id={spec.id}>
      <div>
        <h3 id={`${base}-title`} className="text-lg font-bold">
          {spec.label}
        </h3>
        <p id={`${base}-how`} className="text-[0.97rem] text-muted">
          {checkInstructions(spec, table, graph)}
        </p>
      </div>

      {tangentCheck ? (
        <p className="text-[0.97rem]" data-testid={`${base}-tangent`}>
          {tangent ? (
            <>
              Your tangent{graph ? ` on “${graph.title}”` : ""} runs from ({fmt(tangent.x1)}, {fmt(tangent.y1)}) to ({fmt(tangent.x2)}, {fmt(tangent.y2)}).
            </>
          ) : (
            <>
              You have not drawn a tangent yet{graph ? (
                <>
                  {" "}
                  on <a href={`#graph-${graph.id}`}>“{graph.title}”</a>
                </>
              ) : null}
              . Draw it first: the check reads it.
            </>
          )}
        </p>
      ) : null}

      {perRow ? null : readOnly ? (
        <p>
          <span className="font-semibold">Your answer: </span>
          {answer.value.trim() ? `${answer.value}${answer.unit.trim() ? ` ${answer.unit}` : ""}` : <span className="text-muted">not given</span>}
        </p>
      ) : (
        <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-3">
          <div className="flex flex-col gap-1">
            <label htmlFor={`${base}-value`} className="font-semibold">
              Your answer
            </label>
            <Input
              id={`${base}-value`}
              value={answer.value}
              autoComplete="off"
              spellCheck={false}
              maxLength={40}
              aria-describedby={`${base}-how`}
              onChange={(e) => onAnswerChange?.({ value: e.target.value, unit: answer.unit })}
            />
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${base}-unit`} className="font-semibold">
              Unit
            </label>
            <Input
              id={`${base}-unit`}
              value={answer.unit}
              autoComplete="off"
              spellCheck={false}
              maxLength={40}
              list={`${base}-units`}
              onChange={(e) => onAnswerChange?.({ value: answer.value, unit: e.target.value })}
            />
            <datalist id={`${base}-units`}>
              {UNIT_SUGGESTIONS.map((u) => (
                <option key={u} value={u} />
              ))}
            </datalist>
          </div>
        </div>
      )}

      {working}

      {readOnly ? null : (
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={onCheck} disabled={busy} aria-describedby={`${base}-result`}>
            {busy ? "Saving and checking…" : perRow ? "Check my column" : "Check"}
          </Button>
          {state ? <span className="text-sm text-muted" suppressHydrationWarning>Last checked {new Date(state.ranAt).toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" })}</span> : null}
        </div>
      )}

      <div id={`${base}-result`} aria-live="polite" className="flex flex-col gap-2">
        {error ? (
          <p role="alert" className="font-semibold text-bad">
            {error}
          </p>
        ) : null}
        {state ? (
          <div className={cn("flex flex-col gap-2 rounded-md border p-3", stale ? "border-warn/50 bg-warn-soft" : "border-line bg-paper")} data-testid={`${base}-verdict`}>
            {stale ? (
              <p className="flex items-start gap-2 font-semibold text-warn" data-testid={`${base}-stale`}>
                <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0">
                  <path d="M15.5 7A6 6 0 1 0 16 11.5" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
                  <path d="M16.4 2.8 15.9 7.4 11.4 6.8" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
                </svg>
                <span>Needs checking again: your results or your answer changed after this check{readOnly ? "." : ", so press Check again."}</span>
              </p>
            ) : null}
            <p className="flex flex-wrap items-center gap-2">
              <span className="font-semibold">{stale ? "Last check:" : "Check:"}</span>
              <VerdictBadge verdict={state.verdict} muted={stale} />
            </p>
            {state.hint ? <p className={cn(stale && "text-muted")}>{state.hint}</p> : null}
            {state.expected ? (
              <p>
                <span className="font-semibold">Expected from your data: </span>
                {fmt(state.expected.value)}
                {state.expected.unit ? ` ${state.expected.unit}` : ""}
              </p>
            ) : null}
            {rows && rows.length ? (
              <ol className="flex flex-col gap-1" aria-label="Each row">
                {rows.map((r) => (
                  <li key={r.index} className="flex flex-wrap items-center gap-2">
                    <span className="w-16 font-semibold">Row {r.index + 1}</span>
                    <VerdictBadge verdict={r.verdict} muted={stale} className="text-sm" />
                  </li>
                ))}
              </ol>
            ) : null}
          </div>
        ) : readOnly ? (
          <p className="text-muted">Not checked.</p>
        ) : null}
      </div>
    </section>
  );
}

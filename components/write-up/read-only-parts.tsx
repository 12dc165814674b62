"use client";

import type { ReactNode } from "react";
import type { CheckSpec, GraphSpec, TableTemplate } from "@/lib/validation/practicals";
import type { FilledTable } from "@/lib/validation/write-ups";
import { answerFingerprint, checkDataFingerprint } from "@/lib/write-ups/stale";
import { CheckPanel } from "./check-panel";
import { isTangentCheck } from "./check-words";
import { EMPTY_TABLE, rowHasReading } from "./content-helpers";
import { ResultsGrid } from "./results-grid";
import type { CheckStateJson } from "./types";

const ignore = () => undefined;

/** A results table shown, not edited (handed-in work and the staff view). */
export function ReadOnlyGrid({ table, value }: { table: TableTemplate; value: FilledTable | undefined }) {
  return <ResultsGrid table={table} value={value ?? EMPTY_TABLE} onChange={ignore} readOnly id={`grid-${table.id}`} />;
}

/** A calculation check with the student's answer and its latest verdict, read-only. */
export function ReadOnlyCheck({
  spec,
  table,
  graph,
  tables,
  answer,
  state,
  working,
}: {
  spec: CheckSpec;
  table: TableTemplate | undefined;
  graph: GraphSpec | null;
  tables: Record<string, FilledTable>;
  answer: { value: string; unit: string; tangent?: { x1: number; y1: number; x2: number; y2: number } | null } | undefined;
  state: CheckStateJson | undefined;
  working: ReactNode;
}) {
  const dataHash = checkDataFingerprint(spec, tables);
  const a = { value: answer?.value ?? "", unit: answer?.unit ?? "" };
  const tangent = isTangentCheck(spec) ? (answer?.tangent ?? null) : null;
  // The server says whether the result is stale; read-only work cannot change, so that stands.
  const basis = state && !state.stale ? { dataHash, answerHash: answerFingerprint(answer) } : null;
  return (
    <CheckPanel
      spec={spec}
      table={table}
      graph={graph}
      answer={a}
      tangent={tangent}
      dataHash={dataHash}
      result={state ? { state, basis } : null}
      readOnly
      working={working}
      rowHasData={(i) => rowHasReading(table, tables[spec.tableId], i)}
    />
  );
}

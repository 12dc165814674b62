"use client";

import { Button } from "@/components/ui/button";
import type { GraphSpec, TableTemplate } from "@/lib/validation/practicals";
import { cn } from "@/lib/utils";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { fieldDomId, type Draft } from "../../draft";
import { newPartId } from "../../ids";
import { columnHeader } from "../../units";
import { CheckboxField, ChoiceGroup, PathErrors, SelectField, TextField, useErrorsUnder } from "../fields";
import { changeContent, removeAt, replaceAt, type Change } from "../state";

const FITS: { value: GraphSpec["fit"]; label: string; hint: string }[] = [
  { value: "line", label: "Straight line of best fit", hint: "When the points should lie on a line (a gradient to find)." },
  { value: "curve", label: "Smooth curve of best fit", hint: "When the rate changes, for example gas collected over time." },
  { value: "none", label: "No line", hint: "Points only." },
];

/** Sensible axes for a table: the independent variable across, the first measured (or mean) column up. */
export function defaultAxes(table: TableTemplate | undefined): { xColumn: string; yColumn: string } {
  const x = table?.columns.find((c) => c.role === "independent") ?? table?.columns[0];
  const y = table?.columns.find((c) => c.id !== x?.id && (c.role === "mean" || c.role === "derived")) ?? table?.columns.find((c) => c.id !== x?.id && c.role === "dependent") ?? table?.columns.find((c) => c.id !== x?.id);
  return { xColumn: x?.id ?? "", yColumn: y?.id ?? "" };
}

function GraphCard({ graph, index, tables, onChange, onRemove }: { graph: GraphSpec; index: number; tables: TableTemplate[]; onChange: (g: GraphSpec) => void; onRemove: () => void }) {
  const base = `content.graphs.${index}`;
  const problems = useErrorsUnder(base);
  const table = tables.find((t) => t.id === graph.tableId);
  const columns = (table?.columns ?? []).map((c) => ({ value: c.id, label: columnHeader(c) }));
  return (
    <li id={fieldDomId(base)} tabIndex={-1} className={cn("flex flex-col gap-4 rounded-lg border bg-surface p-4", problems ? "border-warn" : "border-line")}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-lg font-bold">
          Graph {index + 1}
          {graph.title.trim() ? <span className="font-normal text-muted">: {graph.title}</span> : null}
        </h3>
        <ConfirmButton tone="caution" size="sm" label="Remove graph" variant="ghost" question={`Remove graph ${index + 1}?`} confirmLabel="Yes, remove it" onConfirm={onRemove} />
      </div>
      <TextField path={`${base}.title`} label="Graph title" hint="For example “Volume of gas against time”." value={graph.title} onChange={(title) => onChange({ ...graph, title })} />
      <SelectField
        path={`${base}.tableId`}
        label="Data from the table"
        value={graph.tableId}
        placeholder="Choose a table…"
        options={tables.map((t, i) => ({ value: t.id, label: t.title.trim() || `Table ${i + 1}` }))}
        onChange={(tableId) => onChange({ ...graph, tableId, ...defaultAxes(tables.find((t) => t.id === tableId)) })}
      />
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField path={`${base}.xColumn`} label="x-axis (across)" hint="Usually the independent variable." value={graph.xColumn} placeholder="Choose a column…" options={columns} onChange={(xColumn) => onChange({ ...graph, xColumn })} />
        <SelectField path={`${base}.yColumn`} label="y-axis (up)" value={graph.yColumn} placeholder="Choose a column…" options={columns} onChange={(yColumn) => onChange({ ...graph, yColumn })} />
      </div>
      <ChoiceGroup path={`${base}.fit`} legend="Line of best fit">
        {FITS.map((f) => (
          <label key={f.value} className="flex min-h-11 items-start gap-2 py-1">
            <input type="radio" name={`${base}-fit`} className="mt-1 size-5 accent-brand" checked={graph.fit === f.value} onChange={() => onChange({ ...graph, fit: f.value })} />
            <span>
              <span className="block">{f.label}</span>
              <span className="block text-sm text-muted">{f.hint}</span>
            </span>
          </label>
        ))}
      </ChoiceGroup>
      <div className="grid gap-1 sm:grid-cols-2">
        <CheckboxField id={`${fieldDomId(base)}-origin`} label="Through the origin" hint="The line must pass through (0, 0)." checked={graph.throughOrigin} onChange={(throughOrigin) => onChange({ ...graph, throughOrigin })} />
        <CheckboxField id={`${fieldDomId(base)}-tangents`} label="Students draw tangents" hint="For rates at chosen times." checked={graph.tangents} onChange={(tangents) => onChange({ ...graph, tangents })} />
      </div>
    </li>
  );
}

export function GraphsSection({ draft, change, onGoToTables }: { draft: Draft; change: Change; onGoToTables: () => void }) {
  const { graphs, tables } = draft.content;
  return (
    <div className="flex flex-col gap-4">
      <div id={fieldDomId("content.graphs")} tabIndex={-1}>
        <PathErrors path="content.graphs" />
      </div>
      {tables.length === 0 ? (
        <p className="text-muted">
          Graphs plot the columns of a results table.{" "}
          <a
            href="#tables"
            onClick={(e) => {
              e.preventDefault();
              onGoToTables();
            }}
          >
            Add a results table first
          </a>
          .
        </p>
      ) : null}
      {graphs.length ? (
        <ol className="flex flex-col gap-5">
          {graphs.map((g, i) => (
            <GraphCard
              key={g.id}
              graph={g}
              index={i}
              tables={tables}
              onChange={(next) => changeContent(change, "graphs", (list) => replaceAt(list, i, next))}
              onRemove={() => changeContent(change, "graphs", (list) => removeAt(list, i))}
            />
          ))}
        </ol>
      ) : tables.length ? (
        <p className="text-muted">No graphs yet.</p>
      ) : null}
      <div>
        <Button
          variant="secondary"
          disabled={graphs.length >= 6 || tables.length === 0}
          onClick={() =>
            changeContent(change, "graphs", (list) => {
              const t = tables[0];
              return [...list, { id: newPartId("gr", list.map((g) => g.id)), title: "", tableId: t?.id ?? "", ...defaultAxes(t), fit: "curve", throughOrigin: false, tangents: false }];
            })
          }
        >
          Add a graph
        </Button>
      </div>
    </div>
  );
}

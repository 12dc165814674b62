"use client";

import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { COLUMN_ROLE_LABELS, COLUMN_ROLES, DERIVED_FORMULA_LABELS, DERIVED_FORMULAS, type ColumnTemplate, type TableTemplate } from "@/lib/validation/practicals";
import { cn } from "@/lib/utils";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { fieldDomId, type Draft } from "../../draft";
import { newPartId } from "../../ids";
import { parseTypedNumber } from "../../numbers";
import { COMMON_UNITS, columnHeader } from "../../units";
import { ChoiceGroup, NumberField, PathErrors, SelectField, TextField, useErrorsUnder, useFieldErrors } from "../fields";
import { changeContent, moveBy, removeAt, replaceAt, type Change } from "../state";

/** Decimal places that match an instrument's resolution: 0.01 g → 2, 1 cm³ → 0, 0.5 → 1. */
export function decimalPlacesFor(resolution: number | null | undefined): number | null {
  if (resolution == null || !Number.isFinite(resolution) || resolution <= 0) return null;
  for (let dp = 0; dp <= 6; dp++) {
    const scaled = resolution * 10 ** dp;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-9) return dp;
  }
  return 6;
}

export function blankColumn(taken: string[], role: ColumnTemplate["role"] = "dependent"): ColumnTemplate {
  return { id: newPartId("col", taken), quantity: "", symbol: "", unit: "", role, resolution: null, decimalPlaces: null, rangeMin: null, rangeMax: null, meanOf: [], derivedFrom: null, formula: null };
}

export function blankTable(taken: string[]): TableTemplate {
  const time = blankColumn([], "independent");
  const measured = blankColumn([time.id], "dependent");
  return { id: newPartId("tbl", taken), title: "", rowCount: 8, presetRows: [], columns: [time, measured] };
}

/** Removes a column and every reference to it inside its own table (means, derived columns, planned values). */
export function removeColumn(table: TableTemplate, index: number): TableTemplate {
  const gone = table.columns[index]?.id;
  const columns = removeAt(table.columns, index).map((c) => ({
    ...c,
    meanOf: c.meanOf.filter((id) => id !== gone),
    derivedFrom: c.derivedFrom === gone ? null : c.derivedFrom,
  }));
  const presetRows = table.presetRows.map((r) => Object.fromEntries(Object.entries(r).filter(([k]) => k !== gone)));
  return { ...table, columns, presetRows: trimPresetRows(presetRows) };
}

function trimPresetRows(rows: Record<string, number | null>[]): Record<string, number | null>[] {
  const out = [...rows];
  while (out.length && Object.values(out[out.length - 1]!).every((v) => v === null)) out.pop();
  return out;
}

/** Reads "0, 10, 20, 30" (commas, semicolons, spaces or line breaks between). Non-numbers come back as NaN. */
export function parsePlannedValues(text: string): number[] {
  return text
    .split(/[,;\s]+/)
    .map((t) => t.trim())
    .filter(Boolean)
    .map((t) => {
      const n = parseTypedNumber(t);
      return n === null ? Number.NaN : n;
    });
}

/** Puts one column's planned values into the table's preset rows, leaving other columns' values alone. */
export function setPlannedValues(table: TableTemplate, columnId: string, values: number[]): TableTemplate {
  const length = Math.max(values.length, table.presetRows.length);
  const rows = Array.from({ length }, (_, i) => ({ ...(table.presetRows[i] ?? {}), [columnId]: i < values.length ? values[i]! : null }));
  return { ...table, presetRows: trimPresetRows(rows) };
}

function PlannedValuesField({ table, tableIndex, column, onChange }: { table: TableTemplate; tableIndex: number; column: ColumnTemplate; onChange: (t: TableTemplate) => void }) {
  const id = useId();
  const stored = table.presetRows.map((r) => r[column.id]).filter((v): v is number => typeof v === "number");
  const [text, setText] = useState(stored.join(", "));
  const errors = useFieldErrors(`content.tables.${tableIndex}.presetRows`);
  const values = parsePlannedValues(text);
  const local: string[] = [];
  if (values.some((v) => Number.isNaN(v))) local.push("Planned values must be numbers, separated by commas.");
  if (values.length > table.rowCount) local.push(`There are ${values.length} values but only ${table.rowCount} rows: add rows or remove values.`);
  const shown = local.length ? local : errors;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        Planned values of {columnHeader(column)} <span className="font-normal text-muted">(optional)</span>
      </label>
      <p id={`${id}-hint`} className="text-sm text-muted">
        Filled in for students, one per row, for example “0, 10, 20, 30, 40”.
      </p>
      <Input
        id={id}
        value={text}
        inputMode="decimal"
        aria-describedby={`${id}-hint${shown ? ` ${id}-error` : ""}`}
        aria-invalid={shown ? true : undefined}
        onChange={(e) => {
          setText(e.target.value);
          onChange(setPlannedValues(table, column.id, parsePlannedValues(e.target.value)));
        }}
      />
      {shown ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-bad" aria-live="polite">
          {shown.join(" ")}
        </p>
      ) : null}
    </div>
  );
}

function ColumnEditor({
  table,
  tableIndex,
  column,
  index,
  onChange,
  onMove,
  onRemove,
}: {
  table: TableTemplate;
  tableIndex: number;
  column: ColumnTemplate;
  index: number;
  onChange: (c: ColumnTemplate) => void;
  onMove: (by: number) => void;
  onRemove: () => void;
}) {
  const base = `content.tables.${tableIndex}.columns.${index}`;
  const problems = useErrorsUnder(base);
  const unitListId = useId();
  const others = table.columns.filter((c) => c.id !== column.id);
  const suggestedDp = decimalPlacesFor(column.resolution);
  const set = (patch: Partial<ColumnTemplate>) => onChange({ ...column, ...patch });
  return (
    <li id={fieldDomId(base)} tabIndex={-1} className={cn("flex flex-col gap-3 rounded-md border bg-paper p-3", problems ? "border-warn" : "border-line")}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h4 className="font-bold">
          Column {index + 1}: <span className="font-normal">{columnHeader(column)}</span>
        </h4>
        <div className="flex flex-wrap gap-1">
          <Button size="sm" variant="ghost" disabled={index === 0} onClick={() => onMove(-1)} aria-label={`Move column ${index + 1} left`}>
            ← Move left
          </Button>
          <Button size="sm" variant="ghost" disabled={index === table.columns.length - 1} onClick={() => onMove(1)} aria-label={`Move column ${index + 1} right`}>
            Move right →
          </Button>
          <Button size="sm" variant="ghost" onClick={onRemove} disabled={table.columns.length <= 1} aria-label={`Remove column ${index + 1}${column.quantity.trim() ? ` (${columnHeader(column)})` : ""}`}>
            Remove
          </Button>
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField path={`${base}.quantity`} label="Quantity" hint="For example “time”." value={column.quantity} onChange={(quantity) => set({ quantity })} className="lg:col-span-2" />
        <TextField path={`${base}.symbol`} label="Symbol" hint="Optional, like t." value={column.symbol} onChange={(symbol) => set({ symbol })} />
        <TextField
          path={`${base}.unit`}
          label="Unit"
          hint="Type or pick one."
          value={column.unit}
          onChange={(unit) => set({ unit })}
          inputProps={{ list: unitListId, autoComplete: "off" }}
        />
        <datalist id={unitListId}>
          {COMMON_UNITS.map((u) => (
            <option key={u} value={u} />
          ))}
        </datalist>
      </div>
      <div className="flex flex-wrap gap-1" aria-label={`Common units for column ${index + 1}`} role="group">
        {COMMON_UNITS.map((u) => (
          <button
            key={u}
            type="button"
            aria-pressed={column.unit === u}
            onClick={() => set({ unit: u })}
            className={cn("min-h-8 rounded border px-2 text-sm", column.unit === u ? "border-brand bg-brand-soft font-bold text-brand-strong" : "border-line bg-surface hover:border-brand")}
          >
            {u}
          </button>
        ))}
      </div>
      <SelectField
        path={`${base}.role`}
        label="What this column holds"
        value={column.role}
        options={COLUMN_ROLES.map((r) => ({ value: r, label: COLUMN_ROLE_LABELS[r] }))}
        onChange={(role) => set({ role, meanOf: role === "mean" ? column.meanOf : [], derivedFrom: role === "derived" ? column.derivedFrom : null, formula: role === "derived" ? column.formula : null })}
      />
      {column.role === "mean" ? (
        <ChoiceGroup path={`${base}.meanOf`} legend="Mean of which columns?" hint="Tick the repeat readings this column averages (at least two).">
          {others.length ? (
            others.map((o) => (
              <label key={o.id} className="flex min-h-11 items-center gap-2">
                <input
                  type="checkbox"
                  className="size-5 accent-brand"
                  checked={column.meanOf.includes(o.id)}
                  onChange={(e) => set({ meanOf: e.target.checked ? table.columns.filter((c) => c.id === o.id || column.meanOf.includes(c.id)).map((c) => c.id) : column.meanOf.filter((m) => m !== o.id) })}
                />
                {columnHeader(o)} <span className="text-sm text-muted">({COLUMN_ROLE_LABELS[o.role].replace(/ \(.*\)$/, "").toLowerCase()})</span>
              </label>
            ))
          ) : (
            <p className="text-sm text-muted">Add the repeat columns first.</p>
          )}
        </ChoiceGroup>
      ) : null}
      {column.role === "derived" ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField
            path={`${base}.formula`}
            label="Calculated as"
            value={column.formula ?? ""}
            options={DERIVED_FORMULAS.map((f) => ({ value: f, label: DERIVED_FORMULA_LABELS[f] }))}
            onChange={(formula) => set({ formula })}
          />
          <SelectField
            path={`${base}.derivedFrom`}
            label="From the column"
            value={column.derivedFrom ?? ""}
            options={others.map((o) => ({ value: o.id, label: columnHeader(o) }))}
            onChange={(derivedFrom) => set({ derivedFrom })}
          />
        </div>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <NumberField
          path={`${base}.resolution`}
          label="Instrument resolution"
          hint="Its smallest step."
          unit={column.unit || undefined}
          value={column.resolution}
          onChange={(resolution) => set({ resolution })}
        />
        <div className="flex flex-col gap-1">
          <NumberField path={`${base}.decimalPlaces`} label="Decimal places" hint="For every value." value={column.decimalPlaces} onChange={(decimalPlaces) => set({ decimalPlaces })} />
          {suggestedDp !== null && column.decimalPlaces !== suggestedDp ? (
            <Button size="sm" variant="ghost" className="self-start" onClick={() => set({ decimalPlaces: suggestedDp })}>
              Use {suggestedDp} (matches the resolution)
            </Button>
          ) : null}
        </div>
        <NumberField path={`${base}.rangeMin`} label="Lowest reading" hint="Optional." unit={column.unit || undefined} value={column.rangeMin} onChange={(rangeMin) => set({ rangeMin })} />
        <NumberField path={`${base}.rangeMax`} label="Highest reading" hint="Optional." unit={column.unit || undefined} value={column.rangeMax} onChange={(rangeMax) => set({ rangeMax })} />
      </div>
      <p className="-mt-1 text-sm text-muted">The lowest and highest readings are the instrument&apos;s range: readings outside it are flagged in students&apos; tables.</p>
    </li>
  );
}

/** The header row as students will see it, live as the columns change. */
export function HeaderPreview({ table }: { table: TableTemplate }) {
  return (
    <figure className="flex flex-col gap-1">
      <figcaption className="font-semibold">Preview of the header row</figcaption>
      <div className="overflow-x-auto rounded-md border border-line bg-surface">
        <table className="w-full border-collapse text-left">
          <thead>
            <tr>
              {table.columns.map((c) => (
                <th key={c.id} scope="col" className="border-b border-r border-line bg-sunken px-3 py-2 font-semibold last:border-r-0">
                  {columnHeader(c)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {[0, 1].map((r) => (
              <tr key={r}>
                {table.columns.map((c) => {
                  const v = table.presetRows[r]?.[c.id];
                  return (
                    <td key={c.id} className="h-9 border-t border-r border-line px-3 last:border-r-0">
                      {typeof v === "number" ? v : ""}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </figure>
  );
}

function TableCard({ table, index, onChange, onRemove, usedBy }: { table: TableTemplate; index: number; onChange: (t: TableTemplate) => void; onRemove: () => void; usedBy: number }) {
  const base = `content.tables.${index}`;
  const problems = useErrorsUnder(base);
  const independents = table.columns.filter((c) => c.role === "independent");
  return (
    <li id={fieldDomId(base)} tabIndex={-1} className={cn("flex flex-col gap-4 rounded-lg border bg-surface p-4", problems ? "border-warn" : "border-line")}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-lg font-bold">
          Table {index + 1}
          {table.title.trim() ? <span className="font-normal text-muted">: {table.title}</span> : null}
        </h3>
        <ConfirmButton
          tone="caution"
          size="sm"
          label="Remove table"
          variant="ghost"
          question={`Remove table ${index + 1}${table.title.trim() ? ` (${table.title.trim()})` : ""}?${usedBy ? ` ${usedBy} graph${usedBy === 1 ? "" : "s"} or check${usedBy === 1 ? "" : "s"} use it and will need another table.` : ""}`}
          confirmLabel="Yes, remove it"
          onConfirm={onRemove}
        />
      </div>
      <TextField path={`${base}.title`} label="Table title" hint="For example “Volume of gas collected over time”." value={table.title} onChange={(title) => onChange({ ...table, title })} />
      <HeaderPreview table={table} />
      <section aria-label={`Columns of table ${index + 1}`} className="flex flex-col gap-3">
        <h4 className="font-bold">Columns</h4>
        <p className="-mt-2 text-sm text-muted">The independent variable usually goes first. Headers show as “quantity / unit”; units never go in the cells.</p>
        <div id={fieldDomId(`${base}.columns`)} tabIndex={-1}>
          <PathErrors path={`${base}.columns`} />
        </div>
        <ol className="flex flex-col gap-3">
          {table.columns.map((c, ci) => (
            <ColumnEditor
              key={c.id}
              table={table}
              tableIndex={index}
              column={c}
              index={ci}
              onChange={(next) => onChange({ ...table, columns: replaceAt(table.columns, ci, next) })}
              onMove={(by) => onChange({ ...table, columns: moveBy(table.columns, ci, by) })}
              onRemove={() => onChange(removeColumn(table, ci))}
            />
          ))}
        </ol>
        <div className="flex flex-wrap gap-2">
          <Button size="sm" variant="secondary" disabled={table.columns.length >= 14} onClick={() => onChange({ ...table, columns: [...table.columns, blankColumn(table.columns.map((c) => c.id))] })}>
            Add a column
          </Button>
          <Button
            size="sm"
            variant="secondary"
            disabled={table.columns.length + 4 > 14}
            onClick={() => {
              const ids = table.columns.map((c) => c.id);
              const repeats = [1, 2, 3].map(() => {
                const col = { ...blankColumn(ids, "repeat") };
                ids.push(col.id);
                return col;
              });
              const mean = { ...blankColumn(ids, "mean"), meanOf: repeats.map((r) => r.id) };
              onChange({ ...table, columns: [...table.columns, ...repeats, mean] });
            }}
          >
            Add three repeats and a mean
          </Button>
        </div>
      </section>
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField path={`${base}.rowCount`} label="Number of rows" hint="From 1 to 60." value={table.rowCount} onChange={(n) => onChange({ ...table, rowCount: n ?? Number.NaN })} />
      </div>
      {independents.map((c) => (
        <PlannedValuesField key={c.id} table={table} tableIndex={index} column={c} onChange={onChange} />
      ))}
      <div id={fieldDomId(`${base}.presetRows`)} tabIndex={-1}>
        {independents.length ? null : <PathErrors path={`${base}.presetRows`} />}
      </div>
    </li>
  );
}

export function TablesSection({ draft, change }: { draft: Draft; change: Change }) {
  const tables = draft.content.tables;
  const usage = (id: string) => draft.content.graphs.filter((g) => g.tableId === id).length + draft.content.checks.filter((c) => c.tableId === id).length;
  return (
    <div className="flex flex-col gap-4">
      <div id={fieldDomId("content.tables")} tabIndex={-1}>
        <PathErrors path="content.tables" />
      </div>
      {tables.length ? (
        <ol className="flex flex-col gap-5">
          {tables.map((t, i) => (
            <TableCard
              key={t.id}
              table={t}
              index={i}
              usedBy={usage(t.id)}
              onChange={(next) => changeContent(change, "tables", (list) => replaceAt(list, i, next))}
              onRemove={() => changeContent(change, "tables", (list) => removeAt(list, i))}
            />
          ))}
        </ol>
      ) : (
        <p className="text-muted">No results table yet. Students fill these in during the practical; graphs and calculation checks read from them.</p>
      )}
      <div>
        <Button variant="secondary" disabled={tables.length >= 4} onClick={() => changeContent(change, "tables", (list) => [...list, blankTable(list.map((t) => t.id))])}>
          Add a results table
        </Button>
      </div>
    </div>
  );
}

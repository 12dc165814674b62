"use client";

import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Select } from "@/components/ui/field";
import { CHECK_KINDS, CHECK_VISIBILITY, type CheckKind, type CheckSpec, type TableTemplate } from "@/lib/validation/practicals";
import { cn } from "@/lib/utils";
import { CHECK_COLUMN_FIELDS, CHECK_KIND_HINTS, CHECK_KIND_LABELS, CHECK_VISIBILITY_LABELS, DEFAULT_TOLERANCE, changeCheckKind, makeCheck, moveCheckToTable, suggestedUnit } from "../../check-kinds";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { fieldDomId, type Draft } from "../../draft";
import { newPartId } from "../../ids";
import { COMMON_UNITS, columnHeader } from "../../units";
import { CheckPreview } from "../check-preview";
import { CheckboxField, ChoiceGroup, NumberField, PathErrors, SelectField, TextField, useErrorsUnder } from "../fields";
import { changeContent, moveBy, removeAt, replaceAt, type Change } from "../state";

const MODEL_LABELS = {
  auto: "Let Meniscus choose (recommended)",
  "first-order": "A first-order rise or decay",
  polynomial: "A smooth polynomial",
  local: "A local fit around the time",
} as const;

type AnyCheck = CheckSpec & Record<string, unknown>;

function withField(check: CheckSpec, field: string, value: unknown): CheckSpec {
  return { ...(check as AnyCheck), [field]: value } as CheckSpec;
}

function ColumnBindings({ check, base, table, onChange }: { check: CheckSpec; base: string; table: TableTemplate | undefined; onChange: (c: CheckSpec) => void }) {
  const columns = table?.columns ?? [];
  const options = columns.map((c) => ({ value: c.id, label: columnHeader(c) }));
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      {CHECK_COLUMN_FIELDS[check.kind].map(({ field, label, many }) => {
        const value = (check as AnyCheck)[field];
        if (many) {
          const chosen = Array.isArray(value) ? (value as string[]) : [];
          return (
            <ChoiceGroup key={field} path={`${base}.${field}`} legend={label} hint="Tick at least two." className="sm:col-span-2">
              {columns.map((c) => (
                <label key={c.id} className="flex min-h-11 items-center gap-2">
                  <input
                    type="checkbox"
                    className="size-5 accent-brand"
                    checked={chosen.includes(c.id)}
                    onChange={(e) => onChange(withField(check, field, e.target.checked ? columns.filter((x) => x.id === c.id || chosen.includes(x.id)).map((x) => x.id) : chosen.filter((id) => id !== c.id)))}
                  />
                  {columnHeader(c)}
                </label>
              ))}
            </ChoiceGroup>
          );
        }
        return (
          <SelectField
            key={field}
            path={`${base}.${field}`}
            label={label}
            value={typeof value === "string" ? value : ""}
            placeholder="Choose a column…"
            options={options}
            onChange={(v) => onChange(withField(check, field, v))}
          />
        );
      })}
    </div>
  );
}

function KindSettings({ check, base, table, onChange }: { check: CheckSpec; base: string; table: TableTemplate | undefined; onChange: (c: CheckSpec) => void }) {
  const unitOf = (id: string) => table?.columns.find((c) => c.id === id)?.unit || undefined;
  switch (check.kind) {
    case "mean-rate":
      return (
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField path={`${base}.from`} label="From x =" unit={unitOf(check.x)} value={check.from} onChange={(n) => onChange({ ...check, from: n ?? Number.NaN })} />
          <NumberField path={`${base}.to`} label="To x =" unit={unitOf(check.x)} value={check.to} onChange={(n) => onChange({ ...check, to: n ?? Number.NaN })} />
        </div>
      );
    case "gradient":
      return <CheckboxField id={`${fieldDomId(base)}-origin`} label="Line through the origin" hint="Fit y = mx with no intercept." checked={check.throughOrigin} onChange={(throughOrigin) => onChange({ ...check, throughOrigin })} />;
    case "rate-at":
      return (
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField path={`${base}.at`} label="Tangent at x =" unit={unitOf(check.x)} value={check.at} onChange={(n) => onChange({ ...check, at: n ?? Number.NaN })} />
          <SelectField
            path={`${base}.model`}
            label="Curve used to work out the rate"
            value={check.model}
            options={(Object.keys(MODEL_LABELS) as (keyof typeof MODEL_LABELS)[]).map((m) => ({ value: m, label: MODEL_LABELS[m] }))}
            onChange={(model) => onChange({ ...check, model })}
          />
        </div>
      );
    case "activation-energy":
      return (
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField
            path={`${base}.temperatureUnit`}
            label="Temperatures are recorded in"
            value={check.temperatureUnit}
            options={[
              { value: "°C", label: "°C (Meniscus converts to K)" },
              { value: "K", label: "K" },
            ]}
            onChange={(temperatureUnit) => onChange({ ...check, temperatureUnit })}
          />
          <SelectField
            path={`${base}.rateIs`}
            label="The rate column holds"
            value={check.rateIs}
            options={[
              { value: "time", label: "A time (rate taken as 1/t)" },
              { value: "rate-constant", label: "A rate constant k" },
            ]}
            onChange={(rateIs) => onChange({ ...check, rateIs })}
          />
        </div>
      );
    case "percentage-uncertainty":
      return (
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField path={`${base}.resolution`} label="Instrument resolution" unit={unitOf(check.reading)} value={check.resolution} onChange={(n) => onChange({ ...check, resolution: n ?? Number.NaN })} />
          <SelectField
            path={`${base}.readingsPerValue`}
            label="Readings for each value"
            value={String(check.readingsPerValue) as "1" | "2"}
            options={[
              { value: "1", label: "One reading" },
              { value: "2", label: "Two readings (start and end), so the uncertainty doubles" },
            ]}
            onChange={(v) => onChange({ ...check, readingsPerValue: v === "2" ? 2 : 1 })}
          />
        </div>
      );
    default:
      return null;
  }
}

function CheckCard({ check, index, count, tables, onChange, onMove, onRemove }: { check: CheckSpec; index: number; count: number; tables: TableTemplate[]; onChange: (c: CheckSpec) => void; onMove: (by: number) => void; onRemove: () => void }) {
  const base = `content.checks.${index}`;
  const problems = useErrorsUnder(base);
  const table = tables.find((t) => t.id === check.tableId);
  const unitListId = useId();
  const suggestion = suggestedUnit(check, table);
  return (
    <li id={fieldDomId(base)} tabIndex={-1} className={cn("flex flex-col gap-4 rounded-lg border bg-surface p-4", problems ? "border-warn" : "border-line")}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-lg font-bold">
          Check {index + 1}: <span className="font-normal">{check.label || CHECK_KIND_LABELS[check.kind]}</span>
        </h3>
        <div className="flex flex-wrap gap-1">
          <Button size="sm" variant="ghost" disabled={index === 0} onClick={() => onMove(-1)} aria-label={`Move check ${index + 1} up`}>
            ↑ Up
          </Button>
          <Button size="sm" variant="ghost" disabled={index === count - 1} onClick={() => onMove(1)} aria-label={`Move check ${index + 1} down`}>
            ↓ Down
          </Button>
          <ConfirmButton tone="caution" size="sm" label="Remove check" variant="ghost" question={`Remove check ${index + 1} (${check.label || CHECK_KIND_LABELS[check.kind]})? Rubric criteria linked to it lose the link.`} confirmLabel="Yes, remove it" onConfirm={onRemove} />
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          path={`${base}.kind`}
          label="What students calculate"
          hint={CHECK_KIND_HINTS[check.kind]}
          value={check.kind}
          options={CHECK_KINDS.map((k) => ({ value: k, label: CHECK_KIND_LABELS[k] }))}
          onChange={(kind) => onChange(changeCheckKind(check, kind, table))}
        />
        <TextField path={`${base}.label`} label="Name students see" hint="For example “Mean rate from 0 to 30 s”." value={check.label} onChange={(label) => onChange({ ...check, label })} />
      </div>
      <SelectField
        path={`${base}.tableId`}
        label="Results table"
        hint="The check reads this table's columns from each student's own data."
        value={check.tableId}
        placeholder="Choose a table…"
        options={tables.map((t, i) => ({ value: t.id, label: t.title.trim() || `Table ${i + 1}` }))}
        onChange={(tableId) => onChange(moveCheckToTable(check, tables.find((t) => t.id === tableId)))}
      />
      <ColumnBindings check={check} base={base} table={table} onChange={onChange} />
      <KindSettings check={check} base={base} table={table} onChange={onChange} />
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <NumberField
            path={`${base}.tolerancePercent`}
            label="Tolerance"
            hint={`How far from Meniscus's value an answer may be and still agree. Usual for this kind: ${DEFAULT_TOLERANCE[check.kind]} %.`}
            unit="%"
            value={check.tolerancePercent}
            onChange={(n) => onChange({ ...check, tolerancePercent: n ?? Number.NaN })}
          />
          {check.tolerancePercent !== DEFAULT_TOLERANCE[check.kind] ? (
            <Button size="sm" variant="ghost" className="self-start" onClick={() => onChange({ ...check, tolerancePercent: DEFAULT_TOLERANCE[check.kind] })}>
              Use the usual {DEFAULT_TOLERANCE[check.kind]} %
            </Button>
          ) : null}
        </div>
        <div className="flex flex-col gap-1">
          <TextField
            path={`${base}.expectedUnit`}
            label="Expected unit"
            hint="Equivalent units are converted, not refused."
            value={check.expectedUnit}
            onChange={(expectedUnit) => onChange({ ...check, expectedUnit })}
            inputProps={{ list: unitListId, autoComplete: "off" }}
          />
          <datalist id={unitListId}>
            {[suggestion, ...COMMON_UNITS, "%", "kJ/mol", "J/mol"].filter((u, i, all) => u && all.indexOf(u) === i).map((u) => (
              <option key={u} value={u} />
            ))}
          </datalist>
          {suggestion && suggestion !== check.expectedUnit ? (
            <Button size="sm" variant="ghost" className="self-start" onClick={() => onChange({ ...check, expectedUnit: suggestion })}>
              Use {suggestion}
            </Button>
          ) : null}
        </div>
      </div>
      <ChoiceGroup path={`${base}.sigFigs`} legend="Significant figures">
        <div className="flex flex-wrap gap-x-5">
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" name={`${base}-sf`} className="size-5 accent-brand" checked={check.sigFigs === null} onChange={() => onChange({ ...check, sigFigs: null })} />
            No rule
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" name={`${base}-sf`} className="size-5 accent-brand" checked={check.sigFigs !== null} onChange={() => onChange({ ...check, sigFigs: { min: 2, max: 3 } })} />
            Between a fewest and a most
          </label>
        </div>
        {check.sigFigs ? (
          <div className="grid max-w-md grid-cols-2 gap-3">
            <NumberField path={`${base}.sigFigs.min`} label="Fewest" value={check.sigFigs.min} onChange={(n) => onChange({ ...check, sigFigs: { ...check.sigFigs!, min: n ?? Number.NaN } })} />
            <NumberField path={`${base}.sigFigs.max`} label="Most" value={check.sigFigs.max} onChange={(n) => onChange({ ...check, sigFigs: { ...check.sigFigs!, max: n ?? Number.NaN } })} />
          </div>
        ) : null}
      </ChoiceGroup>
      <ChoiceGroup path={`${base}.show`} legend="What students see after checking">
        {CHECK_VISIBILITY.map((v) => (
          <label key={v} className="flex min-h-11 items-center gap-2">
            <input type="radio" name={`${base}-show`} className="size-5 accent-brand" checked={check.show === v} onChange={() => onChange({ ...check, show: v })} />
            {CHECK_VISIBILITY_LABELS[v]}
          </label>
        ))}
      </ChoiceGroup>
      <CheckPreview check={check} table={table} index={index} />
    </li>
  );
}

export function ChecksSection({ draft, change, onGoToTables }: { draft: Draft; change: Change; onGoToTables: () => void }) {
  const { checks, tables } = draft.content;
  const [kind, setKind] = useState<CheckKind>("mean-rate");
  return (
    <div className="flex flex-col gap-4">
      <div id={fieldDomId("content.checks")} tabIndex={-1}>
        <PathErrors path="content.checks" />
      </div>
      {tables.length === 0 ? (
        <p className="text-muted">
          Checks recompute students’ calculations from their own results table.{" "}
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
      {checks.length ? (
        <ol className="flex flex-col gap-5">
          {checks.map((c, i) => (
            <CheckCard
              key={c.id}
              check={c}
              index={i}
              count={checks.length}
              tables={tables}
              onChange={(next) => changeContent(change, "checks", (list) => replaceAt(list, i, next))}
              onMove={(by) => changeContent(change, "checks", (list) => moveBy(list, i, by))}
              onRemove={() =>
                change((d) => ({
                  ...d,
                  content: {
                    ...d.content,
                    checks: removeAt(d.content.checks, i),
                    rubric: d.content.rubric ? { ...d.content.rubric, criteria: d.content.rubric.criteria.map((cr) => ({ ...cr, checkIds: cr.checkIds.filter((id) => id !== c.id) })) } : null,
                  },
                }))
              }
            />
          ))}
        </ol>
      ) : tables.length ? (
        <p className="text-muted">No calculation checks yet.</p>
      ) : null}
      {tables.length ? (
        <div className="flex flex-col gap-2 rounded-lg border border-dashed border-line p-3 sm:flex-row sm:items-end">
          <div className="flex flex-1 flex-col gap-1">
            <label htmlFor="new-check-kind" className="font-semibold">
              New check
            </label>
            <Select id="new-check-kind" value={kind} onChange={(e) => setKind(e.target.value as CheckKind)}>
              {CHECK_KINDS.map((k) => (
                <option key={k} value={k}>
                  {CHECK_KIND_LABELS[k]}
                </option>
              ))}
            </Select>
          </div>
          <Button variant="secondary" disabled={checks.length >= 12} onClick={() => changeContent(change, "checks", (list) => [...list, makeCheck(kind, tables[0], { id: newPartId("chk", list.map((c) => c.id)) })])}>
            Add this check
          </Button>
        </div>
      ) : null}
    </div>
  );
}

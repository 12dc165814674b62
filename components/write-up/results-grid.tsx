"use client";

import { useId, useMemo, useRef, useState, type ClipboardEvent, type JSX, type KeyboardEvent } from "react";
import { Button, buttonClasses } from "@/components/ui/button";
import { cn } from "@/lib/utils";
import type { ColumnTemplate, TableTemplate } from "@/lib/validation/practicals";
import { MAX_CELL_CHARS, MAX_TABLE_ROWS, type FilledTable } from "@/lib/validation/write-ups";
import { csvFileName, MAX_CSV_BYTES, parsePastedText, planCsvImport, tableToCsv, type CsvImportPlan } from "@/lib/write-ups/csv";
import { ANOMALY_PERCENT, cellText, columnHeading, decisionKey, gridRowCount, presetText, validateTable, type AnomalyFlag, type CellIssue } from "@/lib/write-ups/table-validation";
import { DecisionPanel } from "./grid/decision-panel";
import { addRow, applyBlock, applyImport, removeEmptyRowsAtEnd, restoreCell, setCell, setDecision } from "./grid/grid-model";
import { ImportPanel } from "./grid/import-panel";

const ROLE_NOTES: Record<ColumnTemplate["role"], string> = {
  independent: "you choose",
  dependent: "measured",
  repeat: "repeat",
  mean: "mean: you work it out",
  derived: "you work it out",
};

type Notice = { tone: "good" | "bad"; text: string; undo?: FilledTable };
type Cell = { row: number; col: number };

function selectionAt(input: HTMLInputElement) {
  const length = input.value.length;
  const start = input.selectionStart ?? length;
  const end = input.selectionEnd ?? length;
  const all = start === 0 && end === length;
  return { atStart: all || (start === 0 && end === 0), atEnd: all || (start === length && end === length) };
}

/**
 * A student's results table as a spreadsheet-like grid built from the practical's template.
 * Headings are "quantity / unit"; preset values are read-only; every typed cell is checked with
 * `validateTable` (numbers only, instrument range, decimal places), anomalous repeats are
 * flagged by the stated rule and the student decides, with a reason, whether to leave each out.
 * Keyboard: arrows move (Left/Right at the edge of the text, or when the whole cell is
 * selected), Tab and Shift+Tab, Enter moves down, Escape undoes the edit of the cell. A block
 * pasted from a spreadsheet fills across and down from the focused cell; a block bigger than the
 * table is refused whole, with the reason. CSV import (with confirmation) and export.
 */
export function ResultsGrid(props: {
  table: TableTemplate;
  value: FilledTable;
  onChange: (next: FilledTable) => void;
  readOnly?: boolean;
  /** DOM id prefix. */
  id?: string;
  /** Leave out the table's title (when the page shows it already). */
  hideTitle?: boolean;
}): JSX.Element {
  const { table, value, onChange, readOnly = false } = props;
  const autoId = useId();
  const prefix = props.id ?? `grid${autoId.replace(/[^A-Za-z0-9_-]/g, "")}`;
  const rowCount = gridRowCount(table, value);
  const columns = table.columns;
  const validation = useMemo(() => validateTable(table, value), [table, value]);

  const [active, setActive] = useState<Cell>({ row: 0, col: 0 });
  const [editing, setEditing] = useState<string | null>(null);
  const [notice, setNotice] = useState<Notice | null>(null);
  const [deciding, setDeciding] = useState<Cell | null>(null);
  const [pendingImport, setPendingImport] = useState<{ plan: CsvImportPlan; fileName: string } | null>(null);
  const original = useRef<{ key: string; text: string; decision: FilledTable["decisions"][string] | undefined } | null>(null);

  const cellId = (row: number, col: number) => `${prefix}-r${row}-c${col}`;
  const issueId = (i: number) => `${prefix}-issue-${i}`;
  const anomalyId = (i: number) => `${prefix}-anomaly-${i}`;
  const isPresetCell = (row: number, col: number) => presetText(table, row, columns[col]!) !== null;
  const editable = (row: number, col: number) => !readOnly && !isPresetCell(row, col);

  const issuesByCell = useMemo(() => {
    const map = new Map<string, { issue: CellIssue; index: number }[]>();
    validation.issues.forEach((issue, index) => {
      const key = decisionKey(issue.row, issue.column);
      map.set(key, [...(map.get(key) ?? []), { issue, index }]);
    });
    return map;
  }, [validation.issues]);
  const anomaliesByCell = useMemo(() => {
    const map = new Map<string, { anomaly: AnomalyFlag; index: number }>();
    validation.anomalies.forEach((anomaly, index) => map.set(decisionKey(anomaly.row, anomaly.column), { anomaly, index }));
    return map;
  }, [validation.anomalies]);

  const focusCell = (row: number, col: number) => {
    if (row < 0 || row >= rowCount || col < 0 || col >= columns.length) return false;
    const el = document.getElementById(cellId(row, col)) as HTMLInputElement | null;
    if (!el) return false;
    el.focus();
    el.select();
    return true;
  };

  const change = (next: FilledTable) => {
    if (!readOnly) onChange(next);
  };

  const nextEditable = (row: number, col: number, step: 1 | -1): Cell | null => {
    let index = row * columns.length + col + step;
    while (index >= 0 && index < rowCount * columns.length) {
      const r = Math.floor(index / columns.length);
      const c = index % columns.length;
      if (editable(r, c)) return { row: r, col: c };
      index += step;
    }
    return null;
  };

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>, row: number, col: number) => {
    if (e.altKey || e.ctrlKey || e.metaKey) return;
    const input = e.currentTarget;
    const move = (r: number, c: number) => {
      e.preventDefault();
      focusCell(r, c);
    };
    switch (e.key) {
      case "ArrowUp":
        return move(row - 1, col);
      case "ArrowDown":
        return move(row + 1, col);
      case "ArrowLeft":
        if (!e.shiftKey && selectionAt(input).atStart) move(row, col - 1);
        return;
      case "ArrowRight":
        if (!e.shiftKey && selectionAt(input).atEnd) move(row, col + 1);
        return;
      case "Enter":
        return move(row + (e.shiftKey ? -1 : 1), col);
      case "Tab": {
        if (readOnly) return;
        const target = nextEditable(row, col, e.shiftKey ? -1 : 1);
        if (target) move(target.row, target.col);
        return;
      }
      case "Escape": {
        const o = original.current;
        const key = decisionKey(row, columns[col]!.id);
        if (!o || o.key !== key || readOnly) return;
        if ((cellText(table, value, row, columns[col]!) ?? "") !== o.text || value.decisions[key] !== o.decision) {
          e.preventDefault();
          change(restoreCell(table, value, row, columns[col]!.id, o.text, o.decision));
          setEditing(null);
          requestAnimationFrame(() => input.select());
        }
        return;
      }
    }
  };

  const onPaste = (e: ClipboardEvent<HTMLInputElement>, row: number, col: number) => {
    if (readOnly) return;
    const text = e.clipboardData.getData("text/plain");
    const block = parsePastedText(text);
    const single = block.length <= 1 && (block[0]?.length ?? 0) <= 1;
    if (single && (block[0]?.[0] ?? "").length <= MAX_CELL_CHARS) return;
    e.preventDefault();
    const result = applyBlock(table, value, { row, col }, block);
    if (!result.ok) {
      setNotice({ tone: "bad", text: result.message });
      return;
    }
    setNotice({ tone: "good", text: result.message, undo: value });
    change(result.next);
    setEditing(null);
  };

  const startImport = async (file: File) => {
    if (file.size > MAX_CSV_BYTES) {
      setNotice({ tone: "bad", text: "This file is too large for a results table. Choose the CSV file with just this table’s readings." });
      return;
    }
    const result = planCsvImport(table, await file.text());
    if (!result.ok) {
      setNotice({ tone: "bad", text: result.message });
      return;
    }
    setNotice(null);
    setPendingImport({ plan: result.plan, fileName: file.name });
  };

  const exportCsv = () => {
    const blob = new Blob([`\uFEFF${tableToCsv(table, value)}`], { type: "text/csv;charset=utf-8" });
    const url = URL.createObjectURL(blob);
    const a = document.createElement("a");
    a.href = url;
    a.download = csvFileName(table);
    document.body.appendChild(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };

  const hasTyped = Array.from({ length: rowCount }).some((_, r) => columns.some((c) => presetText(table, r, c) === null && cellText(table, value, r, c) !== null));
  const decisionCell = deciding ? anomaliesByCell.get(decisionKey(deciding.row, columns[deciding.col]?.id ?? "")) : undefined;
  const visibleIssues = validation.issues.map((issue, index) => ({ issue, index })).filter(({ issue }) => decisionKey(issue.row, issue.column) !== editing);
  const titleId = `${prefix}-title`;
  const helpId = `${prefix}-help`;

  return (
    <section className="flex flex-col gap-3" aria-labelledby={titleId}>
      <div className="flex flex-wrap items-end justify-between gap-2">
        <h3 id={titleId} className={cn("text-lg font-bold", props.hideTitle && "sr-only")}>
          {table.title}
        </h3>
        <div className="flex flex-wrap gap-2">
          {!readOnly ? (
            <>
              <label className={cn(buttonClasses("secondary", "sm"), "cursor-pointer focus-within:outline-3 focus-within:outline-offset-2 focus-within:outline-[var(--focus)]")}>
                Import from a CSV file
                <input
                  type="file"
                  accept=".csv,text/csv,text/plain"
                  className="sr-only"
                  onChange={(e) => {
                    const file = e.target.files?.[0];
                    e.target.value = "";
                    if (file) void startImport(file);
                  }}
                />
              </label>
            </>
          ) : null}
          <Button variant="secondary" size="sm" className="no-print" onClick={exportCsv}>
            Download as CSV
          </Button>
        </div>
      </div>
      {!readOnly ? (
        <p id={helpId} className="text-sm text-muted">
          Type numbers only: the units are in the headings. Arrow keys, Tab and Enter move between cells; Escape undoes a cell you are changing. You can paste a block copied from a spreadsheet; a block bigger than the table is not pasted at all, so nothing is half-done.
        </p>
      ) : null}

      <div className="w-fit max-w-full overflow-x-auto rounded-lg border border-line bg-surface">
        <table role="grid" aria-labelledby={titleId} aria-describedby={readOnly ? undefined : helpId} aria-readonly={readOnly || undefined} aria-rowcount={rowCount + 1} className="border-separate border-spacing-0 text-[0.97rem]">
          <thead>
            <tr role="row">
              <th role="columnheader" scope="col" className="sticky left-0 z-20 w-12 min-w-12 border-r border-b border-line bg-sunken px-2 py-2 text-left text-sm font-semibold">
                Row
              </th>
              {columns.map((c, ci) => (
                <th
                  key={c.id}
                  role="columnheader"
                  scope="col"
                  id={`${prefix}-h${ci}`}
                  className={cn("min-w-28 max-w-44 border-b border-line bg-sunken px-2 py-2 text-right align-bottom font-semibold", ci === 0 && "sticky left-12 z-20 border-r")}
                >
                  <span className="block leading-snug">
                    {c.quantity}
                    {c.unit.trim() ? <span className="whitespace-nowrap"> / {c.unit}</span> : null}
                  </span>
                  <span className="block text-xs font-normal text-muted">
                    {c.symbol ? <i className="font-serif">{c.symbol}</i> : null}
                    {c.symbol ? " · " : null}
                    {ROLE_NOTES[c.role]}
                  </span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {Array.from({ length: rowCount }, (_, r) => (
              <tr role="row" key={r}>
                <th role="rowheader" scope="row" className="sticky left-0 z-10 border-r border-b border-line bg-sunken px-2 text-left text-sm font-semibold text-muted tabular-nums">
                  {r + 1}
                </th>
                {columns.map((c, ci) => {
                  const key = decisionKey(r, c.id);
                  const preset = presetText(table, r, c);
                  const text = cellText(table, value, r, c) ?? "";
                  const shownIssues = key === editing ? [] : (issuesByCell.get(key) ?? []);
                  const hasError = shownIssues.some((i) => i.issue.level === "error");
                  const hasWarning = !hasError && shownIssues.length > 0;
                  const flag = anomaliesByCell.get(key);
                  const excluded = Boolean(flag?.anomaly.excluded && flag.anomaly.decision);
                  const undecided = Boolean(flag && !flag.anomaly.decision);
                  const describedBy = [...shownIssues.map((i) => `${issueId(i.index)}-msg`), ...(flag ? [`${anomalyId(flag.index)}-msg`] : [])].join(" ") || undefined;
                  const tabbable = readOnly ? active.row === r && active.col === ci : preset === null;
                  return (
                    <td
                      key={c.id}
                      role="gridcell"
                      aria-readonly={preset !== null || readOnly || undefined}
                      className={cn("relative border-b border-line bg-surface p-0", ci === 0 && "sticky left-12 z-10 border-r", ci > 0 && "border-l")}
                    >
                      <input
                        id={cellId(r, ci)}
                        type="text"
                        inputMode="decimal"
                        autoComplete="off"
                        spellCheck={false}
                        maxLength={MAX_CELL_CHARS}
                        value={text}
                        readOnly={preset !== null || readOnly}
                        tabIndex={tabbable ? 0 : -1}
                        aria-label={`Row ${r + 1}, ${columnHeading(c)}${preset !== null ? " (filled in for you)" : ""}${excluded ? " (left out)" : ""}`}
                        aria-invalid={hasError || undefined}
                        aria-describedby={describedBy}
                        onFocus={(e) => {
                          setActive({ row: r, col: ci });
                          original.current = { key, text: cellText(table, value, r, c) ?? "", decision: value.decisions[key] };
                          e.currentTarget.select();
                        }}
                        onBlur={() => setEditing((k) => (k === key ? null : k))}
                        onChange={(e) => {
                          if (preset !== null || readOnly) return;
                          setEditing(key);
                          change(setCell(table, value, r, c.id, e.target.value));
                        }}
                        onKeyDown={(e) => onKeyDown(e, r, ci)}
                        onPaste={(e) => onPaste(e, r, ci)}
                        className={cn(
                          "block min-h-11 w-full min-w-28 bg-transparent px-2 py-2 text-right tabular-nums text-ink rounded-none focus:outline-3 focus:-outline-offset-3 focus:outline-solid focus:outline-[var(--focus)]",
                          preset !== null && "bg-sunken text-muted",
                          hasWarning && "bg-warn-soft",
                          undecided && "bg-accent-soft",
                          hasError && "bg-bad-soft shadow-[inset_0_0_0_2px_var(--bad)]",
                          excluded && "text-muted line-through",
                          flag && "pl-9",
                        )}
                      />
                      {flag ? (
                        <button
                          type="button"
                          tabIndex={-1}
                          onClick={() => setDeciding({ row: r, col: ci })}
                          disabled={readOnly}
                          title={undecided ? "This reading looks anomalous: decide what to do with it" : "Change your decision about this reading"}
                          aria-label={`Row ${r + 1}, ${columnHeading(c)}: ${undecided ? "decide about this anomalous reading" : "change your decision"}`}
                          className="absolute top-1/2 left-1 flex size-7 -translate-y-1/2 items-center justify-center rounded-full border border-accent bg-surface text-sm font-bold text-accent disabled:cursor-default"
                        >
                          {excluded ? "–" : "!"}
                        </button>
                      ) : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {!readOnly ? (
        <div className="flex flex-wrap gap-2">
          <Button
            variant="secondary"
            size="sm"
            disabled={rowCount >= MAX_TABLE_ROWS}
            onClick={() => {
              const next = addRow(table, value);
              if (next) {
                change(next);
                requestAnimationFrame(() => focusCell(rowCount, Math.max(0, columns.findIndex((_, ci) => !isPresetCell(rowCount, ci)))));
              }
            }}
          >
            Add a row
          </Button>
          <Button
            variant="secondary"
            size="sm"
            onClick={() => {
              const { next, removed } = removeEmptyRowsAtEnd(table, value);
              if (removed === 0) setNotice({ tone: "good", text: "There are no empty rows at the end to remove." });
              else {
                setNotice({ tone: "good", text: `Removed ${removed} empty ${removed === 1 ? "row" : "rows"} from the end.`, undo: value });
                change(next);
              }
            }}
          >
            Remove empty rows at the end
          </Button>
          {rowCount >= MAX_TABLE_ROWS ? <p className="self-center text-sm text-muted">A table holds at most {MAX_TABLE_ROWS} rows.</p> : null}
        </div>
      ) : null}

      <div aria-live="polite">
        {notice?.tone === "good" ? (
          <p role="status" className="flex flex-wrap items-center gap-2 rounded-md border border-good/40 bg-good-soft px-3 py-2">
            <span>{notice.text}</span>
            {notice.undo ? (
              <Button
                variant="ghost"
                size="sm"
                onClick={() => {
                  change(notice.undo!);
                  setNotice({ tone: "good", text: "Undone." });
                }}
              >
                Undo
              </Button>
            ) : null}
          </p>
        ) : null}
      </div>
      {notice?.tone === "bad" ? (
        <div role="alert" className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-l-4 border-bad/50 bg-bad-soft px-3 py-2">
          <span>{notice.text}</span>
          <Button variant="ghost" size="sm" onClick={() => setNotice(null)}>
            Dismiss
          </Button>
        </div>
      ) : null}

      {pendingImport ? (
        <ImportPanel
          table={table}
          fileName={pendingImport.fileName}
          plan={pendingImport.plan}
          replacesData={hasTyped || Object.keys(value.decisions).length > 0}
          onCancel={() => setPendingImport(null)}
          onConfirm={() => {
            const result = applyImport(table, pendingImport.plan);
            setPendingImport(null);
            if (!result.ok) setNotice({ tone: "bad", text: result.message });
            else {
              setNotice({ tone: "good", text: result.message, undo: value });
              change(result.next);
            }
          }}
        />
      ) : null}

      {deciding && decisionCell ? (
        <DecisionPanel
          key={decisionKey(deciding.row, columns[deciding.col]!.id)}
          heading={columnHeading(columns[deciding.col]!)}
          row={deciding.row}
          reading={cellText(table, value, deciding.row, columns[deciding.col]!) ?? ""}
          anomaly={decisionCell.anomaly}
          onClose={() => {
            const cell = deciding;
            setDeciding(null);
            requestAnimationFrame(() => focusCell(cell.row, cell.col));
          }}
          onRemove={
            decisionCell.anomaly.decision
              ? () => {
                  const cell = deciding;
                  change(setDecision(value, cell.row, columns[cell.col]!.id, null));
                  setDeciding(null);
                  requestAnimationFrame(() => focusCell(cell.row, cell.col));
                }
              : null
          }
          onSave={(decision) => {
            const cell = deciding;
            change(setDecision(value, cell.row, columns[cell.col]!.id, decision));
            setDeciding(null);
            requestAnimationFrame(() => focusCell(cell.row, cell.col));
          }}
        />
      ) : null}

      {validation.anomalies.length ? (
        <div className="rounded-lg border border-line bg-surface p-3">
          <h4 className="font-bold">Readings that look anomalous</h4>
          <p className="text-sm text-muted">
            Rule: a repeat more than {ANOMALY_PERCENT} % away from the middle value (median) of its row’s repeats is flagged (common practice). Until you decide, a flagged reading is left out of the mean.
          </p>
          <ul className="mt-2 flex flex-col gap-2">
            {validation.anomalies.map((a, i) => {
              const ci = columns.findIndex((c) => c.id === a.column);
              const reading = cellText(table, value, a.row, columns[ci]!) ?? "";
              return (
                <li key={decisionKey(a.row, a.column)} className="flex flex-wrap items-start justify-between gap-2 border-t border-line pt-2 first:border-t-0 first:pt-0">
                  <div className="min-w-0 flex-1">
                    <p className="font-semibold">
                      Row {a.row + 1}, {columnHeading(columns[ci]!)}: <span className={a.excluded && a.decision ? "line-through" : ""}>{reading}</span>
                    </p>
                    <p id={`${anomalyId(i)}-msg`} className="text-sm">
                      {a.message}{" "}
                      {a.decision ? (
                        <span>
                          {a.decision.include ? "You kept it in" : "You left it out"}: “{a.decision.reason}”
                        </span>
                      ) : (
                        <span className="font-semibold">Not decided yet.</span>
                      )}
                    </p>
                  </div>
                  {!readOnly ? (
                    <Button variant="secondary" size="sm" onClick={() => setDeciding({ row: a.row, col: ci })} aria-label={`${a.decision ? "Change decision" : "Decide"}: row ${a.row + 1}, ${columnHeading(columns[ci]!)}`}>
                      {a.decision ? "Change" : "Decide"}
                    </Button>
                  ) : null}
                </li>
              );
            })}
          </ul>
        </div>
      ) : null}

      {visibleIssues.length ? (
        <div className="rounded-lg border border-line bg-surface p-3">
          <h4 className="font-bold">Check these cells</h4>
          <ul className="mt-1 flex flex-col gap-1">
            {visibleIssues.map(({ issue, index }) => {
              const ci = columns.findIndex((c) => c.id === issue.column);
              return (
                <li key={index} id={issueId(index)} className="flex items-start gap-2 text-[0.97rem]">
                  <span className={cn("mt-0.5 w-14 shrink-0 rounded px-1.5 text-center text-xs leading-5 font-bold uppercase", issue.level === "error" ? "bg-bad-soft text-bad" : "bg-warn-soft text-warn")}>
                    {issue.level === "error" ? "Fix" : "Check"}
                  </span>
                  <button type="button" className="min-h-7 text-left underline-offset-2 hover:underline" onClick={() => focusCell(issue.row, ci)}>
                    Row {issue.row + 1}, {columnHeading(columns[ci]!)}: <span id={`${issueId(index)}-msg`}>{issue.message}</span>
                  </button>
                </li>
              );
            })}
          </ul>
        </div>
      ) : null}
    </section>
  );
}

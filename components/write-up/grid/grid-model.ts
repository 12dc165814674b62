import type { TableTemplate } from "@/lib/validation/practicals";
import { MAX_CELL_CHARS, MAX_TABLE_ROWS, type FilledTable } from "@/lib/validation/write-ups";
import { headingOf, isHeadingRow, type CsvImportPlan } from "@/lib/write-ups/csv";
import { cellText, columnHeading, decisionKey, gridRowCount, presetText, readCell } from "@/lib/write-ups/table-validation";

type Row = FilledTable["rows"][number];

/** Every row with every column present, preset values written in (checks read the rows). */
export function normaliseRows(table: TableTemplate, filled: FilledTable, count = gridRowCount(table, filled)): Row[] {
  const n = Math.min(MAX_TABLE_ROWS, Math.max(count, 1));
  return Array.from({ length: n }, (_, r) => {
    const row: Row = {};
    for (const c of table.columns) {
      const preset = presetText(table, r, c);
      const v = filled.rows[r]?.[c.id];
      row[c.id] = preset ?? (typeof v === "number" ? (Number.isFinite(v) ? v : null) : typeof v === "string" && v !== "" ? v : null);
    }
    return row;
  });
}

/** Drops decisions about rows that no longer exist or cells that are now blank. */
function keepValidDecisions(table: TableTemplate, rows: Row[], decisions: FilledTable["decisions"]): FilledTable["decisions"] {
  const out: FilledTable["decisions"] = {};
  for (const [key, d] of Object.entries(decisions)) {
    const m = /^(\d+):(.+)$/.exec(key);
    if (!m) continue;
    const row = rows[Number(m[1])];
    const v = row?.[m[2]!];
    if (row && v !== null && v !== undefined && String(v).trim() !== "") out[key] = d;
  }
  return out;
}

/** True when a cell is one of the teacher's preset values (read-only). */
export function isPreset(table: TableTemplate, row: number, columnId: string): boolean {
  const c = table.columns.find((col) => col.id === columnId);
  return c ? presetText(table, row, c) !== null : false;
}

/** Sets one typed cell ("" clears it). Preset cells are left as they are. */
export function setCell(table: TableTemplate, filled: FilledTable, row: number, columnId: string, text: string): FilledTable {
  if (isPreset(table, row, columnId) || row < 0 || row >= MAX_TABLE_ROWS) return filled;
  const rows = normaliseRows(table, filled, Math.max(gridRowCount(table, filled), row + 1));
  rows[row] = { ...rows[row]!, [columnId]: text === "" ? null : text.slice(0, MAX_CELL_CHARS) };
  return { rows, decisions: keepValidDecisions(table, rows, filled.decisions) };
}

/** Sets a cell and its decision together (used to undo an edit with Escape). */
export function restoreCell(table: TableTemplate, filled: FilledTable, row: number, columnId: string, text: string, decision: FilledTable["decisions"][string] | undefined): FilledTable {
  const next = setCell(table, filled, row, columnId, text);
  const decisions = { ...next.decisions };
  const key = decisionKey(row, columnId);
  if (decision && text.trim() !== "") decisions[key] = decision;
  else delete decisions[key];
  return { ...next, decisions };
}

/** Records (or, with null, removes) the student's decision about one reading. */
export function setDecision(filled: FilledTable, row: number, columnId: string, decision: { include: boolean; reason: string } | null): FilledTable {
  const decisions = { ...filled.decisions };
  const key = decisionKey(row, columnId);
  if (decision) decisions[key] = { include: decision.include, reason: decision.reason.trim() };
  else delete decisions[key];
  return { ...filled, decisions };
}

/** True when a row has nothing typed (preset cells do not count). */
export function isRowEmpty(table: TableTemplate, filled: FilledTable, row: number): boolean {
  return table.columns.every((c) => presetText(table, row, c) !== null || cellText(table, filled, row, c) === null);
}

/** One more row at the end, or null when the table already has the most rows a table may hold. */
export function addRow(table: TableTemplate, filled: FilledTable): FilledTable | null {
  const count = gridRowCount(table, filled);
  if (count >= MAX_TABLE_ROWS) return null;
  const rows = normaliseRows(table, filled, count + 1);
  return { rows, decisions: keepValidDecisions(table, rows, filled.decisions) };
}

/** Removes rows at the end with nothing typed in them, keeping the preset rows and at least one row. */
export function removeEmptyRowsAtEnd(table: TableTemplate, filled: FilledTable): { next: FilledTable; removed: number } {
  const count = gridRowCount(table, filled);
  let keep = count;
  while (keep > Math.max(1, table.presetRows.length) && isRowEmpty(table, filled, keep - 1)) keep--;
  if (keep === count) return { next: filled, removed: 0 };
  const rows = normaliseRows(table, filled, keep);
  return { next: { rows, decisions: keepValidDecisions(table, rows, filled.decisions) }, removed: count - keep };
}

export type BlockResult = { ok: true; next: FilledTable; message: string } | { ok: false; message: string };

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function presetConflict(table: TableTemplate, row: number, columnId: string, text: string): string | null {
  const c = table.columns.find((col) => col.id === columnId)!;
  const preset = presetText(table, row, c);
  if (preset === null || text.trim() === "") return null;
  const typed = readCell(text);
  if (typed !== null && typed === readCell(preset)) return null;
  return `Row ${row + 1} of “${columnHeading(c)}” is already filled in (${preset}), but the new value is ${text}.`;
}

/**
 * Pastes a block of cells with its top-left corner at (row, column index), filling across and
 * down and adding rows as needed. All or nothing: a block with more rows than a table holds,
 * more columns than there are from the starting column, a cell over the length limit, or a value
 * that disagrees with a preset cell, is refused with the reason and nothing changes. A heading row
 * at the top of the block (naming the table's columns) is skipped. Decisions about pasted-over
 * readings whose value changed are dropped.
 */
export function applyBlock(table: TableTemplate, filled: FilledTable, start: { row: number; col: number }, block: string[][]): BlockResult {
  let cells = block;
  let skippedHeading = false;
  if (cells.length > 1 && isHeadingRow(table, cells[0]!)) {
    cells = cells.slice(1);
    skippedHeading = true;
  }
  const height = cells.length;
  const width = Math.max(0, ...cells.map((r) => r.length));
  if (height === 0 || width === 0) return { ok: false, message: "There was nothing to paste." };
  const startHeading = columnHeading(table.columns[start.col]!);
  if (start.row + height > MAX_TABLE_ROWS) {
    return {
      ok: false,
      message: `Nothing was pasted: the block has ${plural(height, "row")}, but a table holds at most ${MAX_TABLE_ROWS} rows, so from row ${start.row + 1} there is room for ${MAX_TABLE_ROWS - start.row}.`,
    };
  }
  const room = table.columns.length - start.col;
  if (width > room) {
    return {
      ok: false,
      message: `Nothing was pasted: the block is ${plural(width, "column")} wide, but from “${startHeading}” the table has ${plural(room, "column")}. Start the paste further left, or copy fewer columns.`,
    };
  }
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const text = cells[r]![c] ?? "";
      if (text.length > MAX_CELL_CHARS) {
        return { ok: false, message: `Nothing was pasted: a value in row ${r + 1} of the block is longer than ${MAX_CELL_CHARS} characters, and a cell holds one reading.` };
      }
      const conflict = presetConflict(table, start.row + r, table.columns[start.col + c]!.id, text);
      if (conflict) return { ok: false, message: `Nothing was pasted: ${conflict} Paste into the columns you fill in.` };
    }
  }
  const rows = normaliseRows(table, filled, Math.max(gridRowCount(table, filled), start.row + height));
  const decisions = { ...filled.decisions };
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const row = start.row + r;
      const id = table.columns[start.col + c]!.id;
      if (isPreset(table, row, id)) continue;
      const text = cells[r]![c] ?? "";
      const before = rows[row]![id];
      rows[row] = { ...rows[row]!, [id]: text === "" ? null : text };
      if (String(before ?? "") !== text) delete decisions[decisionKey(row, id)];
    }
  }
  const where = `starting at row ${start.row + 1}, “${startHeading}”`;
  return {
    ok: true,
    next: { rows, decisions: keepValidDecisions(table, rows, decisions) },
    message: `Pasted ${plural(height, "row")} × ${plural(width, "column")}, ${where}.${skippedHeading ? " The heading row was left out." : ""}`,
  };
}

/**
 * Replaces the table with a CSV file's readings (see `planCsvImport`). Preset cells keep their
 * values; a file value that disagrees with one is refused with the reason, and nothing changes.
 * Reading decisions are cleared, because they were about the old readings.
 */
export function applyImport(table: TableTemplate, plan: CsvImportPlan): BlockResult {
  const count = Math.min(MAX_TABLE_ROWS, Math.max(plan.rows.length, table.presetRows.length, table.rowCount));
  const empty: FilledTable = { rows: [], decisions: {} };
  const rows = normaliseRows(table, empty, count);
  for (let r = 0; r < plan.rows.length; r++) {
    for (let i = 0; i < plan.mapping.length; i++) {
      const id = plan.mapping[i];
      if (!id) continue;
      const text = plan.rows[r]![i] ?? "";
      const conflict = presetConflict(table, r, id, text);
      if (conflict) return { ok: false, message: `Nothing was imported: ${conflict}` };
      if (!isPreset(table, r, id)) rows[r] = { ...rows[r]!, [id]: text === "" ? null : text };
    }
  }
  const used = plan.mapping.filter(Boolean).length;
  const columns = plan.mapping.map((id) => (id ? headingOf(table, id) : null)).filter(Boolean);
  return {
    ok: true,
    next: { rows, decisions: {} },
    message: `Imported ${plural(plan.rows.length, "row")} into ${plural(used, "column")}: ${columns.join(", ")}.`,
  };
}

import type { TableRows } from "@/lib/checks/types";
import type { ColumnTemplate } from "@/lib/validation/practicals";
import { normaliseNumberText, parseTypedNumber } from "./numbers";

/** The text of a sample-data grid: one array of cell texts per row, one cell per column. */
export type GridText = string[][];

/**
 * Splits text copied from a spreadsheet into rows and cells. Spreadsheets put tabs between cells
 * and line breaks between rows, and wrap a cell in double quotes when it holds a tab, a line
 * break or a quote. A trailing line break (which they add) does not make an extra row.
 */
export function parseClipboardTable(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = "";
  let quoted = false;
  let atCellStart = true;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
      continue;
    }
    if (ch === '"' && atCellStart) {
      quoted = true;
      atCellStart = false;
      continue;
    }
    if (ch === "\t") {
      row.push(cell);
      cell = "";
      atCellStart = true;
      continue;
    }
    if (ch === "\r" || ch === "\n") {
      if (ch === "\r" && text[i + 1] === "\n") i++;
      row.push(cell);
      rows.push(row);
      row = [];
      cell = "";
      atCellStart = true;
      continue;
    }
    cell += ch;
    atCellStart = false;
  }
  if (cell !== "" || row.length) {
    row.push(cell);
    rows.push(row);
  }
  return rows.map((r) => r.map((c) => c.trim()));
}

/** Whether a pasted row looks like column headings rather than readings. */
function isHeaderRow(cells: string[]): boolean {
  const filled = cells.filter((c) => c !== "");
  return filled.length > 0 && filled.every((c) => parseTypedNumber(c) === null || Number.isNaN(parseTypedNumber(c)!)) && filled.some((c) => /[A-Za-z]/.test(c));
}

export type PasteResult = { grid: GridText; note: string | null };

/**
 * Puts pasted cells into the grid from the cell pasted into, to the right and downwards, adding
 * rows as needed up to `maxRows`. A first row of headings is left out. Returns null when the text
 * is a single value (the browser's own paste into the one cell is right for that).
 */
export function pasteIntoGrid(grid: GridText, text: string, at: { row: number; col: number }, columnCount: number, maxRows: number): PasteResult | null {
  if (!/[\t\r\n]/.test(text.replace(/[\r\n]+$/, ""))) return null;
  let cells = parseClipboardTable(text);
  const notes: string[] = [];
  if (cells.length > 1 && isHeaderRow(cells[0]!)) {
    cells = cells.slice(1);
    notes.push("The first pasted row looked like headings, so it was left out.");
  }
  const next = grid.map((r) => [...r]);
  let cutRows = 0;
  let cutCols = false;
  cells.forEach((pastedRow, i) => {
    const r = at.row + i;
    if (r >= maxRows) {
      cutRows++;
      return;
    }
    while (next.length <= r) next.push(Array.from({ length: columnCount }, () => ""));
    pastedRow.forEach((value, j) => {
      const c = at.col + j;
      if (c >= columnCount) {
        if (value !== "") cutCols = true;
        return;
      }
      next[r]![c] = value;
    });
  });
  if (cutRows) notes.push(`${cutRows} pasted ${cutRows === 1 ? "row was" : "rows were"} left out: the table has at most ${maxRows} rows.`);
  if (cutCols) notes.push("Some pasted cells were left out: there were more of them than columns to the right.");
  return { grid: next, note: notes.length ? notes.join(" ") : null };
}

export type CellProblem = { row: number; col: number; text: string; message: string };

/**
 * The grid as readings keyed by column id, plus every cell that is not a number. Readings stay
 * as typed text (so "0.50" keeps its decimal places for the significant-figure rules); blank and
 * unreadable cells are null. Rows that are entirely blank at the end are left out.
 */
export function gridToRows(grid: GridText, columns: Pick<ColumnTemplate, "id" | "quantity" | "unit">[]): { rows: TableRows; problems: CellProblem[] } {
  const problems: CellProblem[] = [];
  const rows: TableRows = grid.map((cells, r) => {
    const row: Record<string, string | null> = {};
    columns.forEach((col, c) => {
      const text = cells[c] ?? "";
      const value = parseTypedNumber(text);
      if (value !== null && Number.isNaN(value)) {
        problems.push({ row: r, col: c, text, message: `Row ${r + 1}, ${col.quantity || "column " + (c + 1)}: “${text}” is not a number.` });
        row[col.id] = null;
      } else row[col.id] = value === null ? null : normaliseNumberText(text);
    });
    return row;
  });
  while (rows.length && Object.values(rows[rows.length - 1]!).every((v) => v === null) && !problems.some((p) => p.row === rows.length - 1)) rows.pop();
  return { rows, problems };
}

/** An empty grid for a table, with its planned values already in place. */
export function emptyGrid(columns: Pick<ColumnTemplate, "id">[], rowCount: number, presetRows: Record<string, number | null>[] = []): GridText {
  return Array.from({ length: rowCount }, (_, r) => columns.map((col) => {
    const v = presetRows[r]?.[col.id];
    return typeof v === "number" ? String(v) : "";
  }));
}

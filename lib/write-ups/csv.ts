import Papa from "papaparse";
import { parseTypedNumber } from "@/lib/marking";
import type { ColumnTemplate, TableTemplate } from "@/lib/validation/practicals";
import { MAX_CELL_CHARS, MAX_TABLE_ROWS, type FilledTable } from "@/lib/validation/write-ups";
import { cellText, columnHeading, gridRowCount } from "./table-validation";

/** Largest CSV file the grid imports (a 60-row table is a few kilobytes). */
export const MAX_CSV_BYTES = 100_000;

const FORMULA_CHARS = "=+\\-@\\t\\r\\u2212\\uFF1D\\uFF0B\\uFF0D\\uFF20";
const FORMULA_START = new RegExp(`^[${FORMULA_CHARS}]`);
const ESCAPED_START = new RegExp(`^'+[${FORMULA_CHARS}]`);
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Makes a cell safe to open in a spreadsheet: text starting with = + - − @ (or a tab or carriage
 * return) could run as a formula, so it gets a leading apostrophe (the usual defence against
 * CSV formula injection, common practice). Plain numbers such as "-3.2" are left alone: a
 * spreadsheet reads them as numbers, never as formulas. Text that already starts with
 * apostrophes before such a character gets one more, so that importing gives it back unchanged.
 */
export function escapeCsvCell(text: string): string {
  const formula = FORMULA_START.test(text) && !PLAIN_NUMBER.test(text);
  return formula || ESCAPED_START.test(text) ? `'${text}` : text;
}

/** Undoes {@link escapeCsvCell} when a file exported by Meniscus is imported again. */
export function unescapeCsvCell(text: string): string {
  return ESCAPED_START.test(text) ? text.slice(1) : text;
}

/**
 * The table as CSV: a heading row "quantity / unit" (DOMAIN.md convention) and one row per
 * table row as typed, preset values included, blank rows at the end left off. Cells are escaped
 * against formula injection and quoted where they hold commas, quotes or line breaks.
 */
export function tableToCsv(table: TableTemplate, filled: FilledTable): string {
  const count = gridRowCount(table, filled);
  const rows: string[][] = [];
  for (let r = 0; r < count; r++) rows.push(table.columns.map((c) => escapeCsvCell(cellText(table, filled, r, c) ?? "")));
  while (rows.length && rows[rows.length - 1]!.every((v) => v === "")) rows.pop();
  const headings = table.columns.map((c) => escapeCsvCell(columnHeading(c)));
  return Papa.unparse([headings, ...rows], { newline: "\r\n", quotes: false });
}

/** A file name for the download, from the table title. */
export function csvFileName(table: Pick<TableTemplate, "title">): string {
  const base = table.title
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .replace(/\s+/g, "-")
    .toLowerCase()
    .slice(0, 60);
  return `${base || "results"}.csv`;
}

function dropTrailingBlanks(block: string[][]): string[][] {
  const rows = block.map((r) => r.map((c) => c.trim()));
  while (rows.length && rows[rows.length - 1]!.every((c) => c === "")) rows.pop();
  let width = 0;
  for (const r of rows) for (let i = r.length - 1; i >= 0; i--) if (r[i] !== "") { width = Math.max(width, i + 1); break; }
  return rows.map((r) => Array.from({ length: width }, (_, i) => r[i] ?? ""));
}

/** Splits delimited text into rows of cells (quoted cells allowed), trimmed, with empty rows and columns at the end removed. */
export function parseDelimited(text: string, delimiter: "\t" | ","): string[][] {
  const clean = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  const result = Papa.parse<string[]>(clean, { delimiter, skipEmptyLines: false, newline: "\n", quoteChar: '"' });
  return dropTrailingBlanks(result.data.filter((r): r is string[] => Array.isArray(r)));
}

const DECIMAL_COMMA = /^\s*[+\-\u2212]?\d+,\d+\s*$/;

/**
 * Reads text pasted from a spreadsheet or a note as a block of cells. Tabs separate cells when
 * there are any (spreadsheets copy that way); otherwise commas do, except that a single value
 * like "12,5" stays one cell (it is a decimal comma, and the table asks for a decimal point).
 */
export function parsePastedText(text: string): string[][] {
  const clean = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  if (clean.includes("\t")) return parseDelimited(clean, "\t");
  const trimmed = clean.replace(/\n+$/, "");
  if (!trimmed.includes("\n") && DECIMAL_COMMA.test(trimmed)) return [[trimmed.trim()]];
  if (clean.includes(",")) return parseDelimited(clean, ",");
  return dropTrailingBlanks(trimmed.split("\n").map((line) => [line]));
}

function isNumberText(text: string): boolean {
  try {
    return parseTypedNumber(text).trailingText === "";
  } catch {
    return false;
  }
}

function normalise(text: string): string {
  return text
    .normalize("NFKC")
    .toLowerCase()
    .replace(/[\u2212\u2013]/g, "-")
    .replace(/\^/g, "")
    .replace(/\s+/g, "");
}

/** Forms of a heading a student's file may use: "time / s", "time (s)", "time in s", "time/s". */
function headingForms(heading: string): string[] {
  const h = heading.trim();
  const forms = [h];
  const bracket = /^(.*?)\s*[([]\s*(.*?)\s*[)\]]$/.exec(h);
  if (bracket) forms.push(`${bracket[1]}/${bracket[2]}`);
  const inUnit = /^(.*?)\s+in\s+(.*)$/i.exec(h);
  if (inUnit) forms.push(`${inUnit[1]}/${inUnit[2]}`);
  return forms.map(normalise);
}

/**
 * Matches headings to the table's columns by "quantity / unit" (or quantity alone, or symbol and
 * unit, when only one column has it). Each column is matched at most once.
 */
export function matchHeadings(table: TableTemplate, headings: string[]): (string | null)[] {
  const keys = new Map<string, string[]>();
  const addKey = (key: string, id: string) => {
    if (!key) return;
    const list = keys.get(key) ?? [];
    if (!list.includes(id)) list.push(id);
    keys.set(key, list);
  };
  for (const c of table.columns) {
    addKey(normalise(columnHeading(c)), c.id);
    addKey(normalise(`${c.quantity}/${c.unit}`), c.id);
    addKey(normalise(c.quantity), c.id);
    if (c.symbol.trim()) addKey(normalise(c.unit.trim() ? `${c.symbol}/${c.unit}` : c.symbol), c.id);
  }
  const used = new Set<string>();
  return headings.map((h) => {
    if (!h.trim()) return null;
    for (const form of headingForms(h)) {
      const ids = keys.get(form);
      if (ids && ids.length === 1 && !used.has(ids[0]!)) {
        used.add(ids[0]!);
        return ids[0]!;
      }
    }
    return null;
  });
}

/** True when a row of cells looks like a heading row: some text that is not a number, and at least one cell naming a column. */
export function isHeadingRow(table: TableTemplate, row: string[]): boolean {
  return row.some((c) => c !== "" && !isNumberText(c)) && matchHeadings(table, row).some((id) => id !== null);
}

export type CsvImportPlan = {
  /** "headings": the file's headings named the columns; "positional": its columns are used in order. */
  mode: "headings" | "positional";
  /** The file's column labels (its headings, or "column 1", "column 2"…). */
  fileColumns: string[];
  /** For each file column, the table column it fills, or null when it is not used. */
  mapping: (string | null)[];
  /** The readings, one array per row, in the file's column order. */
  rows: string[][];
};

export type CsvImportResult = { ok: true; plan: CsvImportPlan } | { ok: false; message: string };

/**
 * Reads a CSV file for a results table. The first row is taken as headings when it holds text;
 * headings are matched to the table's columns ("quantity / unit", "quantity (unit)", the quantity
 * alone…). When no heading matches, or there are no headings, the file's columns are used in order,
 * which the student must confirm. Refuses (with the reason, and nothing imported) a file with
 * more rows than a table holds, more columns than the table when used in order, over-long cells,
 * or no readings.
 */
export function planCsvImport(table: TableTemplate, text: string): CsvImportResult {
  if (text.length > MAX_CSV_BYTES) return { ok: false, message: "This file is too large for a results table. Choose the CSV file with just this table's readings." };
  const clean = text.replace(/^\uFEFF/, "");
  const firstLine = clean.split(/\r\n|\n|\r/, 1)[0] ?? "";
  const delimiter = firstLine.includes("\t") && !firstLine.includes(",") ? "\t" : firstLine.includes(";") && !firstLine.includes(",") ? null : ",";
  if (delimiter === null) return { ok: false, message: "This file separates its values with semicolons. Save it as CSV with commas (most spreadsheets call it “CSV (comma delimited)”) and try again." };
  const all = parseDelimited(clean, delimiter).map((r) => r.map(unescapeCsvCell));
  if (all.length === 0) return { ok: false, message: "This file is empty: there are no readings to import." };
  const first = all[0]!;
  const hasHeadings = first.some((c) => c !== "" && !isNumberText(c));
  const rows = hasHeadings ? all.slice(1) : all;
  if (rows.length === 0) return { ok: false, message: "This file has headings but no readings under them." };
  if (rows.length > MAX_TABLE_ROWS) {
    return { ok: false, message: `This file has ${rows.length} rows of readings, but a table holds at most ${MAX_TABLE_ROWS}. Nothing was imported.` };
  }
  for (let r = 0; r < rows.length; r++) {
    const long = rows[r]!.findIndex((c) => c.length > MAX_CELL_CHARS);
    if (long >= 0) return { ok: false, message: `Row ${r + 1} of the file has a value longer than ${MAX_CELL_CHARS} characters (column ${long + 1}). A cell holds one reading. Nothing was imported.` };
  }
  const width = Math.max(first.length, ...rows.map((r) => r.length));
  const fileColumns = Array.from({ length: width }, (_, i) => (hasHeadings && first[i] ? first[i]! : `column ${i + 1}`));
  const padded = rows.map((r) => Array.from({ length: width }, (_, i) => r[i] ?? ""));
  if (hasHeadings) {
    const mapping = matchHeadings(table, fileColumns.map((h, i) => (first[i] ? h : "")));
    if (mapping.some((id) => id !== null)) return { ok: true, plan: { mode: "headings", fileColumns, mapping, rows: padded } };
  }
  if (width > table.columns.length) {
    return {
      ok: false,
      message: `The file has ${width} columns but this table has ${table.columns.length}, and ${hasHeadings ? "its headings do not match the table's" : "it has no headings"}, so Meniscus cannot tell which is which. Give the file headings like “${columnHeading(table.columns[0]!)}”. Nothing was imported.`,
    };
  }
  return { ok: true, plan: { mode: "positional", fileColumns, mapping: fileColumns.map((_, i) => table.columns[i]!.id), rows: padded } };
}

/** The heading of a column by id, for messages. */
export function headingOf(table: TableTemplate, id: string): string {
  const c: ColumnTemplate | undefined = table.columns.find((col) => col.id === id);
  return c ? columnHeading(c) : id;
}

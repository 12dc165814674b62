import { findAnomalies, parseTypedNumber, type TypedNumber } from "@/lib/marking";
import type { ColumnTemplate, TableTemplate } from "@/lib/validation/practicals";
import { MAX_TABLE_ROWS, type FilledTable } from "@/lib/validation/write-ups";

/** One problem with one typed cell. Errors must be fixed; warnings are advice. */
export type CellIssue = { row: number; column: string; level: "error" | "warning"; message: string };

/**
 * A repeat reading that looks anomalous by the rule, or that the student chose to leave out.
 * `excludedByRule` is true when the rule flagged it (the rule leaves it out of the mean unless the
 * student decides to keep it); false when only the student's decision leaves it out.
 */
export type AnomalyFlag = {
  row: number;
  column: string;
  message: string;
  excludedByRule: boolean;
  /** Whether the reading is left out of the mean after the student's decision, if any. */
  excluded: boolean;
  decision: { include: boolean; reason: string } | null;
};

export type TableValidation = {
  issues: CellIssue[];
  anomalies: AnomalyFlag[];
  /** Mean of the kept repeats per row, for the table's first mean column (null when there are no readings). */
  means: Record<number, number | null>;
  /** The same for every mean column, by column id. */
  meansByColumn: Record<string, Record<number, number | null>>;
};

/** Anomaly threshold, percent from the median of a row's repeats (common practice; the engine's default). */
export const ANOMALY_PERCENT = 10;

/** The anomaly rule in words a student can follow. */
export const ANOMALY_RULE =
  `A repeat reading is flagged when it is more than ${ANOMALY_PERCENT} % away from the middle value (the median) of the repeats in its row. ` +
  "This is a rule of thumb (common practice): you decide whether to leave the reading out, and say why.";

/** "quantity / unit", the heading convention for results tables (IUPAC Green Book, SI Brochure). */
export function columnHeading(col: Pick<ColumnTemplate, "quantity" | "unit">): string {
  return col.unit.trim() ? `${col.quantity} / ${col.unit}` : col.quantity;
}

/** Rows the grid shows: the student's rows, or the planned row count for a new table, never fewer than the preset rows. */
export function gridRowCount(table: TableTemplate, filled: FilledTable): number {
  const base = filled.rows.length > 0 ? filled.rows.length : table.rowCount;
  return Math.min(MAX_TABLE_ROWS, Math.max(base, table.presetRows.length, 1));
}

/** The teacher's preset value for a cell as text (formatted to the column's decimal places), or null. */
export function presetText(table: TableTemplate, row: number, col: ColumnTemplate): string | null {
  const v = table.presetRows[row]?.[col.id];
  if (typeof v !== "number" || !Number.isFinite(v)) return null;
  return col.decimalPlaces != null ? v.toFixed(col.decimalPlaces) : String(v);
}

/** A cell as the student sees it: the preset value, else what they typed; null when blank. */
export function cellText(table: TableTemplate, filled: FilledTable, row: number, col: ColumnTemplate): string | null {
  const preset = presetText(table, row, col);
  if (preset !== null) return preset;
  const v = filled.rows[row]?.[col.id];
  if (typeof v === "number") return Number.isFinite(v) ? String(v) : null;
  if (typeof v !== "string" || !v.trim()) return null;
  return v;
}

/** Key of a reading decision, "row:column". */
export const decisionKey = (row: number, columnId: string) => `${row}:${columnId}`;

/** The number a cell holds, read the way calculation checks read it (null when blank or unreadable). */
export function readCell(text: string | null): number | null {
  const typed = tryParse(text);
  return typed ? typed.value : null;
}

function tryParse(text: string | null): TypedNumber | null {
  if (text === null || !text.trim()) return null;
  try {
    const typed = parseTypedNumber(text);
    return Number.isFinite(typed.value) ? typed : null;
  } catch {
    return null;
  }
}

/** Number of decimal places in an instrument's resolution (0.01 → 2, 0.5 → 1, 1 → 0, 10 → 0). */
export function resolutionDecimalPlaces(resolution: number): number {
  for (let dp = 0; dp <= 8; dp++) {
    const scaled = resolution * 10 ** dp;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-9 * Math.max(1, scaled)) return dp;
  }
  return 8;
}

const places = (n: number) => (n <= 0 ? "a whole number" : `${n} decimal place${n === 1 ? "" : "s"}`);
const fmt = (n: number) => String(Number(n.toPrecision(6)));
const withUnit = (n: number, unit: string) => (unit.trim() ? `${fmt(n)} ${unit}` : fmt(n));

/** A plain name for the instrument behind a unit, for messages ("This balance reads to 0.01 g"). */
export function instrumentFor(unit: string): string {
  const u = unit.trim();
  if (["g", "kg", "mg"].includes(u)) return "balance";
  if (["°C", "K"].includes(u)) return "thermometer";
  if (["s", "min", "ms"].includes(u)) return "timer";
  return "instrument";
}

const MEASURED: ColumnTemplate["role"][] = ["independent", "dependent", "repeat"];

/** Groups of columns holding repeats of one reading: each mean column's meanOf, and repeat columns tied to a measured column. */
export function repeatGroups(table: TableTemplate): { meanColumn: string | null; columns: string[] }[] {
  const ids = new Set(table.columns.map((c) => c.id));
  const groups: { meanColumn: string | null; columns: string[] }[] = [];
  const covered = new Set<string>();
  for (const c of table.columns) {
    if (c.role !== "mean") continue;
    const cols = c.meanOf.filter((id) => ids.has(id) && id !== c.id);
    if (cols.length < 2) continue;
    groups.push({ meanColumn: c.id, columns: cols });
    cols.forEach((id) => covered.add(id));
  }
  const byTarget = new Map<string, string[]>();
  for (const c of table.columns) {
    if (c.role !== "repeat" || covered.has(c.id)) continue;
    const target = c.meanOf.find((id) => ids.has(id) && id !== c.id);
    if (!target || covered.has(target)) continue;
    byTarget.set(target, [...(byTarget.get(target) ?? []), c.id]);
  }
  for (const [target, repeats] of byTarget) groups.push({ meanColumn: null, columns: [target, ...repeats] });
  return groups;
}

function decimalPlaceIssue(col: ColumnTemplate, typed: TypedNumber): Omit<CellIssue, "row" | "column"> | null {
  const dp = Math.max(0, typed.decimalPlaces);
  const measured = MEASURED.includes(col.role);
  const instrumentDp = measured && col.resolution != null ? resolutionDecimalPlaces(col.resolution) : null;
  const expected = col.decimalPlaces ?? instrumentDp;
  if (expected === null) return null;
  const reads = col.resolution != null && instrumentDp !== null ? `This ${instrumentFor(col.unit)} reads to ${withUnit(col.resolution, col.unit)}` : null;
  if (reads && instrumentDp !== null && dp > instrumentDp) {
    return { level: "error", message: `${reads}: give ${places(expected)}.` };
  }
  if (dp > expected) {
    return { level: "warning", message: `Give this column to ${places(expected)}: that is as precise as these readings are.` };
  }
  if (dp < expected) {
    return {
      level: "warning",
      message: reads && expected === instrumentDp ? `${reads}: give ${places(expected)}, even when the last digit is 0.` : `Give ${places(expected)}: every value in a column has the same number of decimal places.`,
    };
  }
  return null;
}

/**
 * Checks a student's results table against the practical's template: every typed cell must be a
 * plain number (no units: they belong in the heading), inside the instrument's range, and given to
 * the decimal places the instrument reads to (DOMAIN.md recording conventions; "one number of
 * decimal places per column, matching the resolution" is common practice). Repeat readings are
 * judged with the engine's anomaly rule (`findAnomalies`, more than 10 % from the median of the
 * row's repeats, common practice) and the student's decisions to leave readings out or keep them
 * in are applied to the means.
 *
 * Never throws, whatever the cells hold; messages never contain NaN. Preset cells (the teacher's
 * values) are not judged. Mean and derived columns are the student's own calculations: they get
 * the number, range and decimal-place checks only; their values are never worked out here for
 * display (calculation checks judge them).
 *
 * @param table - the practical's table template
 * @param filled - the student's typed rows and reading decisions
 * @returns cell issues, anomalous readings, and the mean of kept repeats per row
 * @example
 * validateTable(balanceTable, { rows: [{ m: "12.345" }], decisions: {} }).issues[0].message;
 * // => "This balance reads to 0.01 g: give 2 decimal places."
 */
export function validateTable(table: TableTemplate, filled: FilledTable): TableValidation {
  const issues: CellIssue[] = [];
  const rowCount = Math.min(MAX_TABLE_ROWS, Math.max(gridRowCount(table, filled), Array.isArray(filled.rows) ? filled.rows.length : 0));
  const decisions = filled.decisions ?? {};

  for (const col of table.columns) {
    const parsed: { row: number; typed: TypedNumber; preset: boolean }[] = [];
    for (let row = 0; row < rowCount; row++) {
      const preset = presetText(table, row, col) !== null;
      const text = cellText(table, filled, row, col);
      if (text === null) continue;
      const typed = tryParse(text);
      if (preset) {
        if (typed) parsed.push({ row, typed, preset });
        continue;
      }
      const add = (level: CellIssue["level"], message: string) => issues.push({ row, column: col.id, level, message });
      if (!typed) {
        add("error", text.includes(",") ? "Use a decimal point, not a comma: type a number like 12.5." : "Type a number, like 12.5.");
        continue;
      }
      if (typed.trailingText) {
        add("error", col.unit.trim() ? `Type the number only: the unit (${col.unit}) is already in the column heading.` : "Type the number only, with no words or units.");
        continue;
      }
      parsed.push({ row, typed, preset });
      const low = col.rangeMin;
      const high = col.rangeMax;
      if ((low != null && typed.value < low) || (high != null && typed.value > high)) {
        const range =
          low != null && high != null
            ? `from ${fmt(low)} to ${withUnit(high, col.unit)}`
            : low != null
              ? `from ${withUnit(low, col.unit)} upwards`
              : `up to ${withUnit(high as number, col.unit)}`;
        add("error", `This is outside what the ${instrumentFor(col.unit)} can read (${range}). Check the reading.`);
        continue;
      }
      const dpIssue = decimalPlaceIssue(col, typed);
      if (dpIssue) add(dpIssue.level, dpIssue.message);
    }
    const hasExpected = col.decimalPlaces != null || (MEASURED.includes(col.role) && col.resolution != null);
    if (!hasExpected && parsed.length >= 2) {
      // Without a set number of decimal places, the column should at least agree with itself.
      const counts = new Map<number, number>();
      for (const p of parsed) counts.set(Math.max(0, p.typed.decimalPlaces), (counts.get(Math.max(0, p.typed.decimalPlaces)) ?? 0) + 1);
      let usual = Math.max(0, parsed[0]!.typed.decimalPlaces);
      for (const [dp, n] of counts) if (n > (counts.get(usual) ?? 0)) usual = dp;
      for (const p of parsed) {
        if (p.preset || Math.max(0, p.typed.decimalPlaces) === usual) continue;
        issues.push({
          row: p.row,
          column: col.id,
          level: "warning",
          message: `Most values in this column have ${usual === 0 ? "no decimal places" : places(usual)}: give every value in a column the same number of decimal places.`,
        });
      }
    }
  }

  const columnIds = new Set(table.columns.map((c) => c.id));
  for (const [key, d] of Object.entries(decisions)) {
    const m = /^(\d+):(.+)$/.exec(key);
    if (!m || !d || typeof d !== "object") continue;
    const row = Number(m[1]);
    const column = m[2]!;
    if (!columnIds.has(column) || row >= rowCount) continue;
    if (typeof d.reason !== "string" || !d.reason.trim()) {
      issues.push({ row, column, level: "error", message: d.include ? "Say why you kept this reading in." : "Say why you left this reading out." });
    }
  }

  const anomalies: AnomalyFlag[] = [];
  const meansByColumn: Record<string, Record<number, number | null>> = {};
  for (const group of repeatGroups(table)) {
    const cols = group.columns.map((id) => table.columns.find((c) => c.id === id)!);
    const means: Record<number, number | null> = {};
    for (let row = 0; row < rowCount; row++) {
      const readings = cols.map((c) => ({ column: c.id, value: readCell(cellText(table, filled, row, c)) })).filter((r): r is { column: string; value: number } => r.value !== null);
      const flagged = new Map(findAnomalies(readings.map((r) => r.value), ANOMALY_PERCENT).map((a) => [a.index, a]));
      const kept: number[] = [];
      readings.forEach((r, i) => {
        const raw = decisions[decisionKey(row, r.column)];
        const decision = raw && typeof raw.include === "boolean" ? { include: raw.include, reason: typeof raw.reason === "string" ? raw.reason : "" } : null;
        const anomaly = flagged.get(i);
        const excluded = decision ? !decision.include : Boolean(anomaly);
        if (anomaly) {
          anomalies.push({ row, column: r.column, message: anomaly.reason, excludedByRule: true, excluded, decision });
        } else if (decision && !decision.include) {
          anomalies.push({ row, column: r.column, message: "You chose to leave this reading out.", excludedByRule: false, excluded, decision });
        }
        if (!excluded) kept.push(r.value);
      });
      const mean = kept.length ? kept.reduce((s, v) => s + v, 0) / kept.length : null;
      means[row] = mean !== null && Number.isFinite(mean) ? mean : null;
    }
    if (group.meanColumn) meansByColumn[group.meanColumn] = means;
  }
  const firstMean = table.columns.find((c) => c.role === "mean" && meansByColumn[c.id]);
  issues.sort((a, b) => a.row - b.row || table.columns.findIndex((c) => c.id === a.column) - table.columns.findIndex((c) => c.id === b.column));
  return { issues, anomalies, means: firstMean ? meansByColumn[firstMean.id]! : {}, meansByColumn };
}

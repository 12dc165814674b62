import { activationEnergy } from "./activation-energy";
import { checkAnswer, type AnswerCheck, type AnswerPolicy, type ExpectedAnswer, type StudentAnswer, type Verdict } from "./check-answer";
import type { CheckDefinition, CheckPolicy, ColumnId, ResultsTable } from "./check-definition";
import { convertUnit } from "./convert-unit";
import { expectedUnit } from "./expected-unit";
import type { Anomaly } from "./find-anomalies";
import type { SlipCandidate } from "./find-likely-slip";
import { linearFit } from "./linear-fit";
import { MarkingInputError } from "./marking-input-error";
import { meanOfRepeats } from "./mean-of-repeats";
import { meanRate } from "./mean-rate";
import { parseUnit } from "./parse-unit";
import { physicalConstants } from "./physical-constants";
import { rateAt } from "./rate-at";
import { reactionOrder } from "./reaction-order";
import { resolutionUncertainty } from "./resolution-uncertainty";
import { validateCheckDefinition } from "./validate-check-definition";
import { interpolateSorted, sortReadings } from "./internal/sorted-readings";

/** The student's answer to a check: one answer, or one per row for the per-row kinds. */
export type CheckAnswerInput = StudentAnswer | { readonly rows: readonly (StudentAnswer | null)[] };

/** The expected value, for the teacher (do not show it to the student unless the teacher reveals it). */
export interface ExpectedValue {
  readonly value: number;
  readonly unit: string;
  /** Standard uncertainty from the fit's own scatter (0 for exact arithmetic). */
  readonly uncertainty: number;
}

/** One row of a per-row check. */
export interface RowCheck {
  /** Row index in the results table (0-based). */
  readonly row: number;
  readonly expected: ExpectedValue | null;
  /** null when the row's data are blank (nothing to check). */
  readonly result: AnswerCheck | null;
  /** Repeats left out of the mean as anomalous. */
  readonly excluded?: readonly Anomaly[];
}

/** Result of {@link runCheck}: JSON-friendly. */
export interface CheckResult {
  readonly kind: CheckDefinition["kind"];
  /** Overall verdict. For per-row checks: agrees when every row agrees, disagrees when any row disagrees, close when any row is close, otherwise cannot-check. */
  readonly verdict: Verdict;
  /** For the teacher only. null when it could not be worked out. */
  readonly expected: ExpectedValue | null;
  /** The single-answer check (absent for per-row kinds and when nothing could be checked). */
  readonly answer?: AnswerCheck;
  /** Per-row results, for the per-row kinds. */
  readonly rows?: readonly RowCheck[];
  /** Counts of row verdicts, for the per-row kinds. */
  readonly summary?: Readonly<Record<Verdict, number>>;
  /** Plain sentences for the student; never the expected number. */
  readonly hint: string;
  /** Why nothing could be checked: from the student's data or from the answer. */
  readonly problem?: { readonly code: string; readonly message: string; readonly source: "data" | "answer" };
  /** Notes for the teacher: curve used, rows skipped, anomalies left out. */
  readonly notes: readonly string[];
}

interface Prepared {
  readonly expected: ExpectedAnswer;
  readonly policy: AnswerPolicy;
  readonly notes: string[];
}

const functionName = "runCheck";

function columnIndex(table: ResultsTable, id: ColumnId): number {
  return table.columns.findIndex((column) => column.id === id);
}

function columnUnit(table: ResultsTable, id: ColumnId): string {
  return table.columns[columnIndex(table, id)].unit;
}

function cells(table: ResultsTable, id: ColumnId): (number | null)[] {
  const index = columnIndex(table, id);
  return table.rows.map((row) => {
    const value = row[index];
    return value === undefined ? null : value;
  });
}

/** Rows where every listed column has a number; blank rows are skipped with a note. */
function pairedColumns(table: ResultsTable, ids: readonly ColumnId[], notes: string[]): number[][] {
  const columns = ids.map((id) => cells(table, id));
  const kept: number[][] = ids.map(() => []);
  const skipped: number[] = [];
  table.rows.forEach((_, row) => {
    if (columns.some((column) => column[row] === null)) {
      if (columns.some((column) => column[row] !== null)) skipped.push(row + 1);
      return;
    }
    columns.forEach((column, i) => kept[i].push(column[row] as number));
  });
  if (skipped.length === 1) notes.push(`Row ${skipped[0]} has a blank cell and was left out.`);
  if (skipped.length > 1) notes.push(`Rows ${skipped.join(", ")} have a blank cell and were left out.`);
  return kept;
}

function resolvePolicy(definition: CheckDefinition, table: ResultsTable, defaults: AnswerPolicy, columnIds: readonly ColumnId[], notes: string[]): AnswerPolicy {
  const policy: CheckPolicy = { ...defaults, ...(definition.policy ?? {}) };
  const rule = policy.significantFigures;
  if (rule && "matchData" in rule && rule.matchData === "columns") {
    const recorded = columnIds
      .map((id) => table.columns[columnIndex(table, id)].significantFigures)
      .filter((value): value is number => typeof value === "number" && value >= 1);
    const { significantFigures: _omitted, ...rest } = policy;
    if (recorded.length === 0) {
      notes.push("Significant figures were not checked: the columns do not say how many figures they were recorded to.");
      return rest;
    }
    return { ...rest, significantFigures: { matchData: Math.min(...recorded), slack: rule.slack ?? 1 } };
  }
  return policy as AnswerPolicy;
}

function sameDimensions(first: string, second: string): boolean {
  try {
    const a = parseUnit(first);
    const b = parseUnit(second);
    return a.dimensions.every((exponent, i) => exponent === b.dimensions[i]);
  } catch {
    return false;
  }
}

function uniqueIntervals(intervals: readonly (readonly [number, number])[], skip: readonly [number, number]): [number, number][] {
  const seen = new Set<string>([`${skip[0]}:${skip[1]}`, `${skip[1]}:${skip[0]}`]);
  const result: [number, number][] = [];
  for (const [from, to] of intervals) {
    const key = `${from}:${to}`;
    if (from === to || seen.has(key)) continue;
    seen.add(key);
    result.push([from, to]);
  }
  return result;
}

function prepareSingle(definition: CheckDefinition, table: ResultsTable): Prepared {
  const notes: string[] = [];
  const unit = expectedUnit(definition, table.columns);
  switch (definition.kind) {
    case "mean-rate": {
      const [x, y] = pairedColumns(table, [definition.x, definition.y], notes);
      const signed = definition.signed === true;
      const value = meanRate(x, y, definition.from, definition.to, { signed });
      const sorted = [...x].sort((a, b) => a - b);
      const previous = (at: number): number => {
        let found = at;
        for (const value_ of sorted) if (value_ < at) found = value_;
        return found;
      };
      const next = (at: number): number => sorted.find((value_) => value_ > at) ?? at;
      const { from, to } = definition;
      const low = Math.min(from, to);
      const high = Math.max(from, to);
      const neighbours: [number, number][] = [
        [low, next(high)],
        [low, previous(high)],
        [previous(low), high],
        [next(low), high],
        [sorted[0], high],
        [low, sorted[sorted.length - 1]],
      ];
      const slips: SlipCandidate[] = [];
      const readings = sortReadings(x, y, { x: "x", y: "y", purpose: "A mean rate" }, 2, functionName);
      const first = readings.x[0];
      const last = readings.x[readings.x.length - 1];
      for (const [a, b] of uniqueIntervals([...(definition.alternativeIntervals ?? []), ...neighbours], [low, high])) {
        if (a < first || a > last || b < first || b > last) continue;
        const gradient = (interpolateSorted(readings, b) - interpolateSorted(readings, a)) / (b - a);
        slips.push({ code: "wrong-interval", value: signed ? gradient : Math.abs(gradient) });
      }
      const atReadings = x.includes(from) && x.includes(to);
      return {
        expected: { value, unit, method: atReadings ? "calculated" : "fitted", slips, isRate: !signed },
        policy: resolvePolicy(definition, table, {}, [definition.x, definition.y], notes),
        notes,
      };
    }
    case "gradient": {
      const [x, y] = pairedColumns(table, [definition.x, definition.y], notes);
      const fit = linearFit(x, y, { throughOrigin: definition.throughOrigin === true });
      const slips: SlipCandidate[] = [];
      const tryGradient = (xs: ColumnId, ys: ColumnId, code: SlipCandidate["code"]): void => {
        try {
          const [a, b] = pairedColumns(table, [xs, ys], []);
          const other = linearFit(a, b, { throughOrigin: definition.throughOrigin === true });
          // Different kinds of quantity cannot convert: compare the numbers as the student would write them.
          const otherUnit = code === "inverted-ratio" ? unit : expectedUnit({ ...definition, x: xs, y: ys }, table.columns);
          const scale = code !== "inverted-ratio" && sameDimensions(otherUnit, unit) ? convertUnit(1, otherUnit, unit) : 1;
          slips.push({ code, value: other.slope * scale });
        } catch (error) {
          if (!(error instanceof MarkingInputError)) throw error;
        }
      };
      tryGradient(definition.y, definition.x, "inverted-ratio");
      for (const pair of definition.alternativeColumns ?? []) tryGradient(pair.x, pair.y, "wrong-columns");
      for (const column of table.columns) {
        if (column.id === definition.x || column.id === definition.y) continue;
        tryGradient(definition.x, column.id, "wrong-columns");
        tryGradient(column.id, definition.y, "wrong-columns");
      }
      notes.push(`Least-squares line${definition.throughOrigin ? " through the origin" : ""}: R² = ${fit.rSquared.toFixed(4)} from ${fit.count} points.`);
      return {
        expected: { value: fit.slope, unit, standardUncertainty: fit.slopeStdErr, method: "fitted", slips },
        policy: resolvePolicy(definition, table, {}, [definition.x, definition.y], notes),
        notes,
      };
    }
    case "rate-at":
    case "initial-rate": {
      const [x, y] = pairedColumns(table, [definition.x, definition.y], notes);
      const signed = definition.signed === true;
      const at = definition.kind === "rate-at" ? definition.at : Math.min(...x);
      const result = rateAt(x, y, at, { model: definition.model ?? "auto", signed });
      notes.push(result.reason);
      if (result.caution) notes.push(result.caution);
      const slips: SlipCandidate[] = [];
      const sorted = x.map((value, i) => [value, y[i]] as const).sort((a, b) => a[0] - b[0]);
      const sign = (value: number): number => (signed ? value : Math.abs(value));
      if (definition.kind === "initial-rate") {
        const first = sorted[0];
        const last = sorted[sorted.length - 1];
        slips.push({ code: "mean-rate-as-initial-rate", value: sign((last[1] - first[1]) / (last[0] - first[0])) });
      }
      for (let i = 1; i < sorted.length; i += 1) {
        const [x0, y0] = sorted[i - 1];
        const [x1, y1] = sorted[i];
        if (x0 <= at && at <= x1) slips.push({ code: "chord-not-tangent", value: sign((y1 - y0) / (x1 - x0)) });
        if (i >= 2 && sorted[i - 2][0] <= at && at <= x1) {
          slips.push({ code: "chord-not-tangent", value: sign((y1 - sorted[i - 2][1]) / (x1 - sorted[i - 2][0])) });
        }
      }
      const yRange = Math.max(...y) - Math.min(...y);
      return {
        expected: {
          value: result.rate,
          unit,
          standardUncertainty: result.uncertainty,
          method: "tangent",
          slips,
          isRate: !signed,
          ...(yRange > 0 ? { curve: { x: at, y: result.valueAt, yRange } } : {}),
        },
        policy: resolvePolicy(definition, table, {}, [definition.x, definition.y], notes),
        notes,
      };
    }
    case "order": {
      const [c, r] = pairedColumns(table, [definition.concentration, definition.rate], notes);
      const result = reactionOrder(c, r);
      const inverted = linearFit(
        r.map((value) => Math.log10(value)),
        c.map((value) => Math.log10(value)),
      ).slope;
      notes.push(`Order from the log-log gradient: ${result.order.toFixed(3)} (R² = ${result.rSquared.toFixed(4)}).`);
      return {
        expected: { value: result.order, unit: "", standardUncertainty: result.orderStdErr, method: "fitted", slips: [{ code: "inverted-ratio", value: inverted }] },
        policy: resolvePolicy(definition, table, { absoluteTolerance: 0.2, requireUnit: false }, [definition.concentration, definition.rate], notes),
        notes,
      };
    }
    case "activation-energy": {
      const [temperatures, measure] = pairedColumns(table, [definition.temperature, definition.rate], notes);
      const temperatureUnit = (definition.temperatureUnit ?? columnUnit(table, definition.temperature)).trim();
      const celsius = temperatureUnit !== "K";
      const kelvin = temperatures.map((value) => (celsius ? value + physicalConstants.zeroCelsiusInKelvin : value));
      for (const value of kelvin) {
        if (value <= 0) throw new MarkingInputError("not-positive", functionName, "A temperature is at or below absolute zero, which cannot be right; check the temperature column and its unit.");
      }
      const rates = definition.rateIs === "time" ? measure.map((t) => {
        if (t <= 0) throw new MarkingInputError("not-positive", functionName, "A time is zero or negative; every time must be greater than zero.");
        return 1 / t;
      }) : measure;
      const result = activationEnergy(kelvin, rates);
      const toKj = 1 / 1000;
      const slips: SlipCandidate[] = [];
      const asCelsius = kelvin.map((value) => value - physicalConstants.zeroCelsiusInKelvin);
      if (asCelsius.every((value) => value > 0) && new Set(asCelsius).size > 1) {
        slips.push({ code: "celsius-for-kelvin", value: activationEnergy(asCelsius, rates).ea * toKj });
      }
      slips.push({ code: "log10-for-ln", value: (result.ea / Math.LN10) * toKj });
      notes.push(`Arrhenius line: gradient ${result.slope.toPrecision(4)} K, R² = ${result.rSquared.toFixed(4)}, A = ${result.preExponential.toPrecision(3)}.`);
      return {
        expected: { value: result.ea * toKj, unit, standardUncertainty: result.eaStdErr * toKj, method: "fitted", slips },
        policy: resolvePolicy(definition, table, {}, [definition.temperature, definition.rate], notes),
        notes,
      };
    }
    case "percentage-uncertainty": {
      const single = resolutionUncertainty(definition.resolution, { instrument: definition.instrument, readings: definition.readings });
      if (definition.reading === 0) {
        throw new MarkingInputError("not-positive", functionName, "A percentage uncertainty of a zero reading cannot be found.");
      }
      const value = (100 * single.uncertainty) / Math.abs(definition.reading);
      notes.push(`Uncertainty taken as ${single.rule}.`);
      return {
        expected: {
          value,
          unit: "%",
          method: "calculated",
          slips: [
            { code: "resolution-rule", value: value * 2 },
            { code: "resolution-rule", value: value / 2 },
          ],
        },
        policy: resolvePolicy(definition, table, {}, [], notes),
        notes,
      };
    }
    default:
      throw new MarkingInputError("invalid-definition", functionName, "This check is answered row by row.");
  }
}

interface PreparedRow {
  readonly row: number;
  readonly expected: ExpectedAnswer | null;
  readonly excluded?: readonly Anomaly[];
  readonly problem?: { code: string; message: string };
}

function prepareRows(definition: CheckDefinition, table: ResultsTable, notes: string[]): { rows: PreparedRow[]; policy: AnswerPolicy } {
  const unit = expectedUnit(definition, table.columns);
  if (definition.kind === "reciprocal-time") {
    const times = cells(table, definition.t);
    const rows = times.map((t, row): PreparedRow => {
      if (t === null) return { row, expected: null };
      if (!Number.isFinite(t) || t <= 0) {
        return { row, expected: null, problem: { code: "not-positive", message: `The time in row ${row + 1} is zero or negative, so 1/t cannot be found.` } };
      }
      return { row, expected: { value: 1 / t, unit, method: "calculated", isRate: true } };
    });
    return { rows, policy: resolvePolicy(definition, table, {}, [definition.t], notes) };
  }
  if (definition.kind === "mean-of-repeats") {
    const firstUnit = columnUnit(table, definition.repeats[0]);
    const columns = definition.repeats.map((id) => {
      const scale = convertUnit(1, columnUnit(table, id), firstUnit) - convertUnit(0, columnUnit(table, id), firstUnit);
      const shift = convertUnit(0, columnUnit(table, id), firstUnit);
      return cells(table, id).map((value) => (value === null ? null : value * scale + shift));
    });
    const rows = table.rows.map((_, row): PreparedRow => {
      const readings = columns.map((column) => column[row]);
      if (readings.every((value) => value === null)) return { row, expected: null };
      try {
        const result = meanOfRepeats(readings, { anomalyPercent: definition.anomalyPercent });
        const slips: SlipCandidate[] = result.excluded.length > 0 ? [{ code: "anomaly-included", value: result.meanOfAll }] : [];
        return {
          row,
          expected: { value: result.mean, unit, standardUncertainty: 0, method: "calculated", slips },
          ...(result.excluded.length > 0 ? { excluded: result.excluded } : {}),
        };
      } catch (error) {
        if (!(error instanceof MarkingInputError)) throw error;
        return { row, expected: null, problem: { code: error.code, message: error.message } };
      }
    });
    return { rows, policy: resolvePolicy(definition, table, {}, definition.repeats, notes) };
  }
  throw new MarkingInputError("invalid-definition", functionName, "This check is answered with a single value.");
}

function toExpectedValue(expected: ExpectedAnswer): ExpectedValue {
  return { value: expected.value, unit: expected.unit, uncertainty: expected.standardUncertainty ?? 0 };
}

function requireTableShape(table: ResultsTable): void {
  if (!table || !Array.isArray(table.columns) || !Array.isArray(table.rows)) {
    throw new MarkingInputError("invalid-definition", functionName, "The results table needs a list of columns and a list of rows.");
  }
  table.rows.forEach((row, index) => {
    if (!Array.isArray(row) || row.length !== table.columns.length) {
      throw new MarkingInputError("length-mismatch", functionName, `Row ${index + 1} of the results table does not have one cell per column.`);
    }
  });
}

/**
 * Runs one calculation check on one student's write-up: recomputes the expected value from the
 * student's own results table and compares the student's typed answer with it.
 *
 * Method per kind: mean rate by interpolation (`meanRate`); gradient by least squares
 * (`linearFit`); rate at a time and initial rate from a fitted curve (`rateAt`); 1/t and mean of
 * repeats row by row; order from the log-log gradient (`reactionOrder`); activation energy from
 * ln k or ln(1/t) against 1/T in kelvin (`activationEnergy`), in kJ mol⁻¹; percentage
 * uncertainty from the resolution (`resolutionUncertainty`). Rows with a blank cell in a needed
 * column are left out (and noted). Each answer is judged with `checkAnswer` under the check's
 * policy, with slip values computed from the data (neighbouring intervals, other columns, chords,
 * °C for K, log10 for ln, anomalies left in). When the student's data cannot give an expected
 * value, the verdict is "cannot-check" with the reason in `problem` (source "data").
 *
 * @param definition - the check, as the practical defines it
 * @param table - the student's results table (column ids and units, rows of numbers or null)
 * @param answer - the student's typed answer, or `{ rows }` with one answer per row for per-row kinds
 * @returns verdict, expected value (for the teacher), per-answer or per-row checks, hint and notes
 * @throws {MarkingInputError} `invalid-definition`, `unknown-column`, `length-mismatch` when the
 *   definition or the table's shape is wrong (a problem in the practical, not in the student's work)
 * @example
 * runCheck(
 *   { kind: "mean-rate", x: "t", y: "v", from: 0, to: 30 },
 *   { columns: [{ id: "t", unit: "s" }, { id: "v", unit: "cm3" }], rows: [[0, 0], [30, 24], [60, 36]] },
 *   { value: "0.80", unit: "cm3/s" },
 * ).verdict;
 * // => "agrees"
 */
export function runCheck(definition: CheckDefinition, table: ResultsTable, answer: CheckAnswerInput): CheckResult {
  requireTableShape(table);
  validateCheckDefinition(definition, table.columns);
  const perRow = definition.kind === "reciprocal-time" || definition.kind === "mean-of-repeats";
  const hasRows = typeof answer === "object" && answer !== null && "rows" in answer && Array.isArray(answer.rows);

  if (!perRow) {
    let prepared: Prepared;
    try {
      prepared = prepareSingle(definition, table);
    } catch (error) {
      if (!(error instanceof MarkingInputError)) throw error;
      return {
        kind: definition.kind,
        verdict: "cannot-check",
        expected: null,
        hint: `This answer cannot be checked yet: ${error.message}`,
        problem: { code: error.code, message: error.message, source: "data" },
        notes: [],
      };
    }
    if (hasRows || typeof (answer as StudentAnswer)?.value !== "string") {
      const message = "This check needs one answer, typed as a number.";
      return {
        kind: definition.kind,
        verdict: "cannot-check",
        expected: toExpectedValue(prepared.expected),
        hint: message,
        problem: { code: "unreadable-number", message, source: "answer" },
        notes: prepared.notes,
      };
    }
    const result = checkAnswer(prepared.expected, answer as StudentAnswer, prepared.policy);
    return {
      kind: definition.kind,
      verdict: result.verdict,
      expected: toExpectedValue(prepared.expected),
      answer: result,
      hint: result.hint,
      ...(result.verdict === "cannot-check" ? { problem: { code: "unreadable-number", message: result.hint, source: "answer" as const } } : {}),
      notes: prepared.notes,
    };
  }

  const notes: string[] = [];
  const { rows, policy } = prepareRows(definition, table, notes);
  const answers: readonly (StudentAnswer | null)[] = hasRows ? (answer as { rows: readonly (StudentAnswer | null)[] }).rows : [];
  const summary: Record<Verdict, number> = { agrees: 0, close: 0, disagrees: 0, "cannot-check": 0 };
  const checked: RowCheck[] = rows.map((prepared) => {
    const typed = answers[prepared.row] ?? null;
    if (prepared.expected === null) {
      if (prepared.problem) {
        summary["cannot-check"] += 1;
        return {
          row: prepared.row,
          expected: null,
          result: {
            verdict: "cannot-check",
            deviation: null,
            tolerance: null,
            answerValue: null,
            significantFigures: null,
            significantFiguresOk: null,
            unitOk: false,
            unitTyped: null,
            hint: prepared.problem.message,
          },
        };
      }
      return { row: prepared.row, expected: null, result: null };
    }
    const result: AnswerCheck =
      typed === null || typeof typed.value !== "string" || typed.value.trim() === ""
        ? {
            verdict: "cannot-check",
            deviation: null,
            tolerance: null,
            answerValue: null,
            significantFigures: null,
            significantFiguresOk: null,
            unitOk: false,
            unitTyped: null,
            hint: `Row ${prepared.row + 1} has no answer yet.`,
          }
        : checkAnswer(prepared.expected, typed, policy);
    summary[result.verdict] += 1;
    if (prepared.excluded) {
      notes.push(`Row ${prepared.row + 1}: ${prepared.excluded.map((anomaly) => anomaly.value).join(", ")} left out of the mean as anomalous.`);
    }
    return {
      row: prepared.row,
      expected: toExpectedValue(prepared.expected),
      result,
      ...(prepared.excluded ? { excluded: prepared.excluded } : {}),
    };
  });
  const counted = summary.agrees + summary.close + summary.disagrees + summary["cannot-check"];
  const verdict: Verdict =
    counted === 0 ? "cannot-check"
    : summary.disagrees > 0 ? "disagrees"
    : summary.close > 0 ? "close"
    : summary.agrees === counted ? "agrees"
    : "cannot-check";
  const slipRows = checked.filter((row) => row.result?.likelySlip);
  const hint =
    counted === 0 ? "There are no rows with results to check yet."
    : verdict === "agrees" ? "Every row agrees with the values worked out from your own results."
    : [
        `${summary.agrees} of ${counted} rows agree with your results.`,
        ...(slipRows.length > 0 ? [`Row ${slipRows[0].row + 1}: ${slipRows[0].result?.likelySlip?.message}`] : []),
        ...(summary["cannot-check"] > 0 ? [`${summary["cannot-check"]} row${summary["cannot-check"] === 1 ? "" : "s"} could not be checked yet.`] : []),
      ].join(" ");
  return {
    kind: definition.kind,
    verdict,
    expected: null,
    rows: checked,
    summary,
    hint,
    ...(counted === 0 ? { problem: { code: "too-few-points", message: hint, source: "data" as const } } : {}),
    notes,
  };
}

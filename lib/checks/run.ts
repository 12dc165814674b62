import {
  checkKinds,
  findAnomalies,
  MarkingInputError,
  parseTypedNumber,
  runCheck,
  type CheckDefinition,
  type CheckResult,
  type ResultsTable,
} from "@/lib/marking";
import type { CheckSpec, TableTemplate } from "@/lib/validation/practicals";
import type { CheckAnswer, CheckOutcome, StudentCheckView, TableRows, Verdict } from "./types";

/** A cell as a number, or null when blank or unreadable (unreadable cells are flagged by table validation). */
export function cellNumber(cell: string | number | null | undefined): number | null {
  if (cell == null) return null;
  if (typeof cell === "number") return Number.isFinite(cell) ? cell : null;
  if (!cell.trim()) return null;
  try {
    const n = parseTypedNumber(cell).value;
    return Number.isFinite(n) ? n : null;
  } catch {
    return null;
  }
}

/** The engine's table: the template's columns with their units, and the student's numbers. */
export function toResultsTable(table: TableTemplate, rows: TableRows): ResultsTable {
  return {
    columns: table.columns.map((c) => ({ id: c.id, unit: c.unit, label: c.unit ? `${c.quantity} / ${c.unit}` : c.quantity })),
    rows: rows.map((r) => table.columns.map((c) => cellNumber(r[c.id]))),
  };
}

/** The engine's definition of a check from the practical's check, reading fixed values from the data where needed. */
export function toDefinition(spec: CheckSpec, rows: TableRows, keptIn?: ReadonlySet<string>): CheckDefinition {
  const policy = { tolerancePercent: spec.tolerancePercent, ...(spec.sigFigs ? { significantFigures: { min: spec.sigFigs.min, max: spec.sigFigs.max } } : {}) };
  switch (spec.kind) {
    case "mean-rate":
      return { kind: "mean-rate", x: spec.x, y: spec.y, from: spec.from, to: spec.to, policy };
    case "gradient":
      return { kind: "gradient", x: spec.x, y: spec.y, throughOrigin: spec.throughOrigin, policy };
    case "rate-at":
      return { kind: "rate-at", x: spec.x, y: spec.y, at: spec.at, model: spec.model, policy };
    case "initial-rate":
      return { kind: "initial-rate", x: spec.x, y: spec.y, policy };
    case "reciprocal-time":
      return { kind: "reciprocal-time", t: spec.t, policy };
    case "mean-of-repeats":
      return { kind: "mean-of-repeats", repeats: spec.repeats, policy, ...(keptIn?.size ? { anomalyPercent: 1e9 } : {}) };
    case "order":
      return { kind: "order", concentration: spec.concentration, rate: spec.rate, policy };
    case "activation-energy":
      return { kind: "activation-energy", temperature: spec.temperature, temperatureUnit: spec.temperatureUnit, rate: spec.rate, rateIs: spec.rateIs, policy };
    case "percentage-uncertainty": {
      // The uncertainty of the largest reading in the column (the value the student quotes).
      const readings = rows.map((r) => cellNumber(r[spec.reading])).filter((v): v is number => v !== null && v > 0);
      const reading = readings.length ? Math.max(...readings) : NaN;
      return { kind: "percentage-uncertainty", resolution: spec.resolution, reading, readings: spec.readingsPerValue, policy };
    }
  }
}

const isPerRow = (spec: CheckSpec) => spec.kind === "reciprocal-time" || spec.kind === "mean-of-repeats";

function describeExpected(result: CheckResult): string {
  if (!result.expected) return "";
  const { value, unit, uncertainty } = result.expected;
  const v = Number(value.toPrecision(4));
  const u = uncertainty ? ` ± ${Number(uncertainty.toPrecision(2))}` : "";
  return `Expected from this student's data: ${v}${u}${unit ? ` ${unit}` : ""}.`;
}

function outcomeFromResult(spec: CheckSpec, result: CheckResult): CheckOutcome {
  const a = result.answer;
  const reason = [
    result.problem ? result.problem.message : "",
    describeExpected(result),
    a?.deviation != null ? `The answer is ${a.deviation >= 0 ? "above" : "below"} by ${Math.abs(a.deviation * 100).toFixed(1)} % (allowed ${((a.tolerance ?? 0) * 100).toFixed(1)} %).` : "",
    a?.likelySlip ? `Likely slip: ${a.likelySlip.message}` : "",
    ...result.notes,
  ]
    .filter(Boolean)
    .join(" ");
  const rule = spec.sigFigs;
  return {
    checkId: spec.id,
    verdict: result.verdict,
    hint: result.hint,
    reason,
    expected: result.expected ? { value: result.expected.value, unit: result.expected.unit, uncertainty: result.expected.uncertainty || null, method: result.kind } : null,
    deviationPercent: a?.deviation != null ? a.deviation * 100 : null,
    sigFigs: {
      typed: a?.significantFigures ?? null,
      ok: a?.significantFiguresOk ?? null,
      message:
        a && a.significantFiguresOk === false && rule
          ? `Give ${rule.min === rule.max ? rule.min : `${rule.min} to ${rule.max}`} significant figures (you gave ${a.significantFigures}).`
          : null,
    },
    unit: { ok: a ? a.unitOk : null, message: a && !a.unitOk ? "Check the unit: it is missing, not recognised, or does not fit this quantity." : null },
    likelySlip: a?.likelySlip ? { code: a.likelySlip.code, message: a.likelySlip.message } : null,
    tangent: a?.tangent ? { touches: a.tangent.touches, message: a.tangent.touches ? "Your tangent touches the curve at the chosen time." : "Your tangent does not touch the curve at the chosen time: move it so it just touches there." } : null,
    rows: result.rows
      ? result.rows.map((r) => ({ index: r.row, verdict: (r.result?.verdict ?? "cannot-check") as Verdict, expected: r.expected?.value ?? null, typed: r.result?.answerValue ?? null }))
      : null,
  };
}

/**
 * Runs one of a practical's calculation checks against a student's table and answer. Never
 * throws for the student's data or answer: problems come back as "cannot check yet" with a
 * reason. A check whose definition does not fit the table (a problem in the practical) also
 * comes back that way, with the reason for the teacher.
 */
export function runPracticalCheck(spec: CheckSpec, table: TableTemplate, rows: TableRows, answer: CheckAnswer, options: { keptIn?: ReadonlySet<string> } = {}): CheckOutcome {
  const keptIn = options.keptIn;
  if (spec.kind === "mean-of-repeats" && keptIn?.size) {
    // The student chose to keep some flagged readings, with a reason: apply the anomaly rule here,
    // row by row, except for those readings, and let the check use exactly what remains.
    rows = rows.map((r, i) => {
      const cols = spec.repeats.filter((c) => cellNumber(r[c]) !== null);
      const values = cols.map((c) => cellNumber(r[c])!);
      const next = { ...r };
      for (const a of values.length >= 3 ? findAnomalies(values) : []) {
        const col = cols[a.index]!;
        if (!keptIn.has(`${i}:${col}`)) next[col] = null;
      }
      return next;
    });
  }
  const resultsTable = toResultsTable(table, rows);
  let result: CheckResult;
  try {
    const definition = toDefinition(spec, rows, keptIn);
    const input = isPerRow(spec)
      ? { rows: rows.map((r) => { const v = "answerColumn" in spec ? r[spec.answerColumn] : null; return v == null || v === "" ? null : { value: String(v), unit: table.columns.find((c) => c.id === spec.answerColumn)?.unit ?? "" }; }) }
      : { value: answer.value, unit: answer.unit, ...(answer.tangent ? { tangent: answer.tangent } : {}) };
    result = runCheck(definition, resultsTable, input);
  } catch (e) {
    if (!(e instanceof MarkingInputError)) throw e;
    return {
      checkId: spec.id,
      verdict: "cannot-check",
      hint: e.message,
      reason: e.message,
      expected: null,
      deviationPercent: null,
      sigFigs: { typed: null, ok: null, message: null },
      unit: { ok: null, message: null },
      likelySlip: null,
      tangent: null,
      rows: null,
    };
  }
  return outcomeFromResult(spec, result);
}

/**
 * What a student may see of an outcome: always the verdict; the hint unless the teacher chose
 * "verdict only"; the expected value only when the teacher chose to reveal it after marking and
 * the work has been returned.
 */
export function studentView(outcome: CheckOutcome, show: CheckSpec["show"], released: boolean): StudentCheckView {
  return {
    checkId: outcome.checkId,
    verdict: outcome.verdict,
    hint: show === "verdict" ? null : outcome.hint,
    expected: show === "expected-after-marking" && released && outcome.expected ? { value: outcome.expected.value, unit: outcome.expected.unit } : null,
    rows: outcome.rows ? outcome.rows.map((r) => ({ index: r.index, verdict: r.verdict })) : null,
  };
}

/** Plain label of a check kind, from the engine's list. */
export function checkKindLabel(kind: CheckSpec["kind"]): string {
  return checkKinds.find((k) => k.kind === kind)?.label ?? kind;
}

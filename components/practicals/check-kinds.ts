import type { CheckKind, CheckSpec, ColumnTemplate, TableTemplate } from "@/lib/validation/practicals";
import { columnHeader, ratioUnit } from "./units";

/** The kinds of calculation check, in the words a teacher uses. */
export const CHECK_KIND_LABELS: Record<CheckKind, string> = {
  "mean-rate": "Mean rate over an interval",
  gradient: "Gradient of the line of best fit",
  "rate-at": "Rate at a time (tangent)",
  "initial-rate": "Initial rate",
  "reciprocal-time": "1/t for each row",
  "mean-of-repeats": "Mean of repeats for each row",
  order: "Order of reaction (log–log)",
  "activation-energy": "Activation energy (Arrhenius)",
  "percentage-uncertainty": "Percentage uncertainty",
};

export const CHECK_KIND_HINTS: Record<CheckKind, string> = {
  "mean-rate": "Change in y divided by change in x between two chosen values of x.",
  gradient: "The gradient of the straight line of best fit through the student's points.",
  "rate-at": "The gradient of a tangent to the curve at a chosen time.",
  "initial-rate": "The gradient of the curve at the start (x = 0 or the first reading).",
  "reciprocal-time": "1 ÷ time, worked out on each row (clock and disappearing-mark methods).",
  "mean-of-repeats": "The mean of the repeat readings on each row, with anomalies left out.",
  order: "The gradient of log(rate) against log(concentration).",
  "activation-energy": "Ea from the gradient of ln k (or ln 1/t) against 1/T, with T in kelvin.",
  "percentage-uncertainty": "Uncertainty from the instrument's resolution, as a percentage of a reading.",
};

/** Fitted gradients about 10 %, hand-drawn tangents about 15 %, values worked out directly 5 %. */
export const DEFAULT_TOLERANCE: Record<CheckKind, number> = {
  "mean-rate": 5,
  gradient: 10,
  "rate-at": 15,
  "initial-rate": 15,
  "reciprocal-time": 5,
  "mean-of-repeats": 5,
  order: 10,
  "activation-energy": 10,
  "percentage-uncertainty": 5,
};

export const CHECK_VISIBILITY_LABELS = {
  verdict: "The verdict only",
  hint: "The verdict and a hint",
  "expected-after-marking": "The verdict, a hint and the expected value once the work is marked",
} as const;

/** Fields of a check that name a column, and what each is called on screen. */
export const CHECK_COLUMN_FIELDS: Record<CheckKind, { field: string; label: string; many?: boolean }[]> = {
  "mean-rate": [
    { field: "x", label: "x (usually time)" },
    { field: "y", label: "y (what changes)" },
  ],
  gradient: [
    { field: "x", label: "x-axis column" },
    { field: "y", label: "y-axis column" },
  ],
  "rate-at": [
    { field: "x", label: "x (usually time)" },
    { field: "y", label: "y (what changes)" },
  ],
  "initial-rate": [
    { field: "x", label: "x (usually time)" },
    { field: "y", label: "y (what changes)" },
  ],
  "reciprocal-time": [
    { field: "t", label: "Time column" },
    { field: "answerColumn", label: "Column where students write 1/t" },
  ],
  "mean-of-repeats": [
    { field: "repeats", label: "Repeat columns", many: true },
    { field: "answerColumn", label: "Column where students write the mean" },
  ],
  order: [
    { field: "concentration", label: "Concentration column" },
    { field: "rate", label: "Rate column" },
  ],
  "activation-energy": [
    { field: "temperature", label: "Temperature column" },
    { field: "rate", label: "Rate constant or time column" },
  ],
  "percentage-uncertainty": [{ field: "reading", label: "Reading column" }],
};

type Base = Pick<CheckSpec, "id" | "label" | "tableId" | "tolerancePercent" | "sigFigs" | "expectedUnit" | "show">;

function pick(table: TableTemplate | undefined, ...roles: ColumnTemplate["role"][]): ColumnTemplate | undefined {
  for (const role of roles) {
    const col = table?.columns.find((c) => c.role === role);
    if (col) return col;
  }
  return undefined;
}

function other(table: TableTemplate | undefined, not: ColumnTemplate | undefined): ColumnTemplate | undefined {
  return table?.columns.find((c) => c.id !== not?.id);
}

/** A unit to suggest for a check's answer, from the columns it is bound to. */
export function suggestedUnit(check: CheckSpec, table: TableTemplate | undefined): string {
  const col = (id: string | undefined) => table?.columns.find((c) => c.id === id);
  switch (check.kind) {
    case "mean-rate":
    case "gradient":
    case "rate-at":
    case "initial-rate":
      return ratioUnit(col(check.y)?.unit ?? "", col(check.x)?.unit ?? "");
    case "reciprocal-time": {
      const u = col(check.t)?.unit ?? "s";
      return u === "s" ? "s⁻¹" : ratioUnit("", u);
    }
    case "mean-of-repeats":
      return col(check.repeats[0])?.unit ?? "";
    case "order":
      return "";
    case "activation-energy":
      return "kJ/mol";
    case "percentage-uncertainty":
      return "%";
  }
}

/**
 * A new check of a kind, bound to sensible columns of the table (independent variable as x, the
 * first measured or mean column as y), with the default tolerance for its kind. `base` carries
 * over what the teacher already set when they change the kind of an existing check.
 */
export function makeCheck(kind: CheckKind, table: TableTemplate | undefined, base: Partial<Base> & { id: string }): CheckSpec {
  const independent = pick(table, "independent") ?? table?.columns[0];
  const measured = pick(table, "mean", "dependent", "derived", "repeat") ?? other(table, independent);
  const first = table?.columns[0];
  const common: Base = {
    id: base.id,
    label: base.label ?? CHECK_KIND_LABELS[kind],
    tableId: base.tableId ?? table?.id ?? "",
    tolerancePercent: base.tolerancePercent ?? DEFAULT_TOLERANCE[kind],
    sigFigs: base.sigFigs ?? null,
    expectedUnit: base.expectedUnit ?? "",
    show: base.show ?? "hint",
  };
  const x = independent?.id ?? "";
  const y = measured?.id ?? "";
  let check: CheckSpec;
  switch (kind) {
    case "mean-rate": {
      const preset = table?.presetRows.map((r) => r[x]).filter((v): v is number => typeof v === "number") ?? [];
      const usable = preset.length >= 2;
      check = { ...common, kind, x, y, from: usable ? preset[0]! : 0, to: usable ? preset[Math.min(3, preset.length - 1)]! : 30 };
      break;
    }
    case "gradient":
      check = { ...common, kind, x, y, throughOrigin: false };
      break;
    case "rate-at":
      check = { ...common, kind, x, y, at: 20, model: "auto" };
      break;
    case "initial-rate":
      check = { ...common, kind, x, y };
      break;
    case "reciprocal-time": {
      const answer = table?.columns.find((c) => c.role === "derived" && c.formula === "reciprocal");
      const t = table?.columns.find((c) => c.id === answer?.derivedFrom) ?? measured ?? first;
      check = { ...common, kind, t: t?.id ?? "", answerColumn: answer?.id ?? other(table, t)?.id ?? "" };
      break;
    }
    case "mean-of-repeats": {
      const mean = table?.columns.find((c) => c.role === "mean");
      const repeats = mean?.meanOf.length ? mean.meanOf : (table?.columns.filter((c) => c.role === "repeat").map((c) => c.id) ?? []);
      check = { ...common, kind, repeats, answerColumn: mean?.id ?? "" };
      break;
    }
    case "order":
      check = { ...common, kind, concentration: x, rate: y };
      break;
    case "activation-energy": {
      const temperature = table?.columns.find((c) => /temperature/i.test(c.quantity) || c.unit === "°C" || c.unit === "K") ?? independent;
      const rate = table?.columns.find((c) => c.id !== temperature?.id && (c.role === "mean" || c.role === "dependent" || c.role === "derived")) ?? other(table, temperature);
      check = { ...common, kind, temperature: temperature?.id ?? "", temperatureUnit: temperature?.unit === "K" ? "K" : "°C", rate: rate?.id ?? "", rateIs: "time" };
      break;
    }
    case "percentage-uncertainty":
      check = { ...common, kind, resolution: measured?.resolution ?? 1, reading: y, readingsPerValue: 1 };
      break;
  }
  if (!check.expectedUnit) check.expectedUnit = suggestedUnit(check, table);
  return check;
}

/** Changes a check's kind, keeping its name (if the teacher wrote one), table and settings. */
export function changeCheckKind(check: CheckSpec, kind: CheckKind, table: TableTemplate | undefined): CheckSpec {
  const renamed = check.label !== CHECK_KIND_LABELS[check.kind];
  const toleranceChanged = check.tolerancePercent !== DEFAULT_TOLERANCE[check.kind];
  const unitChanged = check.expectedUnit !== suggestedUnit(check, table);
  return makeCheck(kind, table, {
    id: check.id,
    label: renamed ? check.label : undefined,
    tableId: check.tableId,
    tolerancePercent: toleranceChanged ? check.tolerancePercent : undefined,
    sigFigs: check.sigFigs,
    expectedUnit: unitChanged ? check.expectedUnit : undefined,
    show: check.show,
  });
}

/** Binds a check to another table, choosing that table's columns afresh. */
export function moveCheckToTable(check: CheckSpec, table: TableTemplate | undefined): CheckSpec {
  const next = makeCheck(check.kind, table, { id: check.id, label: check.label, tableId: table?.id ?? "", tolerancePercent: check.tolerancePercent, sigFigs: check.sigFigs, show: check.show });
  return next;
}

function header(table: TableTemplate | undefined, id: string | undefined): string {
  const col = table?.columns.find((c) => c.id === id);
  return col ? `“${columnHeader(col)}”` : "a column that is not in the table";
}

function num(n: number): string {
  return Number.isFinite(n) ? String(n) : "?";
}

/** What a check does, in plain words, for the read-only view of a practical. */
export function describeCheck(check: CheckSpec, table: TableTemplate | undefined): string {
  const h = (id: string | undefined) => header(table, id);
  const xUnit = (id: string) => table?.columns.find((c) => c.id === id)?.unit ?? "";
  let what: string;
  switch (check.kind) {
    case "mean-rate":
      what = `Students work out the mean rate: the change in ${h(check.y)} divided by the change in ${h(check.x)}, from ${num(check.from)}${xUnit(check.x) ? ` ${xUnit(check.x)}` : ""} to ${num(check.to)}${xUnit(check.x) ? ` ${xUnit(check.x)}` : ""}.`;
      break;
    case "gradient":
      what = `Students find the gradient of the line of best fit of ${h(check.y)} against ${h(check.x)}${check.throughOrigin ? ", with the line through the origin" : ""}.`;
      break;
    case "rate-at":
      what = `Students draw a tangent to the curve of ${h(check.y)} against ${h(check.x)} at ${num(check.at)}${xUnit(check.x) ? ` ${xUnit(check.x)}` : ""} and find its gradient.`;
      break;
    case "initial-rate":
      what = `Students find the initial rate: the gradient of the curve of ${h(check.y)} against ${h(check.x)} at the start.`;
      break;
    case "reciprocal-time":
      what = `On each row, students work out 1/t from ${h(check.t)} and write it in ${h(check.answerColumn)}.`;
      break;
    case "mean-of-repeats":
      what = `On each row, students work out the mean of ${check.repeats.map((r) => h(r)).join(", ")} (leaving out anomalies) and write it in ${h(check.answerColumn)}.`;
      break;
    case "order":
      what = `Students find the order of reaction from the gradient of log(rate) against log(concentration), using ${h(check.rate)} and ${h(check.concentration)}.`;
      break;
    case "activation-energy":
      what = `Students find the activation energy from the gradient of ${check.rateIs === "time" ? "ln(1/t)" : "ln k"} against 1/T, using ${h(check.rate)} and ${h(check.temperature)} (in ${check.temperatureUnit}).`;
      break;
    case "percentage-uncertainty":
      what = `Students work out the percentage uncertainty in ${h(check.reading)} from a resolution of ${num(check.resolution)}${check.readingsPerValue === 2 ? ", with two readings (start and end) for each value" : ""}.`;
      break;
  }
  const parts = [what, `An answer within ${num(check.tolerancePercent)}\u00a0% of Meniscus’s value agrees.`];
  if (check.sigFigs) parts.push(check.sigFigs.min === check.sigFigs.max ? `Give it to ${check.sigFigs.min} significant figures.` : `Give it to ${check.sigFigs.min} to ${check.sigFigs.max} significant figures.`);
  if (check.expectedUnit.trim()) parts.push(`Unit: ${check.expectedUnit.trim()}.`);
  parts.push(`Students see ${CHECK_VISIBILITY_LABELS[check.show].toLowerCase()}.`);
  return parts.join(" ");
}

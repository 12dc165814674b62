import { evaluatePolynomial, firstOrderFit, linearFit, localRegression, MarkingInputError, polynomialFit, rateAt, tangentTouchesCurve } from "@/lib/marking";
import type { ColumnTemplate, GraphSpec, TableTemplate } from "@/lib/validation/practicals";
import { MAX_TABLE_ROWS, type FilledTable } from "@/lib/validation/write-ups";
import { cellText, columnHeading, decisionKey, gridRowCount, readCell } from "./table-validation";

/** One plotted reading, with the table row it came from. */
export type PlotPoint = { x: number; y: number; row: number };
export type XY = { x: number; y: number };
export type Tangent = { at: number; x1: number; y1: number; x2: number; y2: number };

export type GraphPoints = {
  x: ColumnTemplate;
  y: ColumnTemplate;
  /** Readings plotted and used for the line or curve. */
  points: PlotPoint[];
  /** Readings the student chose to leave out (a decision with include: false on either cell). */
  excludedPoints: PlotPoint[];
  /** Rows with something in them that cannot be plotted: one cell blank, or not a number. */
  leftOut: number;
};

/**
 * The pairs of numbers a graph plots, from the student's table: x and y from the graph's
 * columns (preset values included), rows where both cells are blank skipped silently, rows with
 * a blank or unreadable cell counted in `leftOut`, readings the student left out kept apart.
 * Cells are read the way calculation checks read them, so the graph and the checks agree.
 *
 * @returns the points, or a problem sentence when the graph names a column the table lacks
 */
export function graphPoints(graph: Pick<GraphSpec, "xColumn" | "yColumn">, table: TableTemplate, filled: FilledTable): GraphPoints | { problem: string } {
  const x = table.columns.find((c) => c.id === graph.xColumn);
  const y = table.columns.find((c) => c.id === graph.yColumn);
  if (!x || !y) return { problem: "This graph uses a column that is not in the results table, so it cannot be drawn. Tell your teacher." };
  const rows = Math.min(MAX_TABLE_ROWS, Math.max(gridRowCount(table, filled), filled.rows.length));
  const points: PlotPoint[] = [];
  const excludedPoints: PlotPoint[] = [];
  let leftOut = 0;
  for (let row = 0; row < rows; row++) {
    const xt = cellText(table, filled, row, x);
    const yt = cellText(table, filled, row, y);
    if (xt === null && yt === null) continue;
    const xv = readCell(xt);
    const yv = readCell(yt);
    if (xv === null || yv === null) {
      leftOut++;
      continue;
    }
    const out = [x.id, y.id].some((id) => filled.decisions?.[decisionKey(row, id)]?.include === false);
    (out ? excludedPoints : points).push({ x: xv, y: yv, row });
  }
  return { x, y, points, excludedPoints, leftOut };
}

/** The small note under a graph about readings not plotted, or null when every reading is plotted. */
export function leftOutNote(leftOut: number, excluded: number): string | null {
  const parts: string[] = [];
  if (leftOut > 0) parts.push(`${leftOut} ${leftOut === 1 ? "reading" : "readings"} left out (blank or not numbers)`);
  if (excluded > 0) parts.push(`${excluded} ${excluded === 1 ? "reading" : "readings"} left out by your decision, shown as a circle`);
  return parts.length ? `${parts.join("; ")}.` : null;
}

export type BestFit =
  | { kind: "line"; throughOrigin: boolean; slope: number; intercept: number; valueAt: (x: number) => number; description: string }
  | { kind: "curve"; model: "first-order" | "polynomial" | "local"; valueAt: (x: number) => number; description: string };

export type FitOutcome = { ok: true; fit: BestFit } | { ok: false; message: string };

const engineMessage = (e: unknown): string => {
  if (e instanceof MarkingInputError) return e.message;
  throw e;
};

/**
 * The line or curve of best fit from the calculation engine, as the graph spec asks.
 *
 * - "line": least squares (`linearFit`), through the origin when the spec says so.
 * - "curve": the model `rateAt` chooses for these readings ("auto": a first-order rise or decay
 *   when it fits closely, otherwise a least-squares polynomial of degree n − 2 (1 to 3) with 5
 *   or more readings, otherwise a smooth local curve), rebuilt here so it can be drawn. The
 *   tangent check uses the same curve, so the drawn curve is the one a tangent must touch.
 * - "none": null.
 *
 * Never throws for the student's data: too few readings and the like come back as a sentence.
 * The gradient is never part of the description (students work it out themselves).
 */
export function bestFit(spec: Pick<GraphSpec, "fit" | "throughOrigin">, points: readonly XY[], xHeading = "x value"): FitOutcome | null {
  if (spec.fit === "none") return null;
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const n = points.length;
  const have = `there ${n === 1 ? "is" : "are"} ${n}`;
  if (spec.fit === "line") {
    const need = spec.throughOrigin ? 1 : 2;
    if (n < need) return { ok: false, message: `Too few readings for a line of best fit: at least ${need} ${need === 1 ? "is" : "are"} needed, and ${have}.` };
    try {
      const f = linearFit(xs, ys, { throughOrigin: spec.throughOrigin });
      return {
        ok: true,
        fit: {
          kind: "line",
          throughOrigin: spec.throughOrigin,
          slope: f.slope,
          intercept: f.intercept,
          valueAt: (x) => f.intercept + f.slope * x,
          description: spec.throughOrigin ? "Straight line of best fit through the origin (least squares)." : "Straight line of best fit (least squares).",
        },
      };
    } catch (e) {
      return { ok: false, message: engineMessage(e) };
    }
  }
  if (n < 3) return { ok: false, message: `Too few readings for a curve of best fit: at least 3 are needed, and ${have}.` };
  if (new Set(xs).size !== n) return { ok: false, message: `Two readings have the same ${xHeading}, so a curve cannot be fitted. Check that column.` };
  try {
    const chosen = rateAt(xs, ys, xs[0]!);
    let valueAt: (x: number) => number;
    if (chosen.model === "first-order") {
      const order = xs.map((_, i) => i).sort((i, j) => xs[i]! - xs[j]!);
      const kind = ys[order[order.length - 1]!]! >= ys[order[0]!]! ? "rise" : "decay";
      const f = firstOrderFit(xs, ys, { kind, offset: n >= 5 });
      valueAt = (x) => (kind === "rise" ? f.a * (1 - Math.exp(-f.k * x)) + f.c : f.a * Math.exp(-f.k * x) + f.c);
    } else if (chosen.model === "polynomial") {
      const f = polynomialFit(xs, ys, Math.min(3, Math.max(1, n - 2)));
      valueAt = (x) => evaluatePolynomial(f.coefficients, x);
    } else {
      const degree = n >= 4 ? 2 : 1;
      valueAt = (x) => localRegression(xs, ys, x, { degree }).value;
    }
    return { ok: true, fit: { kind: "curve", model: chosen.model, valueAt, description: chosen.reason } };
  } catch (e) {
    return { ok: false, message: engineMessage(e) };
  }
}

/**
 * Points along a fitted line or curve, evenly spaced from `from` to `to`, for drawing it as a
 * smooth line. Points the curve cannot give (for example a local curve where too few readings
 * lie near) are skipped.
 */
export function sampleFit(fit: BestFit, from: number, to: number, count = 120): XY[] {
  if (!(Number.isFinite(from) && Number.isFinite(to)) || to < from) return [];
  const steps = fit.kind === "line" ? 1 : Math.max(1, count - 1);
  const out: XY[] = [];
  for (let i = 0; i <= steps; i++) {
    const x = i === steps ? to : from + ((to - from) * i) / steps;
    try {
      const y = fit.valueAt(x);
      if (Number.isFinite(y)) out.push({ x, y });
    } catch (e) {
      if (!(e instanceof MarkingInputError)) throw e;
    }
  }
  return out;
}

/** The x range a fit is drawn over: the readings' range (from 0 for a line through the origin). */
export function fitRange(fit: BestFit, points: readonly XY[]): { from: number; to: number } | null {
  if (points.length === 0) return null;
  let from = Math.min(...points.map((p) => p.x));
  let to = Math.max(...points.map((p) => p.x));
  if (fit.kind === "line" && fit.throughOrigin) {
    from = Math.min(from, 0);
    to = Math.max(to, 0);
  }
  return { from, to };
}

/** The student's tangent extended across the plot from `from` to `to`; null when its two points share an x. */
export function tangentAcross(t: Pick<Tangent, "x1" | "y1" | "x2" | "y2">, from: number, to: number): [XY, XY] | null {
  if (![t.x1, t.y1, t.x2, t.y2, from, to].every(Number.isFinite) || t.x1 === t.x2) return null;
  const g = (t.y2 - t.y1) / (t.x2 - t.x1);
  return [
    { x: from, y: t.y1 + g * (from - t.x1) },
    { x: to, y: t.y1 + g * (to - t.x1) },
  ];
}

/**
 * The unit of a gradient, y unit per x unit: "cm³/s" for simple units, "per" when a slash would
 * be ambiguous ("mol/dm³ per s"), and a reciprocal x unit turned over ("K" for no unit against K⁻¹).
 */
export function gradientUnit(yUnit: string, xUnit: string): string {
  const y = yUnit.trim();
  const x = xUnit.trim();
  const simple = (u: string) => /^[^\s/·⁻]+$/.test(u);
  if (!x) return y;
  const reciprocal = /^(.+)⁻¹$/.exec(x);
  if (reciprocal && simple(reciprocal[1]!)) return y ? `${y} ${reciprocal[1]}` : reciprocal[1]!;
  if (simple(x)) return y ? (simple(y) ? `${y}/${x}` : `${y} per ${x}`) : `per ${x}`;
  return y ? `${y} per (${x})` : `per (${x})`;
}

/** A number for display: `digits` significant figures, no float noise, never NaN. */
export function formatNumber(n: number, digits = 3): string {
  if (!Number.isFinite(n)) return "—";
  return String(Number(n.toPrecision(digits)));
}

const withUnit = (text: string, unit: string) => (unit.trim() ? `${text} ${unit}` : text);

/**
 * The gradient of the student's tangent, Δy/Δx from its two points, with the working as a sentence
 * ("Δy ÷ Δx = 23 cm³ ÷ 40 s = 0.575 cm³/s"). Null when the points share an x.
 */
export function tangentGradient(t: Pick<Tangent, "x1" | "y1" | "x2" | "y2">, xUnit: string, yUnit: string): { gradient: number; deltaX: number; deltaY: number; unit: string; text: string } | null {
  if (![t.x1, t.y1, t.x2, t.y2].every(Number.isFinite) || t.x1 === t.x2) return null;
  const deltaX = t.x2 - t.x1;
  const deltaY = t.y2 - t.y1;
  const gradient = deltaY / deltaX;
  if (!Number.isFinite(gradient)) return null;
  const unit = gradientUnit(yUnit, xUnit);
  return {
    gradient,
    deltaX,
    deltaY,
    unit,
    text: `Δy ÷ Δx = ${withUnit(formatNumber(deltaY, 4), yUnit)} ÷ ${withUnit(formatNumber(deltaX, 4), xUnit)} = ${withUnit(formatNumber(gradient), unit)}`,
  };
}

export type TangentVerdict = { touches: boolean | null; message: string };

/**
 * Whether the student's tangent touches the fitted curve at the chosen x, by the engine's
 * `tangentTouchesCurve` (the line's height at x0 within 5 % of the readings' y range of the
 * curve's, common practice). `touches` is null when it cannot be judged, with the reason.
 */
export function tangentVerdict(t: Tangent, fit: FitOutcome | null, points: readonly XY[], x: Pick<ColumnTemplate, "symbol" | "quantity" | "unit">): TangentVerdict {
  const name = x.symbol.trim() || x.quantity;
  const at = withUnit(formatNumber(t.at, 6), x.unit);
  if (!fit || !fit.ok) return { touches: null, message: "There is no curve of best fit yet, so Meniscus cannot tell whether your tangent touches it." };
  if (points.length === 0) return { touches: null, message: "There are no readings plotted yet." };
  const low = Math.min(...points.map((p) => p.x));
  const high = Math.max(...points.map((p) => p.x));
  if (!Number.isFinite(t.at) || t.at < low || t.at > high) {
    return { touches: null, message: `Choose ${name} between ${formatNumber(low, 6)} and ${withUnit(formatNumber(high, 6), x.unit)}, where there are readings.` };
  }
  if (t.x1 === t.x2) return { touches: null, message: "Your two points are straight above each other, so the line has no gradient. Move them apart sideways." };
  const ys = points.map((p) => p.y);
  const yRange = Math.max(...ys) - Math.min(...ys);
  if (!(yRange > 0)) return { touches: null, message: "The readings do not change, so there is no curve to touch." };
  let curveY: number;
  try {
    curveY = fit.fit.valueAt(t.at);
  } catch (e) {
    return { touches: null, message: engineMessage(e) };
  }
  try {
    const result = tangentTouchesCurve({ x1: t.x1, y1: t.y1, x2: t.x2, y2: t.y2 }, { x: t.at, y: curveY, yRange });
    return result.touches
      ? { touches: true, message: `Your tangent touches the curve at ${name} = ${at}.` }
      : { touches: false, message: `Your tangent does not touch the curve at ${name} = ${at}. Move it so that it just touches the curve there.` };
  } catch (e) {
    return { touches: null, message: engineMessage(e) };
  }
}

function niceStep(rough: number): number {
  const power = 10 ** Math.floor(Math.log10(rough));
  const f = rough / power;
  return (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * power;
}

/**
 * Axis limits that use most of the grid (DOMAIN.md graph conventions): round numbers just
 * outside the readings, starting from 0 when the readings start near it.
 */
export function niceAxis(values: readonly number[], target = 8): { min: number; max: number } {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return { min: 0, max: 1 };
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  if (lo >= 0 && lo <= 0.25 * hi) lo = 0;
  if (hi <= 0 && hi >= 0.25 * lo) hi = 0;
  const size = Math.max(Math.abs(lo), Math.abs(hi));
  if (!(hi - lo > 1e-9 * size) || hi - lo < 1e-300) {
    // One value (or values too close to tell apart): a window around it.
    const centre = (lo + hi) / 2;
    const pad = size < 1e-300 ? 1 : size * 0.1;
    lo = centre - pad;
    hi = centre + pad;
  }
  const step = niceStep((hi - lo) / target);
  const clean = (v: number) => Number(v.toPrecision(12));
  let min = clean(Math.floor(lo / step + 1e-9) * step);
  let max = clean(Math.ceil(hi / step - 1e-9) * step);
  if (min > lo) min = clean(min - step);
  if (max < hi) max = clean(max + step);
  return max > min ? { min, max } : { min: clean(min - step), max: clean(max + step) };
}

/** The axis title, "quantity / unit". */
export const axisTitle = (c: Pick<ColumnTemplate, "quantity" | "unit">) => columnHeading(c);

import type { CheckSpec, ColumnTemplate, GraphSpec, TableTemplate } from "@/lib/validation/practicals";

const heading = (col: Pick<ColumnTemplate, "quantity" | "unit"> | undefined, fallback: string) => (col ? (col.unit.trim() ? `${col.quantity} / ${col.unit}` : col.quantity) : fallback);
const quantity = (col: ColumnTemplate | undefined, fallback: string) => col?.quantity ?? fallback;
const withUnit = (n: number, col: ColumnTemplate | undefined) => (col?.unit.trim() ? `${n} ${col.unit}` : String(n));

/** Checks answered in a column of the results table, row by row, rather than as one number. */
export function isPerRowCheck(spec: CheckSpec): spec is Extract<CheckSpec, { kind: "reciprocal-time" | "mean-of-repeats" }> {
  return spec.kind === "reciprocal-time" || spec.kind === "mean-of-repeats";
}

/** Checks that read the tangent the student drew on a graph. */
export function isTangentCheck(spec: CheckSpec): spec is Extract<CheckSpec, { kind: "rate-at" }> {
  return spec.kind === "rate-at";
}

/** The graph a tangent check reads: one of the same table and axes that allows tangents. */
export function boundGraph(spec: CheckSpec, graphs: GraphSpec[]): GraphSpec | null {
  if (!isTangentCheck(spec)) return null;
  return graphs.find((g) => g.tangents && g.tableId === spec.tableId && g.xColumn === spec.x && g.yColumn === spec.y) ?? graphs.find((g) => g.tangents && g.tableId === spec.tableId) ?? null;
}

/**
 * What the student has to work out, in plain words for 11–18-year-olds. It says how, never
 * the answer, and names the columns as the table headings do.
 */
export function checkInstructions(spec: CheckSpec, table: TableTemplate | undefined, graph: GraphSpec | null): string {
  const col = (id: string) => table?.columns.find((c) => c.id === id);
  switch (spec.kind) {
    case "mean-rate": {
      const x = col(spec.x);
      return `Use your results table: find the change in ${quantity(col(spec.y), "y")} between ${withUnit(spec.from, x)} and ${withUnit(spec.to, x)}, and divide it by the change in ${quantity(x, "x")}.`;
    }
    case "gradient":
      return `Draw the straight line of best fit for ${quantity(col(spec.y), "y")} against ${quantity(col(spec.x), "x")}${spec.throughOrigin ? " through the origin" : ""}, and work out its gradient from a large triangle.`;
    case "rate-at":
      return `Draw a tangent to your curve at ${withUnit(spec.at, col(spec.x))}${graph ? ` on the graph “${graph.title}”` : ""}, then work out its gradient from a large triangle. The check reads the tangent you drew.`;
    case "initial-rate":
      return `Work out the gradient of your curve at the very start, where ${quantity(col(spec.x), "x")} is zero.`;
    case "reciprocal-time":
      return `Work out 1 ÷ ${quantity(col(spec.t), "time")} for every row and write it in the “${heading(col(spec.answerColumn), "answer")}” column of your table. The check looks at each row.`;
    case "mean-of-repeats":
      return `Work out the mean of the repeat readings on every row, leaving out any reading you decided is anomalous, and write it in the “${heading(col(spec.answerColumn), "mean")}” column. The check looks at each row.`;
    case "order":
      return `Plot log(${quantity(col(spec.rate), "rate")}) against log(${quantity(col(spec.concentration), "concentration")}); the gradient of the straight line is the order of reaction.`;
    case "activation-energy":
      return `Plot ${spec.rateIs === "time" ? "ln(1/t)" : "ln k"} against 1/T with T in kelvin${spec.temperatureUnit === "°C" ? " (add 273.15 to the temperatures in °C)" : ""}; the activation energy is −gradient × R, where R = 8.314 J K⁻¹ mol⁻¹.`;
    case "percentage-uncertainty":
      return `Work out the percentage uncertainty of your largest ${quantity(col(spec.reading), "reading")}: the uncertainty of ${spec.readingsPerValue === 2 ? "two readings (start and end)" : "one reading"} divided by the reading, × 100.`;
  }
}

import type { CheckDefinition, ColumnId, ResultsTableColumn } from "./check-definition";
import { checkKinds } from "./check-kinds";
import { MarkingInputError } from "./marking-input-error";

const functionName = "validateCheckDefinition";

function fail(message: string): never {
  throw new MarkingInputError("invalid-definition", functionName, message);
}

function finite(value: unknown, what: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) fail(`The check's ${what} must be a number.`);
}

/**
 * Checks that a calculation-check definition is complete and fits the results-table columns, so a
 * teacher's mistake is caught when the practical is written rather than when it is marked.
 *
 * Checks: a known `kind`; every column id exists; numbers where numbers are needed; options from
 * their allowed lists; at least two repeat columns; a temperature unit of °C or K.
 *
 * @param definition - the check definition
 * @param columns - the results table's columns (ids and units)
 * @returns nothing when the definition is usable
 * @throws {MarkingInputError} `invalid-definition`, `unknown-column`
 * @example
 * validateCheckDefinition({ kind: "gradient", x: "t", y: "v" }, [{ id: "t", unit: "s" }, { id: "v", unit: "cm3" }]);
 * // => undefined (no error)
 */
export function validateCheckDefinition(definition: CheckDefinition, columns: readonly ResultsTableColumn[]): void {
  if (!definition || typeof definition !== "object") fail("The check definition is missing.");
  if (!checkKinds.some((info) => info.kind === definition.kind)) {
    fail(`"${String((definition as { kind?: unknown }).kind)}" is not a kind of check this engine knows.`);
  }
  if (!Array.isArray(columns)) fail("The results table has no list of columns.");
  const ids = new Set(columns.map((column) => column.id));
  const column = (id: ColumnId, role: string): void => {
    if (typeof id !== "string" || !ids.has(id)) {
      throw new MarkingInputError("unknown-column", functionName, `The ${role} column "${String(id)}" is not in the results table.`);
    }
  };
  const models = ["first-order", "polynomial", "local", "auto", undefined];
  switch (definition.kind) {
    case "mean-rate":
      column(definition.x, "x");
      column(definition.y, "y");
      finite(definition.from, "start time");
      finite(definition.to, "end time");
      if (definition.from === definition.to) fail("The interval must start and end at different times.");
      for (const pair of definition.alternativeIntervals ?? []) {
        if (!Array.isArray(pair) || pair.length !== 2) fail("Each other interval must be a pair [from, to].");
        finite(pair[0], "other interval's start");
        finite(pair[1], "other interval's end");
      }
      return;
    case "gradient":
      column(definition.x, "x");
      column(definition.y, "y");
      for (const pair of definition.alternativeColumns ?? []) {
        column(pair.x, "other x");
        column(pair.y, "other y");
      }
      return;
    case "rate-at":
      column(definition.x, "x");
      column(definition.y, "y");
      finite(definition.at, "tangent time");
      if (!models.includes(definition.model)) fail("The curve model must be first-order, polynomial, local or auto.");
      return;
    case "initial-rate":
      column(definition.x, "x");
      column(definition.y, "y");
      if (!models.includes(definition.model)) fail("The curve model must be first-order, polynomial, local or auto.");
      return;
    case "reciprocal-time":
      column(definition.t, "time");
      return;
    case "mean-of-repeats":
      if (!Array.isArray(definition.repeats) || definition.repeats.length < 2) fail("A mean of repeats needs at least two repeat columns.");
      definition.repeats.forEach((id) => column(id, "repeat"));
      if (definition.anomalyPercent !== undefined && !(definition.anomalyPercent > 0)) fail("The anomaly threshold must be above 0 %.");
      return;
    case "order":
      column(definition.concentration, "concentration");
      column(definition.rate, "rate");
      return;
    case "activation-energy": {
      column(definition.temperature, "temperature");
      column(definition.rate, "rate constant or time");
      if (definition.rateIs !== "rate-constant" && definition.rateIs !== "time") fail('Say whether the column holds a "rate-constant" or a "time".');
      const unit = definition.temperatureUnit ?? columns.find((entry) => entry.id === definition.temperature)?.unit;
      if (!["°C", "K", "C", "degC", "oC", "℃"].includes((unit ?? "").trim())) fail("The temperature must be in °C or K.");
      return;
    }
    case "percentage-uncertainty":
      finite(definition.resolution, "resolution");
      finite(definition.reading, "reading");
      if (!(definition.resolution > 0)) fail("The resolution must be greater than zero.");
      if (definition.instrument !== undefined && definition.instrument !== "analogue" && definition.instrument !== "digital") {
        fail('The instrument must be "analogue" or "digital".');
      }
      if (definition.readings !== undefined && definition.readings !== 1 && definition.readings !== 2) fail("The number of readings must be 1 or 2.");
      return;
  }
}

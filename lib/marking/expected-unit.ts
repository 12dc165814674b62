import type { CheckDefinition, ColumnId, ResultsTableColumn } from "./check-definition";
import { checkKinds } from "./check-kinds";
import { parseUnit } from "./parse-unit";

function tidy(text: string): string {
  try {
    return parseUnit(text).display;
  } catch {
    return text;
  }
}

/**
 * The unit a check's answer is expected in, worked out from the columns it uses.
 *
 * y-per-x kinds: unit of y divided by unit of x ("cm³" and "s" give "cm³ s⁻¹"); 1/t: one over the
 * time unit; mean of repeats: the first repeat column's unit; order: no unit; activation energy:
 * kJ mol⁻¹; percentage uncertainty: %. Units the engine does not know are joined as text
 * ("AU/s").
 *
 * @param definition - the check definition
 * @param columns - the results table's columns
 * @returns the unit in tidy form ("" for none)
 * @example
 * expectedUnit({ kind: "mean-rate", x: "t", y: "v", from: 0, to: 30 }, [{ id: "t", unit: "s" }, { id: "v", unit: "cm3" }]);
 * // => "cm³ s⁻¹"
 */
export function expectedUnit(definition: CheckDefinition, columns: readonly ResultsTableColumn[]): string {
  const unitOf = (id: ColumnId): string => columns.find((column) => column.id === id)?.unit ?? "";
  const info = checkKinds.find((entry) => entry.kind === definition.kind);
  switch (definition.kind) {
    case "mean-rate":
    case "gradient":
    case "rate-at":
    case "initial-rate": {
      const y = unitOf(definition.y).trim();
      const x = unitOf(definition.x).trim();
      if (x === "") return tidy(y);
      const joined = y === "" ? `/(${x})` : `(${y})/(${x})`;
      const shown = tidy(joined);
      return shown === joined ? `${y}/${x}` : shown;
    }
    case "reciprocal-time": {
      const t = unitOf(definition.t).trim();
      if (t === "") return "";
      const shown = tidy(`/(${t})`);
      return shown === `/(${t})` ? `1/${t}` : shown;
    }
    case "mean-of-repeats":
      return tidy(unitOf(definition.repeats[0]));
    default:
      return info?.unit ?? "";
  }
}

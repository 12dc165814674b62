import { unitConversion } from "./internal/unit-conversion";
import { requireFiniteNumber } from "./internal/validate";

/**
 * Converts a value between equivalent units, and refuses units that measure different things.
 *
 * Both units are read with {@link parseUnit}; they must have the same dimensions. The value is
 * taken to SI base units and back: value_to = (value x factor_from + offset_from - offset_to) /
 * factor_to, where the Celsius offset (273.15) applies only to a bare temperature such as "°C" to
 * "K" (a temperature difference, or °C inside a compound unit, converts without it).
 *
 * @param value - the number in `fromUnit`
 * @param fromUnit - unit as typed, for example "cm3/min"
 * @param toUnit - unit wanted, for example "cm³ s⁻¹"
 * @returns the value in `toUnit`
 * @throws {MarkingInputError} `not-a-number`, `unknown-unit`, `incompatible-units`
 * @example
 * convertUnit(30, "cm3/min", "cm³ s⁻¹"); // => 0.5
 * convertUnit(25, "°C", "K"); // => 298.15
 */
export function convertUnit(value: number, fromUnit: string, toUnit: string): number {
  requireFiniteNumber(value, "value to convert", "convertUnit");
  return unitConversion(fromUnit, toUnit, "convertUnit")(value);
}

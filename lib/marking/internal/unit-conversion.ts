import { MarkingInputError } from "../marking-input-error";
import { parseUnit } from "../parse-unit";

/**
 * The straight-line map value_to = value_from x scale + shift between two units, or a refusal
 * when they measure different things. The Celsius offset applies only between bare temperatures.
 * Decimal prefixes are applied as exact powers of ten (dividing for negative powers).
 */
export function unitConversion(fromUnit: string, toUnit: string, functionName: string): (value: number) => number {
  const from = parseUnit(fromUnit);
  const to = parseUnit(toUnit);
  if (from.dimensions.some((exponent, i) => exponent !== to.dimensions[i])) {
    const fromText = from.display || "a plain number";
    const toText = to.display || "a plain number";
    throw new MarkingInputError(
      "incompatible-units",
      functionName,
      `${fromText} and ${toText} measure different kinds of quantity, so one cannot be changed into the other.`,
    );
  }
  if (from.isTemperatureScale && to.isTemperatureScale) {
    const shift = from.offset - to.offset;
    const ratio = from.factor / to.factor;
    return (value) => value * ratio + shift;
  }
  const ratio = from.multiplier / to.multiplier;
  const powerShift = from.powerOfTen - to.powerOfTen;
  const power = Number(`1e${Math.abs(powerShift)}`);
  return powerShift >= 0 ? (value) => value * ratio * power : (value) => (value * ratio) / power;
}

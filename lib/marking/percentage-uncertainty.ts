import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber } from "./internal/validate";

/**
 * Percentage uncertainty = uncertainty / |value| x 100.
 *
 * @param uncertainty - absolute uncertainty, zero or more, same unit as the value
 * @param value - the measured value, not zero
 * @returns percentage uncertainty, %
 * @throws {MarkingInputError} `not-a-number`, `not-positive` (value 0 or uncertainty below 0)
 * @example
 * percentageUncertainty(0.5, 25); // => 2
 */
export function percentageUncertainty(uncertainty: number, value: number): number {
  requireFiniteNumber(uncertainty, "uncertainty", "percentageUncertainty");
  requireFiniteNumber(value, "reading", "percentageUncertainty");
  if (uncertainty < 0) {
    throw new MarkingInputError("not-positive", "percentageUncertainty", "An uncertainty cannot be negative.");
  }
  if (value === 0) {
    throw new MarkingInputError("not-positive", "percentageUncertainty", "A percentage uncertainty of a zero reading cannot be found.");
  }
  return (100 * uncertainty) / Math.abs(value);
}

import { MarkingInputError } from "./marking-input-error";
import { physicalConstants } from "./physical-constants";
import { requirePositiveNumber } from "./internal/validate";

/** One known strength of a hydrogen peroxide solution. */
export type PeroxideStrengthInput =
  | { readonly volumeStrength: number }
  | { readonly concentration: number }
  | { readonly percentWeightPerVolume: number };

/** Result of {@link convertPeroxideStrength}. */
export interface PeroxideStrength {
  /** "V volume": dm³ of O2 at 0 °C and 101.325 kPa released by 1 dm³ of solution. */
  readonly volumeStrength: number;
  /** mol/dm³ of H2O2. */
  readonly concentration: number;
  /** g of H2O2 per 100 cm³ of solution (% w/v). */
  readonly percentWeightPerVolume: number;
  readonly caution: string;
}

/**
 * Hydrogen peroxide strength: volume strength, mol/dm³ and % w/v from any one of them.
 *
 * 2 H2O2 -> 2 H2O + O2, so 1 dm³ of "V volume" solution releases V / Vm mol of O2 from
 * 2 V / Vm mol of H2O2: c = 2 V / Vm with Vm = 22.41396954 dm³/mol at 273.15 K and 101.325 kPa
 * (CODATA 2018). % w/v = c x M / 10 with M(H2O2) = 34.0147 g/mol (from 2 x 1.00794 + 2 x 15.9994,
 * standard atomic weights, from memory). Check values (common practice): 100 volume is about
 * 8.9 mol/dm³ and 30 % w/v; 20 volume about 1.8 mol/dm³ and 6 % w/v.
 *
 * @param input - one of volumeStrength, concentration (mol/dm³) or percentWeightPerVolume, above 0
 * @returns all three strengths and a caution
 * @throws {MarkingInputError} `invalid-option` (not exactly one given), `not-a-number`, `not-positive`
 * @example
 * convertPeroxideStrength({ volumeStrength: 20 }).concentration; // => about 1.785
 */
export function convertPeroxideStrength(input: PeroxideStrengthInput): PeroxideStrength {
  const functionName = "convertPeroxideStrength";
  const given = ["volumeStrength", "concentration", "percentWeightPerVolume"].filter(
    (key) => (input as Record<string, unknown>)?.[key] !== undefined,
  );
  if (given.length !== 1) {
    throw new MarkingInputError("invalid-option", functionName, "Give exactly one strength: volume strength, concentration or % w/v.");
  }
  const molarVolume = physicalConstants.molarVolumeAt273K101kPa;
  const molarMass = physicalConstants.hydrogenPeroxideMolarMass;
  let concentration: number;
  if ("volumeStrength" in input) {
    requirePositiveNumber(input.volumeStrength, "volume strength", functionName);
    concentration = (2 * input.volumeStrength) / molarVolume;
  } else if ("concentration" in input) {
    requirePositiveNumber(input.concentration, "concentration", functionName);
    concentration = input.concentration;
  } else {
    requirePositiveNumber(input.percentWeightPerVolume, "percentage", functionName);
    if (input.percentWeightPerVolume > 100) {
      throw new MarkingInputError("impossible-request", functionName, "A solution cannot hold more than 100 g of hydrogen peroxide per 100 cm³.");
    }
    concentration = (input.percentWeightPerVolume * 10) / molarMass;
  }
  return {
    volumeStrength: (concentration * molarVolume) / 2,
    concentration,
    percentWeightPerVolume: (concentration * molarMass) / 10,
    caution: "Check these strengths with a competent person and the supplier's safety data sheet before use.",
  };
}

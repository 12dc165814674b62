import { MarkingInputError } from "./marking-input-error";
import { requirePositiveNumber } from "./internal/validate";

/** Options for {@link resolutionUncertainty}. */
export interface ResolutionUncertaintyOptions {
  /** "analogue" (a scale read by eye): half the smallest division; "digital": the last digit. Default "analogue". */
  readonly instrument?: "analogue" | "digital";
  /** 2 when the value is the difference of two readings (start and end), which doubles it. Default 1. */
  readonly readings?: 1 | 2;
}

/** Result of {@link resolutionUncertainty}. */
export interface ResolutionUncertainty {
  /** School uncertainty, same unit as the resolution. */
  readonly uncertainty: number;
  /** The rule used, in words. */
  readonly rule: string;
  /** GUM standard uncertainty for the same instrument: resolution / (2 sqrt 3) per reading, in quadrature for two. */
  readonly gumStandardUncertainty: number;
}

/**
 * Uncertainty of a reading from the instrument's resolution, as schools teach it (common
 * practice), with the GUM value beside it.
 *
 * School rule: +/- half the smallest division for a scale read by eye, +/- the last digit for a
 * digital display; a value found from two readings (start and end) doubles it. GUM (JCGM 100:2008
 * F.2.2.1): a rectangular distribution of half-width resolution / 2 gives u = resolution / (2 sqrt 3)
 * per reading, and two independent readings combine in quadrature (sqrt 2 u).
 *
 * @param resolution - smallest division or last digit, in the reading's unit, greater than 0
 * @param options - instrument kind and number of readings
 * @returns the school uncertainty, the rule in words and the GUM standard uncertainty
 * @throws {MarkingInputError} `not-a-number`, `not-positive`, `invalid-option`
 * @example
 * resolutionUncertainty(1, { instrument: "analogue", readings: 2 }).uncertainty; // => 1
 */
export function resolutionUncertainty(resolution: number, options: ResolutionUncertaintyOptions = {}): ResolutionUncertainty {
  requirePositiveNumber(resolution, "resolution", "resolutionUncertainty");
  const instrument = options.instrument ?? "analogue";
  const readings = options.readings ?? 1;
  if (instrument !== "analogue" && instrument !== "digital") {
    throw new MarkingInputError("invalid-option", "resolutionUncertainty", 'The instrument must be "analogue" or "digital".');
  }
  if (readings !== 1 && readings !== 2) {
    throw new MarkingInputError("invalid-option", "resolutionUncertainty", "The number of readings must be 1 or 2.");
  }
  const single = instrument === "analogue" ? resolution / 2 : resolution;
  const rule =
    (instrument === "analogue" ? "half the smallest division" : "the last digit of the display") +
    (readings === 2 ? ", doubled because the value comes from two readings" : "");
  const gumSingle = resolution / (2 * Math.sqrt(3));
  return { uncertainty: single * readings, rule, gumStandardUncertainty: readings === 2 ? Math.SQRT2 * gumSingle : gumSingle };
}

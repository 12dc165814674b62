import { requireFiniteSeries, requireMinimumPoints } from "./internal/validate";

/** Result of {@link halfRangeUncertainty}. */
export interface HalfRangeUncertainty {
  readonly mean: number;
  readonly range: number;
  /** Half the range: the school uncertainty of a mean of repeats. */
  readonly uncertainty: number;
  /** uncertainty / |mean| x 100 (0 when the mean is 0 and every reading equal). */
  readonly percentage: number;
}

/**
 * Uncertainty of a mean of repeats as schools take it: half the range (common practice; not the
 * GUM, whose Type A value is s / sqrt(n)).
 *
 * uncertainty = (largest - smallest) / 2; percentage = uncertainty / |mean| x 100.
 *
 * @param readings - repeat readings, any unit, at least 2
 * @returns mean, range, half range and percentage uncertainty
 * @throws {MarkingInputError} `not-a-number`, `too-few-points`, `not-positive` (mean 0 with spread)
 * @example
 * halfRangeUncertainty([45, 47, 46]).uncertainty; // => 1
 */
export function halfRangeUncertainty(readings: readonly number[]): HalfRangeUncertainty {
  requireFiniteSeries(readings, "repeat reading", "halfRangeUncertainty");
  requireMinimumPoints(readings.length, 2, "An uncertainty from repeats", "halfRangeUncertainty");
  const mean = readings.reduce((total, value) => total + value, 0) / readings.length;
  const range = Math.max(...readings) - Math.min(...readings);
  const uncertainty = range / 2;
  return { mean, range, uncertainty, percentage: uncertainty === 0 ? 0 : (100 * uncertainty) / Math.abs(mean) };
}

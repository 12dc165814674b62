import { findAnomalies, type Anomaly } from "./find-anomalies";
import { MarkingInputError } from "./marking-input-error";

/** Options for {@link meanOfRepeats}. */
export interface MeanOfRepeatsOptions {
  /** Anomaly threshold, percent from the median of the repeats (default 10, common practice). */
  readonly anomalyPercent?: number;
  /** false keeps every reading in the mean (default true: anomalies are left out). */
  readonly excludeAnomalies?: boolean;
}

/** Result of {@link meanOfRepeats}. */
export interface MeanOfRepeats {
  /** Mean of the readings kept. */
  readonly mean: number;
  /** Mean of every reading, anomalies included (for spotting the "anomaly left in" slip). */
  readonly meanOfAll: number;
  readonly used: readonly number[];
  readonly excluded: readonly Anomaly[];
  /** Half the range of the readings kept: the repeat uncertainty schools use (common practice). */
  readonly halfRange: number;
  /** Number of blank cells skipped. */
  readonly blanks: number;
}

/**
 * Mean of repeat readings with anomalies flagged and left out by a stated rule.
 *
 * Blank cells (null) are skipped. Anomalies are found with {@link findAnomalies}: with three or
 * more readings, a reading more than `anomalyPercent` (default 10 %) from the median of the other
 * readings is anomalous, unless that would flag half or more of them. The mean is the arithmetic
 * mean of the rest; the repeat uncertainty is half their range.
 *
 * @param readings - repeat readings of one quantity, any unit; null for a blank cell
 * @param options - anomaly threshold, and whether to leave anomalies out
 * @returns mean, mean of all readings, readings used, anomalies left out, half range
 * @throws {MarkingInputError} `too-few-points` (no readings), `not-a-number`, `invalid-option`
 * @example
 * meanOfRepeats([45, 47, null, 60]).mean; // => 46 (60 is more than 10 % from the others)
 */
export function meanOfRepeats(readings: readonly (number | null)[], options: MeanOfRepeatsOptions = {}): MeanOfRepeats {
  const functionName = "meanOfRepeats";
  const present: number[] = [];
  let blanks = 0;
  readings.forEach((value, i) => {
    if (value === null || value === undefined) {
      blanks += 1;
      return;
    }
    if (typeof value !== "number" || !Number.isFinite(value)) {
      throw new MarkingInputError("not-a-number", functionName, `Repeat ${i + 1} is not a number; fill it in or leave it blank.`);
    }
    present.push(value);
  });
  if (present.length === 0) {
    throw new MarkingInputError("too-few-points", functionName, "Every repeat is blank, so there is no mean; fill in at least one reading.");
  }
  const anomalies = options.excludeAnomalies === false ? [] : findAnomalies(present, options.anomalyPercent ?? 10);
  const anomalous = new Set(anomalies.map((anomaly) => anomaly.index));
  const used = present.filter((_, i) => !anomalous.has(i));
  const average = (values: readonly number[]): number => values.reduce((total, value) => total + value, 0) / values.length;
  return {
    mean: average(used),
    meanOfAll: average(present),
    used,
    excluded: anomalies,
    halfRange: (Math.max(...used) - Math.min(...used)) / 2,
    blanks,
  };
}

import { MarkingInputError } from "./marking-input-error";
import { requireFiniteSeries } from "./internal/validate";

/** A reading judged anomalous, with the reason in plain words. */
export interface Anomaly {
  readonly index: number;
  readonly value: number;
  /** Percentage gap from the median of all the repeats. */
  readonly percentFromMedian: number;
  readonly reason: string;
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/**
 * Flags anomalous repeat readings by a stated rule (common practice; the threshold is the
 * teacher's).
 *
 * Rule: with three or more readings, a reading is anomalous when it differs from the median of
 * all the repeats by more than `thresholdPercent` of that median. (The median is used because an
 * anomaly cannot pull it: with 62, 64 and 80 s the median is 64 s, so 80 s is 25 % away.) If the
 * rule would flag half or more of the readings there is no agreed value to judge against, so none
 * is flagged. With fewer than three readings nothing is flagged: there is no way to tell which is
 * wrong.
 *
 * @param readings - repeat readings of one quantity, any unit
 * @param thresholdPercent - largest acceptable gap from the others' median, percent (default 10)
 * @returns the anomalous readings with their index and reason (empty when none)
 * @throws {MarkingInputError} `not-a-number`, `invalid-option` (threshold not above 0)
 * @example
 * findAnomalies([45, 47, 46, 60]).map((a) => a.index); // => [3]
 */
export function findAnomalies(readings: readonly number[], thresholdPercent = 10): Anomaly[] {
  requireFiniteSeries(readings, "repeat reading", "findAnomalies");
  if (!(Number.isFinite(thresholdPercent) && thresholdPercent > 0)) {
    throw new MarkingInputError("invalid-option", "findAnomalies", "The anomaly threshold must be a percentage above 0.");
  }
  if (readings.length < 3) return [];
  const flagged: Anomaly[] = [];
  const centre = median(readings);
  readings.forEach((value, index) => {
    const gap = Math.abs(value - centre);
    const percent = centre === 0 ? (gap === 0 ? 0 : Infinity) : (100 * gap) / Math.abs(centre);
    if (percent > thresholdPercent) {
      flagged.push({
        index,
        value,
        percentFromMedian: percent,
        reason: `This reading is ${Number.isFinite(percent) ? `${percent.toFixed(0)} %` : "far"} away from the middle value of the repeats, more than the ${thresholdPercent} % allowed.`,
      });
    }
  });
  return flagged.length * 2 >= readings.length ? [] : flagged;
}

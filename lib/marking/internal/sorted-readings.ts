import { MarkingInputError } from "../marking-input-error";
import { requireFiniteSeries, requireMinimumPoints, requireSameLength } from "./validate";

/** Readings sorted by x, checked once: finite, paired, enough of them, no repeated x. */
export interface SortedReadings {
  readonly x: Float64Array;
  readonly y: Float64Array;
}

export function sortReadings(
  x: readonly number[],
  y: readonly number[],
  names: { readonly x: string; readonly y: string; readonly purpose: string },
  minimum: number,
  functionName: string,
): SortedReadings {
  requireFiniteSeries(x, names.x, functionName);
  requireFiniteSeries(y, names.y, functionName);
  requireSameLength(x, y, names.x, names.y, functionName);
  requireMinimumPoints(x.length, minimum, names.purpose, functionName);
  const n = x.length;
  const order = new Array<number>(n);
  let sorted = true;
  for (let i = 0; i < n; i += 1) {
    order[i] = i;
    if (i > 0 && x[i] < x[i - 1]) sorted = false;
  }
  if (!sorted) order.sort((i, j) => x[i] - x[j]);
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  for (let i = 0; i < n; i += 1) {
    xs[i] = x[order[i]];
    ys[i] = y[order[i]];
    if (i > 0 && xs[i] === xs[i - 1]) {
      throw new MarkingInputError("repeated-x", functionName, `The ${names.x} value ${xs[i]} appears twice; each reading needs its own ${names.x}.`);
    }
  }
  return { x: xs, y: ys };
}

/** Straight-line interpolation in sorted readings; `at` must lie within them. */
export function interpolateSorted(readings: SortedReadings, at: number): number {
  const { x, y } = readings;
  let low = 0;
  let high = x.length - 1;
  if (at <= x[low]) return y[low];
  if (at >= x[high]) return y[high];
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (x[middle] <= at) low = middle;
    else high = middle;
  }
  if (at === x[low]) return y[low];
  return y[low] + ((at - x[low]) * (y[high] - y[low])) / (x[high] - x[low]);
}

/** Throws unless `at` lies within the sorted readings. */
export function requireWithin(readings: SortedReadings, at: number, what: string, functionName: string): void {
  const low = readings.x[0];
  const high = readings.x[readings.x.length - 1];
  if (!(at >= low && at <= high)) {
    throw new MarkingInputError(
      "out-of-range",
      functionName,
      `The ${what} ${at} is outside the readings (${low} to ${high}); choose a value between the first and last reading.`,
    );
  }
}

import { MarkingInputError } from "./marking-input-error";
import { requireFiniteNumber } from "./internal/validate";

/** Two points on a student's hand-drawn tangent, in the graph's units. */
export interface TangentLine {
  readonly x1: number;
  readonly y1: number;
  readonly x2: number;
  readonly y2: number;
}

/** Where the fitted curve is at the chosen time. */
export interface CurvePoint {
  /** The chosen time x0. */
  readonly x: number;
  /** The curve's y at x0. */
  readonly y: number;
  /** The range of y on the graph (largest minus smallest reading), used as the yardstick. */
  readonly yRange: number;
}

/** Result of {@link tangentTouchesCurve}. */
export interface TangentTouch {
  readonly touches: boolean;
  /** |y_line(x0) - y_curve(x0)| as a fraction of the y range. */
  readonly distance: number;
  /** Gradient of the drawn line, (y2 - y1) / (x2 - x1). */
  readonly gradient: number;
}

/**
 * Does a hand-drawn tangent touch the curve at the chosen time?
 *
 * The drawn line through (x1, y1) and (x2, y2) is extended to x0; its height there is compared
 * with the fitted curve's y at x0. The line touches when the gap is at most `tolerancePercent` of
 * the y range of the graph (default 5 %, common practice for lines drawn by hand).
 *
 * @param line - two points on the drawn line, graph units
 * @param curve - chosen time x0, curve y there and the y range of the readings
 * @param tolerancePercent - allowed gap as a percentage of the y range (default 5)
 * @returns whether it touches, the relative gap and the line's gradient
 * @throws {MarkingInputError} `not-a-number`, `x-all-equal` (the two points share an x),
 *   `not-positive` (y range 0 or less)
 * @example
 * tangentTouchesCurve({ x1: 0, y1: 10, x2: 10, y2: 30 }, { x: 5, y: 20, yRange: 50 }).touches; // => true
 */
export function tangentTouchesCurve(line: TangentLine, curve: CurvePoint, tolerancePercent = 5): TangentTouch {
  const functionName = "tangentTouchesCurve";
  for (const [value, what] of [
    [line.x1, "first point's x"],
    [line.y1, "first point's y"],
    [line.x2, "second point's x"],
    [line.y2, "second point's y"],
    [curve.x, "chosen time"],
    [curve.y, "curve value"],
    [curve.yRange, "range of y"],
  ] as const) {
    requireFiniteNumber(value, what, functionName);
  }
  if (line.x1 === line.x2) {
    throw new MarkingInputError("x-all-equal", functionName, "The two points on the tangent have the same x, so its gradient cannot be found; pick points far apart along the line.");
  }
  if (curve.yRange <= 0) {
    throw new MarkingInputError("not-positive", functionName, "The readings do not change, so there is no curve to touch.");
  }
  const gradient = (line.y2 - line.y1) / (line.x2 - line.x1);
  const lineAtX0 = line.y1 + gradient * (curve.x - line.x1);
  const distance = Math.abs(lineAtX0 - curve.y) / curve.yRange;
  return { touches: distance <= tolerancePercent / 100, distance, gradient };
}

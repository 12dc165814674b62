import { firstOrderFit, type FirstOrderFit } from "./first-order-fit";
import { localRegression } from "./local-regression";
import { MarkingInputError } from "./marking-input-error";
import { polynomialLeastSquares, polynomialValueAndSlope } from "./internal/polynomial-least-squares";
import { sortReadings, type SortedReadings } from "./internal/sorted-readings";
import { requireFiniteNumber } from "./internal/validate";

/** Curve models a tangent can be taken from. */
export type RateModel = "first-order" | "polynomial" | "local" | "auto";

/** Options for {@link rateAt}. */
export interface RateAtOptions {
  /** Which curve to differentiate (default "auto"). */
  readonly model?: RateModel;
  /** Polynomial degree when the model is "polynomial" (default: n - 2, between 1 and 3). */
  readonly degree?: number;
  /** true: return the signed gradient as `rate` (negative when the quantity falls). Default false. */
  readonly signed?: boolean;
}

/** Result of {@link rateAt}. */
export interface RateAt {
  /** The rate: |dy/dx| at the chosen x, or the signed gradient when `signed` was asked for. */
  readonly rate: number;
  /** dy/dx with its sign. */
  readonly gradient: number;
  /** Standard uncertainty of the gradient, from the fit's own scatter. */
  readonly uncertainty: number;
  /** The model actually used (never "auto"). */
  readonly model: Exclude<RateModel, "auto">;
  /** y of the fitted curve at the chosen x (where a tangent must touch). */
  readonly valueAt: number;
  /** Plain sentence saying which curve was used and why. */
  readonly reason: string;
  /** A warning about this tangent, for example at the end of the readings. */
  readonly caution?: string;
  /** R^2 of the curve used (absent for the local curve). */
  readonly rSquared?: number;
}

function firstOrderGradient(fit: FirstOrderFit, t: number): { value: number; gradient: number; uncertainty: number } {
  const e = Math.exp(-fit.k * t);
  const sign = fit.kind === "rise" ? 1 : -1;
  const value = fit.kind === "rise" ? fit.a * (1 - e) + fit.c : fit.a * e + fit.c;
  const gradient = sign * fit.a * fit.k * e;
  const partial = [sign * fit.k * e, sign * fit.a * e * (1 - fit.k * t)];
  let variance = 0;
  for (let i = 0; i < 2; i += 1) {
    for (let j = 0; j < 2; j += 1) variance += partial[i] * fit.covariance[i][j] * partial[j];
  }
  return { value, gradient, uncertainty: Math.sqrt(Math.max(0, variance)) };
}

// The marking bench asks for several tangents on the same table (rate at a time, initial rate),
// so first-order fits are remembered by their data. The fit depends only on the numbers, so this
// changes nothing but speed.
const rememberedFits = new Map<string, FirstOrderFit | MarkingInputError>();

function fitFirstOrder(readings: SortedReadings): FirstOrderFit {
  const { x, y } = readings;
  const kind = y[y.length - 1] >= y[0] ? "rise" : "decay";
  const key = `${x.join(",")}|${y.join(",")}`;
  let remembered = rememberedFits.get(key);
  if (remembered === undefined) {
    try {
      remembered = firstOrderFit(Array.from(x), Array.from(y), { kind, offset: x.length >= 5 });
    } catch (error) {
      if (!(error instanceof MarkingInputError)) throw error;
      remembered = error;
    }
    if (rememberedFits.size >= 256) rememberedFits.clear();
    rememberedFits.set(key, remembered);
  }
  if (remembered instanceof MarkingInputError) throw remembered;
  return remembered;
}

function tryFirstOrder(readings: SortedReadings): FirstOrderFit | null {
  try {
    return fitFirstOrder(readings);
  } catch (error) {
    if (error instanceof MarkingInputError) return null;
    throw error;
  }
}

/**
 * Rate at a chosen time: the derivative of a curve fitted to the readings, with its uncertainty.
 *
 * Models: "first-order" fits y = a(1 - e^(-kt)) + c or a e^(-kt) + c (rise or decay chosen from
 * the data, offset c when there are 5 or more readings) and differentiates it
 * (dy/dt = +/- a k e^(-kt)); "polynomial" fits a least-squares polynomial (degree n - 2, at most
 * 3, unless given) and differentiates it; "local" uses a LOESS-style local quadratic. "auto"
 * takes the first-order curve when it fits well (converges, R^2 >= 0.98 and residual SD at most
 * 5 % of the y range), otherwise a polynomial when there are 5 or more readings, otherwise the
 * local curve, and says which in `reason`. The uncertainty is the delta-method standard error of
 * the gradient from the fit's covariance.
 *
 * @param x - times (or any independent variable), all different, at least 3
 * @param y - readings, same length
 * @param at - where to take the tangent, within the readings, unit of x
 * @param options - model, polynomial degree, signed
 * @returns rate (y-unit per x-unit), signed gradient, uncertainty, model used, curve value there
 * @throws {MarkingInputError} `not-a-number`, `length-mismatch`, `too-few-points`, `repeated-x`,
 *   `out-of-range`, `invalid-option`, `not-converged` (model "first-order" only)
 * @example
 * const t = [0, 10, 20, 30, 40, 50, 60];
 * rateAt(t, t.map((s) => 50 * (1 - Math.exp(-0.05 * s))), 0, { model: "first-order" }).rate;
 * // => 2.5  (a k = 50 x 0.05 cm^3 per s)
 */
export function rateAt(x: readonly number[], y: readonly number[], at: number, options: RateAtOptions = {}): RateAt {
  const functionName = "rateAt";
  const readings = sortReadings(x, y, { x: "time", y: "reading", purpose: "A rate from a curve" }, 3, functionName);
  requireFiniteNumber(at, "chosen time", functionName);
  const model = options.model ?? "auto";
  if (!["first-order", "polynomial", "local", "auto"].includes(model)) {
    throw new MarkingInputError("invalid-option", functionName, 'The curve must be "first-order", "polynomial", "local" or "auto".');
  }
  const low = readings.x[0];
  const high = readings.x[readings.x.length - 1];
  if (at < low || at > high) {
    throw new MarkingInputError(
      "out-of-range",
      functionName,
      `The time ${at} is outside the readings (${low} to ${high}); a tangent can only be drawn where there is data.`,
    );
  }
  let yLow = Infinity;
  let yHigh = -Infinity;
  for (const value of y) {
    yLow = Math.min(yLow, value);
    yHigh = Math.max(yHigh, value);
  }
  const yRange = yHigh - yLow;
  const atEnd = at === high ? "This time is the last reading: a tangent there is unreliable because the curve has no readings beyond it." : undefined;
  const finish = (
    gradient: number,
    uncertainty: number,
    used: Exclude<RateModel, "auto">,
    valueAt: number,
    reason: string,
    rSquared?: number,
    caution?: string,
  ): RateAt => ({
    rate: options.signed ? gradient : Math.abs(gradient),
    gradient,
    uncertainty,
    model: used,
    valueAt,
    reason,
    ...(caution ? { caution } : {}),
    ...(rSquared === undefined ? {} : { rSquared }),
  });

  const polynomial = (reason: string): RateAt => {
    const degree = options.degree ?? Math.min(3, Math.max(1, x.length - 2));
    if (!Number.isInteger(degree) || degree < 1 || degree > 10) {
      throw new MarkingInputError("invalid-option", functionName, "The degree of the curve must be a whole number from 1 to 10.");
    }
    const fit = polynomialLeastSquares(x, y, degree, false, functionName);
    const point = polynomialValueAndSlope(fit, at);
    const edge = at === low || at === high;
    const caution = edge
      ? "A polynomial's gradient at the first or last reading can be well off; a first-order curve is safer there."
      : undefined;
    return finish(point.slope, point.slopeStdErr, "polynomial", point.value, reason, fit.rSquared, caution ?? atEnd);
  };
  const local = (reason: string): RateAt => {
    const result = localRegression(x, y, at, { degree: x.length >= 4 ? 2 : 1 });
    return finish(result.slope, result.slopeStdErr, "local", result.value, reason, undefined, atEnd);
  };

  if (model === "first-order") {
    const fit = fitFirstOrder(readings);
    const point = firstOrderGradient(fit, at);
    return finish(point.gradient, point.uncertainty, "first-order", point.value, `First-order ${fit.kind} curve, as asked.`, fit.rSquared, atEnd);
  }
  if (model === "polynomial") return polynomial(`Polynomial curve, as asked.`);
  if (model === "local") return local("Smooth local curve, as asked.");

  if (x.length >= 4) {
    const fit = tryFirstOrder(readings);
    if (fit && fit.rSquared >= 0.98 && fit.residualStdDev <= 0.05 * yRange) {
      const point = firstOrderGradient(fit, at);
      return finish(
        point.gradient,
        point.uncertainty,
        "first-order",
        point.value,
        `The readings follow a first-order ${fit.kind} closely (R² = ${fit.rSquared.toFixed(4)}), so its curve was used.`,
        fit.rSquared,
        atEnd,
      );
    }
  }
  if (x.length >= 5) {
    return polynomial("The readings do not follow a first-order curve closely, so a least-squares polynomial was used.");
  }
  return local("Too few readings for a model curve, so a smooth local curve was used.");
}

import { MarkingInputError } from "../marking-input-error";

/** Throws unless every value is a finite number; `what` names the column in plain words. */
export function requireFiniteSeries(values: readonly number[], what: string, functionName: string): void {
  if (!Array.isArray(values)) {
    throw new MarkingInputError("not-a-number", functionName, `The ${what} must be a list of numbers.`);
  }
  for (let i = 0; i < values.length; i += 1) {
    const value = values[i];
    if (typeof value !== "number" || !Number.isFinite(value)) {
      throw new MarkingInputError(
        "not-a-number",
        functionName,
        `Reading ${i + 1} of the ${what} is blank or not a number; fill it in or remove that row.`,
      );
    }
  }
}

export function requireFiniteNumber(value: number, what: string, functionName: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new MarkingInputError("not-a-number", functionName, `The ${what} is blank or not a number.`);
  }
}

export function requirePositiveNumber(value: number, what: string, functionName: string): void {
  requireFiniteNumber(value, what, functionName);
  if (value <= 0) {
    throw new MarkingInputError("not-positive", functionName, `The ${what} must be greater than zero.`);
  }
}

export function requirePositiveSeries(values: readonly number[], what: string, functionName: string): void {
  requireFiniteSeries(values, what, functionName);
  values.forEach((value, i) => {
    if (value <= 0) {
      throw new MarkingInputError(
        "not-positive",
        functionName,
        `Reading ${i + 1} of the ${what} is zero or negative, but every ${what} value must be greater than zero.`,
      );
    }
  });
}

export function requireSameLength(
  x: readonly number[],
  y: readonly number[],
  xWhat: string,
  yWhat: string,
  functionName: string,
): void {
  if (x.length !== y.length) {
    throw new MarkingInputError(
      "length-mismatch",
      functionName,
      `There are ${x.length} ${xWhat} values but ${y.length} ${yWhat} values; each row needs both.`,
    );
  }
}

export function requireMinimumPoints(count: number, needed: number, what: string, functionName: string): void {
  if (count < needed) {
    throw new MarkingInputError(
      "too-few-points",
      functionName,
      `${what} needs at least ${needed} readings, but only ${count} ${count === 1 ? "was" : "were"} given.`,
    );
  }
}

export function countDistinct(values: readonly number[]): number {
  return new Set(values).size;
}

/** Throws when two x values are the same (used where readings must be in distinct times). */
export function requireDistinct(values: readonly number[], what: string, functionName: string): void {
  const seen = new Set<number>();
  for (const value of values) {
    if (seen.has(value)) {
      throw new MarkingInputError(
        "repeated-x",
        functionName,
        `The ${what} value ${value} appears twice; each reading needs its own ${what}.`,
      );
    }
    seen.add(value);
  }
}

/**
 * Double-double arithmetic: a number held as an unevaluated sum hi + lo of two doubles, giving
 * about 32 significant digits. Used inside least-squares fits so that converting coefficients
 * from a centred, scaled variable back to powers of x keeps full double precision (error-free
 * transformations of Knuth (TwoSum) and Dekker (TwoProduct with splitting)).
 */
export interface DoubleDouble {
  readonly hi: number;
  readonly lo: number;
}

const SPLITTER = 134217729; // 2^27 + 1, Dekker's splitting constant for doubles

export const ddZero: DoubleDouble = { hi: 0, lo: 0 };

export function dd(value: number): DoubleDouble {
  return { hi: value, lo: 0 };
}

function quickTwoSum(a: number, b: number): DoubleDouble {
  const sum = a + b;
  return { hi: sum, lo: b - (sum - a) };
}

export function twoSum(a: number, b: number): DoubleDouble {
  const sum = a + b;
  const bVirtual = sum - a;
  const error = a - (sum - bVirtual) + (b - bVirtual);
  return { hi: sum, lo: error };
}

export function twoProduct(a: number, b: number): DoubleDouble {
  const product = a * b;
  let t = SPLITTER * a;
  const aHigh = t - (t - a);
  const aLow = a - aHigh;
  t = SPLITTER * b;
  const bHigh = t - (t - b);
  const bLow = b - bHigh;
  const error = aHigh * bHigh - product + aHigh * bLow + aLow * bHigh + aLow * bLow;
  return { hi: product, lo: error };
}

export function ddAdd(a: DoubleDouble, b: DoubleDouble): DoubleDouble {
  const s = twoSum(a.hi, b.hi);
  const t = twoSum(a.lo, b.lo);
  const first = quickTwoSum(s.hi, s.lo + t.hi);
  return quickTwoSum(first.hi, first.lo + t.lo);
}

export function ddNeg(a: DoubleDouble): DoubleDouble {
  return { hi: -a.hi, lo: -a.lo };
}

export function ddSub(a: DoubleDouble, b: DoubleDouble): DoubleDouble {
  return ddAdd(a, ddNeg(b));
}

export function ddMul(a: DoubleDouble, b: DoubleDouble): DoubleDouble {
  const p = twoProduct(a.hi, b.hi);
  return quickTwoSum(p.hi, p.lo + (a.hi * b.lo + a.lo * b.hi));
}

export function ddDiv(a: DoubleDouble, b: DoubleDouble): DoubleDouble {
  const q1 = a.hi / b.hi;
  let remainder = ddSub(a, ddMul(b, dd(q1)));
  const q2 = remainder.hi / b.hi;
  remainder = ddSub(remainder, ddMul(b, dd(q2)));
  const q3 = remainder.hi / b.hi;
  return ddAdd(quickTwoSum(q1, q2), dd(q3));
}

export function ddSqrt(a: DoubleDouble): DoubleDouble {
  if (a.hi <= 0) return ddZero;
  const approx = Math.sqrt(a.hi);
  // One Newton step in double-double: sqrt(a) ~ x + (a - x^2) / (2x).
  const correction = ddSub(a, twoProduct(approx, approx)).hi / (2 * approx);
  return quickTwoSum(approx, correction);
}

export function ddToNumber(a: DoubleDouble): number {
  return a.hi + a.lo;
}

/** Sum of doubles carried in double-double. */
export function ddSum(values: readonly number[]): DoubleDouble {
  let total = ddZero;
  for (const value of values) total = ddAdd(total, dd(value));
  return total;
}

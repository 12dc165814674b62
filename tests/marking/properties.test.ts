import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { linearFit } from "@/lib/marking/linear-fit";
import { polynomialFit } from "@/lib/marking/polynomial-fit";
import { firstOrderFit } from "@/lib/marking/first-order-fit";
import { meanRate } from "@/lib/marking/mean-rate";
import { rateAt } from "@/lib/marking/rate-at";
import { activationEnergy } from "@/lib/marking/activation-energy";
import { reactionOrder } from "@/lib/marking/reaction-order";
import { meanOfRepeats } from "@/lib/marking/mean-of-repeats";
import { runCheck } from "@/lib/marking/run-check";
import { convertUnit } from "@/lib/marking/convert-unit";
import { MarkingInputError } from "@/lib/marking/marking-input-error";
import type { ResultsTable } from "@/lib/marking/check-definition";

// Fixed seed so every run checks the same cases.
const settings = { seed: 20261201, numRuns: 60 };

const close = (actual: number, expected: number, rel: number, abs = 0): boolean =>
  Number.isFinite(actual) && Math.abs(actual - expected) <= Math.max(abs, rel * Math.abs(expected));

/** Distinct, sorted x values, spread out enough to fit (2 to 12 values in [-1000, 1000]). */
const distinctXs = (min: number, max: number) =>
  fc
    .uniqueArray(fc.integer({ min: -1000, max: 1000 }), { minLength: min, maxLength: max })
    .map((values) => [...values].sort((a, b) => a - b).map((value) => value / 10));

const permutationOf = (length: number) =>
  fc.array(fc.nat(), { minLength: length, maxLength: length }).map((keys) =>
    keys
      .map((key, i) => [key, i] as const)
      .sort((a, b) => a[0] - b[0] || a[1] - b[1])
      .map(([, i]) => i),
  );

describe("exact data gives exact answers", () => {
  it("straight line: slope and intercept recovered, standard error zero", () => {
    fc.assert(
      fc.property(distinctXs(2, 12), fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -100, max: 100, noNaN: true }), (x, slope, intercept) => {
        const fit = linearFit(x, x.map((value) => slope * value + intercept));
        return close(fit.slope, slope, 1e-9, 1e-9) && close(fit.intercept, intercept, 1e-9, 1e-7) && fit.slopeStdErr <= 1e-9 * (1 + Math.abs(slope));
      }),
      settings,
    );
  });

  it("polynomial of degree 2 to 4 recovered", () => {
    fc.assert(
      fc.property(
        distinctXs(6, 12),
        fc.array(fc.integer({ min: -20, max: 20 }), { minLength: 5, maxLength: 5 }),
        fc.integer({ min: 2, max: 4 }),
        (x, rawCoefficients, degree) => {
          const coefficients = rawCoefficients.slice(0, degree + 1).map((value) => value / 4);
          const y = x.map((value) => coefficients.reduce((sum, c, k) => sum + c * value ** k, 0));
          const fit = polynomialFit(x, y, degree);
          const size = Math.max(...y.map(Math.abs), 1);
          return fit.coefficients.every((value, k) => Math.abs(value - coefficients[k]) * Math.max(...x.map((v) => Math.abs(v) ** k), 1) <= 1e-8 * size);
        },
      ),
      settings,
    );
  });

  it("first-order rise and decay recovered from exact readings", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 100, noNaN: true }),
        fc.double({ min: 0.01, max: 0.2, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }),
        fc.boolean(),
        (a, k, c, isRise) => {
          const t = [0, 5, 10, 15, 20, 30, 40, 60, 80, 100];
          const y = t.map((s) => (isRise ? a * (1 - Math.exp(-k * s)) + c : a * Math.exp(-k * s) + c));
          const fit = firstOrderFit(t, y, { kind: isRise ? "rise" : "decay" });
          return close(fit.a, a, 1e-6) && close(fit.k, k, 1e-6) && close(fit.c, c, 1e-6, 1e-5);
        },
      ),
      settings,
    );
  });

  it("activation energy recovered from exact Arrhenius data", () => {
    fc.assert(
      fc.property(fc.double({ min: 10e3, max: 200e3, noNaN: true }), fc.double({ min: 1, max: 1e12, noNaN: true }), (ea, a) => {
        const temperatures = [280, 295, 310, 325, 340];
        const k = temperatures.map((kelvin) => a * Math.exp(-ea / (8.31446261815324 * kelvin)));
        const result = activationEnergy(temperatures, k);
        return close(result.ea, ea, 1e-9) && close(result.preExponential, a, 1e-6);
      }),
      settings,
    );
  });

  it("order recovered from exact power-law rates", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 6 }), fc.double({ min: 1e-6, max: 1e3, noNaN: true }), (twiceOrder, k) => {
        const order = twiceOrder / 2;
        const c = [0.05, 0.1, 0.2, 0.4];
        const result = reactionOrder(c, c.map((value) => k * value ** order));
        return close(result.order, order, 0, 1e-9) && result.roundedOrder === order && close(result.rateConstant, k, 1e-9);
      }),
      settings,
    );
  });
});

describe("results do not depend on row order", () => {
  it("fits, mean rates and rates at a time", () => {
    fc.assert(
      fc.property(
        distinctXs(6, 10).chain((x) => fc.tuple(fc.constant(x), fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: x.length, maxLength: x.length }), permutationOf(x.length))),
        ([x, noise, order]) => {
          const y = x.map((value, i) => 3 + 0.5 * value + noise[i]);
          const px = order.map((i) => x[i]);
          const py = order.map((i) => y[i]);
          const a = linearFit(x, y);
          const b = linearFit(px, py);
          const p = polynomialFit(x, y, 2);
          const q = polynomialFit(px, py, 2);
          const from = x[1];
          const to = x[x.length - 2];
          const mid = (x[2] + x[3]) / 2;
          return (
            close(b.slope, a.slope, 1e-12, 1e-12) &&
            close(b.slopeStdErr, a.slopeStdErr, 1e-10, 1e-12) &&
            q.coefficients.every((value, i) => close(value, p.coefficients[i], 1e-9, 1e-9)) &&
            close(meanRate(px, py, from, to), meanRate(x, y, from, to), 1e-12, 1e-12) &&
            close(rateAt(px, py, mid, { model: "local" }).gradient, rateAt(x, y, mid, { model: "local" }).gradient, 1e-9, 1e-9)
          );
        },
      ),
      settings,
    );
  });

  it("runCheck gives the same verdict and expected value for shuffled rows", () => {
    fc.assert(
      fc.property(permutationOf(8), (order) => {
        const rows = [0, 10, 20, 30, 40, 60, 80, 100].map((t) => [t, Number((45 * (1 - Math.exp(-0.035 * t))).toFixed(1))]);
        const table: ResultsTable = { columns: [{ id: "t", unit: "s" }, { id: "v", unit: "cm3" }], rows };
        const shuffled: ResultsTable = { ...table, rows: order.map((i) => rows[i]) };
        const definition = { kind: "rate-at" as const, x: "t", y: "v", at: 30 };
        const a = runCheck(definition, table, { value: "0.55", unit: "cm3/s" });
        const b = runCheck(definition, shuffled, { value: "0.55", unit: "cm3/s" });
        return a.verdict === b.verdict && close(b.expected?.value ?? Number.NaN, a.expected?.value ?? Number.NaN, 1e-9);
      }),
      { ...settings, numRuns: 25 },
    );
  });
});

describe("scaling units scales answers", () => {
  it("y times s multiplies gradients by s; x times s divides them by s", () => {
    fc.assert(
      fc.property(distinctXs(3, 10), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (x, scale) => {
        const y = x.map((value, i) => 2 * value + (i % 2 === 0 ? 1 : -1));
        const base = linearFit(x, y);
        return (
          close(linearFit(x, y.map((value) => value * scale)).slope, base.slope * scale, 1e-10, 1e-12) &&
          close(linearFit(x.map((value) => value * scale), y).slope, base.slope / scale, 1e-10, 1e-12)
        );
      }),
      settings,
    );
  });

  it("a table in minutes gives the same rate as the same table in seconds, after conversion", () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 90, noNaN: true }), fc.double({ min: 0.01, max: 0.1, noNaN: true }), (final, k) => {
        const seconds = [0, 15, 30, 45, 60, 90, 120, 180];
        const volumes = seconds.map((t) => final * (1 - Math.exp(-k * t)));
        const inSeconds: ResultsTable = { columns: [{ id: "t", unit: "s" }, { id: "v", unit: "cm3" }], rows: seconds.map((t, i) => [t, volumes[i]]) };
        const inMinutes: ResultsTable = { columns: [{ id: "t", unit: "min" }, { id: "v", unit: "cm3" }], rows: seconds.map((t, i) => [t / 60, volumes[i]]) };
        const a = runCheck({ kind: "mean-rate", x: "t", y: "v", from: 15, to: 90 }, inSeconds, { value: "1", unit: "cm3/s" });
        const b = runCheck({ kind: "mean-rate", x: "t", y: "v", from: 0.25, to: 1.5 }, inMinutes, { value: "1", unit: "cm3/s" });
        const aValue = a.expected?.value ?? Number.NaN;
        const bValue = convertUnit(b.expected?.value ?? Number.NaN, b.expected?.unit ?? "", a.expected?.unit ?? "");
        return close(bValue, aValue, 1e-12) && a.answer?.deviation !== null && close(b.answer?.deviation ?? Number.NaN, a.answer?.deviation ?? Number.NaN, 1e-9, 1e-12);
      }),
      settings,
    );
  });
});

describe("bad input always gives the typed error, never a silent NaN", () => {
  const badNumber = fc.constantFrom(Number.NaN, Infinity, -Infinity);
  it("a blank or non-finite reading anywhere is refused by every fit and rate", () => {
    fc.assert(
      fc.property(distinctXs(6, 10), fc.nat(), badNumber, fc.boolean(), (x, position, bad, inY) => {
        const y = x.map((value) => 1 + 2 * value);
        const index = position % x.length;
        const xs = inY ? x : x.map((value, i) => (i === index ? bad : value));
        const ys = inY ? y.map((value, i) => (i === index ? bad : value)) : y;
        const calls = [
          () => linearFit(xs, ys),
          () => polynomialFit(xs, ys, 2),
          () => firstOrderFit(xs, ys, { kind: "rise" }),
          () => meanRate(xs, ys, x[0], x[1]),
          () => rateAt(xs, ys, x[1]),
        ];
        return calls.every((call) => {
          try {
            call();
            return false;
          } catch (error) {
            return error instanceof MarkingInputError && error.code === "not-a-number";
          }
        });
      }),
      settings,
    );
  });

  it("mismatched lengths, too few points and non-positive values are refused with their codes", () => {
    fc.assert(
      fc.property(distinctXs(3, 8), fc.integer({ min: -5, max: 0 }), (x, nonPositive) => {
        const y = x.map((value) => value * 2);
        const expectCode = (call: () => unknown, code: string): boolean => {
          try {
            call();
            return false;
          } catch (error) {
            return error instanceof MarkingInputError && error.code === code;
          }
        };
        return (
          expectCode(() => linearFit(x, y.slice(1)), "length-mismatch") &&
          expectCode(() => polynomialFit(x.slice(0, 2), y.slice(0, 2), 2), "too-few-points") &&
          expectCode(() => activationEnergy([300, nonPositive], [1, 2]), "not-positive") &&
          expectCode(() => reactionOrder([0.1, nonPositive], [1, 2]), "not-positive") &&
          expectCode(() => meanOfRepeats([null, null]), "too-few-points")
        );
      }),
      settings,
    );
  });

  it("any finite input either gives finite numbers or the typed error", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 0, maxLength: 8 }),
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 0, maxLength: 8 }),
        (x, y) => {
          const outcomes = [
            () => Object.values(linearFit(x, y)).filter((value) => typeof value === "number"),
            () => polynomialFit(x, y, 2).coefficients,
            () => [meanRate(x, y, x[0], x[x.length - 1])],
            () => [rateAt(x, y, x[0]).rate, rateAt(x, y, x[0]).uncertainty],
            () => [activationEnergy(x, y).ea],
            () => [reactionOrder(x, y).order],
          ];
          return outcomes.every((outcome) => {
            try {
              return (outcome() as number[]).every((value) => Number.isFinite(value));
            } catch (error) {
              return error instanceof MarkingInputError;
            }
          });
        },
      ),
      { ...settings, numRuns: 150 },
    );
  });
});

describe("a guard that the property helpers can fail", () => {
  it("close() rejects NaN and far values", () => {
    expect(close(Number.NaN, 1, 0.1)).toBe(false);
    expect(close(2, 1, 0.1)).toBe(false);
  });
});

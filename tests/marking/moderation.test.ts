import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { defaultSampleRule, drawModerationSample, markingAgreement, MarkingInputError, suggestMarkAdjustment, weightedKappa } from "@/lib/marking";
import { expectClose } from "./helpers";

/** A 2×2 table of agreements as two lists of levels: a yes-yes, b yes-no, c no-yes, d no-no. */
function fromTable(a: number, b: number, c: number, d: number) {
  const first: number[] = [];
  const second: number[] = [];
  const push = (n: number, x: number, y: number) => {
    for (let i = 0; i < n; i++) {
      first.push(x);
      second.push(y);
    }
  };
  push(a, 1, 1);
  push(b, 1, 0);
  push(c, 0, 1);
  push(d, 0, 0);
  return { first, second };
}

describe("weightedKappa (Cohen's kappa)", () => {
  it("reproduces the worked example of 50 proposals read by two readers: κ = 0.40", () => {
    // Worked example in the Wikipedia article "Cohen's kappa" (from memory): 20 both yes, 5 and 10
    // disagreements, 15 both no: p_o = 0.70, p_e = 0.50, κ = 0.40.
    const { first, second } = fromTable(20, 5, 10, 15);
    const k = weightedKappa(first, second, 2, "none");
    expectClose(k.observed, 0.7, { abs: 1e-12 });
    expectClose(k.expected, 0.5, { abs: 1e-12 });
    expectClose(k.kappa, 0.4, { abs: 1e-12 });
  });

  it("shows that the same raw agreement can give different kappas (same source, from memory)", () => {
    // 45/15/25/15 → p_o 0.60, p_e 0.54, κ ≈ 0.1304; 25/35/5/35 → p_o 0.60, p_e 0.46, κ ≈ 0.2593.
    const one = fromTable(45, 15, 25, 15);
    const two = fromTable(25, 35, 5, 35);
    expectClose(weightedKappa(one.first, one.second, 2, "none").kappa, 0.1304, { abs: 5e-5 });
    expectClose(weightedKappa(two.first, two.second, 2, "none").kappa, 0.2593, { abs: 5e-5 });
  });

  it("with two levels every weighting gives Cohen's unweighted kappa (the weights are then 1 and 0)", () => {
    const { first, second } = fromTable(20, 5, 10, 15);
    expect(weightedKappa(first, second, 2, "linear").kappa).toBeCloseTo(0.4, 12);
    expect(weightedKappa(first, second, 2, "quadratic").kappa).toBeCloseTo(0.4, 12);
  });

  it("gives partial credit for near misses with more levels: linear weights sit between none and quadratic", () => {
    const t = [0, 1, 2, 3, 2, 1, 0, 3, 2, 1];
    const m = [0, 2, 2, 3, 1, 1, 1, 3, 3, 1];
    const none = weightedKappa(t, m, 4, "none").kappa;
    const lin = weightedKappa(t, m, 4, "linear").kappa;
    const quad = weightedKappa(t, m, 4, "quadratic").kappa;
    expect(none).toBeLessThan(lin);
    expect(lin).toBeLessThan(quad);
  });

  it("is 1 for perfect agreement and symmetric in the two markers", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 3 }), fc.integer({ min: 0, max: 3 })), { minLength: 2, maxLength: 40 }), (pairs) => {
        const a = pairs.map((p) => p[0]);
        const b = pairs.map((p) => p[1]);
        expect(weightedKappa(a, a, 4).kappa).toBeCloseTo(1, 12);
        expect(weightedKappa(a, b, 4).kappa).toBeCloseTo(weightedKappa(b, a, 4).kappa, 12);
      }),
    );
  });

  it("refuses levels out of range, mismatched lists and empty input with the typed error", () => {
    expect(() => weightedKappa([0, 4], [0, 1], 4)).toThrowError(MarkingInputError);
    expect(() => weightedKappa([0], [0, 1], 4)).toThrowError(expect.objectContaining({ code: "length-mismatch" }));
    expect(() => weightedKappa([], [], 4)).toThrowError(expect.objectContaining({ code: "too-few-points" }));
  });
});

describe("drawModerationSample (common practice rule)", () => {
  const cohort = (n: number, markers = ["t1", "t2", "t3"]) => Array.from({ length: n }, (_, i) => ({ id: `w${String(i).padStart(3, "0")}`, total: (i * 7) % 31, markerId: markers[i % markers.length]! }));

  it("takes at least five or 10 %, whichever is larger, and all of a small cohort", () => {
    expect(drawModerationSample(cohort(30), {}, 1).ids).toHaveLength(5);
    expect(drawModerationSample(cohort(120), {}, 1).ids).toHaveLength(12);
    expect(drawModerationSample(cohort(121), {}, 1).ids).toHaveLength(13);
    expect(drawModerationSample(cohort(3), {}, 1).ids).toHaveLength(3);
    expect(defaultSampleRule).toEqual({ minCount: 5, percent: 10, includeExtremes: true, everyMarker: true });
  });

  it("always includes the highest and lowest work and every marker, and is the same for the same seed in any order", () => {
    fc.assert(
      fc.property(fc.integer({ min: 6, max: 200 }), fc.integer({ min: 1, max: 6 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }), (n, markerCount, seed) => {
        const markers = Array.from({ length: markerCount }, (_, i) => `m${i}`);
        const c = cohort(n, markers);
        const draw = drawModerationSample(c, {}, seed);
        const totals = c.map((w) => w.total);
        const drawn = c.filter((w) => draw.ids.includes(w.id));
        expect(drawn.some((w) => w.total === Math.min(...totals))).toBe(true);
        expect(drawn.some((w) => w.total === Math.max(...totals))).toBe(true);
        for (const m of markers) expect(drawn.some((w) => w.markerId === m)).toBe(true);
        expect(draw.ids.length).toBeGreaterThanOrEqual(Math.min(n, Math.max(5, Math.ceil(n / 10))));
        expect(drawModerationSample([...c].reverse(), {}, seed).ids).toEqual(draw.ids);
        expect(new Set(draw.ids).size).toBe(draw.ids.length);
      }),
      { numRuns: 150 },
    );
  });

  it("spreads the sample across the mark range", () => {
    const c = Array.from({ length: 100 }, (_, i) => ({ id: `w${i}`, total: i, markerId: "t" }));
    const totals = drawModerationSample(c, {}, 42).ids.map((id) => Number(id.slice(1))).sort((a, b) => a - b);
    const quarters = [0, 1, 2, 3].map((q) => totals.filter((t) => t >= q * 25 && t < (q + 1) * 25).length);
    expect(quarters.every((k) => k >= 1)).toBe(true);
  });

  it("different seeds usually give different samples", () => {
    const c = cohort(80);
    const draws = new Set([1, 2, 3, 4, 5].map((s) => drawModerationSample(c, {}, s).ids.join()));
    expect(draws.size).toBeGreaterThan(1);
  });

  it("refuses a bad rule, a fractional seed and duplicate ids", () => {
    expect(() => drawModerationSample(cohort(10), { percent: 0 }, 1)).toThrowError(expect.objectContaining({ code: "invalid-option" }));
    expect(() => drawModerationSample(cohort(10), {}, 1.5)).toThrowError(expect.objectContaining({ code: "invalid-option" }));
    expect(() => drawModerationSample([{ id: "a", total: 1, markerId: "t" }, { id: "a", total: 2, markerId: "t" }], {}, 1)).toThrowError(expect.objectContaining({ code: "repeated-x" }));
  });
});

describe("markingAgreement and suggestMarkAdjustment", () => {
  const criteria = [{ id: "c1", levelCount: 3 }];
  const pair = (id: string, t: number, m: number, tl = 1, ml = 1) => ({ id, teacher: { levels: { c1: tl }, total: t }, moderator: { levels: { c1: ml }, total: m } });

  it("confirms marks that agree within tolerance with no lean", () => {
    const a = markingAgreement([pair("a", 6, 6), pair("b", 4, 5), pair("c", 8, 7), pair("d", 3, 3), pair("e", 7, 7)], criteria, 1);
    expect(a.verdict).toBe("confirmed");
    expect(a.totals.withinToleranceShare).toBe(1);
    expectClose(a.totals.meanDifference, 0, { abs: 1e-12 });
  });

  it("asks for review when the teacher is consistently generous, and says so", () => {
    const a = markingAgreement([pair("a", 8, 6, 2, 1), pair("b", 6, 4, 2, 1), pair("c", 9, 7, 2, 1), pair("d", 5, 3, 1, 0), pair("e", 7, 5, 2, 1)], criteria, 1);
    expect(a.verdict).toBe("review-needed");
    expect(a.reasons.join(" ")).toMatch(/generous/);
    expect(a.criteria[0]!.meanLevelDifference).toBe(-1);
  });

  it("fits the moderator's totals on the teacher's and adjusts the cohort, keeping within 0..max", () => {
    // Exact data: moderator = teacher − 2 → slope 1, intercept −2 (hand-worked).
    const adj = suggestMarkAdjustment([{ teacher: 8, moderator: 6 }, { teacher: 6, moderator: 4 }, { teacher: 9, moderator: 7 }], [{ id: "x", total: 10 }, { id: "y", total: 1 }], 12);
    expectClose(adj.slope, 1, { abs: 1e-12 });
    expectClose(adj.intercept, -2, { abs: 1e-12 });
    expect(adj.changes).toEqual([{ id: "x", before: 10, after: 8 }, { id: "y", before: 1, after: 0 }]);
  });

  it("falls back to the mean shift when every sampled teacher total is the same", () => {
    const adj = suggestMarkAdjustment([{ teacher: 5, moderator: 6 }, { teacher: 5, moderator: 8 }], [{ id: "x", total: 5 }], 10);
    expect(adj.slope).toBe(1);
    expect(adj.changes[0]!.after).toBe(7);
    expect(() => suggestMarkAdjustment([{ teacher: 5, moderator: 6 }], [], 10)).toThrowError(expect.objectContaining({ code: "too-few-points" }));
  });
});

import { describe, expect, it } from "vitest";
import { linearFit, rateAt, tangentTouchesCurve } from "@/lib/marking";
import {
  bestFit,
  fitRange,
  formatNumber,
  gradientUnit,
  graphPoints,
  leftOutNote,
  niceAxis,
  sampleFit,
  tangentAcross,
  tangentGradient,
  tangentVerdict,
  type GraphPoints,
} from "@/lib/write-ups/graph-data";
import { expectClose } from "../marking/helpers";
import { gasFilled, gasGraph, gasTable, gasVolumes } from "./fixtures";

const times = gasVolumes.map((_, i) => i * 10);
const points = times.map((x, i) => ({ x, y: gasVolumes[i]! }));
const shaped = (filled = gasFilled()) => graphPoints(gasGraph, gasTable, filled) as GraphPoints;

describe("graphPoints", () => {
  it("pairs x and y from the table, preset times included", () => {
    expect(shaped().points).toEqual(points.map((p, row) => ({ ...p, row })));
  });

  it("skips blank and non-number cells and counts them for the note", () => {
    const g = shaped(gasFilled(["0", "24", "", "forty", "52", null, null, null]));
    expect(g.points.map((p) => p.row)).toEqual([0, 1, 4]);
    expect(g.leftOut).toBe(5);
    expect(leftOutNote(g.leftOut, 0)).toBe("5 readings left out (blank or not numbers).");
    expect(leftOutNote(1, 0)).toBe("1 reading left out (blank or not numbers).");
    expect(leftOutNote(0, 0)).toBeNull();
  });

  it("ignores rows where both cells are blank", () => {
    const g = graphPoints({ xColumn: "t", yColumn: "v" }, { ...gasTable, presetRows: [] }, { rows: [{ t: "0", v: "0" }, {}, { t: null, v: "" }], decisions: {} }) as GraphPoints;
    expect(g.points).toHaveLength(1);
    expect(g.leftOut).toBe(0);
  });

  it("keeps readings the student left out apart from the plotted ones", () => {
    const filled = { ...gasFilled(), decisions: { "3:v": { include: false, reason: "The syringe stuck." } } };
    const g = shaped(filled);
    expect(g.points.map((p) => p.row)).not.toContain(3);
    expect(g.excludedPoints).toEqual([{ x: 30, y: 47, row: 3 }]);
    expect(leftOutNote(0, 1)).toBe("1 reading left out by your decision, shown as a circle.");
  });

  it("includes a reading the student decided to keep", () => {
    const g = shaped({ ...gasFilled(), decisions: { "3:v": { include: true, reason: "It looked fine." } } });
    expect(g.points).toHaveLength(8);
  });

  it("reports a graph bound to a missing column instead of throwing", () => {
    expect(graphPoints({ xColumn: "t", yColumn: "nope" }, gasTable, gasFilled())).toHaveProperty("problem");
  });
});

describe("bestFit: curve", () => {
  it("uses the model rateAt chooses, and the sampled curve matches the engine's curve at sample points", () => {
    const fit = bestFit(gasGraph, points);
    expect(fit?.ok).toBe(true);
    if (!fit?.ok || fit.fit.kind !== "curve") throw new Error("expected a curve");
    expect(fit.fit.model).toBe(rateAt(times, gasVolumes, 0).model);
    const samples = sampleFit(fit.fit, 0, 70, 15);
    expect(samples).toHaveLength(15);
    for (const s of samples) expectClose(s.y, rateAt(times, gasVolumes, s.x).valueAt, { rel: 1e-9, abs: 1e-9 });
  });

  it("matches the engine for a polynomial curve (readings that are not first-order)", () => {
    const xs = [0, 1, 2, 3, 4, 5, 6];
    const ys = [1, 3, 2, 5, 4, 7, 6];
    const fit = bestFit({ fit: "curve", throughOrigin: false }, xs.map((x, i) => ({ x, y: ys[i]! })));
    if (!fit?.ok || fit.fit.kind !== "curve") throw new Error("expected a curve");
    expect(fit.fit.model).toBe("polynomial");
    for (const x of [0, 0.5, 2.5, 6]) expectClose(fit.fit.valueAt(x), rateAt(xs, ys, x).valueAt, { rel: 1e-9, abs: 1e-9 });
  });

  it("matches the engine for the local curve used with few readings", () => {
    const xs = [0, 10, 20, 30];
    const ys = [0, 30, 20, 45];
    const fit = bestFit({ fit: "curve", throughOrigin: false }, xs.map((x, i) => ({ x, y: ys[i]! })));
    if (!fit?.ok || fit.fit.kind !== "curve") throw new Error("expected a curve");
    expect(fit.fit.model).toBe("local");
    for (const x of [0, 5, 15, 30]) expectClose(fit.fit.valueAt(x), rateAt(xs, ys, x).valueAt, { rel: 1e-9, abs: 1e-9 });
  });

  it("says plainly when there are too few readings or repeated times, never throwing", () => {
    expect(bestFit(gasGraph, points.slice(0, 2))).toEqual({ ok: false, message: "Too few readings for a curve of best fit: at least 3 are needed, and there are 2." });
    expect(bestFit(gasGraph, points.slice(0, 1))).toEqual({ ok: false, message: "Too few readings for a curve of best fit: at least 3 are needed, and there is 1." });
    expect(bestFit(gasGraph, [{ x: 0, y: 0 }, { x: 10, y: 5 }, { x: 10, y: 6 }], "time / s")).toEqual({ ok: false, message: "Two readings have the same time / s, so a curve cannot be fitted. Check that column." });
  });

  it("returns null when the graph asks for no fit", () => {
    expect(bestFit({ fit: "none", throughOrigin: false }, points)).toBeNull();
  });
});

describe("bestFit: line", () => {
  // Invented voltage and current readings for a resistor, roughly V = 4.7 I.
  const vi = [
    { x: 0.1, y: 0.48 },
    { x: 0.2, y: 0.93 },
    { x: 0.3, y: 1.43 },
    { x: 0.4, y: 1.87 },
  ];

  it("is the engine's least-squares line", () => {
    const fit = bestFit({ fit: "line", throughOrigin: false }, vi);
    if (!fit?.ok || fit.fit.kind !== "line") throw new Error("expected a line");
    const engine = linearFit(vi.map((p) => p.x), vi.map((p) => p.y));
    expect(fit.fit.slope).toBe(engine.slope);
    expect(fit.fit.intercept).toBe(engine.intercept);
    const samples = sampleFit(fit.fit, 0.1, 0.4);
    expect(samples).toHaveLength(2);
    expectClose(samples[1]!.y, engine.intercept + engine.slope * 0.4, { rel: 1e-12 });
  });

  it("goes through the origin when the spec says, and is drawn from 0", () => {
    const fit = bestFit({ fit: "line", throughOrigin: true }, vi);
    if (!fit?.ok || fit.fit.kind !== "line") throw new Error("expected a line");
    expect(fit.fit.intercept).toBe(0);
    expect(fit.fit.slope).toBe(linearFit(vi.map((p) => p.x), vi.map((p) => p.y), { throughOrigin: true }).slope);
    expect(fitRange(fit.fit, vi)).toEqual({ from: 0, to: 0.4 });
  });

  it("never tells the student the gradient in its description", () => {
    const fit = bestFit({ fit: "line", throughOrigin: false }, vi);
    expect(fit?.ok && fit.fit.description).toBe("Straight line of best fit (least squares).");
  });

  it("needs two readings, or one through the origin, and explains equal x values", () => {
    expect(bestFit({ fit: "line", throughOrigin: false }, vi.slice(0, 1))).toEqual({ ok: false, message: "Too few readings for a line of best fit: at least 2 are needed, and there is 1." });
    expect(bestFit({ fit: "line", throughOrigin: true }, vi.slice(0, 1))?.ok).toBe(true);
    const same = bestFit({ fit: "line", throughOrigin: false }, [{ x: 1, y: 1 }, { x: 1, y: 2 }]);
    expect(same?.ok).toBe(false);
  });
});

describe("tangents", () => {
  const t = { at: 20, x1: 0, y1: 7.1, x2: 40, y2: 30.1 };

  it("gives the gradient as Δy ÷ Δx with the unit y per x", () => {
    const g = tangentGradient(t, "s", "cm³");
    expect(g).toMatchObject({ deltaX: 40, unit: "cm³/s" });
    expectClose(g!.gradient, 23 / 40, { rel: 1e-12 });
    expect(g!.text).toBe("Δy ÷ Δx = 23 cm³ ÷ 40 s = 0.575 cm³/s");
  });

  it("keeps the sign of a falling line", () => {
    expect(tangentGradient({ x1: 0, y1: 120.5, x2: 100, y2: 119.3 }, "s", "g")!.text).toBe("Δy ÷ Δx = -1.2 g ÷ 100 s = -0.012 g/s");
  });

  it("has no gradient when the points share an x", () => {
    expect(tangentGradient({ x1: 5, y1: 1, x2: 5, y2: 2 }, "s", "g")).toBeNull();
    expect(tangentAcross({ x1: 5, y1: 1, x2: 5, y2: 2 }, 0, 10)).toBeNull();
  });

  it("writes gradient units y per x", () => {
    expect(gradientUnit("cm³", "s")).toBe("cm³/s");
    expect(gradientUnit("mol/dm³", "s")).toBe("mol/dm³ per s");
    expect(gradientUnit("", "K⁻¹")).toBe("K");
    expect(gradientUnit("V", "A")).toBe("V/A");
    expect(gradientUnit("g", "")).toBe("g");
    expect(gradientUnit("", "s")).toBe("per s");
  });

  it("extends the line through both points across the plot", () => {
    const [a, b] = tangentAcross(t, -10, 70)!;
    expectClose(a.y, 7.1 - 0.575 * 10, { rel: 1e-12 });
    expectClose(b.y, 7.1 + 0.575 * 70, { rel: 1e-12 });
    expect([a.x, b.x]).toEqual([-10, 70]);
  });

  it("judges the touch with the engine, using the fitted curve's y at the chosen time and the readings' y range", () => {
    const fit = bestFit(gasGraph, points);
    if (!fit?.ok) throw new Error("expected a fit");
    const y20 = fit.fit.valueAt(20);
    const slope = rateAt(times, gasVolumes, 20).gradient;
    const touching = { at: 20, x1: 0, y1: y20 - 20 * slope, x2: 50, y2: y20 + 30 * slope };
    const verdict = tangentVerdict(touching, fit, points, gasTable.columns[0]!);
    expect(verdict).toEqual({ touches: true, message: "Your tangent touches the curve at t = 20 s." });
    const lifted = { ...touching, y1: touching.y1 + 9, y2: touching.y2 + 9 };
    expect(tangentTouchesCurve(lifted, { x: 20, y: y20, yRange: 58 }).touches).toBe(false);
    expect(tangentVerdict(lifted, fit, points, gasTable.columns[0]!)).toEqual({ touches: false, message: "Your tangent does not touch the curve at t = 20 s. Move it so that it just touches the curve there." });
  });

  it("cannot judge without a curve, outside the readings, or with the points above each other", () => {
    const x = gasTable.columns[0]!;
    const fit = bestFit(gasGraph, points);
    expect(tangentVerdict(t, null, points, x).touches).toBeNull();
    expect(tangentVerdict(t, { ok: false, message: "x" }, points, x).touches).toBeNull();
    expect(tangentVerdict({ ...t, at: 95 }, fit, points, x)).toEqual({ touches: null, message: "Choose t between 0 and 70 s, where there are readings." });
    expect(tangentVerdict({ ...t, x2: 0 }, fit, points, x).touches).toBeNull();
    const flat = points.map((p) => ({ ...p, y: 5 }));
    expect(tangentVerdict(t, bestFit({ fit: "line", throughOrigin: false }, flat), flat, x).message).toBe("The readings do not change, so there is no curve to touch.");
  });
});

describe("axes and numbers", () => {
  it("uses round limits just outside the readings, from 0 when they start near it", () => {
    expect(niceAxis(times)).toEqual({ min: 0, max: 70 });
    expect(niceAxis(gasVolumes)).toEqual({ min: 0, max: 60 });
    expect(niceAxis([0.003096, 0.003411])).toEqual({ min: 0.00305, max: 0.00345 });
    expect(niceAxis([-5.2, -3.1])).toEqual({ min: -5.5, max: -3 });
    expect(niceAxis([120.5, 119.3])).toEqual({ min: 119.2, max: 120.6 });
  });

  it("copes with no readings and a single value", () => {
    expect(niceAxis([])).toEqual({ min: 0, max: 1 });
    expect(niceAxis([5, 5])).toEqual({ min: 4.4, max: 5.6 });
    expect(niceAxis([-2])).toEqual({ min: -2.2, max: -1.8 });
  });

  it("formats numbers without float noise, never as NaN", () => {
    expect(formatNumber(0.1 + 0.2, 4)).toBe("0.3");
    expect(formatNumber(Number.NaN)).toBe("—");
  });
});

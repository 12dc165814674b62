import { describe, expect, it } from "vitest";
import { checkHistory, skillProgress, termOf, type ReturnedWork } from "@/lib/progress/summary";

// Invented marks, worked by hand.
const work = (title: string, day: number, criteria: [string, number, number][]): ReturnedWork => ({
  writeUpId: title,
  title,
  returnedAt: new Date(Date.UTC(2026, 9, day)),
  total: criteria.reduce((s, c) => s + c[1], 0),
  maxTotal: criteria.reduce((s, c) => s + c[2], 0),
  criteria: criteria.map(([t, marks, max]) => ({ title: t, marks, max, level: "" })),
});

describe("skill progress from known marks", () => {
  const returned = [
    work("Gas over time", 3, [["Recording results", 2, 2], ["Processing data", 0, 2]]),
    work("Marble chips", 10, [["Recording results", 1, 2], ["Processing data", 1, 2]]),
    work("Peroxide", 17, [["Recording results", 2, 2], ["Processing data", 2, 2]]),
  ];

  it("averages each skill across practicals as a percentage of the marks available", () => {
    const skills = skillProgress(returned);
    const recording = skills.find((s) => s.title === "Recording results")!;
    // (100 + 50 + 100) / 3 = 83.3 %; latest 100 %.
    expect(recording.averagePercent).toBeCloseTo(250 / 3, 10);
    expect(recording.latestPercent).toBe(100);
    expect(recording.status).toBe("secure");
    const processing = skills.find((s) => s.title === "Processing data")!;
    // (0 + 50 + 100) / 3 = 50 % → "getting there"; the latest (100 %) is 50 points above the average, lifting it one step.
    expect(processing.averagePercent).toBe(50);
    expect(processing.status).toBe("secure");
    expect(processing.points.map((p) => p.practical)).toEqual(["Gas over time", "Marble chips", "Peroxide"]);
  });

  it("calls a skill one to work on when it is mostly low and not improving", () => {
    const skills = skillProgress([work("A", 1, [["Evaluation", 0, 3]]), work("B", 2, [["Evaluation", 1, 3]])]);
    expect(skills[0]!.averagePercent).toBeCloseTo(100 / 6, 10);
    expect(skills[0]!.status).toBe("focus");
  });
});

describe("calculation-check history", () => {
  const at = (m: number) => new Date(Date.UTC(2026, 10, 1, 10, m));
  it("counts right first time per kind from each check's first attempt, and recurring slips over all attempts", () => {
    const h = checkHistory([
      { writeUpId: "w1", checkId: "a", kind: "mean-rate", verdict: "disagrees", slipCode: "minutes-for-seconds", at: at(1) },
      { writeUpId: "w1", checkId: "a", kind: "mean-rate", verdict: "agrees", slipCode: null, at: at(2) },
      { writeUpId: "w2", checkId: "a", kind: "mean-rate", verdict: "agrees", slipCode: null, at: at(3) },
      { writeUpId: "w2", checkId: "b", kind: "rate-at", verdict: "close", slipCode: "tangent-not-touching", at: at(4) },
      { writeUpId: "w3", checkId: "b", kind: "rate-at", verdict: "disagrees", slipCode: "minutes-for-seconds", at: at(5) },
    ]);
    expect(h.kinds.find((k) => k.kind === "mean-rate")).toMatchObject({ checks: 2, rightFirstTime: 1, share: 0.5 });
    expect(h.kinds.find((k) => k.kind === "rate-at")).toMatchObject({ checks: 2, rightFirstTime: 0 });
    expect(h.slips[0]).toMatchObject({ code: "minutes-for-seconds", count: 2 });
    expect(h.slips[0]!.message).toMatch(/minutes and seconds/);
  });
});

describe("school terms (common practice in England and Wales)", () => {
  it("places dates in autumn, spring and summer terms", () => {
    expect(termOf(new Date("2026-12-01")).name).toBe("Autumn term 2026");
    expect(termOf(new Date("2027-02-10")).name).toBe("Spring term 2027");
    expect(termOf(new Date("2027-06-10")).name).toBe("Summer term 2027");
  });
});

import { describe, expect, it } from "vitest";
import { checkAnswer, type ExpectedAnswer } from "@/lib/marking/check-answer";
import { slipCodes } from "@/lib/marking/slip-codes";
import { expectClose, expectMarkingError } from "./helpers";

const rate: ExpectedAnswer = { value: 0.5, unit: "cm3/s", method: "fitted", isRate: true };

describe("checkAnswer verdict bands (defaults: 10 % fitted, 15 % tangent, close up to twice; common practice)", () => {
  it("agrees inside the tolerance, close up to twice it, disagrees beyond", () => {
    expect(checkAnswer(rate, { value: "0.53", unit: "cm3/s" }).verdict).toBe("agrees");
    expect(checkAnswer(rate, { value: "0.58", unit: "cm3/s" }).verdict).toBe("close");
    expect(checkAnswer(rate, { value: "0.65", unit: "cm3/s" }).verdict).toBe("disagrees");
  });

  it("reports the relative deviation after unit conversion", () => {
    const result = checkAnswer(rate, { value: "33", unit: "cm3/min" });
    expectClose(result.deviation ?? Number.NaN, 0.1, { rel: 1e-9 });
    expectClose(result.answerValue ?? Number.NaN, 0.55, { rel: 1e-12 });
  });

  it("uses 15 % for tangents", () => {
    expect(checkAnswer({ ...rate, method: "tangent" }, { value: "0.57", unit: "cm3/s" }).verdict).toBe("agrees");
    expect(checkAnswer(rate, { value: "0.57", unit: "cm3/s" }).verdict).toBe("close");
  });

  it("follows the teacher's tolerance and close band", () => {
    expect(checkAnswer(rate, { value: "0.53", unit: "cm3/s" }, { tolerancePercent: 5 }).verdict).toBe("close");
    expect(checkAnswer(rate, { value: "0.58", unit: "cm3/s" }, { closeFactor: 1 }).verdict).toBe("disagrees");
  });

  it("widens the tolerance by the fit's own uncertainty: sqrt(10 %² + (2u/E)²)", () => {
    const scattered = { ...rate, standardUncertainty: 0.05 };
    const result = checkAnswer(scattered, { value: "0.60", unit: "cm3/s" });
    expectClose(result.tolerance ?? Number.NaN, Math.sqrt(0.1 ** 2 + 0.2 ** 2), { rel: 1e-12 });
    expect(result.verdict).toBe("agrees");
  });

  it("converts equivalent units instead of refusing them", () => {
    expect(checkAnswer(rate, { value: "30", unit: "cm3 min-1" }).verdict).toBe("agrees");
    expect(checkAnswer(rate, { value: "5.0e-4", unit: "dm3/s" }).verdict).toBe("agrees");
    expect(checkAnswer(rate, { value: "0.50 cm³ s⁻¹" }).verdict).toBe("agrees");
  });

  it("a right number with no unit, or a unit that does not fit, is close, with a unit hint", () => {
    const missing = checkAnswer(rate, { value: "0.50" });
    expect(missing.verdict).toBe("close");
    expect(missing.unitOk).toBe(false);
    expect(missing.hint).toContain("unit");
    const wrong = checkAnswer(rate, { value: "0.50", unit: "cm3" });
    expect(wrong.verdict).toBe("close");
    expect(wrong.unitOk).toBe(false);
  });

  it("a pure number needs no unit", () => {
    expect(checkAnswer({ value: 2, unit: "" }, { value: "2.0" }).unitOk).toBe(true);
  });

  it("cannot check an unreadable answer, and says how to type it", () => {
    const result = checkAnswer(rate, { value: "about half" });
    expect(result.verdict).toBe("cannot-check");
    expect(result.deviation).toBeNull();
    expect(result.hint.length).toBeGreaterThan(20);
  });

  it("uses an absolute tolerance for a value near zero (order 0)", () => {
    expect(checkAnswer({ value: 0.02, unit: "" }, { value: "0" }, { absoluteTolerance: 0.2 }).verdict).toBe("agrees");
  });
});

describe("checkAnswer significant figures (teacher's rule)", () => {
  it("a {min, max} range", () => {
    const ok = checkAnswer(rate, { value: "0.503", unit: "cm3/s" }, { significantFigures: { min: 2, max: 3 } });
    expect(ok.significantFiguresOk).toBe(true);
    const tooMany = checkAnswer(rate, { value: "0.50312", unit: "cm3/s" }, { significantFigures: { min: 2, max: 3 } });
    expect(tooMany.significantFiguresOk).toBe(false);
    expect(tooMany.significantFigures).toBe(5);
    expect(tooMany.verdict).toBe("agrees");
    expect(tooMany.hint).toContain("significant figures");
  });
  it("match the data ± 1", () => {
    const rule = { matchData: 3 };
    expect(checkAnswer(rate, { value: "0.50", unit: "cm3/s" }, { significantFigures: rule }).significantFiguresOk).toBe(true);
    expect(checkAnswer(rate, { value: "0.5", unit: "cm3/s" }, { significantFigures: rule }).significantFiguresOk).toBe(false);
    expect(checkAnswer(rate, { value: "0.50000", unit: "cm3/s" }, { significantFigures: rule }).significantFiguresOk).toBe(false);
  });
  it("no rule: not judged", () => {
    expect(checkAnswer(rate, { value: "0.5", unit: "cm3/s" }).significantFiguresOk).toBeNull();
  });
  it("explains that trailing zeros of a whole number do not count", () => {
    const result = checkAnswer({ value: 1200, unit: "s" }, { value: "1200", unit: "s" }, { significantFigures: { min: 3, max: 4 } });
    expect(result.significantFiguresOk).toBe(false);
    expect(result.hint).toContain("Zeros at the end");
  });
});

describe("checkAnswer names the likely slip (worked examples; slips listed in DOMAIN as common practice)", () => {
  const cases: [string, ExpectedAnswer, { value: string; unit?: string }, string][] = [
    ["minutes for seconds: 0.5 cm³/s worked out per minute but labelled per second", rate, { value: "30", unit: "cm3/s" }, "minutes-for-seconds"],
    ["seconds for minutes", { value: 30, unit: "cm3/min", isRate: true }, { value: "0.5", unit: "cm3/min" }, "minutes-for-seconds"],
    ["cm³ for dm³: 0.25 mol/dm³ computed with a volume in cm³", { value: 0.25, unit: "mol/dm3" }, { value: "0.00025", unit: "mol/dm3" }, "cm3-for-dm3"],
    ["dm³ for cm³", { value: 0.25, unit: "mol/dm3" }, { value: "250", unit: "mol/dm3" }, "cm3-for-dm3"],
    ["J for kJ", { value: 52, unit: "kJ/mol" }, { value: "52000", unit: "kJ/mol" }, "joules-for-kilojoules"],
    ["inverted ratio (time over volume)", rate, { value: "2.0", unit: "cm3/s" }, "inverted-ratio"],
    ["lost minus sign on a falling line", { value: -0.024, unit: "g/s" }, { value: "0.024", unit: "g/s" }, "lost-minus-sign"],
    ["negative rate", rate, { value: "-0.50", unit: "cm3/s" }, "negative-rate"],
    ["wrong sign on a rising line's gradient", { value: 0.024, unit: "g/s" }, { value: "-0.024", unit: "g/s" }, "wrong-sign"],
    ["a fraction for a percentage", { value: 4, unit: "%" }, { value: "0.04", unit: "%" }, "percentage-as-fraction"],
    ["a power of ten", { value: 3.4, unit: "s-1" }, { value: "0.34", unit: "s-1" }, "power-of-ten"],
  ];
  for (const [label, expected, answer, code] of cases) {
    it(label, () => {
      const result = checkAnswer(expected, answer);
      expect(result.verdict).toBe("disagrees");
      expect(result.likelySlip?.code).toBe(code);
      expect(result.hint).toContain(result.likelySlip?.message ?? "missing");
    });
  }

  it("prefers a data slip given by the caller (wrong interval) over unit slips", () => {
    const expected: ExpectedAnswer = { ...rate, method: "calculated", slips: [{ code: "wrong-interval", value: 0.8 }] };
    expect(checkAnswer(expected, { value: "0.80", unit: "cm3/s" }).likelySlip?.code).toBe("wrong-interval");
  });

  it("°C for K in an activation energy", () => {
    const expected: ExpectedAnswer = { value: 49.2, unit: "kJ/mol", slips: [{ code: "celsius-for-kelvin", value: 0.52 }] };
    expect(checkAnswer(expected, { value: "0.52", unit: "kJ/mol" }).likelySlip?.code).toBe("celsius-for-kelvin");
  });

  it("names no slip when none fits", () => {
    const result = checkAnswer(rate, { value: "0.77", unit: "cm3/s" });
    expect(result.verdict).toBe("disagrees");
    expect(result.likelySlip).toBeUndefined();
  });

  it("every slip sentence is plain and never contains a digit of an expected number", () => {
    for (const code of slipCodes) {
      const result = checkAnswer({ value: 0.123456, unit: "cm3/s", slips: [{ code, value: 98.7654 }] }, { value: "98.7654", unit: "cm3/s" });
      expect(result.likelySlip?.code).toBe(code);
      expect(result.hint).not.toMatch(/0\.12|123456|98\.7/);
    }
  });

  it("hints never reveal the expected value", () => {
    for (const typed of ["0.1", "0.5", "0.9", "30", "-0.5", "nonsense"]) {
      const hint = checkAnswer({ value: 0.4837, unit: "cm3/s" }, { value: typed, unit: "cm3/s" }).hint;
      expect(hint).not.toMatch(/0\.48|4837/);
    }
  });
});

describe("checkAnswer with a drawn tangent", () => {
  const tangentExpected: ExpectedAnswer = { value: 0.65, unit: "cm3/s", method: "tangent", curve: { x: 30, y: 38.5, yRange: 52 } };
  it("a tangent that touches and a matching number agrees", () => {
    const result = checkAnswer(tangentExpected, { value: "0.68", unit: "cm3/s", tangent: { x1: 0, y1: 18.1, x2: 60, y2: 58.9 } });
    expect(result.tangent?.touches).toBe(true);
    expect(result.verdict).toBe("agrees");
  });
  it("a tangent that misses the curve at the time asked is reported, and the verdict is at best close", () => {
    const result = checkAnswer(tangentExpected, { value: "0.68", unit: "cm3/s", tangent: { x1: 0, y1: 30, x2: 60, y2: 70.8 } });
    expect(result.tangent?.touches).toBe(false);
    expect(result.verdict).toBe("close");
    expect(result.likelySlip?.code).toBe("tangent-not-touching");
  });
  it("a number that does not match the student's own line is named", () => {
    const result = checkAnswer(tangentExpected, { value: "0.30", unit: "cm3/s", tangent: { x1: 0, y1: 18.1, x2: 60, y2: 58.9 } });
    expect(result.likelySlip?.code).toBe("tangent-gradient-misread");
  });
});

describe("checkAnswer refuses a bad policy or expected value", () => {
  it("NaN expected value", () => expectMarkingError(() => checkAnswer({ value: Number.NaN, unit: "" }, { value: "1" }), "not-a-number"));
  it("negative tolerance", () => expectMarkingError(() => checkAnswer(rate, { value: "1" }, { tolerancePercent: -1 }), "invalid-option"));
  it("close band under 1", () => expectMarkingError(() => checkAnswer(rate, { value: "1" }, { closeFactor: 0.5 }), "invalid-option"));
  it("bad significant-figure rule", () =>
    expectMarkingError(() => checkAnswer(rate, { value: "1" }, { significantFigures: { min: 3, max: 2 } }), "invalid-option"));
});

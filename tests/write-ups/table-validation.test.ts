import { describe, expect, it } from "vitest";
import { findAnomalies } from "@/lib/marking";
import {
  ANOMALY_RULE,
  cellText,
  columnHeading,
  gridRowCount,
  instrumentFor,
  repeatGroups,
  resolutionDecimalPlaces,
  validateTable,
} from "@/lib/write-ups/table-validation";
import { blank, clockTable, freeTable, gasFilled, gasTable, massTable } from "./fixtures";

const issuesAt = (v: ReturnType<typeof validateTable>, row: number, column: string) => v.issues.filter((i) => i.row === row && i.column === column);

describe("headings and layout", () => {
  it("writes headings as quantity / unit (DOMAIN.md; IUPAC Green Book convention)", () => {
    expect(columnHeading(gasTable.columns[1]!)).toBe("volume of gas / cm³");
    expect(columnHeading({ quantity: "ln(1/t)", unit: "" })).toBe("ln(1/t)");
  });

  it("shows the planned rows for a new table and the student's rows after that, between the presets and 60", () => {
    expect(gridRowCount(gasTable, blank())).toBe(8);
    expect(gridRowCount(massTable, { rows: [{}, {}, {}, {}, {}, {}], decisions: {} })).toBe(6);
    expect(gridRowCount(gasTable, { rows: [{}], decisions: {} })).toBe(8);
    expect(gridRowCount(massTable, { rows: Array.from({ length: 80 }, () => ({})), decisions: {} })).toBe(60);
  });

  it("shows preset values formatted to the column's decimal places, ahead of anything typed", () => {
    expect(cellText(gasTable, { rows: [{ t: "99" }], decisions: {} }, 0, gasTable.columns[0]!)).toBe("0");
    expect(cellText(gasTable, gasFilled(), 3, gasTable.columns[0]!)).toBe("30");
    expect(cellText(massTable, { rows: [{ m: 12.5 }], decisions: {} }, 0, massTable.columns[1]!)).toBe("12.5");
    expect(cellText(massTable, { rows: [{ m: "   " }], decisions: {} }, 0, massTable.columns[1]!)).toBeNull();
  });

  it("counts decimal places in a resolution", () => {
    expect([0.01, 0.5, 1, 10, 0.001, 0.25].map(resolutionDecimalPlaces)).toEqual([2, 1, 0, 0, 3, 2]);
  });

  it("names the instrument from the unit when it is clear, and says 'instrument' otherwise", () => {
    expect(instrumentFor("g")).toBe("balance");
    expect(instrumentFor("°C")).toBe("thermometer");
    expect(instrumentFor("cm³")).toBe("instrument");
  });
});

describe("validateTable: numbers", () => {
  it("accepts a clean table with no issues", () => {
    const v = validateTable(gasTable, gasFilled());
    expect(v.issues).toEqual([]);
    expect(v.anomalies).toEqual([]);
  });

  it("asks for a number when the cell is not one", () => {
    const v = validateTable(massTable, { rows: [{ m: "twelve" }, { m: "12.3.4" }], decisions: {} });
    expect(issuesAt(v, 0, "m")).toEqual([{ row: 0, column: "m", level: "error", message: "Type a number, like 12.5." }]);
    expect(issuesAt(v, 1, "m")[0]!.message).toBe("Type a number, like 12.5.");
  });

  it("explains a decimal comma rather than guessing what it means", () => {
    const v = validateTable(massTable, { rows: [{ m: "12,50" }], decisions: {} });
    expect(issuesAt(v, 0, "m")[0]).toMatchObject({ level: "error", message: "Use a decimal point, not a comma: type a number like 12.5." });
  });

  it("keeps units out of the cells: they belong in the heading (DOMAIN.md)", () => {
    const v = validateTable(massTable, { rows: [{ m: "12.50 g" }], decisions: {} });
    expect(issuesAt(v, 0, "m")[0]).toMatchObject({ level: "error", message: "Type the number only: the unit (g) is already in the column heading." });
  });

  it("ignores blank cells and does not judge preset cells", () => {
    const v = validateTable(gasTable, { rows: [{ t: "abc", v: null }, { v: "" }], decisions: {} });
    expect(v.issues).toEqual([]);
  });

  it("reads numbers stored as numbers as well as text", () => {
    const v = validateTable(massTable, { rows: [{ t: 0, m: 12.34 }], decisions: {} });
    expect(v.issues).toEqual([]);
  });
});

describe("validateTable: range of the instrument", () => {
  it("flags a reading above the top of the scale (a 100 cm³ gas syringe, DOMAIN.md)", () => {
    const v = validateTable(gasTable, gasFilled(["0", "104"]));
    expect(issuesAt(v, 1, "v")[0]).toMatchObject({ level: "error", message: "This is outside what the instrument can read (from 0 to 100 cm³). Check the reading." });
  });

  it("flags a reading below the bottom of the scale", () => {
    const v = validateTable(massTable, { rows: [{ m: "-0.50" }], decisions: {} });
    expect(issuesAt(v, 0, "m")[0]!.message).toBe("This is outside what the balance can read (from 0 to 400 g). Check the reading.");
  });

  it("accepts readings on the ends of the range", () => {
    const v = validateTable(gasTable, gasFilled(["0", "100"]));
    expect(v.issues).toEqual([]);
  });
});

describe("validateTable: decimal places (one number of decimal places per column, matching the resolution: common practice, DOMAIN.md)", () => {
  it("refuses more decimal places than the balance reads to", () => {
    const v = validateTable(massTable, { rows: [{ m: "12.345" }], decisions: {} });
    expect(issuesAt(v, 0, "m")).toEqual([{ row: 0, column: "m", level: "error", message: "This balance reads to 0.01 g: give 2 decimal places." }]);
  });

  it("asks for the trailing zero when a reading has fewer places than the instrument reads to", () => {
    const v = validateTable(massTable, { rows: [{ m: "12.3" }], decisions: {} });
    expect(issuesAt(v, 0, "m")).toEqual([{ row: 0, column: "m", level: "warning", message: "This balance reads to 0.01 g: give 2 decimal places, even when the last digit is 0." }]);
  });

  it("asks for whole numbers on an instrument that reads to 1 unit", () => {
    const v = validateTable(gasTable, gasFilled(["0", "24.5"]));
    expect(issuesAt(v, 1, "v")[0]).toMatchObject({ level: "error", message: "This instrument reads to 1 cm³: give a whole number." });
  });

  it("follows the teacher's decimal places when they are fewer than the instrument shows (hand timing, common practice)", () => {
    const v = validateTable(clockTable, { rows: [{ T: "20.0", r1: "62.35", r2: "62.4", r3: "62" }], decisions: {} });
    expect(issuesAt(v, 0, "r1")).toEqual([{ row: 0, column: "r1", level: "warning", message: "Give this column to 1 decimal place: that is as precise as these readings are." }]);
    expect(issuesAt(v, 0, "r2")).toEqual([]);
    expect(issuesAt(v, 0, "r3")[0]).toMatchObject({ level: "warning", message: "Give 1 decimal place: every value in a column has the same number of decimal places." });
  });

  it("gives calculated columns the teacher's decimal places as advice, never an error", () => {
    const v = validateTable(clockTable, { rows: [{ T: "20.0", tm: "62.33", inv: "0.016" }], decisions: {} });
    expect(issuesAt(v, 0, "tm")[0]).toMatchObject({ level: "warning" });
    expect(issuesAt(v, 0, "inv")[0]).toMatchObject({ level: "warning", message: "Give 4 decimal places: every value in a column has the same number of decimal places." });
  });

  it("asks a column without a set precision to agree with itself (warning)", () => {
    const v = validateTable(freeTable, { rows: [{ f: "1", l: "2.5" }, { f: "2", l: "5.1" }, { f: "3", l: "7.65" }], decisions: {} });
    expect(v.issues).toEqual([
      { row: 2, column: "l", level: "warning", message: "Most values in this column have 1 decimal place: give every value in a column the same number of decimal places." },
    ]);
  });

  it("does not judge decimal places in a column with nothing to compare", () => {
    const v = validateTable(freeTable, { rows: [{ f: "1", l: "2.55" }], decisions: {} });
    expect(v.issues).toEqual([]);
  });
});

describe("validateTable: repeats, anomalies and means", () => {
  // Invented runs: 62.0, 64.0 and 80.0 s. The median is 64.0 s; 80.0 s is 25 % away, more than 10 % (common practice).
  const runs = { T: "20.0", r1: "62.0", r2: "64.0", r3: "80.0" };

  it("finds the repeat groups from the mean column", () => {
    expect(repeatGroups(clockTable)).toEqual([{ meanColumn: "tm", columns: ["r1", "r2", "r3"] }]);
  });

  it("flags the anomalous repeat by the engine's rule and leaves it out of the mean until the student decides", () => {
    const v = validateTable(clockTable, { rows: [runs], decisions: {} });
    expect(v.anomalies).toEqual([
      { row: 0, column: "r3", message: findAnomalies([62, 64, 80])[0]!.reason, excludedByRule: true, excluded: true, decision: null },
    ]);
    expect(v.means[0]).toBe(63);
    expect(v.meansByColumn.tm![0]).toBe(63);
  });

  it("says the rule in words, with its source", () => {
    expect(ANOMALY_RULE).toContain("more than 10 %");
    expect(ANOMALY_RULE).toContain("median");
    expect(ANOMALY_RULE).toContain("common practice");
  });

  it("keeps a flagged reading in the mean when the student decides so, with a reason", () => {
    const v = validateTable(clockTable, { rows: [runs], decisions: { "0:r3": { include: true, reason: "All three runs looked the same to me." } } });
    expect(v.anomalies[0]).toMatchObject({ excludedByRule: true, excluded: false, decision: { include: true } });
    expect(v.means[0]).toBeCloseTo((62 + 64 + 80) / 3, 12);
  });

  it("honours a decision to leave out a reading the rule did not flag", () => {
    const v = validateTable(clockTable, { rows: [{ T: "20.0", r1: "62.0", r2: "64.0", r3: "63.0" }], decisions: { "0:r1": { include: false, reason: "The flask was not swirled." } } });
    expect(v.anomalies).toEqual([{ row: 0, column: "r1", message: "You chose to leave this reading out.", excludedByRule: false, excluded: true, decision: { include: false, reason: "The flask was not swirled." } }]);
    expect(v.means[0]).toBe(63.5);
  });

  it("needs a reason for every decision", () => {
    const v = validateTable(clockTable, { rows: [runs], decisions: { "0:r3": { include: false, reason: "  " } } });
    expect(issuesAt(v, 0, "r3")).toEqual([{ row: 0, column: "r3", level: "error", message: "Say why you left this reading out." }]);
  });

  it("flags nothing with fewer than three readings (no way to tell which is wrong) and gives a null mean for an empty row", () => {
    const v = validateTable(clockTable, { rows: [{ r1: "62.0", r2: "90.0" }, {}], decisions: {} });
    expect(v.anomalies).toEqual([]);
    expect(v.means).toEqual({ 0: 76, 1: null });
  });

  it("reads repeats the way checks do, skipping unreadable cells", () => {
    const v = validateTable(clockTable, { rows: [{ r1: "62.0", r2: "oops", r3: "64.0" }], decisions: {} });
    expect(v.means[0]).toBe(63);
    expect(issuesAt(v, 0, "r2")[0]!.message).toBe("Type a number, like 12.5.");
  });

  it("returns empty means for a table without a mean column", () => {
    expect(validateTable(gasTable, gasFilled()).means).toEqual({});
  });
});

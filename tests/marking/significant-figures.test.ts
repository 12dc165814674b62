import { describe, expect, it } from "vitest";
import { significantFigures } from "@/lib/marking/significant-figures";
import { expectMarkingError } from "./helpers";

// Counting rules as schools teach them (common practice); trailing zeros of a whole number
// without a decimal point are taken as not significant (our documented choice).
const table: [string, number][] = [
  ["0.0450", 3],
  ["0.045", 2],
  ["45", 2],
  ["45.0", 3],
  ["1.20e3", 3],
  ["1.20E+3", 3],
  ["1.20 x 10^3", 3],
  ["1.20 × 10³", 3],
  ["4.5×10⁻²", 2],
  ["1200", 2],
  ["1200.", 4],
  ["1.200e3", 4],
  ["1005", 4],
  ["100.5", 4],
  ["0.5", 1],
  [".5", 1],
  ["-0.00720", 3],
  ["−3.0", 2],
  ["7", 1],
  ["0", 1],
  ["0.00", 2],
  ["12 000", 2],
  ["0.045 cm3/s", 2],
];

describe("significantFigures counts from the typed string", () => {
  for (const [typed, count] of table) {
    it(`"${typed}" has ${count}`, () => expect(significantFigures(typed)).toBe(count));
  }
  it("refuses text that is not a number", () => {
    expectMarkingError(() => significantFigures("about five"), "unreadable-number");
    expectMarkingError(() => significantFigures(""), "unreadable-number");
    expectMarkingError(() => significantFigures("1,250"), "unreadable-number");
  });
});

import { describe, expect, it } from "vitest";
import { parseTypedNumber } from "@/lib/marking/parse-typed-number";
import { expectMarkingError } from "./helpers";

describe("parseTypedNumber", () => {
  it("reads plain, signed and standard-form numbers", () => {
    expect(parseTypedNumber("0.0450").value).toBe(0.045);
    expect(parseTypedNumber("-2.5").value).toBe(-2.5);
    expect(parseTypedNumber("−2.5").value).toBe(-2.5);
    expect(parseTypedNumber("+3").value).toBe(3);
    expect(parseTypedNumber("1.2e-3").value).toBe(0.0012);
    expect(parseTypedNumber("1.2x10-3").value).toBe(0.0012);
    expect(parseTypedNumber("1.2 * 10^(-3)").value).toBe(0.0012);
    expect(parseTypedNumber("5.").value).toBe(5);
  });
  it("returns the text after the number (often a unit)", () => {
    expect(parseTypedNumber("0.45 cm3/s").trailingText).toBe("cm3/s");
    expect(parseTypedNumber("12kJ/mol").trailingText).toBe("kJ/mol");
  });
  it("gives decimal places as written", () => {
    expect(parseTypedNumber("0.0450").decimalPlaces).toBe(4);
    expect(parseTypedNumber("1.20e3").decimalPlaces).toBe(-1);
    expect(parseTypedNumber("1200").decimalPlaces).toBe(0);
  });
  it("flags whole numbers ending in zeros as ambiguous", () => {
    expect(parseTypedNumber("1200").ambiguousTrailingZeros).toBe(true);
    expect(parseTypedNumber("1200.").ambiguousTrailingZeros).toBe(false);
  });
  it("refuses commas, two numbers and words", () => {
    expectMarkingError(() => parseTypedNumber("1,5"), "unreadable-number");
    expectMarkingError(() => parseTypedNumber("1.2.3"), "unreadable-number");
    expectMarkingError(() => parseTypedNumber("7 8"), "unreadable-number");
    expectMarkingError(() => parseTypedNumber("ten"), "unreadable-number");
    expectMarkingError(() => parseTypedNumber("   "), "unreadable-number");
  });
});

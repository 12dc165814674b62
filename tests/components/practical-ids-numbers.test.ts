import { afterEach, describe, expect, it, vi } from "vitest";
import { newPartId, PART_ID_PATTERN } from "@/components/practicals/ids";
import { formatStoredNumber, parseTypedNumber, textMatchesValue } from "@/components/practicals/numbers";
import { partId } from "@/lib/validation/practicals";

afterEach(() => vi.restoreAllMocks());

describe("newPartId", () => {
  it("makes ids the server's schema accepts, with the prefix in front", () => {
    for (let i = 0; i < 200; i++) {
      const id = newPartId("col");
      expect(id).toMatch(PART_ID_PATTERN);
      expect(id.startsWith("col_")).toBe(true);
      expect(partId.safeParse(id).success).toBe(true);
    }
  });

  it("keeps only letters and digits of the prefix, and never returns an empty prefix", () => {
    expect(newPartId("a b/c!")).toMatch(/^abc_[A-Za-z0-9]{10}$/);
    expect(newPartId("***")).toMatch(/^p_[A-Za-z0-9]{10}$/);
  });

  it("does not hand out an id that is already taken", () => {
    let call = 0;
    vi.spyOn(crypto, "getRandomValues").mockImplementation(<T extends ArrayBufferView | null>(array: T): T => {
      const bytes = array as unknown as Uint8Array;
      bytes.fill(call++ === 0 ? 0 : 1);
      return array;
    });
    const id = newPartId("k", ["k_AAAAAAAAAA"]);
    expect(id).toBe("k_BBBBBBBBBB");
    expect(call).toBe(2);
  });
});

describe("parseTypedNumber", () => {
  it.each([
    ["0.5", 0.5],
    [" 12 ", 12],
    ["-3", -3],
    ["\u22123.5", -3.5],
    [".25", 0.25],
    ["4.", 4],
    ["1.2e-3", 0.0012],
    ["2.5×10^-3", 0.0025],
    ["1 000", 1000],
  ])("reads %s as %s", (text, value) => {
    expect(parseTypedNumber(text)).toBeCloseTo(value, 12);
  });

  it("gives null for blank and NaN for anything else", () => {
    expect(parseTypedNumber("")).toBeNull();
    expect(parseTypedNumber("   ")).toBeNull();
    for (const bad of ["abc", "1,5", "3 cm", "1e", "--2", "0x10", "Infinity"]) expect(parseTypedNumber(bad)).toBeNaN();
  });

  it("knows when typed text already stands for a stored value", () => {
    expect(textMatchesValue("0.", 0)).toBe(true);
    expect(textMatchesValue("0.50", 0.5)).toBe(true);
    expect(textMatchesValue("", null)).toBe(true);
    expect(textMatchesValue("x", Number.NaN)).toBe(true);
    expect(textMatchesValue("1", 2)).toBe(false);
    expect(textMatchesValue("", 0)).toBe(false);
    expect(formatStoredNumber(Number.NaN)).toBe("");
    expect(formatStoredNumber(0.001)).toBe("0.001");
  });
});

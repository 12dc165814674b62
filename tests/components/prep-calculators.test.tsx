// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { DilutionCalculator, solveFromText } from "@/components/prep/dilution-calculator";
import { convertFromText, PeroxideCalculator } from "@/components/prep/peroxide-calculator";
import { formatResult, readPositive } from "@/components/prep/read-number";
import { PREP_CHECK_LINE } from "@/lib/ghs";

afterEach(() => cleanup());

const typed = (over: Partial<Record<"c1" | "v1" | "c2" | "v2", string>>) => ({ c1: "", v1: "", c2: "", v2: "", ...over });

describe("reading a typed quantity", () => {
  it("accepts plain and scientific numbers, refuses blanks, units, commas and values that are not above zero", () => {
    expect(readPositive(" 2.0 ", "the stock concentration")).toEqual({ ok: true, value: 2 });
    expect(readPositive("1.5e-2", "x")).toEqual({ ok: true, value: 0.015 });
    expect(readPositive("", "the final volume")).toEqual({ ok: false, message: "Enter the final volume." });
    expect(readPositive("100 cm3", "the final volume")).toEqual({ ok: false, message: "Type only the number here; the unit is chosen from the list." });
    expect(readPositive("1,5", "x").ok).toBe(false);
    expect(readPositive("0", "the final volume")).toEqual({ ok: false, message: "The final volume must be more than zero." });
    expect(readPositive("-3", "the final volume").ok).toBe(false);
  });

  it("shows results to three significant figures, and whole numbers from 1000", () => {
    expect(formatResult(33.3333)).toBe("33.3");
    expect(formatResult(0.0123456)).toBe("0.0123");
    expect(formatResult(1234.56)).toBe("1235");
  });
});

describe("dilution: c1 V1 = c2 V2 through the engine", () => {
  it("works out the volume of stock", () => {
    const r = solveFromText("v1", typed({ c1: "2.0", c2: "0.50", v2: "250" }));
    expect(r.ok && r.result).toMatchObject({ v1: 62.5, solvedFor: "v1", solventToAdd: 187.5 });
  });

  it("puts the refusal of a stronger solution than the stock at the concentration wanted", () => {
    const r = solveFromText("v1", typed({ c1: "1", c2: "2", v2: "100" }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.c2).toMatch(/cannot make a solution stronger than the stock/);
  });

  it("puts the refusal of more stock than the final volume at the volume of stock", () => {
    const r = solveFromText("c2", typed({ c1: "1", v1: "200", v2: "100" }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.v1).toMatch(/more than the final volume/);
  });

  it("names every blank or unreadable input and ignores the unknown", () => {
    const r = solveFromText("v2", typed({ c1: "", v1: "abc", c2: "0.1", v2: "not used" }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.errors).sort()).toEqual(["c1", "v1"]);
  });
});

describe("hydrogen peroxide strength through the engine", () => {
  it("converts 20 volume to about 1.78 mol/dm³ and 6.07 % w/v", () => {
    const r = convertFromText("volumeStrength", "20");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(formatResult(r.result.concentration)).toBe("1.78");
    expect(formatResult(r.result.percentWeightPerVolume)).toBe("6.07");
  });

  it("refuses more than 100 % and blank input with a message", () => {
    expect(convertFromText("percentWeightPerVolume", "120")).toEqual({ ok: false, message: expect.stringMatching(/more than 100 g/) });
    expect(convertFromText("concentration", "")).toEqual({ ok: false, message: "Enter the concentration." });
  });
});

describe("the calculators on the page", () => {
  it("dilution: shows the inputs, the formula in words, the result and the check line; refuses at the field", () => {
    render(<DilutionCalculator />);
    fireEvent.change(screen.getByLabelText("Stock concentration, c1 (mol/dm³)"), { target: { value: "2.0" } });
    fireEvent.change(screen.getByLabelText("Concentration wanted, c2 (mol/dm³)"), { target: { value: "3" } });
    fireEvent.change(screen.getByLabelText("Final volume, V2 (cm³)"), { target: { value: "100" } });
    fireEvent.click(screen.getByRole("button", { name: "Work it out" }));
    const c2 = screen.getByLabelText("Concentration wanted, c2 (mol/dm³)");
    expect(c2.getAttribute("aria-invalid")).toBe("true");
    expect(document.getElementById(c2.getAttribute("aria-describedby")!)?.textContent).toMatch(/stronger than the stock/);
    expect(screen.queryByText(PREP_CHECK_LINE)).toBeNull();

    fireEvent.change(c2, { target: { value: "0.50" } });
    expect(screen.getByText("V1 = 25 cm³")).toBeTruthy();
    expect(screen.getByText("Concentration wanted, c2 = 0.50 mol/dm³")).toBeTruthy();
    expect(screen.getByText(/c1 × V1 = c2 × V2\)\. Rearranged: V1 = c2 × V2 ÷ c1\./)).toBeTruthy();
    expect(screen.getByText(/Measure 25 cm³ of the 2\.0 mol\/dm³ stock and make it up to 100 cm³ with distilled water \(about 75 cm³ of water\)/)).toBeTruthy();
    expect(screen.getByText(PREP_CHECK_LINE).className).toContain("font-bold");
  });

  it("peroxide: shows all three strengths, which one was typed, the working and the check line", () => {
    render(<PeroxideCalculator />);
    fireEvent.change(screen.getByLabelText("The strength you know"), { target: { value: "percentWeightPerVolume" } });
    fireEvent.change(screen.getByLabelText("Percentage, weight per volume (% w/v)"), { target: { value: "30" } });
    fireEvent.click(screen.getByRole("button", { name: "Convert" }));
    expect(screen.getByText("Percentage, weight per volume (your input)")).toBeTruthy();
    expect(screen.getByText("8.82 mol/dm³")).toBeTruthy();
    expect(screen.getByText("98.8 volume")).toBeTruthy();
    expect(screen.getByText(/2 × volume strength ÷ 22\.414/)).toBeTruthy();
    expect(screen.getByText(PREP_CHECK_LINE)).toBeTruthy();
  });
});

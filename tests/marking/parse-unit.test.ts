import { describe, expect, it } from "vitest";
import { parseUnit } from "@/lib/marking/parse-unit";
import { expectMarkingError } from "./helpers";

describe("parseUnit reads the spellings students type (SI Brochure symbols; school spellings are common practice)", () => {
  const sameAs: [string, string][] = [
    ["cm3", "cm³"],
    ["cm^3", "cm³"],
    ["cm³", "cm³"],
    ["mL", "cm³"],
    ["cm3/s", "cm³ s⁻¹"],
    ["cm3 s-1", "cm³ s⁻¹"],
    ["cm³ s⁻¹", "cm³ s⁻¹"],
    ["cm3 per s", "cm³ s⁻¹"],
    ["mol dm-3", "mol dm⁻³"],
    ["mol/dm3", "mol dm⁻³"],
    ["mol.dm-3", "mol dm⁻³"],
    ["M", "mol dm⁻³"],
    ["mol L-1", "mol dm⁻³"],
    ["°C", "°C"],
    ["C", "°C"],
    ["oC", "°C"],
    ["deg C", "°C"],
    ["K", "K"],
    ["s^-1", "s⁻¹"],
    ["/s", "s⁻¹"],
    ["s⁻¹", "s⁻¹"],
    ["s^(-1)", "s⁻¹"],
    ["J/mol K", "J mol⁻¹ K⁻¹"],
    ["J/(mol K)", "J mol⁻¹ K⁻¹"],
    ["kJ mol−1", "kJ mol⁻¹"],
    ["mol/dm3/s", "mol dm⁻³ s⁻¹"],
    ["(mol/dm3)/s", "mol dm⁻³ s⁻¹"],
    ["g/s", "g s⁻¹"],
    ["%", "%"],
    ["", ""],
  ];
  for (const [typed, display] of sameAs) {
    it(`"${typed}" is ${display || "a plain number"}`, () => expect(parseUnit(typed).display).toBe(display));
  }

  it("tells concentration from length by case: M is mol dm⁻³, m is the metre", () => {
    expect(parseUnit("M").dimensions).toEqual([-3, 0, 0, 1, 0, 0]);
    expect(parseUnit("m").dimensions).toEqual([1, 0, 0, 0, 0, 0]);
  });

  it("applies the Celsius offset only to a bare temperature", () => {
    expect(parseUnit("°C").offset).toBe(273.15);
    expect(parseUnit("°C").isTemperatureScale).toBe(true);
    expect(parseUnit("°C/min").offset).toBe(0);
  });

  it("refuses units it does not know, with the part it could not read", () => {
    const error = expectMarkingError(() => parseUnit("furlongs"), "unknown-unit");
    expect(error.message).toContain("furlongs");
    expectMarkingError(() => parseUnit("cm3 / (s"), "unknown-unit");
  });
});

import { describe, expect, it } from "vitest";
import { convertUnit } from "@/lib/marking/convert-unit";
import { expectClose, expectMarkingError } from "./helpers";

describe("convertUnit converts equivalent units (SI definitions: 1 dm³ = 1000 cm³, 1 min = 60 s, T/K = θ/°C + 273.15)", () => {
  it("volume and time", () => {
    expect(convertUnit(1, "dm3", "cm3")).toBe(1000);
    expect(convertUnit(250, "cm³", "dm³")).toBe(0.25);
    expect(convertUnit(30, "cm3/min", "cm3/s")).toBe(0.5);
    expect(convertUnit(2, "min", "s")).toBe(120);
    expect(convertUnit(1, "h", "min")).toBe(60);
  });
  it("concentration and rates", () => {
    expect(convertUnit(1, "M", "mol dm-3")).toBe(1);
    expect(convertUnit(1, "mol/L", "mol dm⁻³")).toBe(1);
    expect(convertUnit(2, "mmol/dm3", "mol/dm3")).toBe(0.002);
    expectClose(convertUnit(0.116, "h-1", "s-1"), 3.2222e-5, { rel: 1e-4 });
  });
  it("energy per amount", () => {
    expect(convertUnit(103, "kJ/mol", "J mol-1")).toBe(103000);
  });
  it("temperatures: a reading converts with the offset, a temperature change without", () => {
    expect(convertUnit(25, "°C", "K")).toBe(298.15);
    expect(convertUnit(273.15, "K", "C")).toBe(0);
    expect(convertUnit(2, "°C/min", "K/min")).toBe(2);
  });
  it("percent and plain numbers", () => {
    expect(convertUnit(5, "%", "")).toBe(0.05);
  });
  it("refuses incompatible units with a reason", () => {
    const error = expectMarkingError(() => convertUnit(1, "cm3/s", "g/s"), "incompatible-units");
    expect(error.message).toContain("cm³ s⁻¹");
    expect(error.message).toContain("g s⁻¹");
    expectMarkingError(() => convertUnit(1, "s-1", "cm3/s"), "incompatible-units");
    expectMarkingError(() => convertUnit(1, "°C", "s"), "incompatible-units");
  });
  it("refuses unknown units and non-numbers", () => {
    expectMarkingError(() => convertUnit(1, "parsecs", "m"), "unknown-unit");
    expectMarkingError(() => convertUnit(Number.NaN, "m", "cm"), "not-a-number");
  });
});

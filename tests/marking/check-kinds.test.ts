import { describe, expect, it } from "vitest";
import { checkKinds } from "@/lib/marking/check-kinds";
import { expectedUnit } from "@/lib/marking/expected-unit";
import { validateCheckDefinition } from "@/lib/marking/validate-check-definition";
import { expectMarkingError } from "./helpers";

const columns = [
  { id: "t", unit: "min" },
  { id: "v", unit: "cm3" },
  { id: "T", unit: "°C" },
  { id: "A", unit: "AU" },
];

describe("checkKinds, expectedUnit and validateCheckDefinition", () => {
  it("lists every kind once, with a label and a unit rule", () => {
    const kinds = checkKinds.map((info) => info.kind);
    expect(new Set(kinds).size).toBe(kinds.length);
    expect(kinds).toEqual(["mean-rate", "gradient", "rate-at", "initial-rate", "reciprocal-time", "mean-of-repeats", "order", "activation-energy", "percentage-uncertainty"]);
    for (const info of checkKinds) expect(info.label.length).toBeGreaterThan(5);
  });
  it("works out the answer's unit from the columns", () => {
    expect(expectedUnit({ kind: "mean-rate", x: "t", y: "v", from: 0, to: 1 }, columns)).toBe("cm³ min⁻¹");
    expect(expectedUnit({ kind: "reciprocal-time", t: "t" }, columns)).toBe("min⁻¹");
    expect(expectedUnit({ kind: "mean-of-repeats", repeats: ["v", "v"] }, columns)).toBe("cm³");
    expect(expectedUnit({ kind: "order", concentration: "v", rate: "v" }, columns)).toBe("");
    expect(expectedUnit({ kind: "activation-energy", temperature: "T", rate: "t", rateIs: "time" }, columns)).toBe("kJ mol⁻¹");
    expect(expectedUnit({ kind: "gradient", x: "t", y: "A" }, columns)).toBe("AU/min");
  });
  it("accepts good definitions and refuses bad ones", () => {
    expect(() => validateCheckDefinition({ kind: "rate-at", x: "t", y: "v", at: 2 }, columns)).not.toThrow();
    expectMarkingError(() => validateCheckDefinition({ kind: "rate-at", x: "t", y: "v", at: Number.NaN }, columns), "invalid-definition");
    expectMarkingError(() => validateCheckDefinition({ kind: "mean-rate", x: "t", y: "v", from: 1, to: 1 }, columns), "invalid-definition");
    expectMarkingError(() => validateCheckDefinition({ kind: "order", concentration: "c", rate: "v" }, columns), "unknown-column");
    expectMarkingError(() => validateCheckDefinition({ kind: "percentage-uncertainty", resolution: 0, reading: 3 }, columns), "invalid-definition");
    expectMarkingError(
      () => validateCheckDefinition({ kind: "activation-energy", temperature: "T", rate: "t", rateIs: "speed" as never }, columns),
      "invalid-definition",
    );
  });
});

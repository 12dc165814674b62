import { describe, expect, it } from "vitest";
import { CHECK_KIND_LABELS, changeCheckKind, DEFAULT_TOLERANCE, describeCheck, makeCheck, moveCheckToTable, suggestedUnit } from "@/components/practicals/check-kinds";
import { checkColumnRefs, CHECK_KINDS, checkSchema, type CheckSpec, type TableTemplate } from "@/lib/validation/practicals";
import { columnHeader, ratioUnit } from "@/components/practicals/units";

const col = (id: string, quantity: string, unit: string, role: TableTemplate["columns"][number]["role"], extra: Partial<TableTemplate["columns"][number]> = {}) => ({
  id,
  quantity,
  symbol: "",
  unit,
  role,
  resolution: null,
  decimalPlaces: null,
  rangeMin: null,
  rangeMax: null,
  meanOf: [],
  derivedFrom: null,
  formula: null,
  ...extra,
});

const gasTable: TableTemplate = {
  id: "t1",
  title: "Gas",
  rowCount: 8,
  presetRows: [{ time: 0 }, { time: 10 }, { time: 20 }, { time: 30 }, { time: 40 }],
  columns: [col("time", "time", "s", "independent"), col("vol", "volume of gas", "cm³", "dependent", { resolution: 1 })],
};

const clockTable: TableTemplate = {
  id: "t2",
  title: "Clock",
  rowCount: 5,
  presetRows: [],
  columns: [
    col("temp", "temperature", "°C", "independent"),
    col("r1", "time 1", "s", "repeat"),
    col("r2", "time 2", "s", "repeat"),
    col("mean", "mean time", "s", "mean", { meanOf: ["r1", "r2"] }),
    col("inv", "1/t", "s⁻¹", "derived", { formula: "reciprocal", derivedFrom: "mean" }),
  ],
};

describe("makeCheck", () => {
  it("makes a valid check of every kind, bound only to the chosen table's columns", () => {
    for (const table of [gasTable, clockTable]) {
      const ids = new Set(table.columns.map((c) => c.id));
      for (const kind of CHECK_KINDS) {
        const check = makeCheck(kind, table, { id: `k-${kind}` });
        const refs = Object.values(checkColumnRefs(check)).flat();
        for (const r of refs.filter(Boolean)) expect(ids.has(r), `${kind} on ${table.title} uses ${r}`).toBe(true);
        expect(check.tolerancePercent).toBe(DEFAULT_TOLERANCE[kind]);
        expect(check.label).toBe(CHECK_KIND_LABELS[kind]);
        if (kind !== "mean-of-repeats" || table === clockTable) expect(checkSchema.safeParse(check).success, `${kind} on ${table.title}`).toBe(true);
      }
    }
  });

  it("leaves a binding empty, for the teacher to choose, when the table has no suitable column", () => {
    const c = makeCheck("mean-of-repeats", gasTable, { id: "k" });
    expect(c).toMatchObject({ repeats: [], answerColumn: "" });
    const parsed = checkSchema.safeParse(c);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((i) => i.path.join("."))).toEqual(expect.arrayContaining(["repeats", "answerColumn"]));
  });

  it("uses the usual tolerances: 5 % calculated, 10 % fitted, 15 % tangents", () => {
    expect(DEFAULT_TOLERANCE["mean-rate"]).toBe(5);
    expect(DEFAULT_TOLERANCE.gradient).toBe(10);
    expect(DEFAULT_TOLERANCE["rate-at"]).toBe(15);
    expect(DEFAULT_TOLERANCE["initial-rate"]).toBe(15);
  });

  it("binds x to the independent variable and y to the measurement, with an interval from the planned values", () => {
    const c = makeCheck("mean-rate", gasTable, { id: "k1" });
    expect(c).toMatchObject({ kind: "mean-rate", tableId: "t1", x: "time", y: "vol", from: 0, to: 30, expectedUnit: "cm³/s" });
  });

  it("finds the repeats, the mean and the 1/t column in a clock table", () => {
    expect(makeCheck("mean-of-repeats", clockTable, { id: "k" })).toMatchObject({ repeats: ["r1", "r2"], answerColumn: "mean" });
    expect(makeCheck("reciprocal-time", clockTable, { id: "k" })).toMatchObject({ t: "mean", answerColumn: "inv", expectedUnit: "s⁻¹" });
    expect(makeCheck("activation-energy", clockTable, { id: "k" })).toMatchObject({ temperature: "temp", temperatureUnit: "°C", rate: "mean", rateIs: "time", expectedUnit: "kJ/mol" });
    expect(makeCheck("percentage-uncertainty", gasTable, { id: "k" })).toMatchObject({ reading: "vol", resolution: 1, expectedUnit: "%" });
  });
});

describe("changing a check", () => {
  it("keeps a name, tolerance and unit the teacher chose, and takes the new kind's defaults otherwise", () => {
    const plain = makeCheck("mean-rate", gasTable, { id: "k1" });
    const moved = changeCheckKind(plain, "rate-at", gasTable);
    expect(moved).toMatchObject({ id: "k1", kind: "rate-at", label: CHECK_KIND_LABELS["rate-at"], tolerancePercent: 15, expectedUnit: "cm³/s" });
    const custom = { ...plain, label: "Rate from 0 to 30 s", tolerancePercent: 8, expectedUnit: "cm³ s⁻¹", show: "verdict" as const };
    expect(changeCheckKind(custom, "gradient", gasTable)).toMatchObject({ kind: "gradient", label: "Rate from 0 to 30 s", tolerancePercent: 8, expectedUnit: "cm³ s⁻¹", show: "verdict" });
  });

  it("re-binds the columns when the check moves to another table", () => {
    const c = makeCheck("gradient", gasTable, { id: "k1" });
    const moved = moveCheckToTable(c, clockTable);
    expect(moved).toMatchObject({ id: "k1", tableId: "t2", x: "temp" });
    expect(clockTable.columns.map((x) => x.id)).toContain((moved as { y: string }).y);
  });
});

describe("units and words", () => {
  it("writes headers as quantity / unit", () => {
    expect(columnHeader({ quantity: "volume of gas", unit: "cm³" })).toBe("volume of gas / cm³");
    expect(columnHeader({ quantity: "number of drops", unit: "" })).toBe("number of drops");
    expect(columnHeader({ quantity: " ", unit: "s" })).toBe("(unnamed quantity) / s");
  });

  it("suggests units for rates", () => {
    expect(ratioUnit("cm³", "s")).toBe("cm³/s");
    expect(ratioUnit("", "s")).toBe("s⁻¹");
    expect(ratioUnit("g", "")).toBe("g");
    expect(suggestedUnit(makeCheck("gradient", gasTable, { id: "k" }), gasTable)).toBe("cm³/s");
  });

  it("describes a check in plain words", () => {
    const c = { ...(makeCheck("mean-rate", gasTable, { id: "k1" }) as Extract<CheckSpec, { kind: "mean-rate" }>), sigFigs: { min: 2, max: 3 } };
    const text = describeCheck(c, gasTable);
    expect(text).toContain("the change in “volume of gas / cm³” divided by the change in “time / s”, from 0 s to 30 s");
    expect(text).toContain("within 5\u00a0% of Meniscus’s value agrees");
    expect(text).toContain("2 to 3 significant figures");
    expect(text).toContain("Students see the verdict and a hint.");
    expect(describeCheck({ ...c, y: "gone" }, gasTable)).toContain("a column that is not in the table");
  });
});

import { describe, expect, it } from "vitest";
import { addRow, applyBlock, isRowEmpty, normaliseRows, removeEmptyRowsAtEnd, restoreCell, setCell, setDecision } from "@/components/write-up/grid/grid-model";
import type { FilledTable } from "@/lib/validation/write-ups";
import { clockTable, gasFilled, gasTable, massTable } from "./fixtures";

const empty = () => ({ rows: [], decisions: {} });

describe("editing cells", () => {
  it("writes every column of every row, with preset values, when a cell changes", () => {
    const next = setCell(gasTable, empty(), 2, "v", "38");
    expect(next.rows).toHaveLength(8);
    expect(next.rows[2]).toEqual({ t: "20", v: "38" });
    expect(next.rows[0]).toEqual({ t: "0", v: null });
  });

  it("never changes a preset cell", () => {
    const before = gasFilled();
    expect(setCell(gasTable, before, 1, "t", "11")).toBe(before);
  });

  it("clears a cell with an empty string and drops the decision about it", () => {
    const withDecision = { rows: [{ T: "20.0", r1: "62.0", r2: "64.0", r3: "80.0" }], decisions: { "0:r3": { include: false, reason: "Late start." } } };
    const cleared = setCell(clockTable, withDecision, 0, "r3", "");
    expect(cleared.rows[0]!.r3).toBeNull();
    expect(cleared.decisions).toEqual({});
    const restored = restoreCell(clockTable, cleared, 0, "r3", "80.0", { include: false, reason: "Late start." });
    expect(restored.rows[0]!.r3).toBe("80.0");
    expect(restored.decisions).toEqual(withDecision.decisions);
  });

  it("records and removes decisions, trimming the reason", () => {
    const next = setDecision(empty(), 0, "r3", { include: false, reason: "  Late start.  " });
    expect(next.decisions).toEqual({ "0:r3": { include: false, reason: "Late start." } });
    expect(setDecision(next, 0, "r3", null).decisions).toEqual({});
  });
});

describe("rows", () => {
  it("adds rows up to 60 and no further", () => {
    let table = { rows: normaliseRows(massTable, empty(), 59), decisions: {} };
    table = addRow(massTable, table)!;
    expect(table.rows).toHaveLength(60);
    expect(addRow(massTable, table)).toBeNull();
  });

  it("removes only empty rows at the end, keeping preset rows", () => {
    const filled: FilledTable = { rows: [{ t: "0", m: "1.00" }, { t: "", m: null }, { t: "2", m: null }, {}, {}], decisions: {} };
    const { next, removed } = removeEmptyRowsAtEnd(massTable, filled);
    expect(removed).toBe(2);
    expect(next.rows).toHaveLength(3);
    expect(removeEmptyRowsAtEnd(gasTable, gasFilled([null])).removed).toBe(0);
    expect(isRowEmpty(gasTable, gasFilled([null]), 0)).toBe(true);
  });
});

describe("pasting a block", () => {
  it("fills across and down from the focused cell", () => {
    const result = applyBlock(clockTable, empty(), { row: 1, col: 1 }, [["61.2", "60.8"], ["45.0", "44.1"]]);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.next.rows[1]).toMatchObject({ r1: "61.2", r2: "60.8", r3: null });
    expect(result.next.rows[2]).toMatchObject({ r1: "45.0", r2: "44.1" });
    expect(result.message).toBe("Pasted 2 rows × 2 columns, starting at row 2, “time, run 1 / s”.");
  });

  it("adds rows when the block runs past the last row", () => {
    const result = applyBlock(massTable, empty(), { row: 3, col: 1 }, [["1.00"], ["2.00"], ["3.00"]]);
    expect(result.ok && result.next.rows).toHaveLength(6);
  });

  it("refuses a block with more rows than a table holds, and changes nothing", () => {
    const block = Array.from({ length: 58 }, (_, i) => [String(i)]);
    const result = applyBlock(massTable, empty(), { row: 3, col: 0 }, block);
    expect(result).toEqual({ ok: false, message: "Nothing was pasted: the block has 58 rows, but a table holds at most 60 rows, so from row 4 there is room for 57." });
  });

  it("refuses a block wider than the columns left", () => {
    const result = applyBlock(massTable, empty(), { row: 0, col: 1 }, [["1", "2"]]);
    expect(result).toEqual({ ok: false, message: "Nothing was pasted: the block is 2 columns wide, but from “mass / g” the table has 1 column. Start the paste further left, or copy fewer columns." });
  });

  it("refuses a block that would change a preset value, but accepts one that repeats it", () => {
    const same = applyBlock(gasTable, empty(), { row: 0, col: 0 }, [["0", "0"], ["10", "24"]]);
    expect(same.ok && same.next.rows[1]).toEqual({ t: "10", v: "24" });
    const different = applyBlock(gasTable, empty(), { row: 0, col: 0 }, [["0", "0"], ["12", "24"]]);
    expect(different.ok).toBe(false);
    expect(!different.ok && different.message).toContain("Row 2 of “time / s” is already filled in (10), but the new value is 12.");
  });

  it("skips a heading row copied with the block", () => {
    const result = applyBlock(gasTable, empty(), { row: 0, col: 0 }, [["time / s", "volume of gas / cm³"], ["0", "0"], ["10", "24"]]);
    expect(result.ok && result.next.rows[1]).toEqual({ t: "10", v: "24" });
    expect(result.ok && result.message).toContain("The heading row was left out.");
  });

  it("does not mistake a first row of bad readings for headings", () => {
    const result = applyBlock(massTable, empty(), { row: 0, col: 1 }, [["abc"], ["1.00"]]);
    expect(result.ok && result.next.rows[0]!.m).toBe("abc");
  });

  it("refuses over-long cells", () => {
    expect(applyBlock(massTable, empty(), { row: 0, col: 1 }, [["1".repeat(25)]]).ok).toBe(false);
  });

  it("drops decisions about readings the paste changed, and keeps the others", () => {
    const before = {
      rows: [{ T: "20.0", r1: "62.0", r2: "64.0", r3: "80.0" }],
      decisions: { "0:r3": { include: false, reason: "Late start." }, "0:r1": { include: true, reason: "Fine." } },
    };
    const result = applyBlock(clockTable, before, { row: 0, col: 1 }, [["62.0", "64.0", "66.0"]]);
    expect(result.ok && result.next.decisions).toEqual({ "0:r1": { include: true, reason: "Fine." } });
  });
});

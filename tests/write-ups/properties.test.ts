import fc from "fast-check";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { applyBlock, applyImport } from "@/components/write-up/grid/grid-model";
import { tableSchema } from "@/lib/validation/practicals";
import { parsePastedText, planCsvImport, tableToCsv } from "@/lib/write-ups/csv";
import { bestFit, niceAxis, sampleFit } from "@/lib/write-ups/graph-data";
import { cellText, validateTable } from "@/lib/write-ups/table-validation";
import { clockTable, massTable } from "./fixtures";

/** A wide table with no presets, so any block shape can land. */
const wide = tableSchema.parse({
  id: "wide",
  title: "Wide",
  rowCount: 5,
  columns: ["a", "b", "c", "d", "e"].map((id) => ({ id, quantity: `quantity ${id}`, unit: "cm", role: "dependent" })),
});

const safeCell = fc.stringMatching(/^[0-9a-z.+\-]{1,12}$/);
const anyCell = fc.string({ maxLength: 24 });

describe("paste properties", () => {
  it("any block within the table's limits lands cell for cell", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 59 }),
        fc.integer({ min: 0, max: 4 }),
        fc.integer({ min: 1, max: 60 }),
        fc.integer({ min: 1, max: 5 }),
        fc.array(fc.option(safeCell, { nil: "" }), { minLength: 300, maxLength: 300 }),
        (row, col, h, w, pool) => {
          const height = Math.min(h, 60 - row);
          const width = Math.min(w, 5 - col);
          const block = Array.from({ length: height }, (_, r) => Array.from({ length: width }, (_, c) => pool[(r * width + c) % pool.length]!));
          const result = applyBlock(wide, { rows: [], decisions: {} }, { row, col }, block);
          expect(result.ok).toBe(true);
          if (!result.ok) return;
          expect(result.next.rows.length).toBe(Math.max(5, row + height));
          for (let r = 0; r < height; r++) for (let c = 0; c < width; c++) expect(result.next.rows[row + r]![wide.columns[col + c]!.id]).toBe(block[r]![c] === "" ? null : block[r]![c]);
        },
      ),
      { numRuns: 150 },
    );
  });

  it("any block past the last row or column is refused whole", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 59 }), fc.integer({ min: 0, max: 4 }), fc.boolean(), (row, col, tooTall) => {
        const height = tooTall ? 61 - row : 1;
        const width = tooTall ? 1 : 6 - col;
        const block = Array.from({ length: height }, () => Array.from({ length: width }, () => "1"));
        expect(applyBlock(wide, { rows: [], decisions: {} }, { row, col }, block).ok).toBe(false);
      }),
      { numRuns: 100 },
    );
  });

  it("a block copied from a spreadsheet (tab-separated) parses back to the same cells", () => {
    fc.assert(
      fc.property(fc.array(fc.array(safeCell, { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 20 }), (rows) => {
        const width = Math.max(...rows.map((r) => r.length));
        const block = rows.map((r) => Array.from({ length: width }, (_, i) => r[i] ?? "x"));
        const text = `${block.map((r) => r.join("\t")).join("\r\n")}\r\n`;
        if (width === 1) return; // one column has no tabs: read as lines (tested below)
        expect(parsePastedText(text)).toEqual(block);
      }),
    );
  });

  it("one column of lines parses back to the same cells", () => {
    fc.assert(
      fc.property(fc.array(fc.stringMatching(/^[0-9.]{1,8}$/), { minLength: 1, maxLength: 30 }), (values) => {
        expect(parsePastedText(values.join("\n"))).toEqual(values.map((v) => [v]));
      }),
    );
  });
});

describe("CSV properties", () => {
  it("export then import gives back every cell exactly, whatever it holds", () => {
    const cell = fc.option(
      anyCell.map((s) => s.replace(/[\r\uFEFF]/g, "").trim()),
      { nil: null },
    );
    fc.assert(
      fc.property(fc.array(fc.record({ t: cell, m: cell }), { minLength: 1, maxLength: 60 }), (rows) => {
        const filled = { rows, decisions: {} };
        const plan = planCsvImport(massTable, tableToCsv(massTable, filled));
        if (rows.every((r) => !r.t && !r.m)) {
          expect(plan.ok).toBe(false);
          return;
        }
        expect(plan.ok).toBe(true);
        if (!plan.ok) return;
        const applied = applyImport(massTable, plan.plan);
        expect(applied.ok).toBe(true);
        if (!applied.ok) return;
        for (let r = 0; r < rows.length; r++) for (const c of massTable.columns) expect(cellText(massTable, applied.next, r, c)).toBe(cellText(massTable, filled, r, c));
      }),
      { numRuns: 200 },
    );
  });

  it("no exported cell starts with a formula character unless it is a plain number", () => {
    fc.assert(
      fc.property(fc.array(fc.record({ t: anyCell, m: anyCell }), { minLength: 1, maxLength: 10 }), (rows) => {
        const parsed = Papa.parse<string[]>(tableToCsv(massTable, { rows, decisions: {} })).data;
        for (const line of parsed) for (const v of line) if (/^[=+\-@\t\r\u2212]/.test(v)) expect(v).toMatch(/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/);
      }),
    );
  });
});

describe("validation properties", () => {
  it("validateTable never throws and never reports NaN, whatever is typed", () => {
    const cell = fc.oneof(anyCell, fc.constantFrom("NaN", "Infinity", "-", ".", "1e400", "1,5", "—", "٣", "12.5 cm", "1e-400", "0x10"), fc.double(), fc.constant(null));
    const decision = fc.record({ include: fc.boolean(), reason: fc.string({ maxLength: 10 }) });
    fc.assert(
      fc.property(
        fc.array(fc.record({ T: cell, r1: cell, r2: cell, r3: cell, tm: cell, inv: cell }), { maxLength: 8 }),
        fc.dictionary(fc.constantFrom("0:r1", "1:r2", "2:r3", "5:T", "9:r1", "0:nope", "bad"), decision),
        (rows, decisions) => {
          const v = validateTable(clockTable, { rows: rows as never, decisions });
          const text = JSON.stringify(v);
          expect(text).not.toMatch(/NaN|Infinity|undefined/);
          for (const m of Object.values(v.means)) expect(m === null || Number.isFinite(m)).toBe(true);
          for (const i of v.issues) expect(i.message.length).toBeGreaterThan(0);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("graph properties", () => {
  it("a fitted line or curve never throws for readings, and its samples are finite", () => {
    const point = fc.record({ x: fc.double({ min: -1e3, max: 1e3, noNaN: true }), y: fc.double({ min: -1e3, max: 1e3, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(point, { maxLength: 9 }), fc.constantFrom("line", "curve") as fc.Arbitrary<"line" | "curve">, fc.boolean(), (points, fit, throughOrigin) => {
        const outcome = bestFit({ fit, throughOrigin }, points);
        expect(outcome).not.toBeNull();
        if (!outcome!.ok) {
          expect(outcome!.message).toMatch(/\w/);
          return;
        }
        const xs = points.map((p) => p.x);
        for (const s of sampleFit(outcome!.fit, Math.min(...xs), Math.max(...xs), 20)) expect(Number.isFinite(s.y)).toBe(true);
      }),
      { numRuns: 150 },
    );
  });

  it("axis limits always contain the values", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 20 }), (values) => {
        const { min, max } = niceAxis(values);
        expect(max).toBeGreaterThan(min);
        for (const v of values) {
          expect(v).toBeGreaterThanOrEqual(min - 1e-9 * Math.abs(min));
          expect(v).toBeLessThanOrEqual(max + 1e-9 * Math.abs(max));
        }
      }),
    );
  });
});

import { describe, expect, it } from "vitest";
import { emptyGrid, gridToRows, parseClipboardTable, pasteIntoGrid } from "@/components/practicals/sample-grid";

const columns = [
  { id: "t", quantity: "time", unit: "s" },
  { id: "v", quantity: "volume of gas", unit: "cm³" },
  { id: "m", quantity: "mass", unit: "g" },
];

describe("parseClipboardTable", () => {
  it("splits a spreadsheet copy into rows and cells, ignoring the trailing line break", () => {
    expect(parseClipboardTable("0\t0\r\n10\t12\r\n20\t21\r\n")).toEqual([
      ["0", "0"],
      ["10", "12"],
      ["20", "21"],
    ]);
  });

  it("keeps blank cells in place and trims spaces", () => {
    expect(parseClipboardTable(" 1 \t\t3\n")).toEqual([["1", "", "3"]]);
  });

  it("reads quoted cells that hold tabs, line breaks and quotes", () => {
    expect(parseClipboardTable('"a\tb"\t"say ""hi"""\n"two\nlines"\t5')).toEqual([
      ["a\tb", 'say "hi"'],
      ["two\nlines", "5"],
    ]);
  });
});

describe("pasteIntoGrid", () => {
  const grid = emptyGrid(columns, 3);

  it("returns null for a single value, so the browser pastes it into the one cell", () => {
    expect(pasteIntoGrid(grid, "12.5", { row: 0, col: 0 }, 3, 10)).toBeNull();
    expect(pasteIntoGrid(grid, "12.5\n", { row: 0, col: 0 }, 3, 10)).toBeNull();
  });

  it("fills rightwards and downwards from the cell pasted into", () => {
    const res = pasteIntoGrid(grid, "1\t2\n3\t4\n", { row: 1, col: 1 }, 3, 10)!;
    expect(res.grid).toEqual([
      ["", "", ""],
      ["", "1", "2"],
      ["", "3", "4"],
    ]);
    expect(res.note).toBeNull();
    expect(grid[1]).toEqual(["", "", ""]);
  });

  it("adds rows as needed, up to the table's limit, and says what was left out", () => {
    const text = ["0\t0", "10\t12", "20\t21", "30\t28", "40\t33"].join("\n");
    const res = pasteIntoGrid(grid, text, { row: 0, col: 0 }, 3, 4)!;
    expect(res.grid).toHaveLength(4);
    expect(res.grid[3]).toEqual(["30", "28", ""]);
    expect(res.note).toMatch(/1 pasted row was left out: the table has at most 4 rows/);
  });

  it("leaves out a first row of headings", () => {
    const res = pasteIntoGrid(grid, "time / s\tvolume / cm³\n0\t0\n10\t15\n", { row: 0, col: 0 }, 3, 10)!;
    expect(res.grid.slice(0, 2)).toEqual([
      ["0", "0", ""],
      ["10", "15", ""],
    ]);
    expect(res.note).toMatch(/headings/);
  });

  it("drops cells beyond the last column and says so", () => {
    const res = pasteIntoGrid(grid, "1\t2\t3\n", { row: 0, col: 1 }, 3, 10)!;
    expect(res.grid[0]).toEqual(["", "1", "2"]);
    expect(res.note).toMatch(/more of them than columns/);
  });
});

describe("gridToRows", () => {
  it("keys readings by column id, keeping the digits as typed, blanks as null", () => {
    const { rows, problems } = gridToRows(
      [
        ["0", "0", ""],
        ["10", "\u221212.50", " 2.5×10^-3 "],
      ],
      columns,
    );
    expect(problems).toEqual([]);
    expect(rows).toEqual([
      { t: "0", v: "0", m: null },
      { t: "10", v: "-12.50", m: "2.5e-3" },
    ]);
  });

  it("names every cell that is not a number", () => {
    const { rows, problems } = gridToRows([["0", "12 cm3", ""]], columns);
    expect(rows[0]).toEqual({ t: "0", v: null, m: null });
    expect(problems).toEqual([{ row: 0, col: 1, text: "12 cm3", message: "Row 1, volume of gas: “12 cm3” is not a number." }]);
  });

  it("leaves out empty rows at the end but keeps empty rows in the middle", () => {
    const { rows } = gridToRows(
      [
        ["1", "", ""],
        ["", "", ""],
        ["3", "", ""],
        ["", "", ""],
        ["", "", ""],
      ],
      columns,
    );
    expect(rows).toHaveLength(3);
    expect(rows[1]).toEqual({ t: null, v: null, m: null });
  });

  it("starts an empty grid with the planned values in place", () => {
    expect(emptyGrid(columns, 3, [{ t: 0 }, { t: 10, v: null }])).toEqual([
      ["0", "", ""],
      ["10", "", ""],
      ["", "", ""],
    ]);
  });
});

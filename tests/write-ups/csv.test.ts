import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { applyImport } from "@/components/write-up/grid/grid-model";
import { csvFileName, escapeCsvCell, matchHeadings, parsePastedText, planCsvImport, tableToCsv, unescapeCsvCell } from "@/lib/write-ups/csv";
import { cellText } from "@/lib/write-ups/table-validation";
import { clockTable, gasFilled, gasTable, massTable } from "./fixtures";

describe("CSV export", () => {
  it("writes headings as quantity / unit and the rows as typed, presets included, blank rows at the end left off", () => {
    const csv = tableToCsv(gasTable, gasFilled(["0", "24", "38", null, null, null, null, null]));
    const lines = csv.split("\r\n");
    expect(lines[0]).toBe("time / s,volume of gas / cm³");
    expect(lines.slice(1, 4)).toEqual(["0,0", "10,24", "20,38"]);
    // Times are preset for every row, so the rows without a volume still carry their time.
    expect(lines).toHaveLength(9);
    expect(lines[8]).toBe("70,");
  });

  it("quotes cells holding commas or quotes", () => {
    const csv = tableToCsv(massTable, { rows: [{ t: "0", m: 'a "b", c' }], decisions: {} });
    expect(csv.split("\r\n")[1]).toBe('0,"a ""b"", c"');
  });

  it("escapes cells that would run as spreadsheet formulas (CSV formula injection, common practice)", () => {
    for (const start of ["=", "+", "-", "@", "−", "\t"]) expect(escapeCsvCell(`${start}SUM(A1)`)).toBe(`'${start}SUM(A1)`);
    expect(escapeCsvCell("=1+1")).toBe("'=1+1");
    expect(escapeCsvCell("-2+3+cmd|' /C calc'!A0")).toBe("'-2+3+cmd|' /C calc'!A0");
  });

  it("leaves plain numbers alone, negative ones included, because a spreadsheet reads them as numbers", () => {
    expect(["-3.2", "+4", "12.50", "1.2e-3", "-.5", "0"].map(escapeCsvCell)).toEqual(["-3.2", "+4", "12.50", "1.2e-3", "-.5", "0"]);
  });

  it("escapes formula cells in the exported file", () => {
    const csv = tableToCsv(massTable, { rows: [{ t: "0", m: "=HYPERLINK(\"x\")" }, { t: "1", m: "-0.50" }], decisions: {} });
    const rows = Papa.parse<string[]>(csv).data;
    expect(rows[1]).toEqual(["0", "'=HYPERLINK(\"x\")"]);
    expect(rows[2]).toEqual(["1", "-0.50"]);
  });

  it("undoes the escape on import, and only for escaped formula starts", () => {
    expect(unescapeCsvCell("'=1+1")).toBe("=1+1");
    expect(unescapeCsvCell("'quoted")).toBe("'quoted");
    // Text that already starts with an apostrophe and a formula character survives the round trip.
    expect(escapeCsvCell("'=x")).toBe("''=x");
    expect(unescapeCsvCell(escapeCsvCell("'=x"))).toBe("'=x");
  });

  it("names the download after the table", () => {
    expect(csvFileName(gasTable)).toBe("volume-of-gas-against-time.csv");
    expect(csvFileName({ title: "   " })).toBe("results.csv");
  });
});

describe("CSV import", () => {
  it("round-trips an exported table exactly, decimal places and all", () => {
    const filled = { rows: [{ t: "0", m: "120.50" }, { t: "30", m: "120.08" }, { t: "60", m: "=bad" }, { t: "90", m: "-0.10" }], decisions: {} };
    const result = planCsvImport(massTable, `\uFEFF${tableToCsv(massTable, filled)}`);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.plan.mode).toBe("headings");
    const applied = applyImport(massTable, result.plan);
    expect(applied.ok).toBe(true);
    if (!applied.ok) return;
    for (let r = 0; r < 4; r++) for (const c of massTable.columns) expect(cellText(massTable, applied.next, r, c)).toBe(cellText(massTable, filled, r, c));
  });

  it("matches headings written in other common ways and in any order", () => {
    expect(matchHeadings(gasTable, ["Volume of gas (cm3)", "Time in s"])).toEqual(["v", "t"]);
    expect(matchHeadings(gasTable, ["V / cm^3", "t/s"])).toEqual(["v", "t"]);
    expect(matchHeadings(gasTable, ["volume of gas", "notes"])).toEqual(["v", null]);
  });

  it("does not match a symbol shared by several columns", () => {
    expect(matchHeadings(clockTable, ["t / s"])).toEqual([null]);
  });

  it("uses the file's columns in order when there are no headings (the grid asks the student to confirm)", () => {
    const result = planCsvImport(massTable, "0,120.50\n30,120.08\n");
    expect(result).toEqual({ ok: true, plan: { mode: "positional", fileColumns: ["column 1", "column 2"], mapping: ["t", "m"], rows: [["0", "120.50"], ["30", "120.08"]] } });
  });

  it("falls back to columns in order when no heading matches", () => {
    const result = planCsvImport(massTable, "A,B\n0,120.50\n");
    expect(result.ok && result.plan.mode).toBe("positional");
    expect(result.ok && result.plan.fileColumns).toEqual(["A", "B"]);
  });

  it("refuses a file with more rows than a table holds, and says so", () => {
    const text = ["time / s,mass / g", ...Array.from({ length: 61 }, (_, i) => `${i},1.00`)].join("\n");
    expect(planCsvImport(massTable, text)).toEqual({ ok: false, message: "This file has 61 rows of readings, but a table holds at most 60. Nothing was imported." });
  });

  it("refuses extra unnamed columns rather than guessing", () => {
    const result = planCsvImport(massTable, "1,2,3\n4,5,6");
    expect(result.ok).toBe(false);
    expect(!result.ok && result.message).toContain("The file has 3 columns but this table has 2");
  });

  it("refuses over-long cells, empty files, semicolon files and headings with no readings", () => {
    expect(planCsvImport(massTable, `time / s,mass / g\n0,${"1".repeat(30)}`).ok).toBe(false);
    expect(planCsvImport(massTable, "")).toEqual({ ok: false, message: "This file is empty: there are no readings to import." });
    expect(planCsvImport(massTable, "time / s;mass / g\n0;1,00").ok).toBe(false);
    expect(planCsvImport(massTable, "time / s,mass / g\n")).toEqual({ ok: false, message: "This file has headings but no readings under them." });
  });

  it("keeps preset values and refuses a file that contradicts them", () => {
    const ok = planCsvImport(gasTable, "time / s,volume of gas / cm³\n0,0\n10,24\n");
    expect(ok.ok && applyImport(gasTable, ok.plan).ok).toBe(true);
    const bad = planCsvImport(gasTable, "time / s,volume of gas / cm³\n0,0\n15,24\n");
    expect(bad.ok).toBe(true);
    if (!bad.ok) return;
    const applied = applyImport(gasTable, bad.plan);
    expect(applied).toEqual({ ok: false, message: "Nothing was imported: Row 2 of “time / s” is already filled in (10), but the new value is 15." });
  });

  it("fills only the volume column from a file that has just that heading, keeping the preset times", () => {
    const plan = planCsvImport(gasTable, "volume of gas / cm³\n0\n24\n38");
    expect(plan.ok).toBe(true);
    if (!plan.ok) return;
    const applied = applyImport(gasTable, plan.plan);
    expect(applied.ok && applied.next.rows.slice(0, 3)).toEqual([{ t: "0", v: "0" }, { t: "10", v: "24" }, { t: "20", v: "38" }]);
    expect(applied.ok && applied.next.rows).toHaveLength(8);
  });
});

describe("parsing pasted text", () => {
  it("splits a spreadsheet block on tabs and lines, dropping the trailing newline", () => {
    expect(parsePastedText("1\t2\r\n3\t4\r\n")).toEqual([["1", "2"], ["3", "4"]]);
  });

  it("splits comma-separated text", () => {
    expect(parsePastedText("12.5, 13.0\n14.1, 15.2")).toEqual([["12.5", "13.0"], ["14.1", "15.2"]]);
  });

  it("keeps a lone decimal comma as one cell, so validation can explain it", () => {
    expect(parsePastedText("12,5")).toEqual([["12,5"]]);
  });

  it("reads quoted cells", () => {
    expect(parsePastedText('"a\tb"\t2')).toEqual([["a\tb", "2"]]);
  });

  it("keeps blank cells inside the block and trims empty columns at the right", () => {
    expect(parsePastedText("1\t\t\n\t2\t\n")).toEqual([["1", ""], ["", "2"]]);
  });

  it("reads one column of lines", () => {
    expect(parsePastedText("24\n38\n47")).toEqual([["24"], ["38"], ["47"]]);
  });
});

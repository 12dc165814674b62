// @vitest-environment jsdom
import { act, cleanup, fireEvent, render, screen, within } from "@testing-library/react";
import { useState } from "react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ResultsGrid } from "@/components/write-up/results-grid";
import type { TableTemplate } from "@/lib/validation/practicals";
import type { FilledTable } from "@/lib/validation/write-ups";
import { clockTable, gasFilled, gasTable, massTable } from "../write-ups/fixtures";

afterEach(() => {
  cleanup();
  vi.restoreAllMocks();
});

let latest: FilledTable | null = null;

function Harness({ table, initial, readOnly }: { table: TableTemplate; initial: FilledTable; readOnly?: boolean }) {
  const [value, setValue] = useState(initial);
  return (
    <ResultsGrid
      table={table}
      value={value}
      readOnly={readOnly}
      id="g"
      onChange={(next) => {
        latest = next;
        setValue(next);
      }}
    />
  );
}

const cell = (row: number, col: number) => document.getElementById(`g-r${row}-c${col}`) as HTMLInputElement;
const setup = (table: TableTemplate, initial: FilledTable = { rows: [], decisions: {} }, readOnly = false) => {
  latest = null;
  return render(<Harness table={table} initial={initial} readOnly={readOnly} />);
};
const paste = (el: HTMLElement, text: string) => fireEvent.paste(el, { clipboardData: { getData: (type: string) => (type === "text/plain" ? text : "") } });

describe("ResultsGrid: structure", () => {
  it("is a grid with quantity / unit column headings, row headings and preset cells read-only", () => {
    setup(gasTable, gasFilled());
    const grid = screen.getByRole("grid", { name: "Volume of gas against time" });
    const headers = within(grid).getAllByRole("columnheader").map((h) => h.textContent);
    expect(headers[1]).toContain("time / s");
    expect(headers[2]).toContain("volume of gas / cm³");
    expect(within(grid).getAllByRole("rowheader")).toHaveLength(8);
    expect(cell(0, 0).readOnly).toBe(true);
    expect(cell(0, 0).value).toBe("0");
    expect(cell(3, 0).value).toBe("30");
    expect(cell(0, 1).readOnly).toBe(false);
    expect(cell(0, 1).inputMode).toBe("decimal");
    expect(cell(0, 1)).toHaveProperty("ariaLabel", "Row 1, volume of gas / cm³");
  });

  it("marks an invalid cell with aria-invalid and describes it with its message", () => {
    setup(massTable, { rows: [{ t: "0", m: "12.345" }], decisions: {} });
    const input = cell(0, 1);
    expect(input.getAttribute("aria-invalid")).toBe("true");
    const ids = input.getAttribute("aria-describedby")!.split(" ");
    expect(ids.map((id) => document.getElementById(id)?.textContent)).toEqual(["This balance reads to 0.01 g: give 2 decimal places."]);
  });

  it("never shows a mean it could work out", () => {
    setup(clockTable, { rows: [{ T: "20.0", r1: "62.0", r2: "64.0", r3: "66.0" }], decisions: {} });
    expect(cell(0, 4).value).toBe("");
    // The readings sit in the cells; no text on the page gives their mean (64).
    expect(document.body.textContent).not.toMatch(/64/);
  });
});

describe("ResultsGrid: keyboard", () => {
  it("moves with the arrow keys, Left and Right only at the edge of the text or when the cell is selected", () => {
    setup(clockTable, { rows: [{ T: "20.0", r1: "62.0" }, {}, {}], decisions: {} });
    const start = cell(0, 1);
    start.focus();
    start.setSelectionRange(2, 2);
    fireEvent.keyDown(start, { key: "ArrowRight" });
    expect(document.activeElement).toBe(start);
    fireEvent.keyDown(start, { key: "ArrowLeft" });
    expect(document.activeElement).toBe(start);
    start.setSelectionRange(4, 4);
    fireEvent.keyDown(start, { key: "ArrowRight" });
    expect(document.activeElement).toBe(cell(0, 2));
    fireEvent.keyDown(cell(0, 2), { key: "ArrowDown" });
    expect(document.activeElement).toBe(cell(1, 2));
    fireEvent.keyDown(cell(1, 2), { key: "ArrowUp" });
    expect(document.activeElement).toBe(cell(0, 2));
    // Arriving selects the whole cell, so Left moves on at once.
    fireEvent.keyDown(cell(0, 2), { key: "ArrowLeft" });
    expect(document.activeElement).toBe(cell(0, 1));
    expect([cell(0, 1).selectionStart, cell(0, 1).selectionEnd]).toEqual([0, 4]);
    fireEvent.keyDown(cell(0, 1), { key: "ArrowLeft" });
    expect(document.activeElement).toBe(cell(0, 0));
    fireEvent.keyDown(cell(0, 0), { key: "ArrowLeft" });
    expect(document.activeElement).toBe(cell(0, 0));
  });

  it("moves down with Enter and up with Shift+Enter", () => {
    setup(massTable);
    cell(0, 1).focus();
    fireEvent.keyDown(cell(0, 1), { key: "Enter" });
    expect(document.activeElement).toBe(cell(1, 1));
    fireEvent.keyDown(cell(1, 1), { key: "Enter", shiftKey: true });
    expect(document.activeElement).toBe(cell(0, 1));
  });

  it("moves with Tab and Shift+Tab between cells the student fills in, skipping preset cells", () => {
    setup(gasTable, gasFilled());
    cell(0, 1).focus();
    fireEvent.keyDown(cell(0, 1), { key: "Tab" });
    expect(document.activeElement).toBe(cell(1, 1));
    fireEvent.keyDown(cell(1, 1), { key: "Tab", shiftKey: true });
    expect(document.activeElement).toBe(cell(0, 1));
    expect(cell(0, 0).tabIndex).toBe(-1);
    expect(cell(0, 1).tabIndex).toBe(0);
  });

  it("undoes the edit of a cell with Escape", () => {
    setup(massTable, { rows: [{ t: "0", m: "120.50" }], decisions: {} });
    const input = cell(0, 1);
    input.focus();
    fireEvent.change(input, { target: { value: "99" } });
    expect(latest!.rows[0]!.m).toBe("99");
    fireEvent.keyDown(input, { key: "Escape" });
    expect(latest!.rows[0]!.m).toBe("120.50");
    expect(cell(0, 1).value).toBe("120.50");
  });

  it("holds back a cell's message while it is being typed in, and shows it when the student moves on", () => {
    setup(massTable);
    const input = cell(0, 1);
    input.focus();
    fireEvent.change(input, { target: { value: "12.3" } });
    expect(input.getAttribute("aria-describedby")).toBeNull();
    fireEvent.keyDown(input, { key: "Enter" });
    fireEvent.blur(input);
    expect(cell(0, 1).getAttribute("aria-describedby")).not.toBeNull();
    expect(screen.getByText("This balance reads to 0.01 g: give 2 decimal places, even when the last digit is 0.")).toBeTruthy();
  });

  it("keeps text that is not a number as typed, flagged, never as NaN", () => {
    setup(massTable);
    fireEvent.change(cell(0, 1), { target: { value: "abc" } });
    fireEvent.blur(cell(0, 1));
    expect(cell(0, 1).value).toBe("abc");
    expect(cell(0, 1).getAttribute("aria-invalid")).toBe("true");
    expect(document.body.textContent).not.toContain("NaN");
  });
});

describe("ResultsGrid: paste", () => {
  it("fills a pasted spreadsheet block across and down from the focused cell, and can undo it", () => {
    setup(clockTable);
    paste(cell(0, 1), "62.0\t64.0\t80.0\r\n45.1\t44.9\t45.3\r\n");
    expect(latest!.rows[0]).toMatchObject({ r1: "62.0", r2: "64.0", r3: "80.0" });
    expect(latest!.rows[1]).toMatchObject({ r1: "45.1", r2: "44.9", r3: "45.3" });
    expect(screen.getByRole("status").textContent).toContain("Pasted 2 rows × 3 columns, starting at row 1, “time, run 1 / s”.");
    fireEvent.click(screen.getByRole("button", { name: "Undo" }));
    expect(latest).toEqual({ rows: [], decisions: {} });
  });

  it("refuses a block bigger than the table, saying why, and changes nothing", () => {
    setup(massTable, { rows: [{ t: "0", m: "1.00" }], decisions: {} });
    paste(cell(0, 1), "1.00\t2.00\n3.00\t4.00");
    expect(latest).toBeNull();
    expect(screen.getByRole("alert").textContent).toContain("Nothing was pasted: the block is 2 columns wide, but from “mass / g” the table has 1 column.");
    const tall = Array.from({ length: 61 }, (_, i) => `${i}.00`).join("\n");
    paste(cell(0, 1), tall);
    expect(latest).toBeNull();
    expect(screen.getByRole("alert").textContent).toContain("a table holds at most 60 rows");
    expect(cell(0, 1).value).toBe("1.00");
  });

  it("leaves a single value to the browser's own paste", () => {
    setup(massTable);
    const event = paste(cell(0, 1), "12.50");
    expect(event).toBe(true);
    expect(latest).toBeNull();
  });
});

describe("ResultsGrid: anomalous repeats", () => {
  const runs = { rows: [{ T: "20.0", r1: "62.0", r2: "64.0", r3: "80.0" }], decisions: {} };

  it("flags the reading with the rule in words, and requires a reason to leave it out", () => {
    setup(clockTable, runs);
    expect(screen.getByText(/more than 10 % away from the middle value \(median\)/)).toBeTruthy();
    expect(screen.getByText("Not decided yet.")).toBeTruthy();
    fireEvent.click(screen.getByRole("button", { name: "Decide: row 1, time, run 3 / s" }));
    const dialog = screen.getByRole("dialog");
    expect(within(dialog).getByRole("radio", { name: "Leave it out of the mean" })).toHaveProperty("checked", true);
    fireEvent.click(within(dialog).getByRole("button", { name: "Save decision" }));
    expect(latest).toBeNull();
    expect(within(dialog).getByText(/Say why you are leaving this reading out/)).toBeTruthy();
    expect(within(dialog).getByRole("textbox", { name: "Why?" }).getAttribute("aria-invalid")).toBe("true");
    fireEvent.change(within(dialog).getByRole("textbox", { name: "Why?" }), { target: { value: "I started the stopwatch late on this run." } });
    fireEvent.click(within(dialog).getByRole("button", { name: "Save decision" }));
    expect(latest!.decisions).toEqual({ "0:r3": { include: false, reason: "I started the stopwatch late on this run." } });
    expect(screen.queryByRole("dialog")).toBeNull();
    expect(cell(0, 3).className).toContain("line-through");
    expect(cell(0, 3)).toHaveProperty("ariaLabel", "Row 1, time, run 3 / s (left out)");
    expect(screen.getByText(/You left it out/).textContent).toContain("I started the stopwatch late on this run.");
  });

  it("lets the student keep a flagged reading in, with a reason, and change their mind later", () => {
    setup(clockTable, runs);
    fireEvent.click(screen.getByRole("button", { name: "Decide: row 1, time, run 3 / s" }));
    const dialog = screen.getByRole("dialog");
    fireEvent.click(within(dialog).getByRole("radio", { name: "Keep it in the mean" }));
    fireEvent.change(within(dialog).getByRole("textbox", { name: "Why?" }), { target: { value: "It was a different batch of acid." } });
    fireEvent.click(within(dialog).getByRole("button", { name: "Save decision" }));
    expect(latest!.decisions["0:r3"]).toEqual({ include: true, reason: "It was a different batch of acid." });
    expect(cell(0, 3).className).not.toContain("line-through");
    fireEvent.click(screen.getByRole("button", { name: "Change decision: row 1, time, run 3 / s" }));
    fireEvent.click(within(screen.getByRole("dialog")).getByRole("button", { name: "Remove my decision" }));
    expect(latest!.decisions).toEqual({});
  });

  it("closes the decision without saving on Escape", () => {
    setup(clockTable, runs);
    fireEvent.click(screen.getByRole("button", { name: "Decide: row 1, time, run 3 / s" }));
    fireEvent.keyDown(screen.getByRole("dialog"), { key: "Escape" });
    expect(screen.queryByRole("dialog")).toBeNull();
    expect(latest).toBeNull();
  });
});

describe("ResultsGrid: rows, import and export", () => {
  it("adds a row and removes empty rows at the end, with undo", () => {
    setup(massTable, { rows: [{ t: "0", m: "1.00" }, {}, {}, {}], decisions: {} });
    fireEvent.click(screen.getByRole("button", { name: "Add a row" }));
    expect(latest!.rows).toHaveLength(5);
    fireEvent.click(screen.getByRole("button", { name: "Remove empty rows at the end" }));
    expect(latest!.rows).toHaveLength(1);
    expect(screen.getByRole("status").textContent).toContain("Removed 4 empty rows from the end.");
  });

  it("imports a CSV file after the student confirms which column goes where", async () => {
    setup(massTable, { rows: [{ t: "0", m: "9.99" }], decisions: {} });
    const input = screen.getByLabelText("Import from a CSV file") as HTMLInputElement;
    const file = new File(["0,120.50\n30,120.08\n"], "balance.csv", { type: "text/csv" });
    await act(async () => {
      fireEvent.change(input, { target: { files: [file] } });
    });
    const dialog = await screen.findByRole("dialog", { name: "Import “balance.csv”?" });
    expect(dialog.textContent).toContain("used in order");
    expect(dialog.textContent).toContain("This replaces everything typed in the table now");
    expect(latest).toBeNull();
    fireEvent.click(within(dialog).getByRole("button", { name: "Yes, use the columns in this order" }));
    expect(latest!.rows.slice(0, 2)).toEqual([{ t: "0", m: "120.50" }, { t: "30", m: "120.08" }]);
  });

  it("refuses a file that cannot be used, with the reason", async () => {
    setup(massTable);
    const input = screen.getByLabelText("Import from a CSV file") as HTMLInputElement;
    const rows = ["time / s,mass / g", ...Array.from({ length: 70 }, (_, i) => `${i},1.00`)].join("\n");
    await act(async () => {
      fireEvent.change(input, { target: { files: [new File([rows], "big.csv")] } });
    });
    expect((await screen.findByRole("alert")).textContent).toContain("This file has 70 rows of readings, but a table holds at most 60. Nothing was imported.");
    expect(latest).toBeNull();
  });

  it("downloads the table as CSV with quantity / unit headings", async () => {
    let blob: Blob | null = null;
    const create = vi.fn((b: Blob) => {
      blob = b;
      return "blob:table";
    });
    Object.assign(URL, { createObjectURL: create, revokeObjectURL: vi.fn() });
    const click = vi.spyOn(HTMLAnchorElement.prototype, "click").mockImplementation(() => {});
    setup(massTable, { rows: [{ t: "0", m: "=1+1" }], decisions: {} });
    fireEvent.click(screen.getByRole("button", { name: "Download as CSV" }));
    expect(click).toHaveBeenCalled();
    const text = await blob!.text();
    expect(text.replace(/^\uFEFF/, "")).toBe("time / s,mass / g\r\n0,'=1+1");
  });

  it("in read-only mode shows the table but takes no edits", () => {
    setup(massTable, { rows: [{ t: "0", m: "1.00" }], decisions: {} }, true);
    expect(cell(0, 1).readOnly).toBe(true);
    expect(screen.queryByRole("button", { name: "Add a row" })).toBeNull();
    expect(screen.queryByLabelText("Import from a CSV file")).toBeNull();
    paste(cell(0, 1), "1\t2");
    expect(latest).toBeNull();
    expect(cell(0, 0).tabIndex).toBe(0);
    expect(cell(0, 1).tabIndex).toBe(-1);
  });
});

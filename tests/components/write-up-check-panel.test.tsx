// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { CheckPanel, type CheckResultEntry } from "@/components/write-up/check-panel";
import type { CheckStateJson } from "@/components/write-up/types";
import { checkSchema, graphSchema, tableSchema, type CheckSpec } from "@/lib/validation/practicals";
import { answerFingerprint } from "@/lib/write-ups/stale";

afterEach(cleanup);

const table = tableSchema.parse({
  id: "gas",
  title: "Volume of gas against time",
  rowCount: 4,
  columns: [
    { id: "t", quantity: "time", unit: "s", role: "independent" },
    { id: "v", quantity: "volume of gas", unit: "cm³", role: "dependent" },
    { id: "inv", quantity: "1/t", unit: "s⁻¹", role: "derived", formula: "reciprocal", derivedFrom: "t" },
  ],
});
const graph = graphSchema.parse({ id: "vt", title: "Volume against time", tableId: "gas", xColumn: "t", yColumn: "v", tangents: true });
const meanRate = checkSchema.parse({ id: "k1", label: "Mean rate from 0 s to 30 s", kind: "mean-rate", tableId: "gas", x: "t", y: "v", from: 0, to: 30, tolerancePercent: 5 });
const rateAt = checkSchema.parse({ id: "k2", label: "Rate at 20 s, from your tangent", kind: "rate-at", tableId: "gas", x: "t", y: "v", at: 20, tolerancePercent: 15 });
const perRow = checkSchema.parse({ id: "k3", label: "1/t on each row", kind: "reciprocal-time", tableId: "gas", t: "t", answerColumn: "inv", tolerancePercent: 5 });

const state = (over: Partial<CheckStateJson> = {}): CheckStateJson => ({ checkId: "k1", verdict: "agrees", hint: "Your answer fits your data.", expected: null, rows: null, stale: false, ranAt: Date.parse("2026-12-03T10:42:00Z"), ...over });
const answer = { value: "1.37", unit: "cm³/s" };
const entry = (over: Partial<CheckStateJson> = {}, basis: CheckResultEntry["basis"] = { dataHash: "data-1", answerHash: answerFingerprint(answer) }): CheckResultEntry => ({ state: state(over), basis });

function panel(props: Partial<Parameters<typeof CheckPanel>[0]> & { spec?: CheckSpec } = {}) {
  return <CheckPanel spec={meanRate} table={table} graph={null} answer={answer} tangent={null} dataHash="data-1" result={entry()} {...props} />;
}

describe("CheckPanel", () => {
  it("says what to work out in plain words, with labelled answer and unit boxes", () => {
    render(panel({ result: null }));
    expect(screen.getByRole("heading", { name: "Mean rate from 0 s to 30 s" })).toBeTruthy();
    expect(screen.getByText(/find the change in volume of gas between 0 s and 30 s, and divide it by the change in time/)).toBeTruthy();
    expect((screen.getByLabelText("Your answer") as HTMLInputElement).value).toBe("1.37");
    expect((screen.getByLabelText("Unit") as HTMLInputElement).value).toBe("cm³/s");
    expect(screen.queryByTestId("check-k1-verdict")).toBeNull();
  });

  it("shows the verdict in our words with its shape, and the hint, while the work is unchanged", () => {
    render(panel());
    const verdict = screen.getByTestId("check-k1-verdict");
    expect(within(verdict).getByText("Agrees")).toBeTruthy();
    expect(verdict.querySelector('[data-verdict-shape="agrees"]')).not.toBeNull();
    expect(within(verdict).getByText("Your answer fits your data.")).toBeTruthy();
    expect(screen.queryByTestId("check-k1-stale")).toBeNull();
    expect(within(verdict).queryByText(/Expected from your data/)).toBeNull();
  });

  it("marks the verdict 'needs checking again' the moment the data change, and clears it when they change back", () => {
    const { rerender } = render(panel());
    rerender(panel({ dataHash: "data-2" }));
    expect(screen.getByTestId("check-k1-stale").textContent).toMatch(/Needs checking again: your results or your answer changed after this check, so press Check again\./);
    expect(screen.getByText("Last check:")).toBeTruthy();
    rerender(panel({ dataHash: "data-1" }));
    expect(screen.queryByTestId("check-k1-stale")).toBeNull();
  });

  it("marks it when the answer or its unit changes, but not for spaces around them", () => {
    const { rerender } = render(panel({ answer: { value: "1.4", unit: "cm³/s" } }));
    expect(screen.getByTestId("check-k1-stale")).toBeTruthy();
    rerender(panel({ answer: { value: "1.37", unit: "cm3/min" } }));
    expect(screen.getByTestId("check-k1-stale")).toBeTruthy();
    rerender(panel({ answer: { value: " 1.37 ", unit: "cm³/s " } }));
    expect(screen.queryByTestId("check-k1-stale")).toBeNull();
  });

  it("treats a result the server already called stale as stale until it runs again", () => {
    render(panel({ result: entry({ stale: true }, null) }));
    expect(screen.getByTestId("check-k1-stale")).toBeTruthy();
  });

  it("a tangent check reads the tangent: moving it makes the result stale", () => {
    const tangent = { x1: 0, y1: 12, x2: 40, y2: 48 };
    const basis = { dataHash: "data-1", answerHash: answerFingerprint({ ...answer, tangent }) };
    const { rerender } = render(panel({ spec: rateAt, graph, tangent, result: { state: state({ checkId: "k2" }), basis } }));
    expect(screen.getByTestId("check-k2-tangent").textContent).toMatch(/Your tangent on “Volume against time” runs from \(0, 12\) to \(40, 48\)/);
    expect(screen.queryByTestId("check-k2-stale")).toBeNull();
    rerender(panel({ spec: rateAt, graph, tangent: { ...tangent, y2: 50 }, result: { state: state({ checkId: "k2" }), basis } }));
    expect(screen.getByTestId("check-k2-stale")).toBeTruthy();
    rerender(panel({ spec: rateAt, graph, tangent: null, result: null }));
    expect(screen.getByTestId("check-k2-tangent").textContent).toMatch(/You have not drawn a tangent yet on “Volume against time”/);
  });

  it("a per-row check lists each row's verdict by its row number, leaving out empty rows", () => {
    const rows = [
      { index: 0, verdict: "agrees" as const },
      { index: 1, verdict: "disagrees" as const },
      { index: 2, verdict: "cannot-check" as const },
      { index: 3, verdict: "cannot-check" as const },
    ];
    const result = { state: state({ checkId: "k3", verdict: "disagrees", rows }), basis: { dataHash: "data-1", answerHash: answerFingerprint({ value: "", unit: "" }) } };
    render(panel({ spec: perRow, result, rowHasData: (i) => i !== 3 }));
    expect(screen.queryByLabelText("Your answer")).toBeNull();
    expect(screen.getByRole("button", { name: "Check my column" })).toBeTruthy();
    const list = screen.getByRole("list", { name: "Each row" });
    const items = within(list).getAllByRole("listitem").map((li) => li.textContent);
    expect(items).toEqual(["Row 1Agrees", "Row 2Does not agree", "Row 3Cannot check yet"]);
  });

  it("passes typing and the Check button on, and says it is saving first while busy", () => {
    const onAnswerChange = vi.fn();
    const onCheck = vi.fn();
    const { rerender } = render(panel({ onAnswerChange, onCheck }));
    fireEvent.change(screen.getByLabelText("Your answer"), { target: { value: "1.36" } });
    expect(onAnswerChange).toHaveBeenCalledWith({ value: "1.36", unit: "cm³/s" });
    fireEvent.change(screen.getByLabelText("Unit"), { target: { value: "cm3/s" } });
    expect(onAnswerChange).toHaveBeenLastCalledWith({ value: "1.37", unit: "cm3/s" });
    fireEvent.click(screen.getByRole("button", { name: "Check" }));
    expect(onCheck).toHaveBeenCalledTimes(1);
    rerender(panel({ onAnswerChange, onCheck, busy: true }));
    const busy = screen.getByRole("button", { name: "Saving and checking…" }) as HTMLButtonElement;
    expect(busy.disabled).toBe(true);
  });

  it("shows the expected value only when the server sent it, and errors as alerts", () => {
    const { rerender } = render(panel({ result: entry({ verdict: "disagrees", expected: { value: 1.366666, unit: "cm³/s" } }) }));
    expect(screen.getByText("Does not agree")).toBeTruthy();
    expect(screen.getByText(/Expected from your data:/).parentElement?.textContent).toBe("Expected from your data: 1.367 cm³/s");
    rerender(panel({ error: "Not checked. You are offline." }));
    expect(screen.getByRole("alert").textContent).toBe("Not checked. You are offline.");
  });

  it("read-only: the answer as text, no inputs or button", () => {
    render(panel({ readOnly: true }));
    expect(screen.queryByRole("textbox")).toBeNull();
    expect(screen.queryByRole("button")).toBeNull();
    expect(screen.getByText("Your answer:").parentElement?.textContent).toBe("Your answer: 1.37 cm³/s");
  });
});

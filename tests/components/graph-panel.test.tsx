// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { useState } from "react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { ChartData } from "chart.js";
import { rateAt } from "@/lib/marking";
import { GraphPanel } from "@/components/write-up/graph-panel";
import { graphSchema, type GraphSpec, type TableTemplate } from "@/lib/validation/practicals";
import type { FilledTable } from "@/lib/validation/write-ups";
import type { Tangent } from "@/lib/write-ups/graph-data";
import { expectClose } from "../marking/helpers";
import { gasFilled, gasGraph, gasTable, gasVolumes } from "../write-ups/fixtures";

// The canvas cannot draw in jsdom, so the chart component is replaced by one that keeps what it was given.
const chartProps: { data?: ChartData<"scatter">; options?: Record<string, unknown> }[] = [];
vi.mock("react-chartjs-2", () => ({
  Scatter: (props: { data: ChartData<"scatter">; options: Record<string, unknown>; "aria-label"?: string }) => {
    chartProps.push({ data: props.data, options: props.options });
    return <canvas role="img" aria-label={props["aria-label"]} />;
  },
}));

afterEach(() => {
  cleanup();
  chartProps.length = 0;
});

const lastChart = () => chartProps[chartProps.length - 1]!;
const dataset = (label: string) => lastChart().data!.datasets.find((d) => d.label === label)!.data as { x: number; y: number }[];

let emitted: (Tangent | null)[] = [];
function Harness({ graph = gasGraph, table = gasTable, filled = gasFilled(), initial = null, readOnly }: { graph?: GraphSpec; table?: TableTemplate; filled?: FilledTable; initial?: Tangent | null; readOnly?: boolean }) {
  const [tangent, setTangent] = useState<Tangent | null>(initial);
  return (
    <GraphPanel
      graph={graph}
      table={table}
      filled={filled}
      tangent={tangent}
      readOnly={readOnly}
      onTangentChange={(t) => {
        emitted.push(t);
        setTangent(t);
      }}
    />
  );
}
const setup = (props: Parameters<typeof Harness>[0] = {}) => {
  emitted = [];
  return render(<Harness {...props} />);
};

describe("GraphPanel: plotting", () => {
  it("plots the readings as crosses with axis titles quantity / unit, and a curve of best fit from the engine", () => {
    setup();
    expect(dataset("Your readings")).toEqual(gasVolumes.map((y, i) => ({ x: i * 10, y })));
    const readings = lastChart().data!.datasets[0]!;
    expect(readings).toMatchObject({ pointStyle: "crossRot" });
    const scales = lastChart().options!.scales as { x: { title: { text: string } }; y: { title: { text: string } } };
    expect(scales.x.title.text).toBe("time / s");
    expect(scales.y.title.text).toBe("volume of gas / cm³");
    const curve = dataset("Best fit");
    expect(curve.length).toBeGreaterThan(50);
    const times = gasVolumes.map((_, i) => i * 10);
    for (const p of [curve[0]!, curve[40]!, curve[curve.length - 1]!]) expectClose(p.y, rateAt(times, gasVolumes, p.x).valueAt, { rel: 1e-9, abs: 1e-9 });
    expect(screen.getByRole("img").getAttribute("aria-label")).toBe("Graph of volume of gas / cm³ against time / s: 8 readings plotted, with a curve of best fit.");
  });

  it("redraws when the table changes and notes readings left out", () => {
    const { rerender } = setup({ filled: gasFilled(["0", "24", "38"]) });
    expect(dataset("Your readings")).toHaveLength(3);
    expect(screen.getByText("5 readings left out (blank or not numbers).")).toBeTruthy();
    rerender(<Harness filled={gasFilled(["0", "24", "38", "47", "abc"])} />);
    expect(dataset("Your readings")).toHaveLength(4);
    expect(screen.getByText("4 readings left out (blank or not numbers).")).toBeTruthy();
  });

  it("draws readings the student left out as circles, apart from the fit", () => {
    setup({ filled: { ...gasFilled(), decisions: { "3:v": { include: false, reason: "The syringe stuck." } } } });
    expect(dataset("Left out")).toEqual([{ x: 30, y: 47 }]);
    expect(dataset("Your readings")).toHaveLength(7);
  });

  it("says plainly when there are too few readings for a curve, without throwing", () => {
    setup({ filled: gasFilled(["0", "24"]) });
    expect(screen.getByText("Too few readings for a curve of best fit: at least 3 are needed, and there are 2.")).toBeTruthy();
    expect(dataset("Best fit")).toEqual([]);
  });

  it("shows a plain message with nothing to plot, and when a column is missing", () => {
    setup({ filled: gasFilled([]) });
    expect(screen.getByText(/No readings to plot yet/)).toBeTruthy();
    cleanup();
    setup({ graph: graphSchema.parse({ ...gasGraph, yColumn: "missing" }) });
    expect(screen.getByRole("alert").textContent).toContain("not in the results table");
  });

  it("draws a straight line through the origin when the spec asks, from x = 0", () => {
    setup({ graph: graphSchema.parse({ ...gasGraph, fit: "line", throughOrigin: true, tangents: false }), filled: gasFilled(["0", "5", "11", "14"]) });
    const line = dataset("Best fit");
    expect(line[0]!.x).toBe(0);
    expect(line[0]!.y).toBe(0);
    expect(screen.queryByRole("group", { name: "Your tangent" })).toBeNull();
  });
});

describe("GraphPanel: tangent", () => {
  const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });

  it("builds the tangent from typed numbers, draws it across the plot, and gives its gradient and the engine's verdict", () => {
    setup();
    type("Tangent at t / s", "20");
    type("Point 1: time / s", "0");
    type("Point 1: volume of gas / cm³", "19");
    type("Point 2: time / s", "40");
    expect(emitted).toEqual([]);
    type("Point 2: volume of gas / cm³", "57");
    expect(emitted).toEqual([{ at: 20, x1: 0, y1: 19, x2: 40, y2: 57 }]);
    const line = dataset("Your tangent");
    expect(line).toHaveLength(2);
    expect(line[0]).toEqual({ x: 0, y: 19 });
    expect(line[1]!.x).toBe(70);
    expectClose(line[1]!.y, 19 + 0.95 * 70, { rel: 1e-12 });
    expect(screen.getByText("Δy ÷ Δx = 38 cm³ ÷ 40 s = 0.95 cm³/s")).toBeTruthy();
    expect(dataset("Gradient triangle")).toEqual([{ x: 0, y: 19 }, { x: 40, y: 19 }, { x: 40, y: 57 }]);
    // The curve is near 38 cm³ at 20 s; this line is at 38 there, so it touches.
    expect(screen.getByText("Your tangent touches the curve at t = 20 s.")).toBeTruthy();
    type("Point 1: volume of gas / cm³", "29");
    type("Point 2: volume of gas / cm³", "67");
    expect(screen.getByText("Your tangent does not touch the curve at t = 20 s. Move it so that it just touches the curve there.")).toBeTruthy();
  });

  it("flags boxes that are not numbers and points straight above each other, without emitting", () => {
    setup({ initial: { at: 20, x1: 0, y1: 19, x2: 40, y2: 57 } });
    type("Point 2: time / s", "forty");
    expect(screen.getByText("Type a number, like 12.5.")).toBeTruthy();
    expect(screen.getByLabelText("Point 2: time / s").getAttribute("aria-invalid")).toBe("true");
    type("Point 2: time / s", "0");
    expect(screen.getByText(/The two points have the same time/)).toBeTruthy();
    expect(emitted).toEqual([]);
  });

  it("keeps what the student typed in the box while the tangent updates", () => {
    setup({ initial: { at: 20, x1: 0, y1: 19, x2: 40, y2: 57 } });
    type("Tangent at t / s", "20.");
    expect((screen.getByLabelText("Tangent at t / s") as HTMLInputElement).value).toBe("20.");
    type("Tangent at t / s", "25");
    expect(emitted).toEqual([{ at: 25, x1: 0, y1: 19, x2: 40, y2: 57 }]);
  });

  it("removes the tangent", () => {
    setup({ initial: { at: 20, x1: 0, y1: 19, x2: 40, y2: 57 } });
    fireEvent.click(screen.getByRole("button", { name: "Remove the tangent" }));
    expect(emitted).toEqual([null]);
    expect(dataset("Your tangent")).toEqual([]);
    expect((screen.getByLabelText("Tangent at t / s") as HTMLInputElement).value).toBe("20");
  });

  it("shows a saved tangent read-only, with its verdict", () => {
    setup({ initial: { at: 20, x1: 0, y1: 19, x2: 40, y2: 57 }, readOnly: true });
    expect((screen.getByLabelText("Point 1: time / s") as HTMLInputElement).readOnly).toBe(true);
    expect(screen.queryByRole("button", { name: "Remove the tangent" })).toBeNull();
    expect(screen.getByText("Your tangent touches the curve at t = 20 s.")).toBeTruthy();
  });

  it("reads its colours from the palette tokens", () => {
    document.documentElement.style.setProperty("--accent", "rgb(1, 2, 3)");
    setup({ initial: { at: 20, x1: 0, y1: 19, x2: 40, y2: 57 } });
    const tangent = lastChart().data!.datasets.find((d) => d.label === "Your tangent")!;
    expect(tangent.borderColor).toBe("rgb(1, 2, 3)");
    document.documentElement.style.removeProperty("--accent");
  });
});

"use client";

import { useMemo, useRef, useState, type JSX, type PointerEvent } from "react";
import { Scatter } from "react-chartjs-2";
import type { Chart as ChartJS, ChartData, ChartOptions } from "chart.js";
import { Button } from "@/components/ui/button";
import type { GraphSpec, TableTemplate } from "@/lib/validation/practicals";
import type { FilledTable } from "@/lib/validation/write-ups";
import {
  axisTitle,
  bestFit,
  fitRange,
  graphPoints,
  leftOutNote,
  niceAxis,
  sampleFit,
  tangentAcross,
  tangentGradient,
  tangentVerdict,
  type Tangent,
  type XY,
} from "@/lib/write-ups/graph-data";
import "./graph/chart-setup";
import { TangentControls } from "./graph/tangent-controls";
import { draftNumber, fromDraft, roundToAxis, sameTangent, toDraft, type TangentDraft } from "./graph/tangent-draft";
import { usePalette, type Palette } from "./graph/use-palette";

type ScatterChart = ChartJS<"scatter", XY[]>;

/** How close (CSS pixels) a press must be to a tangent point to pick it up: big enough for a finger. */
const HANDLE_REACH = 24;

function LegendKey({ kind, palette }: { kind: "cross" | "line" | "circle" | "tangent"; palette: Palette }) {
  return (
    <svg width="22" height="14" viewBox="0 0 22 14" aria-hidden="true" className="shrink-0">
      {kind === "cross" ? <path d="M7 3l8 8M15 3l-8 8" stroke={palette.ink} strokeWidth="2" /> : null}
      {kind === "line" ? <path d="M1 7h20" stroke={palette.brand} strokeWidth="2.5" /> : null}
      {kind === "circle" ? <circle cx="11" cy="7" r="5" fill="none" stroke={palette.muted} strokeWidth="1.5" /> : null}
      {kind === "tangent" ? <path d="M1 12L21 2" stroke={palette.accent} strokeWidth="2.5" /> : null}
    </svg>
  );
}

/**
 * A graph of two columns of the student's results table: readings as small crosses, the line or
 * curve of best fit from the calculation engine, and (when the practical asks for one) the
 * student's tangent — two points placed or dragged on the graph or typed in boxes, the line drawn
 * through them across the plot, its gradient Δy/Δx with units, and whether it touches the curve
 * at the chosen time. Wheel or pinch to zoom, drag to move, and a button to reset. Redraws as the
 * table changes; blank or unreadable cells are left out with a note; never throws for bad data.
 */
export function GraphPanel(props: {
  graph: GraphSpec;
  table: TableTemplate;
  filled: FilledTable;
  tangent: Tangent | null;
  onTangentChange?: (t: Tangent | null) => void;
  readOnly?: boolean;
  /** The time a calculation check asks the tangent at, used to start the time box. */
  suggestedAt?: number;
}): JSX.Element {
  const { graph, table, filled, tangent, onTangentChange, suggestedAt } = props;
  const readOnly = props.readOnly === true || !onTangentChange;
  const palette = usePalette();
  const chartRef = useRef<ScatterChart | undefined>(undefined);

  const shaped = useMemo(() => graphPoints(graph, table, filled), [graph, table, filled]);
  const data = "problem" in shaped ? null : shaped;
  const points = useMemo(() => data?.points ?? [], [data]);
  const excluded = useMemo(() => data?.excludedPoints ?? [], [data]);
  const fit = useMemo(() => (data ? bestFit(graph, points, axisTitle(data.x)) : null), [data, graph, points]);
  const fitOk = fit?.ok ? fit.fit : null;
  const xAxis = useMemo(() => niceAxis([...points, ...excluded].map((p) => p.x).concat(fitOk?.kind === "line" && fitOk.throughOrigin ? [0] : [])), [points, excluded, fitOk]);
  const yAxis = useMemo(() => niceAxis([...points, ...excluded].map((p) => p.y).concat(fitOk?.kind === "line" && fitOk.throughOrigin ? [0] : [])), [points, excluded, fitOk]);
  const samples = useMemo(() => {
    if (!fitOk) return [];
    const range = fitRange(fitOk, points);
    return range ? sampleFit(fitOk, range.from, range.to) : [];
  }, [fitOk, points]);

  const [draft, setDraft] = useState<TangentDraft>(() => toDraft(tangent, suggestedAt));
  const [seen, setSeen] = useState<Tangent | null>(tangent);
  if (!sameTangent(seen, tangent)) {
    setSeen(tangent);
    if (!sameTangent(fromDraft(draft), tangent)) setDraft(toDraft(tangent, tangent ? undefined : draftNumber(draft.at) ?? suggestedAt));
  }
  const [placing, setPlacing] = useState<0 | 1 | 2>(() => (tangent || readOnly ? 0 : 1));
  const dragRef = useRef<{ handle: 1 | 2; draft: TangentDraft } | null>(null);
  const downRef = useRef<{ x: number; y: number } | null>(null);

  const current = useMemo(() => fromDraft(draft), [draft]);
  const [p1, p2] = useMemo(() => [1, 2].map((h) => ({ x: draftNumber(draft[`x${h}` as "x1"]), y: draftNumber(draft[`y${h}` as "y1"]) })), [draft]);
  const handles = useMemo(() => [p1!, p2!].filter((p): p is XY => p.x !== null && p.y !== null), [p1, p2]);
  const at = draftNumber(draft.at);

  const commit = (next: TangentDraft) => {
    setDraft(next);
    const t = fromDraft(next);
    if (t && !readOnly && !sameTangent(t, tangent)) onTangentChange?.(t);
  };

  const chartData = useMemo<ChartData<"scatter", XY[]>>(() => {
    const line = current && graph.tangents ? tangentAcross(current, xAxis.min, xAxis.max) : null;
    return {
      datasets: [
        {
          label: "Your readings",
          data: points.map((p) => ({ x: p.x, y: p.y })),
          pointStyle: "crossRot",
          pointRadius: 6,
          pointHoverRadius: 8,
          borderWidth: 2,
          borderColor: palette.ink,
          backgroundColor: palette.ink,
          order: 1,
        },
        {
          label: "Left out",
          data: excluded.map((p) => ({ x: p.x, y: p.y })),
          pointStyle: "circle",
          pointRadius: 6,
          borderWidth: 1.5,
          borderColor: palette.muted,
          backgroundColor: "transparent",
          order: 2,
        },
        {
          label: "Best fit",
          data: samples,
          showLine: true,
          pointRadius: 0,
          pointHoverRadius: 0,
          borderWidth: 2.5,
          borderColor: palette.brand,
          backgroundColor: palette.brand,
          order: 3,
        },
        {
          label: "Tangent time",
          data: graph.tangents && at !== null && at >= xAxis.min && at <= xAxis.max ? [{ x: at, y: yAxis.min }, { x: at, y: yAxis.max }] : [],
          showLine: true,
          pointRadius: 0,
          pointHoverRadius: 0,
          borderWidth: 1,
          borderDash: [3, 4],
          borderColor: palette.muted,
          order: 5,
        },
        {
          label: "Your tangent",
          data: line ?? [],
          showLine: true,
          pointRadius: 0,
          pointHoverRadius: 0,
          borderWidth: 2.5,
          borderColor: palette.accent,
          order: 0,
        },
        {
          label: "Gradient triangle",
          data: current && graph.tangents ? [{ x: current.x1, y: current.y1 }, { x: current.x2, y: current.y1 }, { x: current.x2, y: current.y2 }] : [],
          showLine: true,
          pointRadius: 0,
          pointHoverRadius: 0,
          borderWidth: 1.5,
          borderDash: [6, 4],
          borderColor: palette.accent,
          order: 4,
        },
        {
          label: "Tangent points",
          data: graph.tangents ? handles : [],
          pointStyle: "circle",
          pointRadius: 8,
          pointHoverRadius: 10,
          borderWidth: 2,
          borderColor: palette.surface,
          backgroundColor: palette.accent,
          // A point on the edge of the plot stays whole, so it can still be seen and picked up.
          clip: 12,
          order: -1,
        },
      ],
    };
  }, [current, graph.tangents, xAxis, yAxis, points, excluded, samples, at, handles, palette]);

  const xTitle = data ? axisTitle(data.x) : "";
  const yTitle = data ? axisTitle(data.y) : "";
  const options = useMemo<ChartOptions<"scatter">>(
    () => ({
      animation: false,
      responsive: true,
      maintainAspectRatio: false,
      layout: { padding: { top: 8, right: 12 } },
      scales: {
        x: {
          type: "linear",
          min: xAxis.min,
          max: xAxis.max,
          title: { display: true, text: xTitle, color: palette.ink, font: { size: 14, weight: "bold" } },
          grid: { color: palette.line },
          border: { color: palette.muted },
          ticks: { color: palette.muted, includeBounds: false },
        },
        y: {
          type: "linear",
          min: yAxis.min,
          max: yAxis.max,
          title: { display: true, text: yTitle, color: palette.ink, font: { size: 14, weight: "bold" } },
          grid: { color: palette.line },
          border: { color: palette.muted },
          ticks: { color: palette.muted, includeBounds: false },
        },
      },
      plugins: {
        legend: { display: false },
        tooltip: {
          filter: (item) => item.datasetIndex === 0 || item.datasetIndex === 1,
          callbacks: { label: (item) => `${xTitle}: ${item.parsed.x}, ${yTitle}: ${item.parsed.y}${item.datasetIndex === 1 ? " (left out)" : ""}` },
        },
        zoom: {
          zoom: { wheel: { enabled: true }, pinch: { enabled: true }, mode: "xy" },
          pan: { enabled: true, mode: "xy", onPanStart: () => dragRef.current === null },
        },
      },
    }),
    [xAxis, yAxis, xTitle, yTitle, palette],
  );

  const gradient = current ? tangentGradient(current, data?.x.unit ?? "", data?.y.unit ?? "") : null;
  const verdict = current && data && fit ? tangentVerdict(current, fit, points, data.x) : null;

  const position = (e: PointerEvent<HTMLCanvasElement>) => {
    const rect = e.currentTarget.getBoundingClientRect();
    return { x: e.clientX - rect.left, y: e.clientY - rect.top };
  };
  const toValue = (chart: ScatterChart, px: number, py: number): XY | null => {
    const xs = chart.scales.x;
    const ys = chart.scales.y;
    if (!xs || !ys) return null;
    const x = xs.getValueForPixel(px);
    const y = ys.getValueForPixel(py);
    if (x === undefined || y === undefined) return null;
    return { x: roundToAxis(x, xs.max - xs.min), y: roundToAxis(y, ys.max - ys.min) };
  };
  const withPoint = (d: TangentDraft, handle: 1 | 2, v: XY): TangentDraft => ({ ...d, [`x${handle}`]: String(v.x), [`y${handle}`]: String(v.y) });

  const onPointerDown = (e: PointerEvent<HTMLCanvasElement>) => {
    const chart = chartRef.current;
    if (!chart || readOnly || !graph.tangents) return;
    const p = position(e);
    downRef.current = p;
    const near = [p1!, p2!]
      .map((h, i) => {
        if (h.x === null || h.y === null) return null;
        const dx = chart.scales.x!.getPixelForValue(h.x) - p.x;
        const dy = chart.scales.y!.getPixelForValue(h.y) - p.y;
        return { handle: (i + 1) as 1 | 2, distance: Math.hypot(dx, dy) };
      })
      .filter((h): h is { handle: 1 | 2; distance: number } => h !== null && h.distance <= HANDLE_REACH)
      .sort((a, b) => a.distance - b.distance)[0];
    if (near) {
      dragRef.current = { handle: near.handle, draft };
      e.currentTarget.setPointerCapture?.(e.pointerId);
      e.preventDefault();
    }
  };
  const onPointerMove = (e: PointerEvent<HTMLCanvasElement>) => {
    const chart = chartRef.current;
    const drag = dragRef.current;
    if (!chart || !drag) return;
    const p = position(e);
    const v = toValue(chart, p.x, p.y);
    if (!v) return;
    const next = withPoint(drag.draft, drag.handle, v);
    dragRef.current = { ...drag, draft: next };
    setDraft(next);
  };
  const onPointerUp = (e: PointerEvent<HTMLCanvasElement>) => {
    const chart = chartRef.current;
    const drag = dragRef.current;
    const down = downRef.current;
    dragRef.current = null;
    downRef.current = null;
    if (!chart) return;
    if (drag) {
      commit(drag.draft);
      return;
    }
    if (!down || placing === 0) return;
    const p = position(e);
    if (Math.hypot(p.x - down.x, p.y - down.y) > 6) return;
    const area = chart.chartArea;
    if (area && (p.x < area.left || p.x > area.right || p.y < area.top || p.y > area.bottom)) return;
    const v = toValue(chart, p.x, p.y);
    if (!v) return;
    const next = withPoint(draft, placing, v);
    setPlacing(placing === 1 ? 2 : 0);
    commit(next);
  };

  const title = (
    <div className="flex flex-wrap items-end justify-between gap-2">
      <h3 className="text-lg font-bold">{graph.title}</h3>
      {data && points.length + excluded.length > 0 ? (
        <Button variant="secondary" size="sm" className="no-print" onClick={() => chartRef.current?.resetZoom()}>
          Reset zoom
        </Button>
      ) : null}
    </div>
  );

  if (!data) {
    return (
      <section className="flex flex-col gap-3">
        {title}
        <p role="alert" className="rounded-md border border-l-4 border-warn/40 bg-warn-soft p-3">
          {"problem" in shaped ? shaped.problem : ""}
        </p>
      </section>
    );
  }

  const note = leftOutNote(data.leftOut, excluded.length);
  const fitWord = graph.fit === "line" ? "line" : "curve";
  const summary = `Graph of ${yTitle} against ${xTitle}: ${points.length} ${points.length === 1 ? "reading" : "readings"} plotted${fitOk ? `, with a ${fitWord} of best fit` : ""}${current && graph.tangents ? ", and your tangent" : ""}.`;

  return (
    <section className="flex flex-col gap-3" aria-label={graph.title}>
      {title}
      {points.length + excluded.length === 0 ? (
        <p className="rounded-lg border border-dashed border-line bg-surface p-6 text-center text-muted">No readings to plot yet: fill in the results table and the graph draws itself.</p>
      ) : (
        <>
          <div className="relative h-80 w-full rounded-lg border border-line bg-surface p-2 sm:h-[26rem]">
            <Scatter
              ref={chartRef}
              data={chartData}
              options={options}
              aria-label={summary}
              style={{ touchAction: "none" }}
              onPointerDown={onPointerDown}
              onPointerMove={onPointerMove}
              onPointerUp={onPointerUp}
              onPointerCancel={() => {
                dragRef.current = null;
                downRef.current = null;
              }}
              className={placing !== 0 && graph.tangents && !readOnly ? "cursor-crosshair" : undefined}
            />
          </div>
          <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-muted" aria-label="Key">
            <li className="flex items-center gap-1.5">
              <LegendKey kind="cross" palette={palette} /> your readings
            </li>
            {excluded.length ? (
              <li className="flex items-center gap-1.5">
                <LegendKey kind="circle" palette={palette} /> left out
              </li>
            ) : null}
            {fitOk ? (
              <li className="flex items-center gap-1.5">
                <LegendKey kind="line" palette={palette} /> {fitWord} of best fit
              </li>
            ) : null}
            {graph.tangents && current ? (
              <li className="flex items-center gap-1.5">
                <LegendKey kind="tangent" palette={palette} /> your tangent
              </li>
            ) : null}
          </ul>
          <p className="text-sm text-muted no-print">Zoom with the mouse wheel or by pinching; drag the graph to move around.</p>
        </>
      )}
      {note ? <p className="text-sm text-muted">{note}</p> : null}
      {fit && !fit.ok ? (
        <p className="rounded-md border border-line bg-sunken px-3 py-2">{fit.message}</p>
      ) : fitOk ? (
        <p className="text-sm text-muted">{fitOk.description}</p>
      ) : null}
      {graph.tangents ? (
        <TangentControls
          x={data.x}
          y={data.y}
          draft={draft}
          placing={readOnly ? 0 : placing}
          hasPoints={handles.length > 0}
          readOnly={readOnly}
          gradientText={gradient?.text ?? null}
          verdict={verdict}
          onDraftChange={commit}
          onPlace={() => setPlacing(placing === 0 ? 1 : 0)}
          onRemove={
            tangent || handles.length
              ? () => {
                  setDraft(toDraft(null, at ?? undefined));
                  setPlacing(1);
                  if (tangent) onTangentChange?.(null);
                }
              : null
          }
        />
      ) : null}
    </section>
  );
}

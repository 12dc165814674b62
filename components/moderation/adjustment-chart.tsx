"use client";

import { Chart, LinearScale, LineElement, PointElement, ScatterController, Tooltip, type ChartData, type ChartOptions } from "chart.js";
import { useMemo } from "react";
import { Scatter } from "react-chartjs-2";
import { usePalette, type Palette } from "@/components/write-up/graph/use-palette";
import type { SuggestionJson } from "@/components/marking/types";

Chart.register(ScatterController, LinearScale, PointElement, LineElement, Tooltip);

type XY = { x: number; y: number };

function Key({ kind, palette }: { kind: "cross" | "fit" | "same"; palette: Palette }) {
  return (
    <svg width="22" height="14" viewBox="0 0 22 14" aria-hidden="true" className="shrink-0">
      {kind === "cross" ? <path d="M7 3l8 8M15 3l-8 8" stroke={palette.ink} strokeWidth="2" /> : null}
      {kind === "fit" ? <path d="M1 7h20" stroke={palette.accent} strokeWidth="2.5" /> : null}
      {kind === "same" ? <path d="M1 7h20" stroke={palette.muted} strokeWidth="1.5" strokeDasharray="4 3" /> : null}
    </svg>
  );
}

/**
 * Second-marked totals against the teacher's: one cross per piece, the fitted line the adjustment
 * uses, and a dashed line where the two would be equal. Loaded on demand (Chart.js is large).
 */
export function AdjustmentChart({ suggestion, maxTotal }: { suggestion: SuggestionJson; maxTotal: number }) {
  const palette = usePalette();
  const { slope, intercept } = suggestion;
  const data = useMemo<ChartData<"scatter", XY[]>>(
    () => ({
      datasets: [
        { label: "Pieces", data: suggestion.points.map((p) => ({ x: p.teacher, y: p.moderator })), pointStyle: "crossRot", pointRadius: 7, borderWidth: 2, borderColor: palette.ink, backgroundColor: palette.ink },
        {
          label: "Fitted line",
          data: [
            { x: 0, y: intercept },
            { x: maxTotal, y: intercept + slope * maxTotal },
          ],
          showLine: true,
          pointRadius: 0,
          borderWidth: 2.5,
          borderColor: palette.accent,
        },
        {
          label: "No change",
          data: [
            { x: 0, y: 0 },
            { x: maxTotal, y: maxTotal },
          ],
          showLine: true,
          pointRadius: 0,
          borderWidth: 1.5,
          borderDash: [5, 4],
          borderColor: palette.muted,
        },
      ],
    }),
    [suggestion.points, slope, intercept, maxTotal, palette],
  );
  const options = useMemo<ChartOptions<"scatter">>(
    () => ({
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      plugins: { legend: { display: false }, tooltip: { callbacks: { label: (c) => `teacher ${c.parsed.x}, second marking ${Number((c.parsed.y ?? 0).toFixed(1))}` } } },
      scales: {
        x: { type: "linear", min: 0, max: maxTotal, title: { display: true, text: "Teacher's total", color: palette.ink }, ticks: { color: palette.ink, precision: 0 }, grid: { color: palette.line } },
        y: { type: "linear", min: 0, max: maxTotal, title: { display: true, text: "Second-marked total", color: palette.ink }, ticks: { color: palette.ink, precision: 0 }, grid: { color: palette.line } },
      },
    }),
    [maxTotal, palette],
  );
  return (
    <figure className="flex flex-col gap-2">
      <div className="relative h-72 w-full max-w-xl sm:h-80">
        <Scatter data={data} options={options} aria-label={`Scatter graph of ${suggestion.points.length} second-marked totals against the teacher's, with the fitted line and the line of no change. The table below gives the same information.`} role="img" />
      </div>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
        <span className="inline-flex items-center gap-1">
          <Key kind="cross" palette={palette} /> a second-marked piece
        </span>
        <span className="inline-flex items-center gap-1">
          <Key kind="fit" palette={palette} /> fitted line (the suggested adjustment)
        </span>
        <span className="inline-flex items-center gap-1">
          <Key kind="same" palette={palette} /> no change
        </span>
      </figcaption>
    </figure>
  );
}

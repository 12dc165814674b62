"use client";

import { useMemo } from "react";
import { Line } from "react-chartjs-2";
import type { ChartData, ChartOptions } from "chart.js";
import { usePalette } from "@/components/write-up/graph/use-palette";
import { chartDate, lineLook, seriesDates, seriesRange, type SkillSeries } from "./chart-data";
import "./chart-setup";

type Point = { x: number; y: number; practical: string };

/**
 * Each skill's percentage of the marks available, one line per skill, one point per marked
 * practical, dates along the bottom. Lines differ by colour, point shape and dash. The canvas is
 * described in words (`summary`); the table beside it carries every number.
 */
export function SkillChart({ series, summary }: { series: SkillSeries[]; summary: string }) {
  const palette = usePalette();
  const dates = useMemo(() => seriesDates(series), [series]);
  const range = useMemo(() => seriesRange(series), [series]);

  const data = useMemo<ChartData<"line", Point[]>>(() => {
    const colours = [palette.brand, palette.accent, palette.good, palette.bad, palette.muted, palette.ink];
    return {
      datasets: series.map((s, i) => {
        const look = lineLook(i, colours);
        return {
          label: s.label,
          data: s.points,
          borderColor: look.colour,
          backgroundColor: look.colour,
          borderDash: look.dash,
          borderWidth: 2.5,
          pointStyle: look.pointStyle,
          pointRadius: 5,
          pointHoverRadius: 7,
          tension: 0,
        };
      }),
    };
  }, [series, palette]);

  const options = useMemo<ChartOptions<"line">>(
    () => ({
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      parsing: false,
      interaction: { mode: "nearest", intersect: false },
      plugins: {
        legend: { position: "bottom", labels: { color: palette.ink, usePointStyle: true, boxWidth: 10, padding: 14, font: { size: 13 } } },
        tooltip: {
          callbacks: {
            title: (items) => {
              const p = items[0]?.raw as Point | undefined;
              return p ? `${p.practical} (${chartDate(p.x)})` : "";
            },
            label: (item) => `${item.dataset.label}: ${(item.raw as Point).y}% of the marks`,
          },
        },
      },
      scales: {
        x: {
          type: "linear",
          min: range?.min,
          max: range?.max,
          grid: { color: palette.line },
          ticks: { color: palette.ink, maxRotation: 0, autoSkip: true, callback: (v) => chartDate(Number(v)) },
          afterBuildTicks: (axis) => {
            axis.ticks = dates.map((value) => ({ value }));
          },
          title: { display: true, text: "Date the work was handed back", color: palette.muted },
        },
        y: {
          min: 0,
          max: 100,
          grid: { color: palette.line },
          ticks: { color: palette.ink, stepSize: 25, callback: (v) => `${v}%` },
          title: { display: true, text: "Share of the marks", color: palette.muted },
        },
      },
    }),
    [palette, range, dates],
  );

  return (
    <div className="relative h-72 w-full sm:h-80">
      <Line data={data} options={options} role="img" aria-label={summary} fallbackContent={<p>{summary}</p>} />
    </div>
  );
}

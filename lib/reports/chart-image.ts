import "server-only";
import path from "node:path";
import { createCanvas, GlobalFonts } from "@napi-rs/canvas";
import { BarController, BarElement, BasicPlatform, CategoryScale, Chart, Legend, LinearScale, type ChartConfiguration, type Plugin } from "chart.js";

Chart.register(BarController, BarElement, CategoryScale, LinearScale, Legend);

let fontsReady = false;
function registerFonts() {
  if (fontsReady) return;
  GlobalFonts.registerFromPath(path.join(process.cwd(), "fonts", "DejaVuSans.ttf"), "ReportSans");
  fontsReady = true;
}

const whiteBackground: Plugin<"bar"> = {
  id: "white-background",
  beforeDraw(chart) {
    const { ctx, width, height } = chart;
    ctx.save();
    ctx.fillStyle = "#ffffff";
    ctx.fillRect(0, 0, width, height);
    ctx.restore();
  },
};

/**
 * A bar chart of each skill's average and latest result (percent of the marks available), drawn
 * on the server for the PDF report. Returns PNG bytes.
 */
export function skillsChartPng(skills: { title: string; averagePercent: number; latestPercent: number }[], width = 900, height = 420): Buffer {
  registerFonts();
  const canvas = createCanvas(width, height);
  const config: ChartConfiguration<"bar"> = {
    type: "bar",
    data: {
      labels: skills.map((s) => (s.title.length > 28 ? `${s.title.slice(0, 27)}…` : s.title)),
      datasets: [
        { label: "Average this year (%)", data: skills.map((s) => Math.round(s.averagePercent)), backgroundColor: "#23466b" },
        { label: "Most recent (%)", data: skills.map((s) => Math.round(s.latestPercent)), backgroundColor: "#c9853f" },
      ],
    },
    options: {
      responsive: false,
      animation: false,
      devicePixelRatio: 1,
      plugins: { legend: { labels: { font: { family: "ReportSans", size: 16 }, color: "#1c2430" } } },
      scales: {
        y: { min: 0, max: 100, ticks: { font: { family: "ReportSans", size: 14 }, color: "#1c2430" }, title: { display: true, text: "percent of marks", font: { family: "ReportSans", size: 14 } } },
        x: { ticks: { font: { family: "ReportSans", size: 14 }, color: "#1c2430" } },
      },
    },
    plugins: [whiteBackground],
  };
  // chart.js draws on any 2D context; the basic platform needs no DOM.
  const chart = new Chart(canvas as unknown as HTMLCanvasElement, { ...config, platform: BasicPlatform } as ChartConfiguration<"bar">);
  const png = canvas.toBuffer("image/png");
  chart.destroy();
  return png;
}

// @vitest-environment jsdom
import { cleanup, render, screen, within } from "@testing-library/react";
import type { ChartData, ChartOptions } from "chart.js";
import { afterEach, describe, expect, it, vi } from "vitest";
import { chartDate, chartTable, lineLook, seriesDates, seriesRange, skillSeries } from "@/components/progress/chart-data";
import { SkillChart } from "@/components/progress/skill-chart";
import { chartSummary, SkillsOverTime } from "@/components/progress/skills-over-time";
import type { SkillView } from "@/components/progress/types";

// The chart library needs a real canvas; the tests look at what our code hands it instead.
const drawn: { data?: ChartData<"line">; options?: ChartOptions<"line">; label?: string } = {};
vi.mock("react-chartjs-2", () => ({
  Line: (props: { data: ChartData<"line">; options: ChartOptions<"line">; "aria-label": string }) => {
    drawn.data = props.data;
    drawn.options = props.options;
    drawn.label = props["aria-label"];
    return <canvas role="img" aria-label={props["aria-label"]} />;
  },
}));
vi.mock("@/components/progress/skill-chart-lazy", () => ({ SkillChartLazy: ({ summary }: { summary: string }) => <p data-testid="chart">{summary}</p> }));
afterEach(() => cleanup());

const DAY = 86_400_000;
const d = (day: number) => new Date(Date.UTC(2026, 9, day, 12));

// Invented marks: three practicals; "Planning and safety" was not assessed in the second one.
const skills: SkillView[] = [
  {
    title: "Recording results",
    points: [
      { date: d(20), percent: 100, practical: "Peroxide and a catalyst" },
      { date: d(3), percent: 50, practical: "Gas over time" },
      { date: d(10), percent: 66.666, practical: "Chips and powder" },
    ],
    averagePercent: 72.2,
    latestPercent: 100,
    status: "secure",
  },
  {
    title: "Planning and safety",
    points: [
      { date: d(3), percent: 0, practical: "Gas over time" },
      { date: d(20), percent: 50, practical: "Peroxide and a catalyst" },
    ],
    averagePercent: 25,
    latestPercent: 50,
    status: "focus",
  },
  { title: "Never marked", points: [], averagePercent: 0, latestPercent: 0, status: "focus" },
];

describe("chart data shaping", () => {
  it("makes one line per skill with points in date order, whole percentages, and no line for a skill without points", () => {
    const series = skillSeries(skills);
    expect(series.map((s) => s.label)).toEqual(["Recording results", "Planning and safety"]);
    expect(series[0]!.points).toEqual([
      { x: d(3).getTime(), y: 50, practical: "Gas over time" },
      { x: d(10).getTime(), y: 67, practical: "Chips and powder" },
      { x: d(20).getTime(), y: 100, practical: "Peroxide and a catalyst" },
    ]);
  });

  it("reads dates sent as text (as JSON carries them) the same as dates", () => {
    const asText = skills.map((s) => ({ ...s, points: s.points.map((p) => ({ ...p, date: p.date.toISOString() })) }));
    expect(skillSeries(asText)).toEqual(skillSeries(skills));
  });

  it("marks each practical's date once on the x axis", () => {
    expect(seriesDates(skillSeries(skills))).toEqual([d(3).getTime(), d(10).getTime(), d(20).getTime()]);
  });

  it("leaves a twentieth of the span either side, at least three days, and centres a single practical", () => {
    // 17 days of data: a twentieth is under a day, so three days either side.
    expect(seriesRange(skillSeries(skills))).toEqual({ min: d(3).getTime() - 3 * DAY, max: d(20).getTime() + 3 * DAY });
    const long = skillSeries([{ title: "A", points: [{ date: new Date(Date.UTC(2026, 0, 1)), percent: 10, practical: "x" }, { date: new Date(Date.UTC(2026, 0, 1) + 200 * DAY), percent: 20, practical: "y" }] }]);
    expect(seriesRange(long)).toEqual({ min: Date.UTC(2026, 0, 1) - 10 * DAY, max: Date.UTC(2026, 0, 1) + 210 * DAY });
    const one = skillSeries([{ title: "A", points: [{ date: d(5), percent: 10, practical: "x" }] }]);
    const r = seriesRange(one)!;
    expect(d(5).getTime() - r.min).toBe(r.max - d(5).getTime());
    expect(seriesRange([])).toBeNull();
  });

  it("turns the lines into a table: a row per practical by date, a column per skill, blank where a skill was not assessed", () => {
    const t = chartTable(skillSeries(skills));
    expect(t.skills).toEqual(["Recording results", "Planning and safety"]);
    expect(t.rows.map((r) => [r.practical, ...r.percents])).toEqual([
      ["Gas over time", 50, 0],
      ["Chips and powder", 67, null],
      ["Peroxide and a catalyst", 100, 50],
    ]);
  });

  it("gives neighbouring lines different colours, point shapes and dashes, so colour is never the only difference", () => {
    const colours = ["blue", "copper", "green"];
    const looks = [0, 1, 2, 3].map((i) => lineLook(i, colours));
    for (let i = 1; i < looks.length; i++) {
      expect(looks[i]!.pointStyle).not.toBe(looks[i - 1]!.pointStyle);
      expect(looks[i]!.dash).not.toEqual(looks[i - 1]!.dash);
    }
    expect(looks[3]!.colour).toBe("blue");
  });

  it("writes dates the British way in the school's time zone", () => {
    expect(chartDate(Date.UTC(2026, 10, 5, 12))).toBe("5 Nov 2026");
    // 23:30 UTC on 31 October is still 31 October in London (GMT).
    expect(chartDate(Date.UTC(2026, 9, 31, 23, 30))).toBe("31 Oct 2026");
  });
});

describe("the chart and its table", () => {
  it("hands the chart one dataset per skill, ticks at each practical's date, and a 0–100% scale", () => {
    const series = skillSeries(skills);
    render(<SkillChart series={series} summary="A summary for screen readers." />);
    expect(screen.getByRole("img", { name: "A summary for screen readers." })).toBeTruthy();
    expect(drawn.data!.datasets.map((ds) => ds.label)).toEqual(["Recording results", "Planning and safety"]);
    expect(drawn.data!.datasets[0]!.data).toEqual(series[0]!.points);
    expect(drawn.data!.datasets[0]!.borderDash).not.toEqual(drawn.data!.datasets[1]!.borderDash);
    const x = drawn.options!.scales!.x!;
    const y = drawn.options!.scales!.y!;
    expect(y.min).toBe(0);
    expect(y.max).toBe(100);
    const axis = { ticks: [] as { value: number }[] };
    (x.afterBuildTicks as (a: typeof axis) => void)(axis);
    expect(axis.ticks.map((t) => t.value)).toEqual(seriesDates(series));
    const tick = (x.ticks as { callback: (v: number) => string }).callback;
    expect(tick(d(10).getTime())).toBe("10 Oct 2026");
    expect((y.ticks as { callback: (v: number) => string }).callback(75)).toBe("75%");
  });

  it("shows every number of the chart in a table, with 'not assessed' where a skill was not marked", () => {
    render(<SkillsOverTime skills={skills} />);
    expect(screen.getByTestId("chart").textContent).toBe(chartSummary(skills, 3));
    const table = screen.getByRole("table", { name: /chart's numbers/ });
    const rows = within(table).getAllByRole("row");
    expect(rows).toHaveLength(4);
    expect(within(rows[2]!).getByRole("rowheader").textContent).toContain("Chips and powder");
    expect(rows[2]!.textContent).toContain("67%");
    expect(rows[2]!.textContent).toContain("not assessed");
  });

  it("says the lines will grow when only one practical is marked, and shows no chart before any", () => {
    const one = [{ ...skills[0]!, points: [skills[0]!.points[0]!] }];
    render(<SkillsOverTime skills={one} />);
    expect(screen.getByText(/Only one practical has been marked so far/)).toBeTruthy();
    cleanup();
    render(<SkillsOverTime skills={[]} />);
    expect(screen.queryByTestId("chart")).toBeNull();
    expect(screen.getByText(/appears once marked work has been handed back/)).toBeTruthy();
  });
});

/**
 * Shapes skills over time for the progress chart and for its table (the chart's text alternative).
 * Plain functions with no chart library, so the server can shape the data and tests can check it.
 */

const DAY_MS = 86_400_000;

type SkillLike = { title: string; points: readonly { date: Date | string; percent: number; practical: string }[] };

/** One line of the chart: a skill, with a point per marked practical (x in milliseconds since 1970, y in percent). */
export type SkillSeries = { label: string; points: { x: number; y: number; practical: string }[] };

/** Each skill as a line: its points in date order, percentages rounded to whole numbers. */
export function skillSeries(skills: readonly SkillLike[]): SkillSeries[] {
  return skills
    .filter((s) => s.points.length > 0)
    .map((s) => ({
      label: s.title,
      points: s.points
        .map((p) => ({ x: new Date(p.date).getTime(), y: Math.round(p.percent), practical: p.practical }))
        .sort((a, b) => a.x - b.x),
    }));
}

/** The dates the chart marks on its x axis: one per marked practical, oldest first, without repeats. */
export function seriesDates(series: readonly SkillSeries[]): number[] {
  return [...new Set(series.flatMap((s) => s.points.map((p) => p.x)))].sort((a, b) => a - b);
}

/**
 * The x-axis range with room either side, so that the first and last points are not cut in half
 * and a single practical sits in the middle: a twentieth of the span, and at least three days.
 */
export function seriesRange(series: readonly SkillSeries[]): { min: number; max: number } | null {
  const dates = seriesDates(series);
  if (!dates.length) return null;
  const first = dates[0]!;
  const last = dates[dates.length - 1]!;
  const pad = Math.max(3 * DAY_MS, (last - first) / 20);
  return { min: first - pad, max: last + pad };
}

/**
 * The chart as a table: a row per marked practical (by date), a column per skill, each cell the
 * percentage of that skill's marks (null where the practical did not assess that skill).
 */
export function chartTable(series: readonly SkillSeries[]): { skills: string[]; rows: { date: number; practical: string; percents: (number | null)[] }[] } {
  const keyOf = (x: number, practical: string) => `${x}\u0000${practical}`;
  const rows = new Map<string, { date: number; practical: string; percents: (number | null)[] }>();
  series.forEach((s, col) => {
    for (const p of s.points) {
      const key = keyOf(p.x, p.practical);
      const row = rows.get(key) ?? { date: p.x, practical: p.practical, percents: series.map(() => null) };
      row.percents[col] = p.y;
      rows.set(key, row);
    }
  });
  return { skills: series.map((s) => s.label), rows: [...rows.values()].sort((a, b) => a.date - b.date || a.practical.localeCompare(b.practical)) };
}

/**
 * How each line looks, so lines differ by more than colour: a colour from the palette, a point
 * shape and a dash pattern, all repeating in different cycles.
 */
export function lineLook<C>(index: number, colours: readonly C[]): { colour: C; pointStyle: "circle" | "rect" | "triangle" | "rectRot" | "star" | "crossRot"; dash: number[] } {
  const shapes = ["circle", "rect", "triangle", "rectRot", "star", "crossRot"] as const;
  const dashes = [[], [8, 4], [2, 3], [10, 3, 2, 3]];
  return { colour: colours[index % colours.length]!, pointStyle: shapes[index % shapes.length]!, dash: dashes[index % dashes.length]! };
}

/** "5 Nov 2026" for the axis, the table and the tooltip. */
export function chartDate(ms: number): string {
  return new Date(ms).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "Europe/London" });
}

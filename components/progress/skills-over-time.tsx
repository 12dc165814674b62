import { Table, Td, Th } from "@/components/ui/table";
import { chartDate, chartTable, skillSeries } from "./chart-data";
import { SkillChartLazy } from "./skill-chart-lazy";
import type { SkillView } from "./types";

/** The words a screen reader hears for the chart: what it shows and where the numbers are. */
export function chartSummary(skills: readonly SkillView[], practicals: number): string {
  return `Line chart of ${skills.length} skill${skills.length === 1 ? "" : "s"} across ${practicals} marked practical${practicals === 1 ? "" : "s"}, as a share of the marks available. The table after the chart gives every number.`;
}

/**
 * Achievement per skill over the year: the line chart, and the same numbers as a table (shown on
 * the page, so that everyone, including screen-reader users and printed copies, has them).
 */
export function SkillsOverTime({ skills }: { skills: SkillView[] }) {
  const series = skillSeries(skills);
  const table = chartTable(series);
  if (!series.length) return <p className="text-muted">The chart appears once marked work has been handed back.</p>;
  return (
    <div className="flex flex-col gap-3">
      <div className="rounded-lg border border-line bg-surface p-3 progress-chart">
        <SkillChartLazy series={series} summary={chartSummary(skills, table.rows.length)} />
      </div>
      {table.rows.length === 1 ? <p className="text-sm text-muted">Only one practical has been marked so far: the lines grow as more work is handed back.</p> : null}
      <h3 className="font-semibold">The chart&apos;s numbers: share of the marks for each skill</h3>
      {/* A table on wider screens; on a phone the same numbers as one short list per practical. */}
      <div className="hidden sm:block">
        <Table>
          <caption className="sr-only">The chart&apos;s numbers: share of the marks for each skill, by practical</caption>
          <thead>
            <tr>
              <Th>Practical</Th>
              {table.skills.map((s) => (
                <Th key={s} className="whitespace-normal">
                  {s}
                </Th>
              ))}
            </tr>
          </thead>
          <tbody>
            {table.rows.map((r) => (
              <tr key={`${r.date}-${r.practical}`}>
                <Th scope="row" className="bg-transparent font-normal whitespace-normal">
                  <span className="block font-semibold">{r.practical}</span>
                  <span className="text-sm text-muted">{chartDate(r.date)}</span>
                </Th>
                {r.percents.map((p, i) => (
                  <Td key={table.skills[i]}>{p == null ? <span className="text-muted">not assessed</span> : `${p}%`}</Td>
                ))}
              </tr>
            ))}
          </tbody>
        </Table>
      </div>
      <ul className="flex flex-col gap-2 sm:hidden">
        {table.rows.map((r) => (
          <li key={`${r.date}-${r.practical}`} className="rounded-lg border border-line bg-surface p-3">
            <p className="font-semibold">{r.practical}</p>
            <p className="text-sm text-muted">{chartDate(r.date)}</p>
            <dl className="mt-1 grid grid-cols-[1fr_auto] gap-x-3">
              {r.percents.map((p, i) => (
                <div key={table.skills[i]} className="contents">
                  <dt>{table.skills[i]}</dt>
                  <dd className="text-right">{p == null ? <span className="text-muted">not assessed</span> : `${p}%`}</dd>
                </div>
              ))}
            </dl>
          </li>
        ))}
      </ul>
    </div>
  );
}

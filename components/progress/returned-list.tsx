import { Badge } from "@/components/ui/badge";
import type { ReturnedPractical } from "./types";
import { dayWords, marksSentence } from "./words";

/** One marked, handed-back practical: its marks, the level reached for each skill, and the teacher's feedback. */
function ReturnedCard({ work, headingLevel }: { work: ReturnedPractical; headingLevel: "h3" | "h4" }) {
  const H = headingLevel;
  const headingId = `returned-${work.writeUpId}`;
  return (
    <article aria-labelledby={headingId} className="progress-card flex flex-col gap-3 rounded-lg border border-line bg-surface p-4">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <H id={headingId} className="text-lg font-bold">
            {work.title}
          </H>
          <p className="text-sm text-muted">
            Handed back {dayWords(work.returnedAt)}
            {work.markerName ? ` by ${work.markerName}` : ""}
          </p>
        </div>
        {work.late ? <Badge tone="warn">Handed in late</Badge> : null}
      </div>
      <p className="text-lg font-semibold">{marksSentence(work.total, work.maxTotal)}</p>
      {work.criteria.length ? (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-[0.97rem]">
            <caption className="sr-only">Marks for each skill in {work.title}</caption>
            <thead>
              <tr className="border-b border-line text-sm text-muted">
                <th scope="col" className="py-1 pr-3 font-semibold">
                  Skill
                </th>
                <th scope="col" className="py-1 pr-3 font-semibold">
                  Level reached
                </th>
                <th scope="col" className="py-1 text-right font-semibold whitespace-nowrap">
                  Marks
                </th>
              </tr>
            </thead>
            <tbody>
              {work.criteria.map((c) => (
                <tr key={c.title} className="border-b border-line last:border-b-0">
                  <th scope="row" className="py-1.5 pr-3 font-normal">
                    {c.title}
                  </th>
                  <td className="py-1.5 pr-3">{c.level}</td>
                  <td className="py-1.5 text-right whitespace-nowrap">
                    {c.marks} of {c.max}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {work.feedback.trim() ? (
        <figure className="rounded-md border-l-4 border-brand bg-brand-soft px-3 py-2">
          <figcaption className="text-sm font-semibold text-brand-strong">Teacher&apos;s feedback</figcaption>
          <blockquote className="whitespace-pre-line">{work.feedback}</blockquote>
        </figure>
      ) : (
        <p className="text-sm text-muted">No written feedback with this one.</p>
      )}
    </article>
  );
}

/** Marked, handed-back practicals, newest first. Only work the teacher has handed back reaches this list (the server sees to it). */
export function ReturnedList({ items, headingLevel = "h3", emptyText }: { items: ReturnedPractical[]; headingLevel?: "h3" | "h4"; emptyText: string }) {
  if (!items.length) return <p className="text-muted">{emptyText}</p>;
  const newestFirst = [...items].sort((a, b) => new Date(b.returnedAt).getTime() - new Date(a.returnedAt).getTime());
  return (
    <ul className="flex flex-col gap-3">
      {newestFirst.map((w) => (
        <li key={w.writeUpId}>
          <ReturnedCard work={w} headingLevel={headingLevel} />
        </li>
      ))}
    </ul>
  );
}

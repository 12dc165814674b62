import Link from "next/link";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { PdfLink } from "./student-report";
import type { StudentProgressView } from "./types";
import { ComingList, MissedList } from "./work-lists";
import { dayWords, firstNameOf, marksSentence, skillGroups } from "./words";

/** The child's full report page. */
export function childReportHref(studentId: string): string {
  return `/children/${encodeURIComponent(studentId)}`;
}

/**
 * A parent's home-page card for one linked child: marked work with marks and feedback, what is
 * open and coming up, skills in plain words, and the way to the full report and the PDF.
 */
export function ChildCard({ progress }: { progress: StudentProgressView }) {
  const { student } = progress;
  const first = firstNameOf(student.name);
  const headingId = `child-${student.id}`;
  const newestFirst = [...progress.returned].sort((a, b) => new Date(b.returnedAt).getTime() - new Date(a.returnedAt).getTime());
  const groups = skillGroups(progress.skills).filter((g) => g.skills.length);
  const details = [student.yearGroup ? `Year ${student.yearGroup}` : null, student.classes.length ? `Science class${student.classes.length === 1 ? "" : "es"} ${student.classes.map((c) => c.name).join(", ")}` : "Not in a science class yet"].filter(Boolean).join(" · ");
  return (
    <article aria-labelledby={headingId} className="flex flex-col gap-5 rounded-xl border border-line bg-surface p-4 sm:p-5">
      <header>
        <h3 id={headingId} className="text-2xl font-bold">
          {student.name}
        </h3>
        <p className="text-muted">{details}</p>
      </header>

      <section aria-labelledby={`${headingId}-marked`} className="flex flex-col gap-2">
        <h4 id={`${headingId}-marked`} className="text-lg font-bold">
          Marked and handed back
        </h4>
        {newestFirst.length ? (
          <ul className="flex flex-col gap-3">
            {newestFirst.map((w) => (
              <li key={w.writeUpId} className="rounded-lg border border-line p-3">
                <p className="font-semibold">{w.title}</p>
                <p>
                  {marksSentence(w.total, w.maxTotal)} <span className="text-sm text-muted">· handed back {dayWords(w.returnedAt)}</span>
                </p>
                {w.late ? (
                  <p className="mt-1">
                    <Badge tone="warn">Handed in late</Badge>
                  </p>
                ) : null}
                {w.feedback.trim() ? (
                  <figure className="mt-2 rounded-md border-l-4 border-brand bg-brand-soft px-3 py-2">
                    <figcaption className="text-sm font-semibold text-brand-strong">{w.markerName ? `Feedback from ${w.markerName}` : "Teacher's feedback"}</figcaption>
                    <blockquote className="whitespace-pre-line">{w.feedback}</blockquote>
                  </figure>
                ) : null}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-muted">Nothing marked and handed back yet. Marks show here once the teacher hands {first}&apos;s work back.</p>
        )}
      </section>

      <section aria-labelledby={`${headingId}-coming`} className="flex flex-col gap-2">
        <h4 id={`${headingId}-coming`} className="text-lg font-bold">
          To do and coming up
        </h4>
        <ComingList items={progress.coming} emptyText="Nothing open or coming up just now." />
        {progress.missed.length ? (
          <>
            <p className="font-semibold">Not handed in before the deadline</p>
            <MissedList items={progress.missed} emptyText="" />
          </>
        ) : null}
      </section>

      <section aria-labelledby={`${headingId}-skills`} className="flex flex-col gap-2">
        <h4 id={`${headingId}-skills`} className="text-lg font-bold">
          Skills
        </h4>
        {groups.length ? (
          <dl className="flex flex-col gap-2">
            {groups.map((g) => (
              <div key={g.status}>
                <dt className="font-semibold">
                  {g.label} <span className="font-normal text-muted">({g.meaning.replace(/\.$/, "").toLowerCase()})</span>
                </dt>
                <dd>{g.skills.map((s) => s.title).join(", ")}</dd>
              </div>
            ))}
          </dl>
        ) : (
          <p className="text-muted">Skills show here once marked work has been handed back.</p>
        )}
      </section>

      <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">
        <Link href={childReportHref(student.id)} className={buttonClasses("primary")}>
          {first}&apos;s full progress report
        </Link>
        <PdfLink studentId={student.id} />
      </div>
      <p className="text-sm text-muted">
        Not sure what a word means? <Link href={`${childReportHref(student.id)}#glossary`}>See the words explained</Link>.
      </p>
    </article>
  );
}

import type { ReactNode } from "react";
import { buttonClasses } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { CalculationHistory } from "./calculation-history";
import { Glossary } from "./glossary";
import { PrintButton } from "./report-actions";
import { ReturnedList } from "./returned-list";
import { SkillGroups } from "./skill-summary";
import { SkillsOverTime } from "./skills-over-time";
import type { Reader, StudentProgressView } from "./types";
import { ComingList, MissedList } from "./work-lists";
import { firstNameOf, summaryLines } from "./words";
import "./report-print.css";

/** Where the term report PDF of a student downloads from. */
export function reportPdfHref(studentId: string): string {
  return `/api/students/${encodeURIComponent(studentId)}/report-pdf`;
}

/** A link that downloads the term report as a PDF. */
export function PdfLink({ studentId, variant = "secondary", className }: { studentId: string; variant?: "primary" | "secondary"; className?: string }) {
  return (
    <a href={reportPdfHref(studentId)} download className={buttonClasses(variant, "md", className)}>
      Download the term report (PDF)
    </a>
  );
}

function Section({ id, title, lead, children }: { id: string; title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="progress-section flex flex-col gap-3">
      <div>
        <h2 id={id} className="text-xl font-bold">
          {title}
        </h2>
        {lead ? <p className="mt-1 max-w-3xl text-muted">{lead}</p> : null}
      </div>
      {children}
    </section>
  );
}

/**
 * A student's progress report: in short, skills in plain words, each skill over the year as a
 * chart with its table, marked practicals with marks per skill and feedback, missed and coming
 * work, calculation checks (for the student and staff only: the data layer leaves them out for
 * parents), and the glossary. Prints cleanly; the PDF is the term's version of the same.
 */
export function StudentReport({ progress, reader, eyebrow }: { progress: StudentProgressView; reader: Reader; eyebrow: string }) {
  const { student } = progress;
  const first = firstNameOf(student.name);
  const you = reader === "student";
  const details = [student.yearGroup ? `Year ${student.yearGroup}` : null, student.classes.map((c) => c.name).join(", ") || null].filter(Boolean).join(" · ");
  return (
    <div className="progress-report flex flex-col gap-8">
      <PageHeader
        eyebrow={eyebrow}
        title={you ? "Your progress in practical science" : `${student.name}: practical science`}
        lead={details || undefined}
        actions={
          <>
            <PdfLink studentId={student.id} variant="primary" />
            <PrintButton />
          </>
        }
      />

      <Card className="progress-card flex flex-col gap-1 border-brand/40">
        <h2 className="text-lg font-bold">In short</h2>
        {summaryLines(progress, reader).map((line) => (
          <p key={line}>{line}</p>
        ))}
        <p className="mt-1 text-sm text-muted no-print">
          New to the words? <a href="#glossary">See what they mean</a>.
        </p>
      </Card>

      <Section
        id="skills-heading"
        title="Skills"
        lead={
          you
            ? "Each practical is marked on a few skills. Here is how each skill is going, from the share of the marks you got for it."
            : `Each practical is marked on a few skills. Here is how each one is going for ${first}, from the share of the marks for it.`
        }
      >
        <SkillGroups skills={progress.skills} />
      </Section>

      <Section id="chart-heading" title="Skills over the year" lead="Each line is one skill; each point is one marked practical. Higher is better: 100% means every mark for that skill.">
        <SkillsOverTime skills={progress.skills} />
      </Section>

      <Section id="returned-heading" title="Marked practicals" lead={you ? "Your marked work, newest first, with your teacher's feedback." : `Work the teacher has marked and handed back to ${first}, newest first.`}>
        <ReturnedList items={progress.returned} emptyText={you ? "Nothing has been marked and handed back yet." : `Nothing has been marked and handed back to ${first} yet.`} />
      </Section>

      <Section id="missed-heading" title="Not handed in" lead={progress.missed.length ? (you ? "These closed before you handed in a write-up. Ask your teacher whether you can still catch up." : `These closed before ${first} handed in a write-up. The teacher can say whether it can still be caught up.`) : undefined}>
        <MissedList items={progress.missed} emptyText={you ? "Nothing missed. Well done." : "Nothing missed."} />
      </Section>

      <Section id="coming-heading" title="Open and coming up" lead="Practicals to do now or soon, with their due dates.">
        <ComingList items={progress.coming} emptyText="Nothing open or coming up just now." />
      </Section>

      {progress.checkHistory ? (
        <Section id="checks-heading" title={you ? "Your calculations" : "Calculation checks"}>
          <CalculationHistory history={progress.checkHistory} reader={reader} />
        </Section>
      ) : null}

      <Glossary reader={reader} />
    </div>
  );
}

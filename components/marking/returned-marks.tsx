import { Card } from "@/components/ui/card";
import type { PracticalContent } from "@/lib/validation/practicals";
import { formatMarks } from "./status";

type ReturnedMark = {
  criteria: Record<string, { levelId: string; marks: number }>;
  comments: Record<string, string>;
  feedback: string;
  total: number;
  maxTotal: number;
};

const SECTION_NAMES: Record<string, string> = { plan: "Plan", observations: "Observations", conclusion: "Conclusion", evaluation: "Evaluation" };

/** The part of the write-up a comment was left on, by the key the marking desk gives it ("plan", "table:<id>", "check:<id>", …). */
function partName(key: string, practical: PracticalContent): string {
  if (SECTION_NAMES[key]) return SECTION_NAMES[key];
  const [kind, id] = key.split(":");
  if (kind === "table") return `Results: ${practical.tables.find((t) => t.id === id)?.title ?? "table"}`;
  if (kind === "graph") return `Graph: ${practical.graphs.find((g) => g.id === id)?.title ?? "graph"}`;
  if (kind === "check") return `Calculation: ${practical.checks.find((c) => c.id === id)?.label ?? "calculation"}`;
  return "Your write-up";
}

/**
 * The marks of a returned write-up as the student sees them: the total, the level reached for
 * each rubric criterion, the teacher's feedback and their comments on parts of the work.
 */
export function ReturnedMarks({ mark, practical, reader = "student" }: { mark: ReturnedMark; practical: PracticalContent; reader?: "student" | "staff" }) {
  const criteria = practical.rubric?.criteria ?? [];
  const comments = Object.entries(mark.comments).filter(([, text]) => text.trim());
  return (
    <Card className="flex flex-col gap-4 border-brand/40">
      <section aria-labelledby="returned-marks-heading" className="flex flex-col gap-4">
        <div>
          <h2 id="returned-marks-heading" className="text-xl font-bold">
            {reader === "student" ? "Your marks" : "Marks"}
          </h2>
          <p className="text-lg">
            <span className="font-bold tabular-nums">{formatMarks(mark.total)}</span> out of {mark.maxTotal}
          </p>
        </div>
        {criteria.length ? (
          <div className="overflow-x-auto">
            <table className="w-full border-collapse text-left text-[0.97rem]">
              <caption className="sr-only">The level reached for each part of the rubric</caption>
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
                {criteria.map((c) => {
                  const got = mark.criteria[c.id];
                  const level = c.levels.find((l) => l.id === got?.levelId);
                  const max = Math.max(0, ...c.levels.map((l) => l.marks));
                  return (
                    <tr key={c.id} className="border-b border-line last:border-b-0">
                      <th scope="row" className="py-1.5 pr-3 font-normal">
                        {c.title}
                      </th>
                      <td className="py-1.5 pr-3">
                        {level ? (
                          <>
                            <span className="font-semibold">{level.label}</span>
                            {level.descriptor ? <span className="block text-sm text-muted">{level.descriptor}</span> : null}
                          </>
                        ) : (
                          <span className="text-muted">Not marked</span>
                        )}
                      </td>
                      <td className="py-1.5 text-right whitespace-nowrap tabular-nums">{got ? `${got.marks} of ${max}` : "—"}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        ) : null}
        {mark.feedback.trim() ? (
          <figure className="rounded-md border-l-4 border-brand bg-brand-soft px-3 py-2">
            <figcaption className="text-sm font-semibold text-brand-strong">Teacher&apos;s feedback</figcaption>
            <blockquote className="whitespace-pre-line">{mark.feedback}</blockquote>
          </figure>
        ) : null}
        {comments.length ? (
          <div className="flex flex-col gap-2">
            <h3 className="font-bold">Comments on parts of the write-up</h3>
            <ul className="flex flex-col gap-2">
              {comments.map(([key, text]) => (
                <li key={key} className="rounded-md border-l-4 border-accent bg-accent-soft px-3 py-2">
                  <span className="block text-sm font-semibold">{partName(key, practical)}</span>
                  <span className="whitespace-pre-line">{text}</span>
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </section>
    </Card>
  );
}

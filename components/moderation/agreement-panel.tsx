import type { AgreementJson, SampleJson } from "@/components/marking/types";
import { AgreementVerdict, percent, signed } from "./words";

function leaning(meanLevelDifference: number): string {
  if (Math.abs(meanLevelDifference) < 0.05) return "no lean";
  return meanLevelDifference > 0 ? "second marker higher" : "second marker lower";
}

/**
 * How well the teacher's marking agrees with the second marking on the finished pieces: per
 * criterion and on totals, with the verdict and its reasons in plain words.
 */
export function AgreementPanel({ agreement, criteria, toleranceMarks }: { agreement: AgreementJson; criteria: NonNullable<SampleJson["rubric"]>["criteria"]; toleranceMarks: number }) {
  const title = (id: string) => criteria.find((c) => c.id === id)?.title ?? id;
  const t = agreement.totals;
  return (
    <section aria-labelledby="agreement-heading" className="flex flex-col gap-4 rounded-lg border border-line bg-surface p-4">
      <div className="flex flex-col gap-2">
        <h2 id="agreement-heading" className="text-xl font-bold">
          Agreement
        </h2>
        <p className="text-muted">
          From the {agreement.count} piece{agreement.count === 1 ? "" : "s"} second-marked so far.
        </p>
        <div>
          <AgreementVerdict verdict={agreement.verdict} />
        </div>
        <ul className="list-disc pl-6">
          {agreement.reasons.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      </div>

      <div className="flex flex-col gap-2">
        <h3 className="text-lg font-bold">Totals</h3>
        <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
          <dt className="font-semibold">Within {toleranceMarks} mark{toleranceMarks === 1 ? "" : "s"}</dt>
          <dd>{percent(t.withinToleranceShare)} of pieces</dd>
          <dt className="font-semibold">Mean difference</dt>
          <dd>
            {signed(t.meanDifference)} marks <span className="text-muted">(second total minus the teacher&apos;s: {t.meanDifference > 0 ? "the teacher marked lower" : t.meanDifference < 0 ? "the teacher marked higher" : "no lean"})</span>
          </dd>
          <dt className="font-semibold">Mean size of difference</dt>
          <dd>{t.meanAbsoluteDifference.toFixed(1)} marks</dd>
          <dt className="font-semibold">Largest difference</dt>
          <dd>{signed(t.largestDifference, 0)} marks</dd>
        </dl>
      </div>

      <div className="flex flex-col gap-2">
        <h3 className="text-lg font-bold">By criterion</h3>
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left text-[0.97rem]">
            <caption className="sr-only">Agreement on each criterion</caption>
            <thead>
              <tr>
                {["Criterion", "Pieces", "Same level", "Within one level", "Mean level difference", "Weighted kappa"].map((h) => (
                  <th key={h} scope="col" className="border-b border-line bg-sunken px-3 py-2 align-bottom font-semibold">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {agreement.criteria.map((c) => (
                <tr key={c.id}>
                  <th scope="row" className="border-b border-line px-3 py-2 font-semibold">
                    {title(c.id)}
                  </th>
                  <td className="border-b border-line px-3 py-2 tabular-nums">{c.count}</td>
                  <td className="border-b border-line px-3 py-2 tabular-nums">{percent(c.exactShare)}</td>
                  <td className="border-b border-line px-3 py-2 tabular-nums">{percent(c.withinOneLevelShare)}</td>
                  <td className="border-b border-line px-3 py-2">
                    <span className="tabular-nums">{signed(c.meanLevelDifference, 2)}</span> <span className="text-sm text-muted">({leaning(c.meanLevelDifference)})</span>
                  </td>
                  <td className="border-b border-line px-3 py-2 tabular-nums">{c.kappa === null ? <span className="text-sm text-muted">needs two pieces</span> : c.kappa.toFixed(2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="text-sm text-muted">
          Weighted kappa is how much more often the two markers agree than chance alone would give: 1 is full agreement, 0 no better than chance, below 0 worse; a level apart counts as part agreement. Source: Cohen (1968), weighted kappa, linear weights.
        </p>
      </div>
    </section>
  );
}

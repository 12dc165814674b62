import type { ReactNode } from "react";
import { CheckOutcomeRows, fourFigures as num } from "@/components/write-up/check-outcome-rows";
import { RichTextView } from "@/components/editor/rich-text-view";
import type { CheckSpec } from "@/lib/validation/practicals";
import type { StoredAnswer } from "@/lib/validation/write-ups";
import { formatDateTime } from "@/lib/utils";
import { VerdictMark } from "./status";
import type { CheckStateJson } from "@/components/write-up/types";

const perRow = (spec: CheckSpec) => spec.kind === "reciprocal-time" || spec.kind === "mean-of-repeats";

/**
 * One calculation check as a marker reads it: the student's answer and working, the engine's
 * verdict, the value expected from this student's own data, how far off the answer is, the
 * likely slip and the reason.
 */
export function CheckOutcomeView({ spec, answer, state, footer }: { spec: CheckSpec; answer: StoredAnswer | undefined; state: CheckStateJson | undefined; footer?: ReactNode }) {
  const o = state?.outcome;
  const headingId = `check-${spec.id}-heading`;
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-2 rounded-lg border border-line bg-surface p-3 sm:p-4 print:break-inside-avoid">
      <h3 id={headingId} className="font-bold">
        {spec.label}
      </h3>
      {perRow(spec) ? (
        <p className="text-sm text-muted">Answered row by row in the results table.</p>
      ) : (
        <p>
          <span className="font-semibold">Answer: </span>
          {answer?.value?.trim() ? (
            <span className="tabular-nums">
              {answer.value}
              {answer.unit?.trim() ? ` ${answer.unit}` : ""}
            </span>
          ) : (
            <span className="text-muted">not given</span>
          )}
        </p>
      )}
      {answer?.working ? (
        <div className="rounded-md border border-line bg-paper p-2">
          <p className="text-sm font-semibold">Working</p>
          <RichTextView doc={answer.working} headingOffset={3} />
        </div>
      ) : null}
      {!o ? (
        <p className="text-muted">The student did not run this check.</p>
      ) : (
        <div className="flex flex-col gap-1.5">
          <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <VerdictMark verdict={o.verdict} stale={state.stale} className="text-base" />
            <span className="text-sm text-muted">checked {formatDateTime(state.ranAt)}</span>
          </p>
          <dl className="grid gap-x-4 gap-y-0.5 text-[0.97rem] sm:grid-cols-[max-content_1fr]">
            <CheckOutcomeRows outcome={o} tolerancePercent={spec.tolerancePercent} />
            {o.reason ? (
              <>
                <dt className="font-semibold">Why</dt>
                <dd>{o.reason}</dd>
              </>
            ) : null}
          </dl>
          {o.rows?.length ? (
            <div className="overflow-x-auto">
              <table className="border-collapse text-sm">
                <caption className="sr-only">Row by row</caption>
                <thead>
                  <tr>
                    <th scope="col" className="border-b border-line px-2 py-1 text-left">
                      Row
                    </th>
                    <th scope="col" className="border-b border-line px-2 py-1 text-right">
                      Student
                    </th>
                    <th scope="col" className="border-b border-line px-2 py-1 text-right">
                      Expected
                    </th>
                    <th scope="col" className="border-b border-line px-2 py-1 text-left">
                      Verdict
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {o.rows.map((r) => (
                    <tr key={r.index}>
                      <td className="border-b border-line px-2 py-1">{r.index + 1}</td>
                      <td className="border-b border-line px-2 py-1 text-right tabular-nums">{r.typed != null ? num(r.typed) : "—"}</td>
                      <td className="border-b border-line px-2 py-1 text-right tabular-nums">{r.expected != null ? num(r.expected) : "—"}</td>
                      <td className="border-b border-line px-2 py-1">
                        <VerdictMark verdict={r.verdict} />
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
        </div>
      )}
      {footer}
    </section>
  );
}

import type { ReactNode } from "react";
import { CheckOutcomeRows, fourFigures as num } from "@/components/write-up/check-outcome-rows";
import { Badge } from "@/components/ui/badge";
import { Table, Td, Th } from "@/components/ui/table";
import type { CheckSpec, TableTemplate } from "@/lib/validation/practicals";
import { checkInstructions, isPerRowCheck } from "./check-words";
import type { CheckStateJson } from "./types";
import { VerdictBadge } from "./verdict";


/**
 * One calculation check as the teacher sees it: the student's answer and working, the verdict,
 * and everything behind it — the value expected from this student's own data, how far off the
 * answer is, significant figures, unit, the likely slip and the engine's reason.
 */
export function StaffCheckOutcome({
  spec,
  table,
  answer,
  state,
  working,
}: {
  spec: CheckSpec;
  table: TableTemplate | undefined;
  answer: { value: string; unit: string } | undefined;
  state: CheckStateJson | undefined;
  working: ReactNode;
}) {
  const o = state?.outcome;
  const perRow = isPerRowCheck(spec);
  return (
    <section aria-labelledby={`staff-check-${spec.id}`} className="flex flex-col gap-3 rounded-lg border border-line bg-surface p-4">
      <div>
        <h3 id={`staff-check-${spec.id}`} className="text-lg font-bold">
          {spec.label}
        </h3>
        <p className="text-[0.95rem] text-muted">{checkInstructions(spec, table, null)}</p>
      </div>
      {perRow ? null : (
        <p>
          <span className="font-semibold">Student&apos;s answer: </span>
          {answer?.value?.trim() ? `${answer.value}${answer.unit?.trim() ? ` ${answer.unit}` : ""}` : <span className="text-muted">not given</span>}
        </p>
      )}
      {working}
      {!state || !o ? (
        <p className="text-muted">The student has not run this check.</p>
      ) : (
        <div className="flex flex-col gap-2 rounded-md border border-line bg-paper p-3">
          <p className="flex flex-wrap items-center gap-2">
            <VerdictBadge verdict={o.verdict} muted={state.stale} />
            {state.stale ? <Badge tone="warn">Stale: data or answer changed since</Badge> : null}
            <span className="text-sm text-muted">Run {new Date(state.ranAt).toLocaleString("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" })}</span>
          </p>
          <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
            <CheckOutcomeRows outcome={o} tolerancePercent={spec.tolerancePercent} />
            <dt className="font-semibold">Hint shown</dt>
            <dd>{spec.show === "verdict" ? <span className="text-muted">none (verdict only)</span> : o.hint}</dd>
            <dt className="font-semibold">Reason</dt>
            <dd>{o.reason || <span className="text-muted">none given</span>}</dd>
          </dl>
          {o.rows?.length ? (
            <Table>
              <thead>
                <tr>
                  <Th>Row</Th>
                  <Th>Student</Th>
                  <Th>Expected</Th>
                  <Th>Verdict</Th>
                </tr>
              </thead>
              <tbody>
                {o.rows.map((r) => (
                  <tr key={r.index}>
                    <Td>{r.index + 1}</Td>
                    <Td>{r.typed != null ? num(r.typed) : "—"}</Td>
                    <Td>{r.expected != null ? num(r.expected) : "—"}</Td>
                    <Td>
                      <VerdictBadge verdict={r.verdict} className="text-sm" />
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          ) : null}
        </div>
      )}
    </section>
  );
}

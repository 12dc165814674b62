"use client";

import { useMutation } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Textarea } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { cn, formatDateTime } from "@/lib/utils";
import type { SampleJson, SuggestionJson } from "@/components/marking/types";
import { signed } from "./words";

const AdjustmentChart = dynamic(() => import("./adjustment-chart").then((m) => m.AdjustmentChart), {
  ssr: false,
  loading: () => (
    <div className="flex h-72 max-w-xl items-center justify-center rounded-md border border-line bg-paper text-muted" role="status">
      Loading the graph…
    </div>
  ),
});

type Decision = SampleJson["adjustments"][number];

const num = (n: number, d = 2) => String(Number(n.toFixed(d)));

/** The suggested line in words: new total = slope × teacher's total ± intercept, rounded. */
export function lineInWords(s: Pick<SuggestionJson, "slope" | "intercept">, maxTotal: number): string {
  const b = Math.abs(s.intercept) < 0.005 ? "" : ` ${s.intercept > 0 ? "+" : "−"} ${num(Math.abs(s.intercept))}`;
  return `new total = ${num(s.slope)} × teacher's total${b}, rounded to whole marks and kept between 0 and ${maxTotal}`;
}

/**
 * The adjustment the second marking suggests for the whole cohort: the scatter with its fitted
 * line, the before/after table for everyone, and Accept or Reject with a reason. Once decided,
 * the decision is shown instead of the form (and the server refuses a second one).
 */
export function AdjustmentPanel({ sampleId, suggestion, maxTotal, decisions, onDecided }: { sampleId: string; suggestion: SuggestionJson; maxTotal: number; decisions: Decision[]; onDecided: () => Promise<void> }) {
  const [decision, setDecision] = useState<"accept" | "reject" | "">("");
  const [reason, setReason] = useState("");
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ tone: "good" | "bad"; text: string } | null>(null);
  const name = useId();
  const decided = decisions.find((d) => d.status === "accepted" || d.status === "rejected");
  const changed = suggestion.changes.filter((c) => c.after !== c.before).length;

  const decide = useMutation({
    mutationFn: (body: { decision: "accept" | "reject"; reason: string }) => fetchJson<{ status: string; changed: number }>(`/api/moderation/samples/${sampleId}/adjustment`, { method: "POST", json: body }),
    onSuccess: async (res) => {
      setErrors({});
      setMessage({ tone: "good", text: res.status === "accepted" ? `Accepted: ${res.changed} marks now show the adjusted total; the teacher's own marks are kept beside them.` : "Rejected: no marks were changed. The decision and your reason are recorded." });
      await onDecided();
    },
    onError: (e) => {
      setErrors(e instanceof ApiError ? e.fieldErrors : {});
      setMessage({ tone: "bad", text: e instanceof ApiError ? e.message : "Something went wrong. Please try again." });
    },
  });

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const local: Record<string, string[]> = {};
    if (!decision) local.decision = ["Choose Accept or Reject."];
    if (reason.trim().length < 3) local.reason = ["Give a reason for the decision."];
    if (Object.keys(local).length) {
      setErrors(local);
      setMessage({ tone: "bad", text: "Not recorded yet: the decision needs attention." });
      return;
    }
    decide.mutate({ decision: decision as "accept" | "reject", reason });
  };

  return (
    <section aria-labelledby="adjust-heading" className="flex flex-col gap-4 rounded-lg border border-line bg-surface p-4">
      <div>
        <h2 id="adjust-heading" className="text-xl font-bold">
          Suggested adjustment for the whole cohort
        </h2>
        <p className="mt-1">
          The second marking differs from the teacher&apos;s in a consistent way, so the marks of everyone in the cohort could be moved along the line fitted to the sample: <strong>{lineInWords(suggestion, maxTotal)}</strong>.
          {suggestion.rSquared !== null ? ` The line fits the sample with R² = ${num(suggestion.rSquared)}.` : ""} {changed} of {suggestion.changes.length} totals would change.
        </p>
      </div>
      <AdjustmentChart suggestion={suggestion} maxTotal={maxTotal} />
      <details className="rounded-md border border-line" open={suggestion.changes.length <= 40}>
        <summary className="cursor-pointer px-3 py-2 font-semibold">Before and after, for everyone ({suggestion.changes.length})</summary>
        <div className="max-h-[28rem] overflow-auto">
          <table className="w-full border-collapse text-left text-[0.97rem]">
            <caption className="sr-only">Totals before and after the suggested adjustment</caption>
            <thead className="sticky top-0">
              <tr>
                {["Student", "Teacher's total", "After", "Change"].map((h) => (
                  <th key={h} scope="col" className="border-b border-line bg-sunken px-3 py-2 font-semibold">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {suggestion.changes.map((c) => (
                <tr key={c.id}>
                  <td className="border-b border-line px-3 py-1.5">{c.studentName}</td>
                  <td className="border-b border-line px-3 py-1.5 tabular-nums">{c.before}</td>
                  <td className={cn("border-b border-line px-3 py-1.5 tabular-nums", c.after !== c.before && "font-semibold")}>{c.after}</td>
                  <td className="border-b border-line px-3 py-1.5 tabular-nums">{c.after === c.before ? <span className="text-muted">none</span> : signed(c.after - c.before, 0)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
      {decided ? (
        <p className={cn("rounded-md border p-3", decided.status === "accepted" ? "border-good/40 bg-good-soft" : "border-line bg-sunken")}>
          <strong>{decided.status === "accepted" ? "Accepted" : "Rejected"}</strong>
          {decided.decidedAt ? ` ${formatDateTime(decided.decidedAt)}` : ""}
          {decided.status === "accepted" ? `, changing ${decided.changes} mark${decided.changes === 1 ? "" : "s"}` : ""}. Reason: {decided.reason || "none given"}
        </p>
      ) : (
        <form onSubmit={submit} noValidate className="flex flex-col gap-3 no-print">
          <fieldset className="flex flex-col gap-1" aria-describedby={errors.decision ? "decision-error" : undefined}>
            <legend className="font-semibold">Your decision</legend>
            <label className="flex items-center gap-2">
              <input type="radio" name={name} value="accept" checked={decision === "accept"} onChange={() => setDecision("accept")} className="size-4 accent-brand" />
              Accept: apply the adjusted totals to the whole cohort (the teacher&apos;s own marks are kept)
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" name={name} value="reject" checked={decision === "reject"} onChange={() => setDecision("reject")} className="size-4 accent-brand" />
              Reject: leave every mark as it is
            </label>
            {errors.decision ? (
              <p id="decision-error" className="text-sm font-semibold text-bad">
                {errors.decision.join(" ")}
              </p>
            ) : null}
          </fieldset>
          <div className="flex flex-col gap-1">
            <label htmlFor="decision-reason" className="font-semibold">
              Reason
            </label>
            <Textarea
              id="decision-reason"
              value={reason}
              maxLength={600}
              onChange={(e) => setReason(e.target.value)}
              aria-invalid={errors.reason ? true : undefined}
              aria-describedby={`decision-reason-hint${errors.reason ? " decision-reason-error" : ""}`}
            />
            <p id="decision-reason-hint" className="text-sm text-muted">
              Recorded with the decision, and in the audit trail.
            </p>
            {errors.reason ? (
              <p id="decision-reason-error" className="text-sm font-semibold text-bad">
                {errors.reason.join(" ")}
              </p>
            ) : null}
          </div>
          <div>
            <Button type="submit" disabled={decide.isPending}>
              {decide.isPending ? "Recording…" : "Record the decision"}
            </Button>
          </div>
        </form>
      )}
      <div role="status" aria-live="polite">
        {message ? <p className={cn("rounded-md border p-2", message.tone === "good" ? "border-good/40 bg-good-soft" : "border-bad/40 bg-bad-soft")}>{message.text}</p> : null}
      </div>
    </section>
  );
}

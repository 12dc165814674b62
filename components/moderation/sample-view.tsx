"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Badge } from "@/components/ui/badge";
import { PageHeader } from "@/components/ui/page-header";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { cn } from "@/lib/utils";
import type { SampleJson } from "@/components/marking/types";
import { AdjustmentPanel } from "./adjustment-panel";
import { AgreementPanel } from "./agreement-panel";
import { SampleChangesForm } from "./sample-changes-form";
import { SampleItemsTable } from "./sample-items-table";
import { ruleInWords } from "./words";

/**
 * One moderation sample: the pieces and why each was chosen, second-marking progress, the
 * teacher's totals (hidden while blind until each piece is second-marked), adding or swapping
 * work, agreement once pieces are second-marked, the suggested cohort adjustment with its
 * decision, and finishing the sample.
 */
export function SampleView({ initial }: { initial: SampleJson }) {
  const sampleId = initial.id;
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: ["sample", sampleId],
    queryFn: () => fetchJson<SampleJson>(`/api/moderation/samples/${sampleId}`),
    initialData: initial,
    refetchOnWindowFocus: true,
  });
  const s = query.data;
  const [notice, setNotice] = useState<{ tone: "good" | "bad"; text: string } | null>(null);
  const active = s.items.filter((i) => !i.removed);
  const removed = s.items.filter((i) => i.removed);
  const finished = active.filter((i) => i.moderation?.completed).length;
  const open = s.status === "open";

  const refresh = async () => {
    await queryClient.invalidateQueries({ queryKey: ["sample", sampleId] });
    await queryClient.invalidateQueries({ queryKey: ["samples"] });
  };

  const complete = useMutation({
    mutationFn: () => fetchJson<SampleJson>(`/api/moderation/samples/${sampleId}`, { method: "PATCH", json: { status: "completed" } }),
    onSuccess: async (next) => {
      queryClient.setQueryData(["sample", sampleId], next);
      setNotice({ tone: "good", text: "This sample is finished. It stays here for the record; nothing in it can be second-marked any more." });
      await queryClient.invalidateQueries({ queryKey: ["samples"] });
    },
    onError: (e) => setNotice({ tone: "bad", text: e instanceof ApiError ? e.message : "Something went wrong. Please try again." }),
  });

  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link href="/moderation">← All moderation samples</Link>
      </p>
      <PageHeader
        eyebrow="Moderation sample"
        title={s.scope}
        lead={
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone={open ? "brand" : "good"}>{open ? "In progress" : "Finished"}</Badge>
            <span>
              {finished} of {active.length} second-marked · drawn from {s.cohortSize} marked piece{s.cohortSize === 1 ? "" : "s"}
            </span>
          </span>
        }
      />
      <dl className="grid gap-x-6 gap-y-1 rounded-lg border border-line bg-surface p-4 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Rule</dt>
        <dd>{ruleInWords(s.rule)}</dd>
        <dt className="font-semibold">Recorded seed</dt>
        <dd>
          <span className="tabular-nums">{s.seed}</span> <span className="text-muted">(the same seed and marked work always give the same draw)</span>
        </dd>
        <dt className="font-semibold">Blind</dt>
        <dd>
          {s.blind
            ? s.isModerator
              ? "Yes: the teacher's marks are hidden from you until you finish second-marking each piece."
              : "Yes: the moderator sees the teacher's marks only after finishing each piece."
            : "No: the teacher's marks are shown alongside."}
        </dd>
        <dt className="font-semibold">Tolerance</dt>
        <dd>
          {s.toleranceMarks} mark{s.toleranceMarks === 1 ? "" : "s"} between totals counts as agreeing
        </dd>
      </dl>
      {!s.isModerator ? <p className="rounded-md border border-line bg-sunken p-3">You can read this sample as an admin; only its moderator second-marks the work.</p> : null}

      <section aria-labelledby="items-heading" className="flex flex-col gap-3">
        <h2 id="items-heading" className="text-xl font-bold">
          Work in the sample
        </h2>
        <SampleItemsTable sampleId={sampleId} items={active} blind={s.blind} showClass={!!s.practicalId} youAreModerator={s.isModerator} />
        {removed.length ? (
          <div>
            <h3 className="font-semibold">Taken out of the sample</h3>
            <ul className="list-disc pl-6">
              {removed.map((r) => (
                <li key={r.writeUpId}>
                  {r.studentName}: {r.removedReason || "no reason recorded"}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </section>

      {open ? (
        <details className="rounded-lg border border-line bg-surface p-4">
          <summary className="cursor-pointer text-lg font-bold">Add or swap work</summary>
          <div className="mt-3">
            <SampleChangesForm
              sample={s}
              onChanged={async (next, text) => {
                queryClient.setQueryData(["sample", sampleId], next);
                setNotice({ tone: "good", text });
                await queryClient.invalidateQueries({ queryKey: ["samples"] });
              }}
            />
          </div>
        </details>
      ) : null}

      {s.agreement && s.rubric ? (
        <AgreementPanel agreement={s.agreement} criteria={s.rubric.criteria} toleranceMarks={s.toleranceMarks} />
      ) : (
        <p className="rounded-lg border border-dashed border-line bg-surface p-4 text-muted">Agreement is worked out once at least one piece has been second-marked to the end.</p>
      )}

      {s.suggestion ? (
        <AdjustmentPanel sampleId={sampleId} suggestion={s.suggestion} maxTotal={s.maxTotal} decisions={s.adjustments} onDecided={refresh} />
      ) : s.adjustments.length ? (
        <p className="rounded-md border border-line bg-sunken p-3">
          An adjustment was {s.adjustments[0]!.status}: {s.adjustments[0]!.reason || "no reason recorded"}.
        </p>
      ) : null}

      <div role="status" aria-live="polite">
        {notice ? <p className={cn("rounded-md border p-3", notice.tone === "good" ? "border-good/40 bg-good-soft" : "border-bad/40 bg-bad-soft")}>{notice.text}</p> : null}
      </div>

      {open ? (
        <div className="flex flex-col gap-2 border-t border-line pt-4">
          <h2 className="text-lg font-bold">Finish this sample</h2>
          <p className="text-muted">
            {finished < active.length ? `${active.length - finished} piece${active.length - finished === 1 ? " is" : "s are"} not second-marked yet. ` : "Every piece is second-marked. "}
            Finishing closes the sample: nothing more can be second-marked, added or swapped.
          </p>
          <div>
            <ConfirmButton label="Finish this sample" variant="secondary" question="Finish this sample? Second marking, adding and swapping stop; the sample stays for the record." confirmLabel="Finish it" busy={complete.isPending} onConfirm={() => complete.mutate()} />
          </div>
        </div>
      ) : null}
    </div>
  );
}

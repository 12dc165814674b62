"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { LoadError, Loading } from "@/components/admin/query-state";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { fetchJson } from "@/lib/fetch-json";
import { formatDate } from "@/lib/utils";
import type { SampleDrawn, SampleSummaryJson } from "@/components/marking/types";
import { DrawSampleForm, type Drawer } from "./draw-sample-form";

function Progress({ done, of }: { done: number; of: number }) {
  const share = of ? done / of : 0;
  return (
    <span className="flex items-center gap-2">
      <span className="block h-2 w-24 overflow-hidden rounded-full border border-line bg-sunken" aria-hidden="true">
        <span className="block h-full bg-brand" style={{ width: `${Math.round(share * 100)}%` }} />
      </span>
      <span className="whitespace-nowrap tabular-nums">
        {done} of {of} second-marked
      </span>
    </span>
  );
}

/** Moderation samples assigned to me (every sample, for an admin), and drawing a new one. */
export function ModerationHome({ me }: { me: Drawer }) {
  const queryClient = useQueryClient();
  const samples = useQuery({ queryKey: ["samples"], queryFn: () => fetchJson<{ samples: SampleSummaryJson[] }>("/api/moderation/samples") });
  const [drawing, setDrawing] = useState(false);
  const [drawn, setDrawn] = useState<SampleDrawn | null>(null);
  const formHeading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    if (drawing) formHeading.current?.focus();
  }, [drawing]);

  const list = samples.data?.samples ?? [];
  const open = list.filter((s) => s.status === "open");
  const done = list.filter((s) => s.status === "completed");

  const table = (rows: SampleSummaryJson[], caption: string) => (
    <div className="overflow-x-auto rounded-lg border border-line bg-surface">
      <table className="w-full border-collapse text-left text-[0.97rem]">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr>
            <th scope="col" className="border-b border-line bg-sunken px-3 py-2 font-semibold">
              Sample of
            </th>
            {me.admin ? (
              <th scope="col" className="border-b border-line bg-sunken px-3 py-2 font-semibold">
                Moderator
              </th>
            ) : null}
            <th scope="col" className="border-b border-line bg-sunken px-3 py-2 font-semibold">
              Progress
            </th>
            <th scope="col" className="border-b border-line bg-sunken px-3 py-2 font-semibold">
              Drawn
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((s) => (
            <tr key={s.id}>
              <td className="border-b border-line px-3 py-2">
                <Link href={`/moderation/${s.id}`} className="font-semibold">
                  {s.scope}
                </Link>
                {s.status === "completed" ? (
                  <Badge tone="good" className="ml-2 text-xs">
                    finished
                  </Badge>
                ) : null}
              </td>
              {me.admin ? <td className="border-b border-line px-3 py-2">{s.moderatorName}</td> : null}
              <td className="border-b border-line px-3 py-2">
                <Progress done={s.secondMarked} of={s.items} />
              </td>
              <td className="border-b border-line px-3 py-2 whitespace-nowrap">{formatDate(s.createdAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Moderation"
        lead={me.admin ? "Every moderation sample in the school. A moderator second-marks a sample of marked work to check that marking is consistent." : "Moderation samples drawn for you. Second-mark each piece, then compare your marks with the teacher's."}
        actions={
          <Button variant={drawing ? "secondary" : "primary"} aria-expanded={drawing} aria-controls="draw-sample" onClick={() => setDrawing((d) => !d)}>
            {drawing ? "Close the form" : "Draw a sample"}
          </Button>
        }
      />
      {drawn ? (
        <Alert tone="good" title="Sample drawn">
          <p>
            {drawn.ids.length} piece{drawn.ids.length === 1 ? "" : "s"} of work from a cohort of {drawn.cohortSize}. Recorded seed: <strong className="tabular-nums">{drawn.seed}</strong> — drawing again from the same marked work with this seed gives the same sample.
          </p>
          <p className="mt-1">
            <Link href={`/moderation/${drawn.sampleId}`} className="font-semibold">
              Open the sample
            </Link>
          </p>
        </Alert>
      ) : null}
      {drawing ? (
        <Card id="draw-sample">
          <h2 ref={formHeading} tabIndex={-1} className="mb-3 text-lg font-bold">
            Draw a moderation sample
          </h2>
          <DrawSampleForm
            me={me}
            onCancel={() => setDrawing(false)}
            onDrawn={async (d) => {
              setDrawn(d);
              setDrawing(false);
              await queryClient.invalidateQueries({ queryKey: ["samples"] });
            }}
          />
        </Card>
      ) : null}
      {samples.isPending ? <Loading label="Loading samples…" /> : null}
      {samples.isError ? <LoadError error={samples.error} onRetry={() => samples.refetch()} what="the samples" /> : null}
      {samples.isSuccess ? (
        <>
          <section aria-labelledby="open-samples" className="flex flex-col gap-3">
            <h2 id="open-samples" className="text-xl font-bold">
              In progress
            </h2>
            {open.length ? table(open, "Samples in progress") : <EmptyState title="No samples in progress">{me.admin ? "Draw a sample to assign one to a moderator." : "Draw a sample, or wait for an admin to assign one to you."}</EmptyState>}
          </section>
          {done.length ? (
            <section aria-labelledby="done-samples" className="flex flex-col gap-3">
              <h2 id="done-samples" className="text-xl font-bold">
                Finished
              </h2>
              {table(done, "Finished samples")}
            </section>
          ) : null}
        </>
      ) : null}
      {me.admin ? (
        <p className="text-muted">
          The school&apos;s sampling rule can be changed under <Link href="/admin/moderation-rule">Sampling rule</Link>.
        </p>
      ) : null}
    </div>
  );
}

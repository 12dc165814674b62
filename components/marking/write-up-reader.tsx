"use client";

import dynamic from "next/dynamic";
import type { ReactNode } from "react";
import { RichTextView } from "@/components/editor/rich-text-view";
import { EvidenceGallery } from "@/components/evidence/evidence-gallery";
import { ResultsGrid } from "@/components/write-up/results-grid";
import type { RichTextDoc } from "@/lib/validation/rich-text";
import { formatDateTime } from "@/lib/utils";
import { CheckOutcomeView } from "./check-outcome";
import type { ReaderViewJson } from "./types";

/** The graph panel and its chart library load only in the browser, and only when there is a graph. */
const GraphPanelLazy = dynamic(() => import("@/components/write-up/graph-panel").then((m) => m.GraphPanel), {
  ssr: false,
  loading: () => (
    <div className="flex min-h-64 items-center justify-center rounded-md border border-line bg-surface p-3 text-muted" role="status">
      Loading the graph…
    </div>
  ),
});

const EMPTY_TABLE = { rows: [], decisions: {} };
const ignore = () => {};

function Part({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`part-${id}`} className="flex flex-col gap-3 print:break-inside-avoid-page">
      <h2 id={`part-${id}`} className="border-b border-line pb-1 text-xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Text({ doc }: { doc: RichTextDoc | undefined }) {
  return <RichTextView doc={doc} headingOffset={2} empty={<p className="text-muted italic">Nothing written.</p>} className="max-w-none" />;
}

/**
 * A student's write-up for a marker to read, in the order the student wrote it: plan,
 * observations, results tables, graphs with their tangents, calculations with the engine's
 * verdicts, conclusion and evaluation. `comment` renders whatever goes under each part (the
 * teacher's comment box, or their comment read-only); it is given the part's key
 * ("plan", "table:<id>", "graph:<id>", "check:<id>", …) and its name as a phrase ("the plan").
 */
export function WriteUpReader({ view, comment }: { view: ReaderViewJson; comment?: (key: string, label: string) => ReactNode }) {
  const practical = view.practical.content;
  const content = view.writeUp.content;
  const slot = (key: string, label: string) => (comment ? comment(key, label) : null);
  return (
    <div className="flex min-w-0 flex-col gap-8">
      <p className="text-muted">
        {view.writeUp.safetyAcknowledgedAt ? `Safety section confirmed ${formatDateTime(view.writeUp.safetyAcknowledgedAt)}.` : "The student has not confirmed the safety section."}
        {view.group ? ` Results shared by ${view.group.name}: ${view.group.members.map((m) => m.name).join(", ")}.` : ""}
      </p>
      <Part id="plan" title="Plan">
        <Text doc={content.sections.plan} />
        {slot("plan", "the plan")}
      </Part>
      <Part id="observations" title="Observations">
        <Text doc={content.sections.observations} />
        {slot("observations", "the observations")}
      </Part>
      <Part id="photos" title="Photos">
        <EvidenceGallery target={{ writeUpId: view.writeUp.id }} label="The student's photos" empty={<p className="text-muted italic">No photos added.</p>} />
      </Part>
      <Part id="results" title="Results">
        {practical.tables.length === 0 ? <p className="text-muted">This practical has no results table.</p> : null}
        {practical.tables.map((t) => (
          <div key={t.id} className="flex flex-col gap-2">
            <ResultsGrid table={t} value={view.tables[t.id] ?? EMPTY_TABLE} onChange={ignore} readOnly id={`read-${t.id}`} />
            {slot(`table:${t.id}`, `the table “${t.title}”`)}
          </div>
        ))}
      </Part>
      {practical.graphs.length ? (
        <Part id="graphs" title="Graphs">
          {practical.graphs.map((g) => {
            const t = practical.tables.find((x) => x.id === g.tableId);
            return (
              <div key={g.id} className="flex flex-col gap-2">
                {t ? <GraphPanelLazy graph={g} table={t} filled={view.tables[g.tableId] ?? EMPTY_TABLE} tangent={content.graphs[g.id]?.tangent ?? null} readOnly /> : <p className="text-muted">The graph “{g.title}” has no table.</p>}
                {slot(`graph:${g.id}`, `the graph “${g.title}”`)}
              </div>
            );
          })}
        </Part>
      ) : null}
      {practical.checks.length ? (
        <Part id="calculations" title="Calculations">
          {practical.checks.map((spec) => (
            <CheckOutcomeView key={spec.id} spec={spec} answer={content.answers[spec.id]} state={view.checks[spec.id]} footer={slot(`check:${spec.id}`, `the check “${spec.label}”`)} />
          ))}
        </Part>
      ) : null}
      <Part id="conclusion" title="Conclusion">
        <Text doc={content.sections.conclusion} />
        {slot("conclusion", "the conclusion")}
      </Part>
      <Part id="evaluation" title="Evaluation">
        <Text doc={content.sections.evaluation} />
        {slot("evaluation", "the evaluation")}
      </Part>
    </div>
  );
}

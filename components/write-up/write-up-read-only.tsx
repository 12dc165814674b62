import type { ReactNode } from "react";
import { RichTextView } from "@/components/editor/rich-text-view";
import { EvidenceGallery } from "@/components/evidence/evidence-gallery";
import { boundGraph } from "./check-words";
import { SECTIONS } from "./compare";
import { GraphPanelLazy } from "./lazy-panels";
import { ReadOnlyCheck, ReadOnlyGrid } from "./read-only-parts";
import { StaffCheckOutcome } from "./staff-check-outcome";
import type { WriteUpViewJson } from "./types";

function Part({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`ro-${id}`} className="flex flex-col gap-3">
      <h2 id={`ro-${id}`} className="border-b border-line pb-1 text-2xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

const nothing = (what: string) => <p className="text-muted italic">{what}</p>;

/**
 * A whole write-up, read-only: for the student once it is handed in (or the lab session has
 * closed), and for the teacher, who also sees each check's full outcome. Rendered on the
 * server; only the tables and graphs run in the browser.
 */
export function WriteUpReadOnly({ view, audience, safetyConfirmedText }: { view: WriteUpViewJson; audience: "student" | "staff"; safetyConfirmedText: string | null }) {
  const practical = view.practical.content;
  const content = view.writeUp.content;
  const section = (key: (typeof SECTIONS)[number]["key"]) => <RichTextView doc={content.sections[key]} empty={nothing("Nothing written.")} className="max-w-none" />;
  return (
    <div className="flex max-w-3xl flex-col gap-8">
      <Part id="safety" title="Safety">
        <p>{safetyConfirmedText ?? (audience === "staff" ? "The student has not confirmed the safety section." : "You did not confirm the safety section.")}</p>
      </Part>
      {SECTIONS.slice(0, 2).map((s) => (
        <Part key={s.key} id={s.key} title={s.label}>
          {section(s.key)}
        </Part>
      ))}
      <Part id="photos" title="Photos">
        <EvidenceGallery target={{ writeUpId: view.writeUp.id }} label={audience === "staff" ? "The student's photos" : "Your photos"} empty={nothing(audience === "staff" ? "The student added no photos." : "You added no photos.")} />
      </Part>
      <Part id="results" title="Results">
        {view.group ? (
          <p>
            <strong>Shared by {view.group.name}:</strong> {view.group.members.map((m) => m.name).join(", ")}.
          </p>
        ) : null}
        {practical.tables.length ? practical.tables.map((t) => <ReadOnlyGrid key={t.id} table={t} value={view.tables[t.id]} />) : nothing("This practical has no results table.")}
      </Part>
      {practical.graphs.length ? (
        <Part id="graphs" title="Graphs">
          {practical.graphs.map((g) => {
            const t = practical.tables.find((x) => x.id === g.tableId);
            return t ? <GraphPanelLazy key={g.id} graph={g} table={t} filled={view.tables[g.tableId] ?? { rows: [], decisions: {} }} tangent={content.graphs[g.id]?.tangent ?? null} readOnly /> : null;
          })}
        </Part>
      ) : null}
      {practical.checks.length ? (
        <Part id="calculations" title="Calculations">
          {practical.checks.map((spec) => {
            const table = practical.tables.find((t) => t.id === spec.tableId);
            const answer = content.answers[spec.id];
            const working = answer?.working ? (
              <div>
                <p className="font-semibold">Working</p>
                <RichTextView doc={answer.working} headingOffset={2} empty={nothing("No working written.")} />
              </div>
            ) : null;
            return audience === "staff" ? (
              <StaffCheckOutcome key={spec.id} spec={spec} table={table} answer={answer} state={view.checks[spec.id]} working={working} />
            ) : (
              <ReadOnlyCheck key={spec.id} spec={spec} table={table} graph={boundGraph(spec, practical.graphs)} tables={view.tables} answer={answer} state={view.checks[spec.id]} working={working} />
            );
          })}
        </Part>
      ) : null}
      {SECTIONS.slice(2).map((s) => (
        <Part key={s.key} id={s.key} title={s.label}>
          {section(s.key)}
        </Part>
      ))}
    </div>
  );
}

import type { ReactNode } from "react";
import { RichTextView } from "@/components/editor/rich-text-view";
import { Badge } from "@/components/ui/badge";
import { Table, Td, Th } from "@/components/ui/table";
import { EYE_PROTECTION, GHS_PICTOGRAMS } from "@/lib/ghs";
import { COLUMN_ROLE_LABELS, DERIVED_FORMULA_LABELS, type ColumnTemplate, type GraphSpec, type PracticalContent, type TableTemplate } from "@/lib/validation/practicals";
import { CHECK_KIND_LABELS, describeCheck } from "./check-kinds";
import { GhsPictogram } from "./ghs-pictogram";
import { StandingCaution } from "./standing-caution";
import { columnHeader } from "./units";

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 border-t border-line pt-5">
      <h2 id={id} className="text-xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Missing({ children }: { children: ReactNode }) {
  return <p className="text-muted italic">{children}</p>;
}

/** What a column records, in a line: role, instrument resolution, decimal places, range. */
export function columnDetails(col: ColumnTemplate, table: TableTemplate): string {
  const parts: string[] = [COLUMN_ROLE_LABELS[col.role].replace(/ \(.*\)$/, "").toLowerCase()];
  if (col.role === "mean" && col.meanOf.length) {
    const names = col.meanOf.map((id) => table.columns.find((c) => c.id === id)).filter(Boolean).map((c) => columnHeader(c!));
    parts.push(`of ${names.join(", ")}`);
  }
  if (col.role === "derived" && col.formula) {
    const from = table.columns.find((c) => c.id === col.derivedFrom);
    parts.push(`${DERIVED_FORMULA_LABELS[col.formula].replace(/ \(.*\)$/, "")}${from ? ` of ${columnHeader(from)}` : ""}`);
  }
  if (col.resolution != null) parts.push(`read to ${col.resolution}${col.unit ? ` ${col.unit}` : ""}`);
  if (col.decimalPlaces != null) parts.push(`${col.decimalPlaces} decimal place${col.decimalPlaces === 1 ? "" : "s"}`);
  if (col.rangeMin != null || col.rangeMax != null) parts.push(`range ${col.rangeMin ?? "…"} to ${col.rangeMax ?? "…"}${col.unit ? ` ${col.unit}` : ""}`);
  return parts.join(", ");
}

/** A results table as students will see it: the header row and the rows to fill in. */
export function ResultsTableTemplate({ table, maxRows = 4 }: { table: TableTemplate; maxRows?: number }) {
  const shown = Math.min(table.rowCount, Math.max(maxRows, Math.min(table.presetRows.length, 6)));
  return (
    <div className="flex flex-col gap-2">
      <Table>
        <caption className="px-3 pt-2 text-left font-semibold">{table.title}</caption>
        <thead>
          <tr>
            {table.columns.map((c) => (
              <Th key={c.id} className="whitespace-normal">
                {columnHeader(c)}
              </Th>
            ))}
          </tr>
        </thead>
        <tbody>
          {Array.from({ length: shown }, (_, r) => (
            <tr key={r}>
              {table.columns.map((c) => {
                const v = table.presetRows[r]?.[c.id];
                return (
                  <Td key={c.id} className="relative h-9">
                    {typeof v === "number" ? v : <span className="sr-only">blank</span>}
                  </Td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </Table>
      <p className="text-sm text-muted">
        {table.rowCount} row{table.rowCount === 1 ? "" : "s"} to fill in{shown < table.rowCount ? ` (the first ${shown} are shown)` : ""}.
      </p>
      <ul className="flex flex-col gap-0.5 text-sm">
        {table.columns.map((c) => (
          <li key={c.id}>
            <strong>{columnHeader(c)}</strong>: {columnDetails(c, table)}
          </li>
        ))}
      </ul>
    </div>
  );
}

function describeGraph(g: GraphSpec, tables: TableTemplate[]): string {
  const t = tables.find((x) => x.id === g.tableId);
  const col = (id: string) => t?.columns.find((c) => c.id === id);
  const x = col(g.xColumn);
  const y = col(g.yColumn);
  const fit = g.fit === "line" ? "a straight line of best fit" : g.fit === "curve" ? "a smooth curve of best fit" : "no line of best fit";
  const parts = [`Plot ${y ? columnHeader(y) : "(no column chosen)"} (y-axis) against ${x ? columnHeader(x) : "(no column chosen)"} (x-axis) from “${t?.title ?? "a missing table"}”, with ${fit}${g.throughOrigin ? " through the origin" : ""}.`];
  if (g.tangents) parts.push("Students draw tangents on this graph.");
  return parts.join(" ");
}

/**
 * A practical, read-only, as a clean page: everything a teacher, technician or moderator needs
 * to read it, with the standing caution. Works as a server component (no browser code).
 */
export function PracticalView({ meta, content }: { meta: { title: string; topic: string; subject: string; yearGroup: number }; content: PracticalContent }) {
  const { safety } = content;
  const eye = EYE_PROTECTION.find((e) => e.value === safety.eyeProtection)?.label;
  return (
    <article aria-label={`${meta.title} (read-only)`} className="flex flex-col gap-6">
      <StandingCaution />
      <Section id="view-aim" title="Aim">
        {content.aim.trim() ? <p className="max-w-prose">{content.aim}</p> : <Missing>No aim written yet.</Missing>}
        <RichTextView doc={content.introduction} />
      </Section>

      <Section id="view-method" title="Method">
        <RichTextView doc={content.method} empty={<Missing>No method written yet.</Missing>} />
      </Section>

      <Section id="view-variables" title="Variables and apparatus">
        <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
          <dt className="font-semibold">Independent variable</dt>
          <dd>{content.variables.independent || <span className="text-muted">not given</span>}</dd>
          <dt className="font-semibold">Dependent variable</dt>
          <dd>{content.variables.dependent || <span className="text-muted">not given</span>}</dd>
          <dt className="font-semibold">Controlled variables</dt>
          <dd>{content.variables.controlled.length ? content.variables.controlled.join("; ") : <span className="text-muted">none listed</span>}</dd>
        </dl>
        <h3 className="font-bold">Apparatus</h3>
        {content.apparatus.length ? (
          <ul className="list-disc pl-6">
            {content.apparatus.map((a, i) => (
              <li key={i}>{a}</li>
            ))}
          </ul>
        ) : (
          <Missing>No apparatus listed.</Missing>
        )}
      </Section>

      <Section id="view-safety" title="Safety">
        <div className="flex flex-wrap gap-2">
          <Badge tone="brand">Eye protection: {eye ?? "not stated"}</Badge>
          {safety.otherPpe.map((p, i) => (
            <Badge key={i}>{p}</Badge>
          ))}
        </div>
        {safety.hazards.length ? (
          <ul className="flex flex-col gap-3">
            {safety.hazards.map((h) => (
              <li key={h.id} className="rounded-lg border border-line bg-surface p-3">
                <div className="flex flex-wrap items-start justify-between gap-2">
                  <h3 className="font-bold">{h.substance}</h3>
                  {h.signalWord !== "None" ? <Badge tone={h.signalWord === "Danger" ? "bad" : "warn"}>{h.signalWord}</Badge> : null}
                </div>
                {h.pictograms.length ? (
                  <ul className="my-2 flex flex-wrap gap-3" aria-label="Hazard pictograms">
                    {h.pictograms.map((code) => (
                      <li key={code} className="flex w-20 flex-col items-center text-center text-xs">
                        <GhsPictogram code={code} size={52} decorative />
                        <span>{GHS_PICTOGRAMS.find((p) => p.code === code)?.name}</span>
                      </li>
                    ))}
                  </ul>
                ) : null}
                {h.hazardStatements ? (
                  <p>
                    <strong>Hazards: </strong>
                    {h.hazardStatements}
                  </p>
                ) : null}
                <p>
                  <strong>Control measures: </strong>
                  {h.controls}
                </p>
              </li>
            ))}
          </ul>
        ) : (
          <Missing>No hazards listed yet.</Missing>
        )}
        <div>
          <h3 className="font-bold">If something goes wrong</h3>
          {safety.emergency.trim() ? <p className="max-w-prose whitespace-pre-line">{safety.emergency}</p> : <Missing>Not written yet.</Missing>}
        </div>
        {safety.riskAssessmentRef.trim() ? (
          <p>
            <strong>Risk assessment: </strong>
            {safety.riskAssessmentRef}
          </p>
        ) : null}
      </Section>

      <Section id="view-tables" title="Results tables">
        {content.tables.length ? content.tables.map((t) => <ResultsTableTemplate key={t.id} table={t} />) : <Missing>No results table yet.</Missing>}
      </Section>

      <Section id="view-graphs" title="Graphs">
        {content.graphs.length ? (
          <ul className="flex flex-col gap-2">
            {content.graphs.map((g) => (
              <li key={g.id}>
                <strong>{g.title}. </strong>
                {describeGraph(g, content.tables)}
              </li>
            ))}
          </ul>
        ) : (
          <Missing>No graphs.</Missing>
        )}
      </Section>

      <Section id="view-checks" title="Calculation checks">
        {content.checks.length ? (
          <ol className="flex list-decimal flex-col gap-2 pl-6">
            {content.checks.map((c) => (
              <li key={c.id}>
                <strong>{c.label}</strong> <span className="text-sm text-muted">· {CHECK_KIND_LABELS[c.kind]}</span>
                <p className="max-w-prose">{describeCheck(c, content.tables.find((t) => t.id === c.tableId))}</p>
              </li>
            ))}
          </ol>
        ) : (
          <Missing>No calculation checks.</Missing>
        )}
      </Section>

      <Section id="view-rubric" title="Rubric">
        {content.rubric ? <RubricView rubric={content.rubric} checks={content.checks} /> : <Missing>No rubric yet.</Missing>}
      </Section>
    </article>
  );
}

function RubricView({ rubric, checks }: { rubric: NonNullable<PracticalContent["rubric"]>; checks: PracticalContent["checks"] }) {
  const total = rubric.criteria.reduce((sum, c) => sum + Math.max(0, ...c.levels.map((l) => l.marks)), 0);
  return (
    <div className="flex flex-col gap-3">
      <p>
        <strong>{rubric.title}</strong> · {rubric.style === "competence" ? "Competence record (shown / not yet)" : `Marked out of ${total}`}
      </p>
      {rubric.criteria.map((c) => (
        <div key={c.id} className="flex flex-col gap-1">
          <h3 className="font-bold">{c.title}</h3>
          {c.description ? <p className="text-muted">{c.description}</p> : null}
          {c.checkIds.length ? (
            <p className="text-sm">
              Uses the checks: {c.checkIds.map((id) => checks.find((k) => k.id === id)?.label ?? "a removed check").join(", ")}
            </p>
          ) : null}
          <Table>
            <thead>
              <tr>
                <Th>Level</Th>
                {rubric.style === "marks" ? <Th>Marks</Th> : null}
                <Th>Descriptor</Th>
              </tr>
            </thead>
            <tbody>
              {c.levels.map((l) => (
                <tr key={l.id}>
                  <Td className="font-semibold">{l.label}</Td>
                  {rubric.style === "marks" ? <Td>{l.marks}</Td> : null}
                  <Td className="whitespace-pre-line">{l.descriptor || <span className="text-muted">—</span>}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </div>
      ))}
    </div>
  );
}

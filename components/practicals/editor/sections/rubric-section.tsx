"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { rubricBodySchema, type PracticalContent, type RubricBody } from "@/lib/validation/practicals";
import { cn, formatDate } from "@/lib/utils";
import { CHECK_KIND_LABELS } from "../../check-kinds";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { fieldDomId, type Draft } from "../../draft";
import { newPartId } from "../../ids";
import { ChoiceGroup, NumberField, PathErrors, TextAreaField, TextField, useErrorsUnder } from "../fields";
import { changeContent, moveBy, removeAt, replaceAt, type Change } from "../state";

type Rubric = NonNullable<PracticalContent["rubric"]>;
type Criterion = Rubric["criteria"][number];
type Level = Criterion["levels"][number];

/** Levels for a competence record: "not yet" and "shown". */
export function competenceLevels(): Level[] {
  return [
    { id: newPartId("lvl"), label: "Not yet", marks: 0, descriptor: "" },
    { id: newPartId("lvl"), label: "Shown", marks: 1, descriptor: "" },
  ];
}

function markedLevels(): Level[] {
  return [
    { id: newPartId("lvl"), label: "Not yet", marks: 0, descriptor: "" },
    { id: newPartId("lvl"), label: "Partly", marks: 1, descriptor: "" },
    { id: newPartId("lvl"), label: "Secure", marks: 2, descriptor: "" },
  ];
}

export function blankCriterion(style: Rubric["style"], taken: string[]): Criterion {
  return { id: newPartId("crit", taken), title: "", description: "", checkIds: [], levels: style === "competence" ? competenceLevels() : markedLevels() };
}

/**
 * A rubric from the library, made ready for this practical: links to checks that this practical
 * does not have are dropped (they belonged to the practical the rubric was saved from).
 */
export function rubricFromLibrary(body: RubricBody, sourceRubricId: string, checkIds: string[]): Rubric {
  const known = new Set(checkIds);
  return { ...body, sourceRubricId, criteria: body.criteria.map((c) => ({ ...c, checkIds: c.checkIds.filter((id) => known.has(id)) })) };
}

/** Levels in order of their marks, lowest first (the order the server requires). */
export function sortLevels(levels: Level[]): Level[] {
  return [...levels].sort((a, b) => (Number.isFinite(a.marks) ? a.marks : Infinity) - (Number.isFinite(b.marks) ? b.marks : Infinity));
}

function LevelRow({ level, base, index, count, style, onChange, onMove, onRemove }: { level: Level; base: string; index: number; count: number; style: Rubric["style"]; onChange: (l: Level) => void; onMove: (by: number) => void; onRemove: () => void }) {
  const path = `${base}.levels.${index}`;
  return (
    <li id={fieldDomId(path)} tabIndex={-1} className="flex flex-col gap-2 rounded-md border border-line bg-paper p-3">
      <div className="grid gap-3 sm:grid-cols-[2fr_1fr]">
        <TextField path={`${path}.label`} label={`Level ${index + 1} name`} value={level.label} onChange={(label) => onChange({ ...level, label })} />
        <NumberField
          path={`${path}.marks`}
          label={style === "competence" ? "Value" : "Marks"}
          hint={style === "competence" ? "Not yet 0, shown 1." : undefined}
          value={level.marks}
          onChange={(n) => onChange({ ...level, marks: n ?? Number.NaN })}
        />
      </div>
      <TextAreaField path={`${path}.descriptor`} label="What work at this level looks like" rows={2} value={level.descriptor} onChange={(descriptor) => onChange({ ...level, descriptor })} />
      <div className="flex flex-wrap gap-1">
        <Button size="sm" variant="ghost" disabled={index === 0} onClick={() => onMove(-1)} aria-label={`Move level ${index + 1} (${level.label || "unnamed"}) up`}>
          ↑ Up
        </Button>
        <Button size="sm" variant="ghost" disabled={index === count - 1} onClick={() => onMove(1)} aria-label={`Move level ${index + 1} (${level.label || "unnamed"}) down`}>
          ↓ Down
        </Button>
        <Button size="sm" variant="ghost" disabled={count <= 2} onClick={onRemove} aria-label={`Remove level ${index + 1} (${level.label || "unnamed"})`}>
          Remove
        </Button>
      </div>
    </li>
  );
}

function CriterionCard({ criterion, index, rubric, checks, onChange, onRemove, onMove }: { criterion: Criterion; index: number; rubric: Rubric; checks: PracticalContent["checks"]; onChange: (c: Criterion) => void; onRemove: () => void; onMove: (by: number) => void }) {
  const base = `content.rubric.criteria.${index}`;
  const problems = useErrorsUnder(base);
  const outOfOrder = criterion.levels.some((l, i) => i > 0 && l.marks <= criterion.levels[i - 1]!.marks);
  const setLevels = (levels: Level[]) => onChange({ ...criterion, levels });
  return (
    <li id={fieldDomId(base)} tabIndex={-1} className={cn("flex flex-col gap-4 rounded-lg border bg-surface p-4", problems ? "border-warn" : "border-line")}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-lg font-bold">
          Criterion {index + 1}
          {criterion.title.trim() ? <span className="font-normal text-muted">: {criterion.title}</span> : null}
        </h3>
        <div className="flex flex-wrap gap-1">
          <Button size="sm" variant="ghost" disabled={index === 0} onClick={() => onMove(-1)} aria-label={`Move criterion ${index + 1} up`}>
            ↑ Up
          </Button>
          <Button size="sm" variant="ghost" disabled={index === rubric.criteria.length - 1} onClick={() => onMove(1)} aria-label={`Move criterion ${index + 1} down`}>
            ↓ Down
          </Button>
          <ConfirmButton tone="caution" size="sm" label="Remove criterion" variant="ghost" question={`Remove criterion ${index + 1} and its levels?`} confirmLabel="Yes, remove it" onConfirm={onRemove} />
        </div>
      </div>
      <TextField path={`${base}.title`} label="Criterion" hint="For example “Recording results”." value={criterion.title} onChange={(title) => onChange({ ...criterion, title })} />
      <TextAreaField path={`${base}.description`} label="Description (optional)" rows={2} value={criterion.description} onChange={(description) => onChange({ ...criterion, description })} />
      {checks.length ? (
        <ChoiceGroup path={`${base}.checkIds`} legend="Linked calculation checks" hint="Their results are shown beside this criterion on the marking bench.">
          {checks.map((k) => (
            <label key={k.id} className="flex min-h-11 items-center gap-2">
              <input
                type="checkbox"
                className="size-5 accent-brand"
                checked={criterion.checkIds.includes(k.id)}
                onChange={(e) => onChange({ ...criterion, checkIds: e.target.checked ? checks.filter((x) => x.id === k.id || criterion.checkIds.includes(x.id)).map((x) => x.id) : criterion.checkIds.filter((id) => id !== k.id) })}
              />
              {k.label || CHECK_KIND_LABELS[k.kind]}
            </label>
          ))}
        </ChoiceGroup>
      ) : (
        <PathErrors path={`${base}.checkIds`} />
      )}
      <section aria-label={`Levels of criterion ${index + 1}`} className="flex flex-col gap-2">
        <h4 className="font-bold">Levels, lowest first</h4>
        <div id={fieldDomId(`${base}.levels`)} tabIndex={-1}>
          <PathErrors path={`${base}.levels`} />
        </div>
        <ol className="flex flex-col gap-2">
          {criterion.levels.map((l, li) => (
            <LevelRow
              key={l.id}
              level={l}
              base={base}
              index={li}
              count={criterion.levels.length}
              style={rubric.style}
              onChange={(next) => setLevels(replaceAt(criterion.levels, li, next))}
              onMove={(by) => setLevels(moveBy(criterion.levels, li, by))}
              onRemove={() => setLevels(removeAt(criterion.levels, li))}
            />
          ))}
        </ol>
        <div className="flex flex-wrap gap-2">
          <Button
            size="sm"
            variant="secondary"
            disabled={criterion.levels.length >= 8}
            onClick={() => {
              const top = Math.max(-1, ...criterion.levels.map((l) => (Number.isFinite(l.marks) ? l.marks : -1)));
              setLevels([...criterion.levels, { id: newPartId("lvl", criterion.levels.map((l) => l.id)), label: "", marks: top + 1, descriptor: "" }]);
            }}
          >
            Add a level
          </Button>
          {outOfOrder ? (
            <Button size="sm" variant="ghost" onClick={() => setLevels(sortLevels(criterion.levels))}>
              Put the levels in order of marks
            </Button>
          ) : null}
        </div>
      </section>
    </li>
  );
}

type LibraryRubric = { id: string; title: string; body: RubricBody; updatedAt: string; authorName: string | null };

function RubricLibrary({ hasRubric, checkIds, onUse }: { hasRubric: boolean; checkIds: string[]; onUse: (r: Rubric) => void }) {
  const [open, setOpen] = useState(false);
  const list = useQuery({ queryKey: ["rubrics"], queryFn: () => fetchJson<{ rubrics: LibraryRubric[] }>("/api/rubrics"), enabled: open });
  if (!open)
    return (
      <Button variant="secondary" onClick={() => setOpen(true)} aria-expanded={false}>
        Load from the rubric library
      </Button>
    );
  return (
    <section aria-labelledby="rubric-library-heading" className="flex w-full flex-col gap-2 rounded-lg border border-brand/40 bg-surface p-3">
      <div className="flex items-center justify-between gap-2">
        <h3 id="rubric-library-heading" className="font-bold">
          The rubric library
        </h3>
        <Button size="sm" variant="ghost" onClick={() => setOpen(false)} aria-expanded>
          Close
        </Button>
      </div>
      {list.isPending ? <p role="status">Loading the library…</p> : null}
      {list.isError ? <Alert tone="bad">{list.error instanceof ApiError ? list.error.message : "Could not load the rubric library."}</Alert> : null}
      {list.data && list.data.rubrics.length === 0 ? <p className="text-muted">No rubrics saved yet. Write one here and press “Save to the rubric library”.</p> : null}
      {list.data?.rubrics.length ? (
        <ul className="flex flex-col gap-2">
          {list.data.rubrics.map((r) => (
            <li key={r.id} className="flex flex-col gap-2 rounded-md border border-line p-3 sm:flex-row sm:items-center sm:justify-between">
              <div>
                <p className="font-semibold">{r.title}</p>
                <p className="text-sm text-muted">
                  {r.body.style === "competence" ? "Competence record" : "Marks"} · {r.body.criteria.length} criteri{r.body.criteria.length === 1 ? "on" : "a"} · {r.body.criteria.map((c) => c.title).join(", ")}
                  {r.authorName ? ` · by ${r.authorName}` : ""} · {formatDate(r.updatedAt)}
                </p>
              </div>
              {hasRubric ? (
                <ConfirmButton tone="caution" size="sm" variant="secondary" label="Use this rubric" question={`Replace this practical's rubric with “${r.title}”?`} confirmLabel="Yes, replace it" onConfirm={() => onUse(rubricFromLibrary(r.body, r.id, checkIds))} />
              ) : (
                <Button size="sm" onClick={() => onUse(rubricFromLibrary(r.body, r.id, checkIds))}>
                  Use this rubric
                </Button>
              )}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}

export function RubricSection({ draft, change }: { draft: Draft; change: Change }) {
  const rubric = draft.content.rubric;
  const checks = draft.content.checks;
  const qc = useQueryClient();
  const [saveState, setSaveState] = useState<{ tone: "good" | "bad"; text: string } | null>(null);
  const [savingToLibrary, setSavingToLibrary] = useState(false);
  const setRubric = (fn: (r: Rubric) => Rubric) => changeContent(change, "rubric", (r) => (r ? fn(r) : r));
  const applyRubric = (r: Rubric) => {
    changeContent(change, "rubric", () => r);
    setSaveState({ tone: "good", text: `Loaded “${r.title}”. Change it here as you like: the library copy stays as it was.` });
  };

  if (!rubric) {
    return (
      <div className="flex flex-col gap-4">
        <div id={fieldDomId("content.rubric")} tabIndex={-1}>
          <PathErrors path="content.rubric" />
        </div>
        <p className="max-w-3xl text-muted">
          A rubric says how write-ups are judged. Use marks (criteria with levels worth marks) or a competence record (each skill “shown” or “not yet”).
        </p>
        <div className="flex flex-wrap gap-2">
          <Button onClick={() => changeContent(change, "rubric", () => ({ title: draft.title ? `${draft.title}: rubric` : "", style: "marks", criteria: [blankCriterion("marks", [])], sourceRubricId: null }))}>
            Write a marks rubric
          </Button>
          <Button variant="secondary" onClick={() => changeContent(change, "rubric", () => ({ title: "Practical skills", style: "competence", criteria: [blankCriterion("competence", [])], sourceRubricId: null }))}>
            Write a competence record
          </Button>
          <RubricLibrary hasRubric={false} checkIds={checks.map((c) => c.id)} onUse={applyRubric} />
        </div>
        {saveState ? <p aria-live="polite">{saveState.text}</p> : null}
      </div>
    );
  }

  const total = rubric.criteria.reduce((sum, c) => sum + Math.max(0, ...c.levels.map((l) => (Number.isFinite(l.marks) ? l.marks : 0))), 0);
  const saveToLibrary = async () => {
    setSaveState(null);
    const body = rubricBodySchema.safeParse({ title: rubric.title, style: rubric.style, criteria: rubric.criteria });
    if (!body.success) {
      setSaveState({ tone: "bad", text: "Finish the rubric first: the fields marked in this section say what is missing. (Press Save at the top to mark them.)" });
      return;
    }
    setSavingToLibrary(true);
    try {
      const res = await fetchJson<{ id: string }>("/api/rubrics", { method: "POST", json: body.data });
      setRubric((r) => ({ ...r, sourceRubricId: res.id }));
      await qc.invalidateQueries({ queryKey: ["rubrics"] });
      setSaveState({ tone: "good", text: `Saved “${body.data.title}” to the rubric library. Colleagues can now load it into their practicals.` });
    } catch (e) {
      setSaveState({ tone: "bad", text: e instanceof ApiError ? e.message : "Could not save to the rubric library. Please try again." });
    } finally {
      setSavingToLibrary(false);
    }
  };

  return (
    <div className="flex flex-col gap-5">
      <div id={fieldDomId("content.rubric")} tabIndex={-1}>
        <PathErrors path="content.rubric" />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField path="content.rubric.title" label="Rubric title" value={rubric.title} onChange={(title) => setRubric((r) => ({ ...r, title }))} />
        <ChoiceGroup path="content.rubric.style" legend="Style">
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" name="rubric-style" className="size-5 accent-brand" checked={rubric.style === "marks"} onChange={() => setRubric((r) => ({ ...r, style: "marks" }))} />
            Marks (levels worth marks, totalled)
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" name="rubric-style" className="size-5 accent-brand" checked={rubric.style === "competence"} onChange={() => setRubric((r) => ({ ...r, style: "competence" }))} />
            Competence (shown / not yet)
          </label>
        </ChoiceGroup>
      </div>
      {rubric.style === "competence" && rubric.criteria.some((c) => c.levels.length !== 2 || c.levels[0]!.label !== "Not yet" || c.levels[1]!.label !== "Shown") ? (
        <div className="flex flex-col gap-2 rounded-md border border-line bg-paper p-3 sm:flex-row sm:items-center sm:justify-between">
          <p className="text-sm">A competence record usually has two levels for every skill: “Not yet” and “Shown”.</p>
          <ConfirmButton
            tone="caution"
            size="sm"
            variant="secondary"
            label="Use Not yet / Shown for every criterion"
            question="Replace every criterion's levels (and their descriptors) with “Not yet” and “Shown”?"
            confirmLabel="Yes, replace the levels"
            onConfirm={() => setRubric((r) => ({ ...r, criteria: r.criteria.map((c) => ({ ...c, levels: competenceLevels() })) }))}
          />
        </div>
      ) : null}
      <p className="text-sm text-muted">{rubric.style === "marks" ? `Total: ${total} mark${total === 1 ? "" : "s"}.` : `${rubric.criteria.length} skill${rubric.criteria.length === 1 ? "" : "s"} recorded as shown or not yet.`}</p>
      <div id={fieldDomId("content.rubric.criteria")} tabIndex={-1}>
        <PathErrors path="content.rubric.criteria" />
      </div>
      <ol className="flex flex-col gap-5">
        {rubric.criteria.map((c, i) => (
          <CriterionCard
            key={c.id}
            criterion={c}
            index={i}
            rubric={rubric}
            checks={checks}
            onChange={(next) => setRubric((r) => ({ ...r, criteria: replaceAt(r.criteria, i, next) }))}
            onRemove={() => setRubric((r) => ({ ...r, criteria: removeAt(r.criteria, i) }))}
            onMove={(by) => setRubric((r) => ({ ...r, criteria: moveBy(r.criteria, i, by) }))}
          />
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" disabled={rubric.criteria.length >= 15} onClick={() => setRubric((r) => ({ ...r, criteria: [...r.criteria, blankCriterion(r.style, r.criteria.map((x) => x.id))] }))}>
          Add a criterion
        </Button>
        <Button variant="secondary" disabled={savingToLibrary} onClick={saveToLibrary}>
          {savingToLibrary ? "Saving to the library…" : "Save to the rubric library"}
        </Button>
        <RubricLibrary hasRubric checkIds={checks.map((c) => c.id)} onUse={applyRubric} />
        <ConfirmButton tone="caution" size="sm" label="Remove the rubric" variant="ghost" question="Remove this practical's rubric? The rubric library is not affected." confirmLabel="Yes, remove it" onConfirm={() => changeContent(change, "rubric", () => null)} />
      </div>
      {saveState ? (
        <p aria-live="polite" className={cn("font-semibold", saveState.tone === "good" ? "text-good" : "text-bad")}>
          {saveState.text}
        </p>
      ) : null}
    </div>
  );
}

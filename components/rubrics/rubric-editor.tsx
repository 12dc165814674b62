"use client";

import { toNestErrors } from "@hookform/resolvers";
import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { set, useFieldArray, useForm, useWatch, type Control, type FieldErrors, type Path, type Resolver, type UseFormRegister } from "react-hook-form";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { ErrorSummary, type SummaryItem } from "@/components/lab-sessions/error-summary";
import { flattenErrors, messageAt } from "@/components/lab-sessions/form-errors";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Button, buttonClasses } from "@/components/ui/button";
import { Field, Input, Textarea } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { RubricBody } from "@/lib/validation/practicals";
import {
  competenceSwitchLoses,
  MAX_CRITERIA,
  MAX_LEVELS,
  MIN_LEVELS,
  newCriterion,
  newPartId,
  switchStyle,
  toBody,
  totalMarks,
  valuesFromBody,
  type RubricFormValues,
  type RubricStyle,
} from "./rubric-values";

const resolver: Resolver<RubricFormValues> = async (values, _context, options) => {
  const result = toBody(values);
  if (result.ok) return { values, errors: {} };
  const flat = Object.fromEntries(Object.entries(result.errors).map(([key, message]) => [key, { type: "validate", message }]));
  return { values: {}, errors: toNestErrors(flat, options) };
};

const PART_NAMES: Record<string, string> = { title: "name", description: "description", label: "name", marks: "marks", descriptor: "descriptor" };

/** Where a field is, in words, for the list of problems: "Criterion 2, level 3 marks". */
export function whereIs(key: string, style: RubricStyle): string {
  const what = style === "competence" ? "Skill" : "Criterion";
  if (key === "title") return "Rubric title";
  if (key === "criteria") return style === "competence" ? "Skills" : "Criteria";
  const m = /^criteria\.(\d+)(?:\.(title|description|levels)(?:\.(\d+)\.(label|marks|descriptor))?)?$/.exec(key);
  if (!m) return "Rubric";
  const c = `${what} ${Number(m[1]) + 1}`;
  if (!m[2]) return c;
  if (m[2] !== "levels") return `${c} ${PART_NAMES[m[2]]}`;
  if (!m[3]) return `${c} levels`;
  return `${c}, level ${Number(m[3]) + 1} ${PART_NAMES[m[4]!]}`;
}

type Conflict = { revision: number; body: RubricBody };

type Props = { mode: "create"; initial: RubricFormValues } | { mode: "edit"; rubricId: string; revision: number; archived: boolean; initial: RubricFormValues };

/**
 * Write or change a rubric: criteria, each with levels from lowest to highest, worth marks or
 * judged "shown / not yet". Saving checks the revision, so two people editing the same rubric
 * cannot overwrite each other without being told.
 */
export function RubricEditor(props: Props) {
  const router = useRouter();
  const p = useId().replace(/[^a-zA-Z0-9]/g, "");
  const summaryRef = useRef<HTMLDivElement>(null);
  const [summary, setSummary] = useState<{ items: SummaryItem[]; lead: string | null } | null>(null);
  const [status, setStatus] = useState("");
  const [revision, setRevision] = useState(props.mode === "edit" ? props.revision : 0);
  const [archived, setArchived] = useState(props.mode === "edit" ? props.archived : false);
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [pendingStyle, setPendingStyle] = useState<RubricStyle | null>(null);

  const { register, control, handleSubmit, getValues, setError, reset, formState } = useForm<RubricFormValues>({ defaultValues: props.initial, resolver, shouldFocusError: false });
  const criteria = useFieldArray({ control, name: "criteria", keyName: "key" });
  const style = useWatch({ control, name: "style" });
  const watched = useWatch({ control });
  const total = totalMarks({ title: "", style, criteria: (watched.criteria ?? []) as RubricFormValues["criteria"] });
  const errors = formState.errors;
  const message = (key: string) => messageAt(errors, key);

  useEffect(() => {
    if (summary) summaryRef.current?.focus();
  }, [summary]);
  useEffect(() => {
    if (!formState.isDirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [formState.isDirty]);

  const hrefFor = (key: string) => `#${p}-${key.replace(/\./g, "-")}`;
  const showSummary = (errs: FieldErrors, lead: string | null) => {
    setSummary({ items: flattenErrors(errs).map(([key, msg]) => ({ message: `${whereIs(key, getValues().style)}: ${msg}`, href: hrefFor(key) })), lead });
  };

  const save = useMutation({
    mutationFn: ({ body, rev }: { body: RubricBody; rev: number }): Promise<{ id?: string; revision?: number }> =>
      props.mode === "create"
        ? fetchJson<{ id: string }>("/api/rubrics", { method: "POST", json: body })
        : fetchJson<{ revision: number }>(`/api/rubrics/${encodeURIComponent(props.rubricId)}`, { method: "PATCH", json: { revision: rev, body } }),
    onSuccess: (res, vars) => {
      setSummary(null);
      setConflict(null);
      if (props.mode === "create") {
        router.push(`/rubrics/${res.id}?created=1`);
        return;
      }
      setRevision(res.revision ?? revision + 1);
      reset(valuesFromBody(vars.body));
      setStatus("Saved.");
      router.refresh();
    },
    onError: (error) => handleRefusal(error),
  });

  const archive = useMutation({
    mutationFn: (next: boolean) =>
      fetchJson<{ revision: number }>(`/api/rubrics/${encodeURIComponent(props.mode === "edit" ? props.rubricId : "")}`, { method: "PATCH", json: { revision, archived: next } }),
    onSuccess: (res, next) => {
      setRevision(res.revision);
      setArchived(next);
      setStatus(next ? "Archived: this rubric no longer appears in the library list." : "Restored to the library.");
      router.refresh();
    },
    onError: (error) => handleRefusal(error),
  });

  function handleRefusal(error: unknown) {
    setStatus("");
    if (error instanceof ApiError && error.status === 409) {
      const current = error.body.current as Conflict | undefined;
      if (current) {
        setSummary(null);
        setConflict(current);
        return;
      }
    }
    const placed: FieldErrors = {};
    const leftover: string[] = [];
    if (error instanceof ApiError) {
      for (const [key, messages] of Object.entries(error.fieldErrors)) {
        const text = messages.join(" ");
        if (key === "body" || key.startsWith("body.") || /^(title|style|criteria)/.test(key)) {
          const field = key.replace(/^body\.?/, "") || "title";
          setError(field as Path<RubricFormValues>, { type: "server", message: text });
          set(placed, field, { type: "server", message: text });
        } else leftover.push(text);
      }
      showSummary(placed, leftover.length ? leftover.join(" ") : Object.keys(error.fieldErrors).length ? "Nothing was saved. Correct these and try again:" : `${error.message} Nothing you typed has been lost.`);
    } else showSummary(placed, "Something went wrong. Nothing you typed has been lost; please try again.");
  }

  const onValid = (values: RubricFormValues) => {
    const result = toBody(values);
    if (result.ok) save.mutate({ body: result.body, rev: revision });
  };

  const applyStyle = (next: RubricStyle) => {
    reset(switchStyle(getValues(), next), { keepDefaultValues: true });
    setPendingStyle(null);
  };

  const criterionIds = criteria.fields.map((c) => c.id);

  return (
    <form noValidate className="flex flex-col gap-6" aria-label={props.mode === "create" ? "New rubric" : "Edit rubric"} onSubmit={(e) => handleSubmit(onValid, (errs) => showSummary(errs, "Nothing was saved yet. Correct these and try again:"))(e)}>
      <p className="sr-only" aria-live="polite">
        {status}
      </p>
      {summary ? <ErrorSummary ref={summaryRef} title="Some things need attention" items={summary.items} lead={summary.lead} /> : null}
      {conflict ? (
        <Alert tone="warn" title="Someone else saved this rubric while you were editing">
          <p>Your changes have not been saved, and they are still on this page. Choose what to do:</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button
              variant="secondary"
              size="sm"
              onClick={() => {
                reset(valuesFromBody(conflict.body));
                setRevision(conflict.revision);
                setConflict(null);
                setStatus("Loaded the version someone else saved. Your changes were discarded.");
              }}
            >
              Reload their version (discard mine)
            </Button>
            <Button
              size="sm"
              onClick={() => {
                const result = toBody(getValues());
                if (!result.ok) return handleSubmit(onValid, (errs) => showSummary(errs, "Nothing was saved yet. Correct these and try again:"))();
                setRevision(conflict.revision);
                save.mutate({ body: result.body, rev: conflict.revision });
              }}
            >
              Save mine over theirs
            </Button>
          </div>
        </Alert>
      ) : null}
      {status ? <Alert tone="good">{status}</Alert> : null}
      {archived ? (
        <Alert tone="warn" title="Archived">
          This rubric is archived: it is kept, but not offered in the library list. Restore it to use it again.
        </Alert>
      ) : null}

      <div className="grid gap-4 md:grid-cols-[2fr_1fr]">
        <Field id={`${p}-title`} label="Rubric title" error={message("title")}>
          {(a) => <Input {...a} maxLength={100} {...register("title")} />}
        </Field>
        <div className="flex flex-col justify-end">
          <p className="text-sm text-muted">Most marks</p>
          <p className="text-2xl font-bold" aria-live="polite">
            {style === "competence" ? `${criteria.fields.length} skill${criteria.fields.length === 1 ? "" : "s"}` : `${total} mark${total === 1 ? "" : "s"}`}
          </p>
        </div>
      </div>

      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-semibold">Style</legend>
        {(
          [
            ["marks", "Marks", "Each criterion has levels worth marks; a write-up gets a total."],
            ["competence", "Shown / not yet", "Each criterion is a skill judged “shown” or “not yet”, to build a record of practical competence."],
          ] as const
        ).map(([value, label, description]) => (
          <label key={value} htmlFor={`${p}-style-${value}`} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md px-1 py-2 hover:bg-sunken">
            <input
              id={`${p}-style-${value}`}
              type="radio"
              name={`${p}-style`}
              className="mt-1 size-5 shrink-0 accent-brand"
              checked={style === value}
              onChange={() => (value === "competence" && competenceSwitchLoses(getValues()) ? setPendingStyle("competence") : applyStyle(value))}
            />
            <span>
              <span className="block font-semibold">{label}</span>
              <span className="block text-sm text-muted">{description}</span>
            </span>
          </label>
        ))}
        {pendingStyle ? (
          <div role="alert" className="mt-2 flex flex-col gap-2 rounded-md border border-warn/50 bg-warn-soft p-3">
            <p className="font-semibold">Switching to &ldquo;shown / not yet&rdquo; keeps only each criterion&apos;s lowest and highest level descriptors, worth 0 and 1. The other levels and marks are removed.</p>
            <div className="flex flex-wrap gap-2">
              <Button size="sm" onClick={() => applyStyle("competence")}>
                Switch and remove the other levels
              </Button>
              <Button size="sm" variant="secondary" onClick={() => setPendingStyle(null)}>
                Keep marks
              </Button>
            </div>
          </div>
        ) : null}
      </fieldset>

      <section aria-labelledby={`${p}-criteria`} className="flex flex-col gap-4">
        <h2 id={`${p}-criteria`} tabIndex={-1} className="text-xl font-bold">
          {style === "competence" ? "Skills" : "Criteria"} ({criteria.fields.length})
        </h2>
        {message("criteria") ? <p className="text-sm font-semibold text-bad">{message("criteria")}</p> : null}
        <ol className="flex flex-col gap-4">
          {criteria.fields.map((field, ci) => (
            <li key={field.key} className="rounded-lg border border-line bg-surface p-4">
              <CriterionEditor
                p={p}
                index={ci}
                count={criteria.fields.length}
                control={control}
                register={register}
                style={style}
                message={message}
                onMove={(to) => criteria.move(ci, to)}
                onRemove={() => criteria.remove(ci)}
              />
            </li>
          ))}
        </ol>
        <div>
          <Button variant="secondary" disabled={criteria.fields.length >= MAX_CRITERIA} onClick={() => criteria.append(newCriterion(style, criterionIds))}>
            {style === "competence" ? "Add a skill" : "Add a criterion"}
          </Button>
          {criteria.fields.length >= MAX_CRITERIA ? <span className="ml-2 text-sm text-muted">At most {MAX_CRITERIA}.</span> : null}
        </div>
      </section>

      <div className="flex flex-wrap items-start gap-2 border-t border-line pt-4">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? "Saving…" : props.mode === "create" ? "Save rubric" : "Save changes"}
        </Button>
        <Link href="/rubrics" className={buttonClasses("secondary")}>
          Back to the library
        </Link>
        {props.mode === "edit" ? (
          archived ? (
            <Button variant="ghost" disabled={archive.isPending} onClick={() => archive.mutate(false)}>
              Restore to the library
            </Button>
          ) : (
            <ConfirmButton
              label="Archive"
              variant="ghost"
              tone="danger"
              question={`Archive this rubric? It stays on record but leaves the library list. Practicals that copied it keep their own copy.${formState.isDirty ? " Your unsaved changes will not be saved." : ""}`}
              confirmLabel="Archive it"
              backOutLabel="Keep it"
              busy={archive.isPending}
              onConfirm={() => archive.mutate(true)}
            />
          )
        ) : null}
        {formState.isDirty ? <Badge tone="warn">Unsaved changes</Badge> : null}
      </div>
    </form>
  );
}

function CriterionEditor({
  p,
  index: ci,
  count,
  control,
  register,
  style,
  message,
  onMove,
  onRemove,
}: {
  p: string;
  index: number;
  count: number;
  control: Control<RubricFormValues>;
  register: UseFormRegister<RubricFormValues>;
  style: RubricStyle;
  message: (key: string) => string | undefined;
  onMove: (to: number) => void;
  onRemove: () => void;
}) {
  const levels = useFieldArray({ control, name: `criteria.${ci}.levels`, keyName: "key" });
  const title = useWatch({ control, name: `criteria.${ci}.title` });
  const base = `criteria.${ci}`;
  const id = (key: string) => `${p}-${key.replace(/\./g, "-")}`;
  const name = title?.trim() || `${style === "competence" ? "skill" : "criterion"} ${ci + 1}`;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-lg font-bold">
          {ci + 1}. {title?.trim() || <span className="text-muted">Untitled</span>}
        </h3>
        <div className="flex flex-wrap gap-1">
          <Button variant="ghost" size="sm" disabled={ci === 0} onClick={() => onMove(ci - 1)} aria-label={`Move ${name} up`}>
            Move up
          </Button>
          <Button variant="ghost" size="sm" disabled={ci === count - 1} onClick={() => onMove(ci + 1)} aria-label={`Move ${name} down`}>
            Move down
          </Button>
          <Button variant="ghost" size="sm" disabled={count <= 1} onClick={onRemove} aria-label={`Remove ${name}`}>
            Remove
          </Button>
        </div>
      </div>
      <div className="grid gap-3 md:grid-cols-2">
        <Field id={id(`${base}.title`)} label={style === "competence" ? "Skill" : "Criterion"} error={message(`${base}.title`)}>
          {(a) => <Input {...a} maxLength={80} {...register(`criteria.${ci}.title`)} />}
        </Field>
        <Field id={id(`${base}.description`)} label="Description (optional)" error={message(`${base}.description`)}>
          {(a) => <Input {...a} maxLength={400} {...register(`criteria.${ci}.description`)} />}
        </Field>
      </div>
      <fieldset className="flex flex-col gap-2">
        <legend id={id(`${base}.levels`)} tabIndex={-1} className="mb-1 font-semibold">
          {style === "competence" ? "Judgements" : "Levels, lowest first"}
        </legend>
        {message(`${base}.levels`) ? <p className="text-sm font-semibold text-bad">{message(`${base}.levels`)}</p> : null}
        <ol className="flex flex-col gap-2">
          {levels.fields.map((level, li) => {
            const lk = `${base}.levels.${li}`;
            return (
              <li key={level.key} className="grid gap-2 rounded-md border border-line bg-paper/50 p-3 md:grid-cols-[12rem_7rem_1fr] md:items-start">
                {style === "competence" ? (
                  <p className="font-semibold md:pt-2">{li === 0 ? "Not yet" : "Shown"}</p>
                ) : (
                  <Field id={id(`${lk}.label`)} label="Level" error={message(`${lk}.label`)}>
                    {(a) => <Input {...a} maxLength={40} {...register(`criteria.${ci}.levels.${li}.label`)} />}
                  </Field>
                )}
                {style === "competence" ? (
                  <span className="hidden md:block" aria-hidden="true" />
                ) : (
                  <Field id={id(`${lk}.marks`)} label="Marks" error={message(`${lk}.marks`)}>
                    {(a) => <Input {...a} inputMode="numeric" {...register(`criteria.${ci}.levels.${li}.marks`)} />}
                  </Field>
                )}
                <Field id={id(`${lk}.descriptor`)} label={style === "competence" ? `What “${li === 0 ? "not yet" : "shown"}” looks like` : "Descriptor"} error={message(`${lk}.descriptor`)}>
                  {(a) => <Textarea {...a} maxLength={600} className="min-h-11" rows={2} {...register(`criteria.${ci}.levels.${li}.descriptor`)} />}
                </Field>
                {style === "marks" ? (
                  <div className="flex flex-wrap justify-end gap-1 md:col-span-3">
                    <Button variant="ghost" size="sm" disabled={li === 0} onClick={() => levels.move(li, li - 1)} aria-label={`Move level ${li + 1} of ${name} lower`}>
                      Lower
                    </Button>
                    <Button variant="ghost" size="sm" disabled={li === levels.fields.length - 1} onClick={() => levels.move(li, li + 1)} aria-label={`Move level ${li + 1} of ${name} higher`}>
                      Higher
                    </Button>
                    <Button variant="ghost" size="sm" disabled={levels.fields.length <= MIN_LEVELS} onClick={() => levels.remove(li)} aria-label={`Remove level ${li + 1} of ${name}`}>
                      Remove
                    </Button>
                  </div>
                ) : null}
              </li>
            );
          })}
        </ol>
        {style === "marks" ? (
          <div>
            <Button
              variant="secondary"
              size="sm"
              disabled={levels.fields.length >= MAX_LEVELS}
              onClick={() => {
                const top = Number(levels.fields[levels.fields.length - 1]?.marks ?? "0");
                levels.append({ id: newPartId("l", levels.fields.map((l) => l.id)), label: "", marks: Number.isFinite(top) ? String(top + 1) : "", descriptor: "" });
              }}
            >
              Add a higher level
            </Button>
          </div>
        ) : null}
      </fieldset>
    </div>
  );
}

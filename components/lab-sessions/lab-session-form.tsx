"use client";

import { toNestErrors } from "@hookform/resolvers";
import { useMutation, useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { set, useForm, useWatch, type FieldErrors, type Path, type Resolver } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button, buttonClasses } from "@/components/ui/button";
import { Field, Input, Select, Textarea } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { LabSessionInput } from "@/lib/validation/practicals";
import { ErrorSummary, type SummaryItem } from "./error-summary";
import { flattenErrors, messageAt } from "./form-errors";
import { formFieldFor, formValuesToInput, LATE_WORK_OPTIONS, type LabSessionFormValues } from "./form-values";
import { GroupBuilder, type RosterStudent } from "./group-builder";
import { fromLocalParts } from "./local-date-time";

export type ClassOption = { id: string; name: string; studentCount: number };
export type PracticalOption = { versionId: string; title: string; version: number; topic: string; yearGroup: number };

type Props =
  | { mode: "create"; classes: ClassOption[]; practicals: PracticalOption[]; initial: LabSessionFormValues }
  | { mode: "edit"; labSessionId: string; className: string; practicalTitle: string; initial: LabSessionFormValues; onDone: (saved: boolean) => void };

const resolver: Resolver<LabSessionFormValues> = async (values, _context, options) => {
  const result = formValuesToInput(values);
  if (result.ok) return { values, errors: {} };
  const flat = Object.fromEntries(Object.entries(result.errors).map(([key, message]) => [key, { type: "validate", message }]));
  return { values: {}, errors: toNestErrors(flat, options) };
};

const FIELD_ORDER = ["form", "classId", "practicalVersionId", "opensDate", "opensTime", "dueDate", "dueTime", "grouping", "groups", "lateWork", "lateDays", "notes"];
const orderOf = (key: string) => {
  const i = FIELD_ORDER.indexOf(key.startsWith("groups.") ? "groups" : key);
  return i === -1 ? FIELD_ORDER.length : i;
};

const lateUntil = (dueDate: string, dueTime: string, days: string) => {
  const due = fromLocalParts(dueDate, dueTime);
  const n = Number(days);
  if (!due.ok || !Number.isInteger(n) || n < 0 || n > 60) return null;
  return new Date(due.date.getTime() + n * 86_400_000).toLocaleString("en-GB", { weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });
};

/** Schedule a lab session, or change the dates, groups and rules of one. */
export function LabSessionForm(props: Props) {
  const router = useRouter();
  const p = useId().replace(/[^a-zA-Z0-9]/g, "");
  const summaryRef = useRef<HTMLDivElement>(null);
  const [summary, setSummary] = useState<{ items: SummaryItem[]; lead: string | null } | null>(null);
  const [notice, setNotice] = useState("");
  const { register, handleSubmit, control, setValue, setError, getValues, formState } = useForm<LabSessionFormValues>({
    defaultValues: props.initial,
    resolver,
    shouldFocusError: false,
  });
  const errors = formState.errors;
  const message = (key: string) => messageAt(errors, key);

  const classId = useWatch({ control, name: "classId" });
  const grouping = useWatch({ control, name: "grouping" });
  const groups = useWatch({ control, name: "groups" });
  const lateWork = useWatch({ control, name: "lateWork" });
  const [dueDate, dueTime, lateDays] = useWatch({ control, name: ["dueDate", "dueTime", "lateDays"] });

  const roster = useQuery({
    queryKey: ["class", classId],
    queryFn: () => fetchJson<{ class: { students: RosterStudent[] | null } }>(`/api/classes/${encodeURIComponent(classId)}`),
    enabled: grouping === "groups" && !!classId,
  });

  const hrefFor = (key: string) => {
    if (key.startsWith("groups.")) return `#${p}-groups-${key.split(".")[1]}`;
    if (key === "groups") return `#${p}-groups-section`;
    if (key === "grouping") return `#${p}-grouping-individual`;
    if (key === "lateWork") return `#${p}-lateWork-accept`;
    return `#${p}-${key}`;
  };
  const showSummary = (errs: FieldErrors, lead: string | null) => {
    const items = flattenErrors(errs)
      .filter(([key]) => key !== "form")
      .sort((a, b) => orderOf(a[0]) - orderOf(b[0]))
      .map(([key, msg]) => {
        const g = /^groups\.(\d+)\./.exec(key);
        const name = g ? getValues("groups")[Number(g[1])]?.name.trim() || `Group ${Number(g[1]) + 1}` : null;
        return { message: name ? `${name}: ${msg}` : msg, href: hrefFor(key) };
      });
    const formMessage = messageAt(errs, "form") ?? null;
    setSummary({ items, lead: lead ?? formMessage });
  };
  useEffect(() => {
    if (summary) summaryRef.current?.focus();
  }, [summary]);

  const save = useMutation({
    mutationFn: (input: LabSessionInput) =>
      props.mode === "create"
        ? fetchJson<{ id: string }>("/api/lab-sessions", { method: "POST", json: input })
        : fetchJson<{ id: string }>(`/api/lab-sessions/${encodeURIComponent(props.labSessionId)}`, { method: "PUT", json: input }),
    onSuccess: (res) => {
      setSummary(null);
      if (props.mode === "create") router.push(`/lab-sessions/${res.id}?scheduled=1`);
      else {
        router.refresh();
        props.onDone(true);
      }
    },
    onError: (error) => {
      const placed: FieldErrors = {};
      let lead: string;
      if (error instanceof ApiError) {
        const entries = Object.entries(error.fieldErrors);
        const leftover: string[] = [];
        for (const [key, messages] of entries) {
          const field = formFieldFor(key);
          const text = messages.join(" ");
          if (field) {
            setError(field as Path<LabSessionFormValues>, { type: "server", message: text });
            set(placed, field, { type: "server", message: text });
          } else leftover.push(text);
        }
        lead = !entries.length ? `${error.message} Nothing you typed has been lost.` : leftover.length ? leftover.join(" ") : "Nothing was saved. Correct these and try again:";
      } else lead = "Something went wrong. Nothing you typed has been lost; please try again.";
      showSummary(placed, lead);
    },
  });

  const onValid = (values: LabSessionFormValues) => {
    const result = formValuesToInput(values);
    if (result.ok) save.mutate(result.input);
  };

  const rosterStudents = roster.data?.class.students ?? [];
  const late = lateWork !== "refuse" ? lateUntil(dueDate, dueTime, lateDays) : null;
  const classes = props.mode === "create" ? props.classes : [];

  return (
    <form
      noValidate
      className="flex flex-col gap-6"
      aria-label={props.mode === "create" ? "Schedule a lab session" : "Change this lab session"}
      onSubmit={(e) => handleSubmit(onValid, (errs) => showSummary(errs, "Nothing was saved yet. Correct these and try again:"))(e)}
    >
      {summary ? <ErrorSummary ref={summaryRef} title="Some things need attention" items={summary.items} lead={summary.lead} /> : null}

      <section aria-labelledby={`${p}-what`} className="flex flex-col gap-4">
        <h2 id={`${p}-what`} className="text-lg font-bold">
          Class and practical
        </h2>
        {props.mode === "create" ? (
          <div className="grid gap-4 md:grid-cols-2">
            <Field id={`${p}-classId`} label="Class" error={message("classId")} hint={classes.length ? undefined : "You are not teaching any classes yet."}>
              {(a) => (
                <Select
                  {...a}
                  {...register("classId", {
                    onChange: () => {
                      if (getValues("groups").length) {
                        setValue("groups", []);
                        setNotice("The groups were cleared because the class changed. Make new groups for this class.");
                      }
                    },
                  })}
                >
                  <option value="">Choose a class</option>
                  {classes.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name} ({c.studentCount} student{c.studentCount === 1 ? "" : "s"})
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            <Field
              id={`${p}-practicalVersionId`}
              label="Practical"
              error={message("practicalVersionId")}
              hint={props.practicals.length ? "Only published practicals can be scheduled. The newest published version is used." : undefined}
            >
              {(a) => (
                <Select {...a} {...register("practicalVersionId")}>
                  <option value="">Choose a published practical</option>
                  {props.practicals.map((pr) => (
                    <option key={pr.versionId} value={pr.versionId}>
                      {pr.title} (version {pr.version}) · {pr.topic} · Year {pr.yearGroup}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
            {props.practicals.length === 0 ? (
              <Alert tone="warn" className="md:col-span-2" title="No published practicals yet">
                A practical must be published before it can be scheduled. <Link href="/practicals">Open the practicals library</Link> to publish one.
              </Alert>
            ) : null}
          </div>
        ) : (
          <dl className="grid gap-2 sm:grid-cols-2">
            <div>
              <dt className="text-sm text-muted">Class</dt>
              <dd className="font-semibold">{props.className}</dd>
            </div>
            <div>
              <dt className="text-sm text-muted">Practical</dt>
              <dd className="font-semibold">{props.practicalTitle}</dd>
            </div>
            <p className="text-sm text-muted sm:col-span-2">The class and practical cannot change. To use a different one, cancel this lab session and schedule a new one.</p>
          </dl>
        )}
      </section>

      <section aria-labelledby={`${p}-when`} className="flex flex-col gap-3">
        <h2 id={`${p}-when`} className="text-lg font-bold">
          Dates
        </h2>
        <p className="text-sm text-muted">In the school&apos;s local time. Students can start their write-up when the lab session opens.</p>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <Field id={`${p}-opensDate`} label="Opening date" error={message("opensDate")}>
            {(a) => <Input type="date" {...a} {...register("opensDate")} />}
          </Field>
          <Field id={`${p}-opensTime`} label="Opening time" error={message("opensTime")}>
            {(a) => <Input type="time" {...a} {...register("opensTime")} />}
          </Field>
          <Field id={`${p}-dueDate`} label="Due date" error={message("dueDate")}>
            {(a) => <Input type="date" {...a} {...register("dueDate")} />}
          </Field>
          <Field id={`${p}-dueTime`} label="Due time" error={message("dueTime")}>
            {(a) => <Input type="time" {...a} {...register("dueTime")} />}
          </Field>
        </div>
      </section>

      <section aria-labelledby={`${p}-groups-section`} className="flex flex-col gap-3">
        <h2 id={`${p}-groups-section`} tabIndex={-1} className="text-lg font-bold">
          How students record data
        </h2>
        <fieldset className="flex flex-col gap-1">
          <legend className="sr-only">How students record data</legend>
          {(
            [
              ["individual", "Each student records their own data", "Everyone writes up their own results, even if they share apparatus."],
              ["groups", "Groups share one set of data", "Students in a group record the same results, then each writes up their own analysis."],
            ] as const
          ).map(([value, label, description]) => (
            <label key={value} htmlFor={`${p}-grouping-${value}`} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md px-1 py-2 hover:bg-sunken">
              <input id={`${p}-grouping-${value}`} type="radio" value={value} className="mt-1 size-5 shrink-0 accent-brand" {...register("grouping")} />
              <span>
                <span className="block font-semibold">{label}</span>
                <span className="block text-sm text-muted">{description}</span>
              </span>
            </label>
          ))}
        </fieldset>
        <p className="text-sm font-semibold text-brand-strong" aria-live="polite">
          {notice}
        </p>
        {grouping === "groups" ? (
          !classId ? (
            <p className="text-muted">Choose a class first; its students appear here to put into groups.</p>
          ) : roster.isPending ? (
            <p className="text-muted" role="status">
              Loading the class list…
            </p>
          ) : roster.isError ? (
            <Alert tone="bad" title="Could not load the class list">
              <p>{roster.error instanceof ApiError ? roster.error.message : "Check your connection and try again."}</p>
              <Button variant="secondary" size="sm" className="mt-2" onClick={() => roster.refetch()}>
                Try again
              </Button>
            </Alert>
          ) : (
            <GroupBuilder
              idPrefix={p}
              roster={rosterStudents}
              groups={groups}
              onChange={(next) => setValue("groups", next, { shouldDirty: true, shouldValidate: formState.isSubmitted })}
              errors={Object.fromEntries(["groups", ...groups.flatMap((_, i) => [`groups.${i}.studentIds`, `groups.${i}.name`])].map((k) => [k, message(k)]))}
            />
          )
        ) : null}
      </section>

      <section aria-labelledby={`${p}-late`} className="flex flex-col gap-3">
        <h2 id={`${p}-late`} className="text-lg font-bold">
          Late work
        </h2>
        <fieldset className="flex flex-col gap-1" aria-describedby={message("lateWork") ? `${p}-lateWork-error` : undefined}>
          <legend className="sr-only">What happens to work handed in after the due date</legend>
          {LATE_WORK_OPTIONS.map((o) => (
            <label key={o.value} htmlFor={`${p}-lateWork-${o.value}`} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md px-1 py-2 hover:bg-sunken">
              <input id={`${p}-lateWork-${o.value}`} type="radio" value={o.value} className="mt-1 size-5 shrink-0 accent-brand" {...register("lateWork")} />
              <span>
                <span className="block font-semibold">{o.label}</span>
                <span className="block text-sm text-muted">{o.description}</span>
              </span>
            </label>
          ))}
          {message("lateWork") ? (
            <p id={`${p}-lateWork-error`} className="text-sm font-semibold text-bad">
              {message("lateWork")}
            </p>
          ) : null}
        </fieldset>
        {lateWork !== "refuse" ? (
          <Field
            id={`${p}-lateDays`}
            label="For how many days after the due date?"
            hint={late ? `Late write-ups can be handed in until ${late}.` : "From 0 to 60 days."}
            error={message("lateDays")}
            className="max-w-xs"
          >
            {(a) => <Input type="number" inputMode="numeric" min={0} max={60} step={1} {...a} {...register("lateDays")} />}
          </Field>
        ) : null}
      </section>

      <section aria-labelledby={`${p}-notes-h`} className="flex flex-col gap-3">
        <h2 id={`${p}-notes-h`} className="text-lg font-bold">
          Notes for students
        </h2>
        <Field id={`${p}-notes`} label="Notes (optional)" hint="Shown on the lab session page, for example what to bring or which lab you are in. At most 600 characters." error={message("notes")}>
          {(a) => <Textarea maxLength={600} {...a} {...register("notes")} />}
        </Field>
      </section>

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? (props.mode === "create" ? "Scheduling…" : "Saving…") : props.mode === "create" ? "Schedule lab session" : "Save changes"}
        </Button>
        {props.mode === "create" ? (
          <Link href="/lab-sessions" className={buttonClasses("secondary")}>
            Back to lab sessions
          </Link>
        ) : (
          <Button variant="secondary" onClick={() => props.onDone(false)} disabled={save.isPending}>
            Close without saving
          </Button>
        )}
      </div>
    </form>
  );
}

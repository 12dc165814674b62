"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import { z } from "zod";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { fetchJson } from "@/lib/fetch-json";
import { classCreateSchema } from "@/lib/validation/classes";
import { yearGroupSchema } from "@/lib/validation/common";
import { YEAR_GROUPS } from "./add-person-form";
import type { PickerPerson } from "./api-types";
import { CheckboxGroup } from "./checkbox-group";
import { showServerErrors } from "./form-errors";

/** The class schema, with a plainer message when no year group has been chosen from the list. */
const classFormSchema = classCreateSchema.extend({
  yearGroup: z
    .unknown()
    .refine((v) => v !== undefined && v !== null && v !== "", "Choose a year group.")
    .pipe(yearGroupSchema),
});
export type ClassFormIn = z.input<typeof classFormSchema>;
export type ClassFormOut = z.output<typeof classFormSchema>;
const FIELDS = ["name", "subject", "yearGroup", "academicYear", "teacherIds"] as const;

/** The academic year a date falls in, written like 2026-27 (years start in September). */
export function academicYearOf(d: Date): string {
  const start = d.getMonth() >= 8 ? d.getFullYear() : d.getFullYear() - 1;
  return `${start}-${String((start + 1) % 100).padStart(2, "0")}`;
}

/** Every active teacher, for the teachers checkboxes. */
export function useTeachers() {
  return useQuery({
    queryKey: ["picker", "teacher", "", 500],
    queryFn: () => fetchJson<{ people: PickerPerson[] }>("/api/people-picker?role=teacher&limit=500"),
    staleTime: 60_000,
  });
}

/**
 * Create or edit a class: name, subject, year group, academic year and teachers. On a refused
 * save everything typed stays and each message appears at its field.
 */
export function ClassForm({
  idPrefix,
  initial,
  submitLabel,
  busyLabel,
  onSubmit,
  onCancel,
  extraTeachers = [],
}: {
  idPrefix: string;
  initial: ClassFormIn;
  submitLabel: string;
  busyLabel: string;
  onSubmit: (values: ClassFormOut) => Promise<void>;
  onCancel?: () => void;
  /** Teachers already on the class who may no longer be active, so they still show as ticked. */
  extraTeachers?: { id: string; name: string }[];
}) {
  const [formMessage, setFormMessage] = useState<string | null>(null);
  const teachers = useTeachers();
  const { register, handleSubmit, control, formState, setError } = useForm<ClassFormIn, unknown, ClassFormOut>({
    resolver: zodResolver(classFormSchema),
    defaultValues: initial,
  });

  const submit = handleSubmit(async (values) => {
    setFormMessage(null);
    try {
      await onSubmit(values);
    } catch (e) {
      setFormMessage(showServerErrors<ClassFormIn>(e, FIELDS, setError));
    }
  });

  const teacherOptions = [...(teachers.data?.people ?? [])];
  for (const t of extraTeachers) if (!teacherOptions.some((o) => o.id === t.id)) teacherOptions.push({ id: t.id, name: t.name, email: "", yearGroup: null });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <div aria-live="polite">{formMessage ? <Alert tone="bad">{formMessage}</Alert> : null}</div>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id={`${idPrefix}-name`} label="Class name" hint="As the school writes it, for example 10C Chemistry." error={formState.errors.name?.message}>
          {(p) => <Input {...p} autoComplete="off" {...register("name")} />}
        </Field>
        <Field id={`${idPrefix}-subject`} label="Subject" hint="For example Chemistry, Physics, Biology or Science." error={formState.errors.subject?.message}>
          {(p) => <Input {...p} autoComplete="off" list={`${idPrefix}-subjects`} {...register("subject")} />}
        </Field>
        <datalist id={`${idPrefix}-subjects`}>
          {["Chemistry", "Physics", "Biology", "Science", "Combined Science"].map((s) => (
            <option key={s} value={s} />
          ))}
        </datalist>
        <Field id={`${idPrefix}-year`} label="Year group" error={formState.errors.yearGroup?.message}>
          {(p) => (
            <Select {...p} {...register("yearGroup", { setValueAs: (v) => (v === "" || v == null ? undefined : Number(v)) })}>
              <option value="">Choose a year group</option>
              {YEAR_GROUPS.map((y) => (
                <option key={y} value={y}>
                  Year {y}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field id={`${idPrefix}-academic-year`} label="Academic year" hint="Written like 2026-27." error={formState.errors.academicYear?.message}>
          {(p) => <Input {...p} autoComplete="off" inputMode="numeric" placeholder="2026-27" {...register("academicYear")} />}
        </Field>
      </div>
      {teachers.isPending ? (
        <p className="text-muted" role="status">
          Loading teachers…
        </p>
      ) : teachers.isError ? (
        <Alert tone="bad">The list of teachers could not be loaded. You can save the class now and add teachers later.</Alert>
      ) : teacherOptions.length ? (
        <Controller
          control={control}
          name="teacherIds"
          render={({ field, fieldState }) => (
            <CheckboxGroup
              id={`${idPrefix}-teachers`}
              legend="Teachers"
              hint="Teachers see this class, schedule its lab sessions and mark its work."
              columns
              options={teacherOptions.map((t) => ({ value: t.id, label: t.name, description: t.email || undefined }))}
              value={field.value ?? []}
              onChange={field.onChange}
              error={fieldState.error?.message}
            />
          )}
        />
      ) : (
        <p className="text-muted">There are no teachers yet. Add teachers on the People page, then choose them here.</p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? busyLabel : submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}

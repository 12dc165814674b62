"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { practicalCreateSchema } from "@/lib/validation/practicals";

type FormInput = z.input<typeof practicalCreateSchema>;
type FormOutput = z.output<typeof practicalCreateSchema>;

const SUBJECTS = ["Chemistry", "Physics", "Biology", "Combined science"];

/**
 * Starts a practical: title, topic, year group and subject, then straight into the editor.
 */
export function NewPracticalForm({ topics }: { topics: string[] }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const firstRef = useRef<HTMLInputElement | null>(null);
  const { register, handleSubmit, setError, formState, reset } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(practicalCreateSchema),
    defaultValues: { title: "", topic: "", yearGroup: 10, subject: "Chemistry" },
  });
  useEffect(() => {
    if (open) firstRef.current?.focus();
  }, [open]);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const res = await fetchJson<{ practicalId: string; versionId: string }>("/api/practicals", { method: "POST", json: values });
      router.push(`/practicals/${res.practicalId}/versions/${res.versionId}/edit`);
    } catch (e) {
      if (e instanceof ApiError && Object.keys(e.fieldErrors).length) {
        let placed = false;
        for (const [key, messages] of Object.entries(e.fieldErrors)) {
          if (key === "title" || key === "topic" || key === "yearGroup" || key === "subject") {
            setError(key, { type: "server", message: messages.join(" ") }, { shouldFocus: !placed });
            placed = true;
          }
        }
        if (!placed) setFormError(e.message);
      } else setFormError(e instanceof ApiError ? e.message : "Could not create the practical. Please try again.");
    }
  });

  if (!open) {
    return (
      <Button onClick={() => setOpen(true)} aria-expanded={false} aria-controls="new-practical">
        New practical
      </Button>
    );
  }
  const { ref: titleRef, ...titleField } = register("title");
  const err = formState.errors;
  return (
    <section id="new-practical" aria-labelledby="new-practical-title" className="w-full rounded-lg border border-brand/40 bg-surface p-4 sm:max-w-xl">
      <h2 id="new-practical-title" className="mb-1 text-lg font-bold">
        New practical
      </h2>
      <p className="mb-3 text-muted">You can change all of this later. Next you will write the aim, method, safety, tables, checks and rubric.</p>
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-3">
        {formError ? <Alert tone="bad">{formError}</Alert> : null}
        <Field id="np-title" label="Title" hint="For example “Magnesium and acid: gas collected over time”." error={err.title?.message}>
          {(p) => (
            <Input
              {...p}
              {...titleField}
              ref={(el) => {
                titleRef(el);
                firstRef.current = el;
              }}
              autoComplete="off"
            />
          )}
        </Field>
        <Field id="np-topic" label="Topic" hint="Practicals with the same topic are grouped in the library." error={err.topic?.message}>
          {(p) => <Input {...p} {...register("topic")} list="np-topics" autoComplete="off" />}
        </Field>
        <datalist id="np-topics">
          {topics.map((t) => (
            <option key={t} value={t} />
          ))}
        </datalist>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id="np-year" label="Year group" error={err.yearGroup?.message}>
            {(p) => (
              <Select {...p} {...register("yearGroup", { valueAsNumber: true })}>
                {[7, 8, 9, 10, 11, 12, 13].map((y) => (
                  <option key={y} value={y}>
                    Year {y}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field id="np-subject" label="Subject" error={err.subject?.message}>
            {(p) => (
              <Select {...p} {...register("subject")}>
                {SUBJECTS.map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? "Creating…" : "Create and open the editor"}
          </Button>
          <Button
            variant="ghost"
            onClick={() => {
              reset();
              setFormError(null);
              setOpen(false);
            }}
          >
            Cancel
          </Button>
        </div>
      </form>
    </section>
  );
}

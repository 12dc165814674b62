"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Controller, useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { fetchJson } from "@/lib/fetch-json";
import { ROLE_LABELS, ROLES } from "@/lib/roles";
import { formatDateTime } from "@/lib/utils";
import { userCreateSchema } from "@/lib/validation/users";
import type { CreatedPerson } from "./api-types";
import { CheckboxGroup } from "./checkbox-group";
import { showServerErrors } from "./form-errors";

type FormIn = z.input<typeof userCreateSchema>;
type FormOut = z.output<typeof userCreateSchema>;

const FIELDS = ["name", "email", "roles", "yearGroup", "sendInvitation"] as const;

export const ROLE_HINTS: Record<(typeof ROLES)[number], string> = {
  admin: "Manages people, classes and invitations",
  teacher: "Writes practicals, teaches classes, marks",
  student: "Records write-ups in their classes",
  moderator: "Second-marks a sample of marked work",
  parent: "Sees their own children's progress",
};

export const YEAR_GROUPS = Array.from({ length: 13 }, (_, i) => i + 1);

/** The "Add a person" form. A refused save keeps everything typed and shows each problem at its field. */
export function AddPersonForm({ onDone }: { onDone?: () => void }) {
  const queryClient = useQueryClient();
  const [formMessage, setFormMessage] = useState<string | null>(null);
  const [added, setAdded] = useState<{ id: string; name: string; result: CreatedPerson } | null>(null);
  const form = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(userCreateSchema),
    defaultValues: { name: "", email: "", roles: [], yearGroup: null, sendInvitation: true },
  });
  const { register, handleSubmit, control, formState, setError, reset } = form;
  const roles = useWatch({ control, name: "roles" }) ?? [];
  const isStudent = roles.includes("student");

  const create = useMutation({
    mutationFn: (values: FormOut) =>
      fetchJson<CreatedPerson>("/api/users", { method: "POST", json: { ...values, yearGroup: values.roles.includes("student") ? (values.yearGroup ?? null) : null } }),
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormMessage(null);
    setAdded(null);
    try {
      const result = await create.mutateAsync(values);
      setAdded({ id: result.id, name: values.name, result });
      reset();
      await queryClient.invalidateQueries({ queryKey: ["people"] });
    } catch (e) {
      setFormMessage(showServerErrors<FormIn>(e, FIELDS, setError));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Add a person">
      <div aria-live="polite">
        {formMessage ? <Alert tone="bad">{formMessage}</Alert> : null}
        {added ? (
          <Alert tone={added.result.invitation && !added.result.invitation.sent ? "warn" : "good"} title={`${added.name} has been added.`}>
            <p>
              {added.result.invitation === null
                ? "No invitation was sent. You can send one from their page when you are ready."
                : added.result.invitation.sent
                  ? `An invitation is on its way; its link works until ${formatDateTime(added.result.invitation.expiresAt)}.`
                  : `The invitation could not be sent: ${added.result.invitation.message}`}{" "}
              <Link href={`/admin/people/${added.id}`}>Open {added.name}&apos;s page</Link>
            </p>
          </Alert>
        ) : null}
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="new-name" label="Full name" error={formState.errors.name?.message}>
          {(p) => <Input {...p} autoComplete="off" {...register("name")} />}
        </Field>
        <Field id="new-email" label="E-mail" hint="The invitation goes to this address. It is also how they sign in." error={formState.errors.email?.message}>
          {(p) => <Input {...p} type="email" inputMode="email" autoComplete="off" {...register("email")} />}
        </Field>
      </div>
      <Controller
        control={control}
        name="roles"
        render={({ field, fieldState }) => (
          <CheckboxGroup
            id="new-roles"
            legend="Roles"
            hint="Choose every role this person has; a head of department is often a teacher and a moderator."
            columns
            options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r], description: ROLE_HINTS[r] }))}
            value={field.value ?? []}
            onChange={field.onChange}
            error={fieldState.error?.message}
          />
        )}
      />
      {isStudent ? (
        <Field id="new-year" label="Year group" hint="Shown on class rosters." error={formState.errors.yearGroup?.message} className="sm:max-w-xs">
          {(p) => (
            <Select {...p} {...register("yearGroup", { setValueAs: (v) => (v === "" || v == null ? null : Number(v)) })}>
              <option value="">Not set</option>
              {YEAR_GROUPS.map((y) => (
                <option key={y} value={y}>
                  Year {y}
                </option>
              ))}
            </Select>
          )}
        </Field>
      ) : null}
      <label htmlFor="new-invite" className="flex min-h-11 cursor-pointer items-start gap-3">
        <input id="new-invite" type="checkbox" className="mt-1 size-5 accent-brand" {...register("sendInvitation")} />
        <span>
          <span className="block font-semibold">Send an invitation now</span>
          <span className="block text-sm text-muted">They get an e-mail with a link to choose their password. The link works once, for 7 days.</span>
        </span>
      </label>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Adding…" : "Add this person"}
        </Button>
        {onDone ? (
          <Button variant="secondary" onClick={onDone}>
            Close
          </Button>
        ) : null}
      </div>
    </form>
  );
}

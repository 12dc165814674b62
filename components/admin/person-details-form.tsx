"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Controller, useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { fetchJson } from "@/lib/fetch-json";
import { ROLE_LABELS, ROLES } from "@/lib/roles";
import { userBaseSchema } from "@/lib/validation/users";
import { ROLE_HINTS, YEAR_GROUPS } from "./add-person-form";
import type { PersonDetail } from "./api-types";
import { CheckboxGroup } from "./checkbox-group";
import { showServerErrors } from "./form-errors";

type FormIn = z.input<typeof userBaseSchema>;
type FormOut = z.output<typeof userBaseSchema>;
const FIELDS = ["name", "email", "roles", "yearGroup"] as const;

/** Edits a person's name, e-mail, roles and year group. */
export function PersonDetailsForm({ person, isSelf }: { person: PersonDetail; isSelf: boolean }) {
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<{ tone: "good" | "bad"; text: string } | null>(null);
  const { register, handleSubmit, control, formState, setError, reset } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(userBaseSchema),
    defaultValues: { name: person.name, email: person.email, roles: person.roles, yearGroup: person.yearGroup },
  });
  const roles = useWatch({ control, name: "roles" }) ?? [];

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const { person: saved } = await fetchJson<{ person: PersonDetail }>(`/api/users/${person.id}`, {
        method: "PATCH",
        json: { ...values, yearGroup: values.roles.includes("student") ? (values.yearGroup ?? null) : person.yearGroup },
      });
      queryClient.setQueryData(["person", person.id], { person: saved });
      reset({ name: saved.name, email: saved.email, roles: saved.roles, yearGroup: saved.yearGroup });
      setMessage({ tone: "good", text: "Changes saved." });
      await queryClient.invalidateQueries({ queryKey: ["people"] });
      await queryClient.invalidateQueries({ queryKey: ["audit"] });
    } catch (e) {
      const rest = showServerErrors<FormIn>(e, FIELDS, setError);
      if (rest) setMessage({ tone: "bad", text: rest });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={`Details of ${person.name}`}>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="edit-name" label="Full name" error={formState.errors.name?.message}>
          {(p) => <Input {...p} autoComplete="off" {...register("name")} />}
        </Field>
        <Field
          id="edit-email"
          label="E-mail"
          hint={person.invitation.state === "set-up" ? "They sign in with this address; tell them if you change it." : undefined}
          error={formState.errors.email?.message}
        >
          {(p) => <Input {...p} type="email" inputMode="email" autoComplete="off" {...register("email")} />}
        </Field>
      </div>
      <Controller
        control={control}
        name="roles"
        render={({ field, fieldState }) => (
          <CheckboxGroup
            id="edit-roles"
            legend="Roles"
            hint={isSelf ? "You cannot remove your own admin role; another admin can." : undefined}
            columns
            options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r], description: ROLE_HINTS[r] }))}
            value={field.value ?? []}
            onChange={field.onChange}
            error={fieldState.error?.message}
          />
        )}
      />
      {roles.includes("student") ? (
        <Field id="edit-year" label="Year group" error={formState.errors.yearGroup?.message} className="sm:max-w-xs">
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
      <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>
      <div>
        <Button type="submit" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? "Saving…" : "Save changes"}
        </Button>
      </div>
    </form>
  );
}

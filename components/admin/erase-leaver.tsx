"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { PersonDetail } from "./api-types";

type Erased = { erased: true; writeUps: number; photos: number; classPlaces: number; familyLinks: number; emails: number };

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * "Delete a leaver's data" for a student or parent: cannot be undone, so the admin types the
 * person's name first. Staff are deactivated instead (their marking belongs to the record).
 */
export function EraseLeaverCard({ person, isSelf }: { person: PersonDetail; isSelf: boolean }) {
  const qc = useQueryClient();
  const [name, setName] = useState("");
  const [fieldError, setFieldError] = useState<string[] | undefined>();
  const erase = useMutation({
    mutationFn: () => fetchJson<Erased>(`/api/users/${encodeURIComponent(person.id)}/personal-data`, { method: "DELETE", json: { confirmName: name } }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: ["person", person.id] });
      void qc.invalidateQueries({ queryKey: ["people"] });
    },
    onError: (e) => setFieldError(e instanceof ApiError ? e.fieldErrors.confirmName : undefined),
  });
  if (isSelf || person.roles.some((r) => r !== "student" && r !== "parent")) return null;

  if (erase.isSuccess) {
    const r = erase.data;
    return (
      <Card>
        <CardTitle>Leaver&apos;s data deleted</CardTitle>
        <div aria-live="polite" className="flex flex-col gap-2">
          <Alert tone="good">
            {person.name}&apos;s account and data have been deleted: {plural(r.writeUps, "write-up")}, {plural(r.photos, "photo")}, {plural(r.classPlaces, "class place")},{" "}
            {plural(r.familyLinks, "family link")} and {plural(r.emails, "kept e-mail")}. The audit trail records that you did this, with their id only.
          </Alert>
          <p>
            <Link href="/admin/people">← Back to all people</Link>
          </p>
        </div>
      </Card>
    );
  }

  const matches = name.trim().toLowerCase() === person.name.trim().toLowerCase();
  return (
    <Card className="border-bad/40">
      <CardTitle>Delete a leaver&apos;s data</CardTitle>
      <div className="flex flex-col gap-3">
        <p>
          When {person.name} has left the school, delete everything Meniscus holds about them:{" "}
          {person.roles.includes("student") ? "their write-ups with marks, feedback and photos, their class places, " : ""}their family links, the e-mails kept for them and their account.
          This cannot be undone. Their class&apos;s other work and the school&apos;s totals stay.
        </p>
        <p className="text-sm text-muted">If they may come back, deactivate the account instead. They can download their own data from their Account page first.</p>
        <form
          noValidate
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (matches) erase.mutate();
          }}
        >
          <Field id="erase-confirm-name" label={`Type “${person.name}” to confirm`} error={fieldError}>
            {(p) => <Input {...p} autoComplete="off" value={name} onChange={(e) => setName(e.target.value)} />}
          </Field>
          <div>
            <Button type="submit" variant="danger" disabled={!matches || erase.isPending}>
              {erase.isPending ? "Deleting…" : `Delete ${person.name}'s data`}
            </Button>
          </div>
          <div aria-live="polite">{erase.isError && !fieldError ? <Alert tone="bad">{erase.error.message}</Alert> : null}</div>
        </form>
      </div>
    </Card>
  );
}

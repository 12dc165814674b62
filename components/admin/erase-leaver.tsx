"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { PersonDetail } from "./api-types";

export type Erased = { erased: true; writeUps: number; photos: number; classPlaces: number; familyLinks: number; emails: number };

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * "Delete a leaver's data" for a student or parent: cannot be undone, so the admin types the
 * person's name first. Staff are deactivated instead (their marking belongs to the record).
 */
export function EraseLeaverCard({ person, isSelf, onErased }: { person: PersonDetail; isSelf: boolean; onErased: (result: Erased) => void }) {
  const qc = useQueryClient();
  const [name, setName] = useState("");
  const [fieldError, setFieldError] = useState<string[] | undefined>();
  const erase = useMutation({
    mutationFn: () => fetchJson<Erased>(`/api/users/${encodeURIComponent(person.id)}/personal-data`, { method: "DELETE", json: { confirmName: name } }),
    onSuccess: (result) => {
      onErased(result);
      qc.removeQueries({ queryKey: ["person", person.id] });
      void qc.invalidateQueries({ queryKey: ["people"] });
    },
    onError: (e) => setFieldError(e instanceof ApiError ? e.fieldErrors.confirmName : undefined),
  });
  if (isSelf || person.roles.some((r) => r !== "student" && r !== "parent")) return null;

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

/** What replaces the person's page once their data is deleted. */
export function ErasedNotice({ name, result }: { name: string; result: Erased }) {
  return (
    <div className="flex flex-col gap-4">
      <p>
        <Link href="/admin/people">← All people</Link>
      </p>
      <div role="status">
        <PageHeader eyebrow="Person" title={`${name}'s data has been deleted`} />
        <Alert tone="good">
          Deleted: {plural(result.writeUps, "write-up")}, {plural(result.photos, "photo")}, {plural(result.classPlaces, "class place")}, {plural(result.familyLinks, "family link")},{" "}
          {plural(result.emails, "kept e-mail")} and the account. The audit trail records that you did this and when, with their id only.
        </Alert>
      </div>
    </div>
  );
}

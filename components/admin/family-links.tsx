"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { PersonDetail, PickerPerson } from "./api-types";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { PersonPicker } from "./person-picker";
import { errorMessage } from "./query-state";

type Side = "guardians" | "children";

/**
 * Family links seen from one side: a student's parents and guardians, or a parent's children.
 * Lists the links with a confirmed "Unlink", and a form to add one.
 */
export function FamilyLinks({ person, side }: { person: PersonDetail; side: Side }) {
  const queryClient = useQueryClient();
  const [chosen, setChosen] = useState<PickerPerson | null>(null);
  const [relationship, setRelationship] = useState("");
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ tone: "good" | "bad"; text: string } | null>(null);
  const [pickerKey, setPickerKey] = useState(0);
  const links = side === "guardians" ? person.guardians : person.children;
  const otherRole = side === "guardians" ? "parent" : "student";
  const pair = (otherId: string) => (side === "guardians" ? { parentId: otherId, studentId: person.id } : { parentId: person.id, studentId: otherId });

  const refresh = (otherId: string) => {
    void queryClient.invalidateQueries({ queryKey: ["person", person.id] });
    void queryClient.invalidateQueries({ queryKey: ["person", otherId] });
    void queryClient.invalidateQueries({ queryKey: ["audit"] });
  };

  const link = useMutation({
    mutationFn: (other: PickerPerson) => fetchJson("/api/family-links", { method: "POST", json: { ...pair(other.id), relationship: relationship.trim() || "Parent" } }),
    onSuccess: (_d, other) => {
      setMessage({ tone: "good", text: side === "guardians" ? `${other.name} is now linked to ${person.name}.` : `${person.name} is now linked to ${other.name}.` });
      setChosen(null);
      setRelationship("");
      setFieldErrors({});
      setPickerKey((k) => k + 1);
      refresh(other.id);
    },
    onError: (e) => {
      const fe = e instanceof ApiError ? e.fieldErrors : {};
      setFieldErrors(fe);
      setMessage(Object.keys(fe).length ? null : { tone: "bad", text: errorMessage(e) });
    },
  });

  const unlink = useMutation({
    mutationFn: (other: { id: string; name: string }) => fetchJson("/api/family-links", { method: "DELETE", json: pair(other.id) }),
    onSuccess: (_d, other) => {
      setMessage({ tone: "good", text: `The link between ${person.name} and ${other.name} has been removed. Both accounts are kept.` });
      refresh(other.id);
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });

  const pickerError = fieldErrors[side === "guardians" ? "parentId" : "studentId"]?.join(" ");
  return (
    <div className="flex flex-col gap-4">
      {links.length ? (
        <ul className="flex flex-col divide-y divide-line rounded-md border border-line">
          {links.map((l) => (
            <li key={l.id} className="flex flex-col gap-2 p-3 sm:flex-row sm:items-center sm:justify-between">
              <span>
                <Link href={`/admin/people/${l.id}`} className="font-semibold">
                  {l.name}
                </Link>{" "}
                <span className="text-muted">({l.relationship})</span>
              </span>
              <ConfirmButton
                size="sm"
                label={<>Unlink<span className="sr-only"> {l.name}</span></>}
                question={`Unlink ${l.name} from ${person.name}? ${side === "guardians" ? `${l.name} will no longer see ${person.name}'s progress.` : `${person.name} will no longer see ${l.name}'s progress.`}`}
                confirmLabel="Yes, unlink"
                busy={unlink.isPending}
                onConfirm={() => unlink.mutate({ id: l.id, name: l.name })}
              />
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-muted">{side === "guardians" ? "No parents or guardians are linked yet." : "No children are linked yet."}</p>
      )}

      <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>

      <form
        noValidate
        className="flex flex-col gap-3 rounded-md border border-dashed border-line p-3"
        aria-label={side === "guardians" ? "Link a parent or guardian" : "Link a child"}
        onSubmit={(e) => {
          e.preventDefault();
          if (!chosen) {
            setFieldErrors({ [side === "guardians" ? "parentId" : "studentId"]: [side === "guardians" ? "Choose a parent or guardian first." : "Choose a student first."] });
            return;
          }
          link.mutate(chosen);
        }}
      >
        <p className="font-semibold">{side === "guardians" ? "Link a parent or guardian" : "Link a child"}</p>
        <PersonPicker
          key={pickerKey}
          id={`link-${side}`}
          label={side === "guardians" ? "Parent or guardian" : "Student"}
          role={otherRole}
          value={chosen}
          onChange={(p) => {
            setChosen(p);
            setFieldErrors({});
          }}
          excludeIds={[person.id, ...links.map((l) => l.id)]}
          error={pickerError}
        />
        <Field id={`link-${side}-relationship`} label="Relationship" hint="For example Mother, Father, Guardian, Carer. Leave empty for Parent." error={fieldErrors.relationship} className="sm:max-w-sm">
          {(p) => <Input {...p} value={relationship} maxLength={40} onChange={(e) => setRelationship(e.target.value)} />}
        </Field>
        <div>
          <Button type="submit" variant="secondary" disabled={link.isPending}>
            {link.isPending ? "Linking…" : "Link"}
          </Button>
        </div>
        {side === "guardians" ? (
          <p className="text-sm text-muted">
            Only people with the Parent or guardian role appear here. To link someone new, <Link href="/admin/people">add them first</Link>.
          </p>
        ) : null}
      </form>
    </div>
  );
}

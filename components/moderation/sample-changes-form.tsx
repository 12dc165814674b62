"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field, Select, Textarea } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { SampleJson } from "@/components/marking/types";

/**
 * Adds a piece of marked work to the sample, or swaps one in for another, with the reason (which
 * is recorded and shown beside the piece). Only work from the same cohort that someone else
 * marked can join; the server checks that too.
 */
export function SampleChangesForm({ sample, onChanged }: { sample: SampleJson; onChanged: (next: SampleJson, text: string) => void }) {
  const [action, setAction] = useState<"add" | "swap">("add");
  const [writeUpId, setWriteUpId] = useState("");
  const [removeWriteUpId, setRemoveWriteUpId] = useState("");
  const [reason, setReason] = useState("");
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const name = useId();
  const active = sample.items.filter((i) => !i.removed);
  const nameOf = (id: string) => sample.candidates.find((c) => c.writeUpId === id)?.studentName ?? "";

  const change = useMutation({
    mutationFn: (body: Record<string, string>) => fetchJson<SampleJson>(`/api/moderation/samples/${sample.id}/changes`, { method: "POST", json: body }),
    onSuccess: (next, body) => {
      const out = active.find((i) => i.writeUpId === body.removeWriteUpId)?.studentName;
      onChanged(next, body.action === "swap" ? `${nameOf(body.writeUpId!)} swapped in for ${out ?? "the piece taken out"}.` : `${nameOf(body.writeUpId!)} added to the sample.`);
      setWriteUpId("");
      setRemoveWriteUpId("");
      setReason("");
      setErrors({});
      setMessage(null);
    },
    onError: (e) => {
      setErrors(e instanceof ApiError ? e.fieldErrors : {});
      setMessage(e instanceof ApiError ? e.message : "Something went wrong. Please try again.");
    },
  });

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const local: Record<string, string[]> = {};
    if (!writeUpId) local.writeUpId = ["Choose the work to bring in."];
    if (action === "swap" && !removeWriteUpId) local.removeWriteUpId = ["Choose the piece to take out."];
    if (reason.trim().length < 3) local.reason = [action === "swap" ? "Say why this work is swapped." : "Say why this work is added."];
    if (Object.keys(local).length) {
      setErrors(local);
      setMessage("Not changed yet: some choices need attention.");
      return;
    }
    change.mutate(action === "swap" ? { action, removeWriteUpId, writeUpId, reason } : { action, writeUpId, reason });
  };

  if (!sample.candidates.length) return <p className="text-muted">Every other piece of marked work in this cohort is already in the sample (or was marked by the moderator).</p>;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <fieldset className="flex flex-wrap gap-x-6 gap-y-1">
        <legend className="mb-1 font-semibold">Change</legend>
        <label className="flex items-center gap-2">
          <input type="radio" name={name} checked={action === "add"} onChange={() => setAction("add")} className="size-4 accent-brand" />
          Add a piece
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" name={name} checked={action === "swap"} onChange={() => setAction("swap")} className="size-4 accent-brand" />
          Swap one piece for another
        </label>
      </fieldset>
      {action === "swap" ? (
        <Field id="change-out" label="Take out" error={errors.removeWriteUpId}>
          {(p) => (
            <Select {...p} value={removeWriteUpId} onChange={(e) => setRemoveWriteUpId(e.target.value)}>
              <option value="">Choose a piece in the sample…</option>
              {active.map((i) => (
                <option key={i.writeUpId} value={i.writeUpId}>
                  {i.studentName}
                  {i.className && sample.practicalId ? ` (${i.className})` : ""}
                </option>
              ))}
            </Select>
          )}
        </Field>
      ) : null}
      <Field id="change-in" label={action === "swap" ? "Bring in" : "Add"} error={errors.writeUpId}>
        {(p) => (
          <Select {...p} value={writeUpId} onChange={(e) => setWriteUpId(e.target.value)}>
            <option value="">Choose marked work…</option>
            {sample.candidates.map((c) => (
              <option key={c.writeUpId} value={c.writeUpId}>
                {c.studentName}
                {sample.practicalId ? ` (${c.className})` : ""}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Field id="change-reason" label="Reason" hint="Shown beside the piece and kept in the audit trail." error={errors.reason}>
        {(p) => <Textarea {...p} value={reason} maxLength={400} onChange={(e) => setReason(e.target.value)} className="min-h-16" />}
      </Field>
      <div aria-live="polite">{message ? <p className="font-semibold text-bad">{message}</p> : null}</div>
      <div>
        <Button type="submit" variant="secondary" disabled={change.isPending}>
          {change.isPending ? "Changing…" : action === "swap" ? "Swap it" : "Add it"}
        </Button>
      </div>
    </form>
  );
}

"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { fetchJson } from "@/lib/fetch-json";
import type { PickerPerson } from "./api-types";
import { usePickerSearch } from "./person-picker";
import { errorMessage } from "./query-state";

/** Search the school's students and add the chosen ones to the class in one go. */
export function AddStudents({ classId, className, enrolledIds }: { classId: string; className: string; enrolledIds: readonly string[] }) {
  const queryClient = useQueryClient();
  const [q, setQ] = useState("");
  const [chosen, setChosen] = useState<PickerPerson[]>([]);
  const [message, setMessage] = useState<{ tone: "good" | "bad"; text: string } | null>(null);
  const search = usePickerSearch("student", q, 15);
  const results = search.data?.people ?? [];

  const add = useMutation({
    mutationFn: () => fetchJson<{ added: number; alreadyInClass: number }>(`/api/classes/${classId}/students`, { method: "POST", json: { studentIds: chosen.map((c) => c.id) } }),
    onSuccess: async ({ added, alreadyInClass }) => {
      setMessage({
        tone: "good",
        text: `${added} student${added === 1 ? "" : "s"} added to ${className}.${alreadyInClass ? ` ${alreadyInClass} ${alreadyInClass === 1 ? "was" : "were"} already in it.` : ""}`,
      });
      setChosen([]);
      setQ("");
      await queryClient.invalidateQueries({ queryKey: ["class", classId] });
      await queryClient.invalidateQueries({ queryKey: ["classes"] });
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });

  const toggle = (p: PickerPerson, on: boolean) => setChosen((list) => (on ? [...list, p] : list.filter((x) => x.id !== p.id)));

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-col gap-1">
        <label htmlFor="add-students-search" className="font-semibold">
          Find students
        </label>
        <p id="add-students-hint" className="text-sm text-muted">
          Type part of a name or e-mail address, tick the students to add, then press the button.
        </p>
        <Input id="add-students-search" type="search" autoComplete="off" aria-describedby="add-students-hint" value={q} onChange={(e) => setQ(e.target.value)} />
      </div>
      <p aria-live="polite" className="text-sm text-muted">
        {q.trim() && search.data ? (results.length ? `${search.data.total} found${search.data.total > results.length ? `, showing the first ${results.length}` : ""}.` : "No students found.") : null}
      </p>
      {q.trim() && results.length ? (
        <fieldset>
          <legend className="sr-only">Search results</legend>
          <ul className="flex flex-col gap-1">
            {results.map((p) => {
              const inClass = enrolledIds.includes(p.id);
              const id = `add-student-${p.id}`;
              return (
                <li key={p.id}>
                  <label htmlFor={id} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md border border-line px-3 py-2 hover:border-brand has-disabled:cursor-default has-disabled:opacity-70">
                    <input
                      id={id}
                      type="checkbox"
                      className="mt-1 size-5 accent-brand"
                      disabled={inClass}
                      checked={inClass || chosen.some((c) => c.id === p.id)}
                      onChange={(e) => toggle(p, e.target.checked)}
                    />
                    <span>
                      <span className="block font-semibold">{p.name}</span>
                      <span className="block text-sm text-muted">
                        {p.email}
                        {p.yearGroup ? ` · Year ${p.yearGroup}` : ""}
                        {inClass ? " · already in this class" : ""}
                      </span>
                    </span>
                  </label>
                </li>
              );
            })}
          </ul>
        </fieldset>
      ) : null}
      {chosen.length ? (
        <div className="flex flex-col gap-2 rounded-md border border-brand/40 bg-brand-soft p-3">
          <p className="font-semibold">Chosen ({chosen.length})</p>
          <ul className="flex flex-wrap gap-2">
            {chosen.map((c) => (
              <li key={c.id} className="inline-flex items-center gap-1 rounded-full border border-line bg-surface py-0.5 pl-3 pr-1">
                {c.name}
                <button type="button" className="inline-flex size-8 items-center justify-center rounded-full text-muted hover:bg-sunken" aria-label={`Remove ${c.name} from the chosen students`} onClick={() => toggle(c, false)}>
                  ×
                </button>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>
      <div>
        <Button variant="secondary" disabled={!chosen.length || add.isPending} onClick={() => add.mutate()}>
          {add.isPending ? "Adding…" : chosen.length ? `Add ${chosen.length} student${chosen.length === 1 ? "" : "s"} to the class` : "Add students to the class"}
        </Button>
      </div>
    </div>
  );
}

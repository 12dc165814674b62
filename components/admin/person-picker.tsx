"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { Input } from "@/components/ui/field";
import { fetchJson } from "@/lib/fetch-json";
import type { Role } from "@/lib/roles";
import type { PickerPerson } from "./api-types";
import { useDebouncedValue } from "./use-debounced-value";

type PickerAnswer = { people: PickerPerson[]; total: number };

/** Active people of one role matching a search, through the admin picker route. */
export function usePickerSearch(role: Role, q: string, limit = 8) {
  const term = useDebouncedValue(q.trim(), 250);
  return useQuery({
    queryKey: ["picker", role, term, limit],
    queryFn: () => fetchJson<PickerAnswer>(`/api/people-picker?${new URLSearchParams({ role, q: term, limit: String(limit) })}`),
    enabled: term.length > 0,
    placeholderData: (previous) => previous,
  });
}

function describe(p: PickerPerson) {
  return `${p.email}${p.yearGroup ? ` · Year ${p.yearGroup}` : ""}`;
}

/** Search, then choose one person by pressing their button (Tab moves through the matches). */
export function PersonPicker({
  id,
  label,
  role,
  value,
  onChange,
  excludeIds = [],
  error,
}: {
  id: string;
  label: string;
  role: Role;
  value: PickerPerson | null;
  onChange: (p: PickerPerson | null) => void;
  excludeIds?: readonly string[];
  error?: string;
}) {
  const [q, setQ] = useState("");
  const chosenRef = useRef<HTMLDivElement>(null);
  const searchRef = useRef<HTMLInputElement>(null);
  const moveFocus = useRef<"chosen" | "search" | null>(null);
  useEffect(() => {
    if (moveFocus.current === "chosen") chosenRef.current?.focus();
    if (moveFocus.current === "search") searchRef.current?.focus();
    moveFocus.current = null;
  }, [value]);
  const search = usePickerSearch(role, q);
  const results = (search.data?.people ?? []).filter((p) => !excludeIds.includes(p.id));
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={errorId}>
      <legend className="font-semibold">{label}</legend>
      {value ? (
        <div ref={chosenRef} tabIndex={-1} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-brand/40 bg-brand-soft px-3 py-2">
          <span>
            <span className="sr-only">Chosen: </span>
            <span className="block font-semibold">{value.name}</span>
            <span className="block text-sm text-muted">{describe(value)}</span>
          </span>
          <button
            type="button"
            className="min-h-9 font-semibold text-brand underline underline-offset-4"
            onClick={() => {
              moveFocus.current = "search";
              onChange(null);
            }}
          >
            Choose someone else
          </button>
        </div>
      ) : (
        <>
          <label htmlFor={`${id}-search`} className="text-sm text-muted">
            Type part of a name or e-mail address
          </label>
          <Input ref={searchRef} id={`${id}-search`} type="search" autoComplete="off" value={q} onChange={(e) => setQ(e.target.value)} aria-invalid={error ? true : undefined} />
          <div aria-live="polite" className="text-sm text-muted">
            {q.trim() && search.data
              ? results.length
                ? `${results.length} found${search.data.total > search.data.people.length ? "; more match, so type more of the name to narrow it down" : ""}.`
                : "Nobody found."
              : null}
            {search.isError ? "The search did not work. Try again." : null}
          </div>
          {q.trim() && results.length ? (
            <ul className="flex flex-col gap-1">
              {results.map((p) => (
                <li key={p.id}>
                  <button
                    type="button"
                    className="flex min-h-11 w-full flex-col items-start rounded-md border border-line bg-surface px-3 py-2 text-left hover:border-brand"
                    onClick={() => {
                      moveFocus.current = "chosen";
                      onChange(p);
                    }}
                  >
                    <span className="font-semibold">
                      <span className="sr-only">Choose </span>
                      {p.name}
                    </span>
                    <span className="text-sm text-muted">{describe(p)}</span>
                  </button>
                </li>
              ))}
            </ul>
          ) : null}
        </>
      )}
      <div aria-live="polite">
        {error ? (
          <p id={errorId} className="text-sm font-semibold text-bad">
            {error}
          </p>
        ) : null}
      </div>
    </fieldset>
  );
}

"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { buttonClasses } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Field, Input, Select } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { fetchJson } from "@/lib/fetch-json";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/roles";
import { formatDateTime } from "@/lib/utils";
import { AddPersonForm } from "./add-person-form";
import type { PersonRow } from "./api-types";
import { LoadError, Loading } from "./query-state";
import { StatusBadge } from "./status-badge";
import { useDebouncedValue } from "./use-debounced-value";

/** People shown at once; longer lists get page buttons. */
export const PAGE_SIZE = 50;

export type PeopleFilters = { role: Role | ""; status: string; q: string };

export const STATUS_FILTERS: { value: string; label: string }[] = [
  { value: "", label: "Any account status" },
  { value: "active", label: "Set up (can sign in)" },
  { value: "not-set-up", label: "Not set up yet" },
  { value: "invited", label: "Invited, not set up yet" },
  { value: "not-invited", label: "Not invited yet" },
  { value: "deactivated", label: "Deactivated" },
];

function queryString(f: PeopleFilters): string {
  const qs = new URLSearchParams();
  if (f.role) qs.set("role", f.role);
  if (f.status) qs.set("status", f.status);
  if (f.q.trim()) qs.set("q", f.q.trim());
  return qs.toString();
}

/** The people list: search, filters kept in the address (so a filtered list can be shared), and the add form. */
export function PeopleDirectory({ initial }: { initial: PeopleFilters }) {
  const [filters, setFilters] = useState<PeopleFilters>(initial);
  const [adding, setAdding] = useState(false);
  const addHeading = useRef<HTMLHeadingElement>(null);
  const q = useDebouncedValue(filters.q, 250);
  const settled = { ...filters, q };
  const qs = queryString(settled);

  useEffect(() => {
    window.history.replaceState(null, "", qs ? `?${qs}` : window.location.pathname);
  }, [qs]);

  useEffect(() => {
    if (adding) addHeading.current?.focus();
  }, [adding]);

  const people = useQuery({
    queryKey: ["people", qs],
    queryFn: () => fetchJson<{ people: PersonRow[] }>(`/api/users${qs ? `?${qs}` : ""}`),
    placeholderData: (previous) => previous,
  });

  const set = (patch: Partial<PeopleFilters>) => setFilters((f) => ({ ...f, ...patch }));
  const filtered = !!(settled.role || settled.status || settled.q.trim());
  const list = people.data?.people ?? [];
  const [page, setPage] = useState({ qs, index: 0 });
  // A new search or filter starts again from the first page.
  const pageIndex = page.qs === qs ? page.index : 0;
  const pageCount = Math.max(1, Math.ceil(list.length / PAGE_SIZE));
  const shownIndex = Math.min(pageIndex, pageCount - 1);
  const shown = list.slice(shownIndex * PAGE_SIZE, (shownIndex + 1) * PAGE_SIZE);
  const goTo = (index: number) => setPage({ qs, index });

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow="Administration"
        title="People"
        lead="Everyone with a Meniscus account at your school: staff, students and parents or guardians."
        actions={
          <button type="button" className={buttonClasses(adding ? "secondary" : "primary")} aria-expanded={adding} aria-controls="add-person" onClick={() => setAdding((a) => !a)}>
            {adding ? "Close the form" : "Add a person"}
          </button>
        }
      />

      {adding ? (
        <Card id="add-person">
          <h2 ref={addHeading} tabIndex={-1} className="mb-3 text-lg font-bold">
            Add a person
          </h2>
          <AddPersonForm onDone={() => setAdding(false)} />
        </Card>
      ) : null}

      <section aria-labelledby="people-list-heading" className="flex flex-col gap-3">
        <h2 id="people-list-heading" className="sr-only">
          People list
        </h2>
        <form role="search" className="grid gap-3 sm:grid-cols-[2fr_1fr_1fr]" onSubmit={(e) => e.preventDefault()}>
          <Field id="people-search" label="Search by name or e-mail">
            {(p) => <Input {...p} type="search" value={filters.q} onChange={(e) => set({ q: e.target.value })} placeholder="For example: Marchetti" />}
          </Field>
          <Field id="people-role" label="Role">
            {(p) => (
              <Select {...p} value={filters.role} onChange={(e) => set({ role: e.target.value as Role | "" })}>
                <option value="">Every role</option>
                {ROLES.map((r) => (
                  <option key={r} value={r}>
                    {ROLE_LABELS[r]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field id="people-status" label="Account">
            {(p) => (
              <Select {...p} value={filters.status} onChange={(e) => set({ status: e.target.value })}>
                {STATUS_FILTERS.map((s) => (
                  <option key={s.value} value={s.value}>
                    {s.label}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </form>

        <p aria-live="polite" className="text-sm text-muted">
          {people.isPending || people.isError
            ? ""
            : `${list.length} ${list.length === 1 ? "person" : "people"}${filtered ? " match" : ""}${pageCount > 1 ? ` · showing ${shownIndex * PAGE_SIZE + 1}–${shownIndex * PAGE_SIZE + shown.length}` : ""}${people.isFetching ? " (updating…)" : ""}`}
        </p>

        {people.isPending ? (
          <Loading label="Loading people…" />
        ) : people.isError ? (
          <LoadError error={people.error} what="the people list" onRetry={() => people.refetch()} />
        ) : list.length === 0 ? (
          <EmptyState title={filtered ? "Nobody matches these filters." : "There is nobody here yet."}>
            {filtered ? (
              <button type="button" className="font-semibold text-brand underline underline-offset-4" onClick={() => setFilters({ role: "", status: "", q: "" })}>
                Clear the filters
              </button>
            ) : (
              "Add people one by one here, or import a class roster from a class's page."
            )}
          </EmptyState>
        ) : (
          <Table>
            <caption className="sr-only">People, sorted by name</caption>
            <thead>
              <tr>
                <Th>Name</Th>
                <Th>E-mail</Th>
                <Th>Roles</Th>
                <Th>Year</Th>
                <Th>Account</Th>
                <Th>Last signed in</Th>
              </tr>
            </thead>
            <tbody>
              {shown.map((p) => (
                <tr key={p.id} className={p.status === "deactivated" ? "text-muted" : undefined}>
                  <Td className="whitespace-nowrap font-semibold">
                    <Link href={`/admin/people/${p.id}`}>{p.name}</Link>
                  </Td>
                  <Td className="whitespace-nowrap">{p.email}</Td>
                  <Td className="whitespace-nowrap">{p.roles.map((r) => ROLE_LABELS[r]).join(", ")}</Td>
                  <Td>{p.yearGroup ?? "—"}</Td>
                  <Td>
                    <StatusBadge status={p.status} />
                  </Td>
                  <Td className="whitespace-nowrap">{p.lastSignInAt ? formatDateTime(p.lastSignInAt) : "Never"}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
        {pageCount > 1 && !people.isPending && !people.isError ? (
          <nav aria-label="Pages of the people list" className="flex flex-wrap items-center gap-3">
            <button type="button" className={buttonClasses("secondary")} disabled={shownIndex === 0} onClick={() => goTo(shownIndex - 1)}>
              Previous page
            </button>
            <span className="text-sm text-muted">
              Page {shownIndex + 1} of {pageCount}
            </span>
            <button type="button" className={buttonClasses("secondary")} disabled={shownIndex >= pageCount - 1} onClick={() => goTo(shownIndex + 1)}>
              Next page
            </button>
          </nav>
        ) : null}
      </section>
    </div>
  );
}

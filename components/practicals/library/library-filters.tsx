"use client";

import { usePathname, useRouter } from "next/navigation";
import { useEffect, useRef, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";

export type LibraryFilterValues = { search: string; topic: string; yearGroup: string; archived: boolean };

export function filtersToQuery(f: LibraryFilterValues): string {
  const q = new URLSearchParams();
  if (f.search.trim()) q.set("search", f.search.trim());
  if (f.topic) q.set("topic", f.topic);
  if (f.yearGroup) q.set("yearGroup", f.yearGroup);
  if (f.archived) q.set("archived", "true");
  const s = q.toString();
  return s ? `?${s}` : "";
}

/**
 * Search and filters for the library. It is a plain GET form (it works before scripts load);
 * with scripts, the list follows each change, and typing waits for a pause before searching.
 */
export function LibraryFilters({ initial, topics }: { initial: LibraryFilterValues; topics: string[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const [values, setValues] = useState(initial);
  const [pending, startTransition] = useTransition();
  const shownQuery = useRef(filtersToQuery(initial));

  useEffect(() => {
    const query = filtersToQuery(values);
    if (query === shownQuery.current) return;
    const t = setTimeout(() => {
      shownQuery.current = query;
      startTransition(() => router.replace(`${pathname}${query}`, { scroll: false }));
    }, 350);
    return () => clearTimeout(t);
  }, [values, pathname, router]);

  return (
    <form
      method="get"
      role="search"
      aria-label="Search the practicals"
      className="grid gap-3 rounded-lg border border-line bg-surface p-3 sm:grid-cols-[2fr_1.4fr_1fr_auto] sm:items-end"
      onSubmit={(e) => {
        e.preventDefault();
        shownQuery.current = filtersToQuery(values);
        startTransition(() => router.replace(`${pathname}${shownQuery.current}`, { scroll: false }));
      }}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor="lib-search" className="font-semibold">
          Search
        </label>
        <Input id="lib-search" name="search" type="search" placeholder="Title or topic" value={values.search} onChange={(e) => setValues({ ...values, search: e.target.value })} />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="lib-topic" className="font-semibold">
          Topic
        </label>
        <Select id="lib-topic" name="topic" value={values.topic} onChange={(e) => setValues({ ...values, topic: e.target.value })}>
          <option value="">All topics</option>
          {topics.map((t) => (
            <option key={t} value={t}>
              {t}
            </option>
          ))}
        </Select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="lib-year" className="font-semibold">
          Year group
        </label>
        <Select id="lib-year" name="yearGroup" value={values.yearGroup} onChange={(e) => setValues({ ...values, yearGroup: e.target.value })}>
          <option value="">All years</option>
          {[7, 8, 9, 10, 11, 12, 13].map((y) => (
            <option key={y} value={String(y)}>
              Year {y}
            </option>
          ))}
        </Select>
      </div>
      <div className="flex flex-wrap items-center gap-3 sm:flex-nowrap">
        <label className="flex min-h-11 items-center gap-2 whitespace-nowrap">
          <input type="checkbox" name="archived" value="true" className="size-5 accent-brand" checked={values.archived} onChange={(e) => setValues({ ...values, archived: e.target.checked })} />
          Show archived
        </label>
        <Button type="submit" variant="secondary" size="md">
          Search
        </Button>
      </div>
      <p className="sr-only" aria-live="polite">
        {pending ? "Updating the list…" : ""}
      </p>
    </form>
  );
}

"use client";

import { useQuery } from "@tanstack/react-query";
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ColumnFiltersState,
  type FilterFn,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useId, useMemo, useRef, useState, type KeyboardEvent } from "react";
import { Badge } from "@/components/ui/badge";
import { Button, buttonClasses } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { VERDICT_LABELS, type Verdict } from "@/lib/checks/types";
import { fetchJson } from "@/lib/fetch-json";
import { cn, formatDateTime } from "@/lib/utils";
import { formatMarks, needsMarking, STATUS_LABELS, STATUS_ORDER, StatusBadge, VerdictMark, VerdictShape } from "./status";
import type { BenchJson, BenchRow, BenchStatus } from "./types";

const VERDICTS: Verdict[] = ["agrees", "close", "disagrees", "cannot-check"];
/** Sorting by a check puts the answers that need a look first. */
const VERDICT_RANK: Record<Verdict, number> = { disagrees: 0, close: 1, "cannot-check": 2, agrees: 3 };
const STATUSES: BenchStatus[] = ["submitted", "late", "marked", "returned", "draft", "not-started"];

/** Letters without accents, lower case: "Zoë" is found by "zoe". */
const fold = (s: string) => s.normalize("NFD").replace(/[\u0300-\u036f]/g, "").toLowerCase();

const nameFilter: FilterFn<BenchRow> = (row, _id, value: string) => fold(row.original.studentName).includes(fold(value.trim()));
const statusFilter: FilterFn<BenchRow> = (row, _id, value: string) => (value === "to-mark" ? needsMarking(row.original.status) : row.original.status === value);
const verdictFilter: FilterFn<BenchRow> = (row, id, value: string) => {
  const v = row.getValue<Verdict | undefined>(id);
  return value === "none" ? v === undefined : v === value;
};

/** Can the teacher open this row's write-up? Only once the student has started one. */
const openable = (r: BenchRow) => !!r.writeUpId && r.status !== "not-started";

/**
 * The marking bench: every student of a lab session with where their work stands, the check
 * verdicts at a glance and their marks. Sort by any column, filter by status or by a check's
 * verdict, search by name. Keyboard first: ↑/↓ (and Home/End) move between students, Enter
 * opens the write-up.
 */
export function BenchTable({ initial }: { initial: BenchJson }) {
  const sessionId = initial.labSession.id;
  const router = useRouter();
  const bench = useQuery({
    queryKey: ["bench", sessionId],
    queryFn: () => fetchJson<BenchJson>(`/api/lab-sessions/${sessionId}/bench`),
    initialData: initial,
    refetchOnWindowFocus: true,
  });
  const data = bench.data;
  const ids = { search: useId(), status: useId(), check: useId(), verdict: useId(), help: useId(), count: useId() };

  const [search, setSearch] = useState("");
  const [status, setStatus] = useState<string>("all");
  const [checkId, setCheckId] = useState<string>(data.checks[0]?.id ?? "");
  const [verdict, setVerdict] = useState<string>("all");
  const [sorting, setSorting] = useState<SortingState>([{ id: "status", desc: false }]);

  const columnFilters = useMemo<ColumnFiltersState>(() => {
    const f: ColumnFiltersState = [];
    if (search.trim()) f.push({ id: "name", value: search });
    if (status !== "all") f.push({ id: "status", value: status });
    if (checkId && verdict !== "all") f.push({ id: `check:${checkId}`, value: verdict });
    return f;
  }, [search, status, checkId, verdict]);

  const columns = useMemo<ColumnDef<BenchRow>[]>(() => {
    const cols: ColumnDef<BenchRow>[] = [
      {
        id: "name",
        header: "Student",
        accessorFn: (r) => r.studentName,
        filterFn: nameFilter,
        sortingFn: (a, b) => a.original.studentName.localeCompare(b.original.studentName),
        cell: ({ row }) =>
          openable(row.original) ? (
            <Link href={`/marking/${sessionId}/${row.original.writeUpId}`} tabIndex={-1} className="font-semibold whitespace-nowrap">
              {row.original.studentName}
            </Link>
          ) : (
            <span className="font-semibold whitespace-nowrap">{row.original.studentName}</span>
          ),
      },
      {
        id: "status",
        header: "Status",
        accessorFn: (r) => r.status,
        filterFn: statusFilter,
        sortingFn: (a, b) => STATUS_ORDER[a.original.status] - STATUS_ORDER[b.original.status] || a.original.studentName.localeCompare(b.original.studentName),
        cell: ({ row }) => <StatusBadge status={row.original.status} />,
      },
      ...data.checks.map<ColumnDef<BenchRow>>((c) => ({
        id: `check:${c.id}`,
        header: c.label,
        accessorFn: (r) => r.checks[c.id],
        filterFn: verdictFilter,
        sortUndefined: "last",
        sortingFn: (a, b) => VERDICT_RANK[a.getValue<Verdict>(`check:${c.id}`)] - VERDICT_RANK[b.getValue<Verdict>(`check:${c.id}`)],
        cell: ({ getValue }) => {
          const v = getValue<Verdict | undefined>();
          return v ? <VerdictMark verdict={v} /> : <span className="text-muted">Not run</span>;
        },
      })),
      ...(data.rubric?.criteria ?? []).map<ColumnDef<BenchRow>>((c) => ({
        id: `criterion:${c.id}`,
        header: `${c.title} (out of ${c.max})`,
        accessorFn: (r) => r.marks[c.id],
        sortUndefined: "last",
        cell: ({ getValue }) => {
          const v = getValue<number | undefined>();
          return v === undefined ? <span className="text-muted">—</span> : <span className="tabular-nums">{v}</span>;
        },
      })),
      {
        id: "total",
        header: `Total (out of ${data.maxTotal})`,
        accessorFn: (r) => r.total ?? undefined,
        sortUndefined: "last",
        cell: ({ row }) =>
          row.original.total === null ? (
            <span className="text-muted">—</span>
          ) : (
            <span className="inline-flex flex-wrap items-center gap-1.5">
              <span className="font-semibold tabular-nums">{formatMarks(row.original.total)}</span>
              {row.original.adjusted ? (
                <Badge tone="accent" className="text-xs">
                  adjusted
                </Badge>
              ) : null}
            </span>
          ),
      },
      {
        id: "submittedAt",
        header: "Handed in",
        accessorFn: (r) => r.submittedAt ?? undefined,
        sortUndefined: "last",
        cell: ({ row }) => (row.original.submittedAt ? <span className="whitespace-nowrap">{formatDateTime(row.original.submittedAt)}</span> : <span className="text-muted">—</span>),
      },
    ];
    return cols;
  }, [data.checks, data.rubric, data.maxTotal, sessionId]);

  // eslint-disable-next-line react-hooks/incompatible-library -- TanStack Table manages its own state; the compiler leaves this component unmemoised, which is what it needs.
  const table = useReactTable({
    data: data.rows,
    columns,
    state: { sorting, columnFilters },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (r) => r.studentId,
  });

  const rows = table.getRowModel().rows;
  const [activeId, setActiveId] = useState<string | null>(null);
  const activeIndex = Math.max(0, rows.findIndex((r) => r.id === activeId));
  const rowRefs = useRef(new Map<string, HTMLTableRowElement>());

  const open = (r: BenchRow) => {
    if (openable(r)) router.push(`/marking/${sessionId}/${r.writeUpId}`);
  };

  const moveTo = (index: number) => {
    const target = rows[Math.min(rows.length - 1, Math.max(0, index))];
    if (!target) return;
    setActiveId(target.id);
    rowRefs.current.get(target.id)?.focus();
  };

  const onRowKey = (e: KeyboardEvent<HTMLTableRowElement>, index: number) => {
    if (e.altKey || e.ctrlKey || e.metaKey) return;
    const moves: Record<string, number> = { ArrowDown: index + 1, ArrowUp: index - 1, Home: 0, End: rows.length - 1, PageDown: index + 10, PageUp: index - 10 };
    if (e.key in moves) {
      e.preventDefault();
      moveTo(moves[e.key]!);
    } else if (e.key === "Enter" || e.key === " ") {
      e.preventDefault();
      open(rows[index]!.original);
    }
  };

  const counts = useMemo(() => {
    const c = Object.fromEntries(STATUSES.map((s) => [s, 0])) as Record<BenchStatus, number>;
    for (const r of data.rows) c[r.status]++;
    return c;
  }, [data.rows]);

  // Next to mark: the first handed-in, unmarked write-up in the order shown, else in any order.
  const nextToMark = rows.find((r) => needsMarking(r.original.status) && r.original.writeUpId)?.original ?? table.getCoreRowModel().rows.map((r) => r.original).find((r) => needsMarking(r.status) && r.writeUpId);
  const filtered = columnFilters.length > 0;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-3 lg:flex-row lg:items-center lg:justify-between">
        <p className="flex flex-wrap items-center gap-x-3 gap-y-1" aria-label="Work in this lab session">
          {STATUSES.filter((s) => counts[s] > 0).map((s) => (
            <span key={s} className="inline-flex items-center gap-1">
              <StatusBadge status={s} />
              <span className="font-semibold tabular-nums">{counts[s]}</span>
            </span>
          ))}
        </p>
        <div className="flex flex-wrap gap-2 no-print">
          <Button onClick={() => nextToMark && open(nextToMark)} disabled={!nextToMark || !data.canMark} aria-describedby={!nextToMark ? ids.count : undefined}>
            Mark next handed-in
          </Button>
          <a href={`/api/lab-sessions/${sessionId}/marks-csv`} download className={buttonClasses("secondary")}>
            Export marks (CSV)
          </a>
        </div>
      </div>
      {!data.canMark ? <p className="rounded-md border border-line bg-sunken p-3">You can read this bench; only the class&apos;s teachers can mark its work.</p> : null}

      <fieldset className="flex flex-col gap-3 rounded-lg border border-line bg-surface p-3 sm:flex-row sm:flex-wrap sm:items-end no-print">
        <legend className="px-1 font-semibold">Find students</legend>
        <div className="flex min-w-48 flex-1 flex-col gap-1">
          <label htmlFor={ids.search} className="text-sm font-semibold">
            Search by name
          </label>
          <Input id={ids.search} type="search" value={search} onChange={(e) => setSearch(e.target.value)} autoComplete="off" />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.status} className="text-sm font-semibold">
            Status
          </label>
          <Select id={ids.status} value={status} onChange={(e) => setStatus(e.target.value)} className="sm:w-48">
            <option value="all">Everyone</option>
            <option value="to-mark">Waiting to be marked</option>
            {STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABELS[s]}
              </option>
            ))}
          </Select>
        </div>
        {data.checks.length ? (
          <>
            <div className="flex flex-col gap-1">
              <label htmlFor={ids.check} className="text-sm font-semibold">
                Calculation check
              </label>
              <Select id={ids.check} value={checkId} onChange={(e) => setCheckId(e.target.value)} className="sm:w-64">
                {data.checks.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.label}
                  </option>
                ))}
              </Select>
            </div>
            <div className="flex flex-col gap-1">
              <label htmlFor={ids.verdict} className="text-sm font-semibold">
                Its verdict
              </label>
              <Select id={ids.verdict} value={verdict} onChange={(e) => setVerdict(e.target.value)} className="sm:w-48">
                <option value="all">Any</option>
                {VERDICTS.map((v) => (
                  <option key={v} value={v}>
                    {VERDICT_LABELS[v]}
                  </option>
                ))}
                <option value="none">Not run</option>
              </Select>
            </div>
          </>
        ) : null}
        {filtered ? (
          <Button
            variant="ghost"
            onClick={() => {
              setSearch("");
              setStatus("all");
              setVerdict("all");
            }}
          >
            Show everyone
          </Button>
        ) : null}
      </fieldset>

      <p id={ids.count} className="text-muted" aria-live="polite">
        {filtered ? `Showing ${rows.length} of ${data.rows.length} students.` : `${data.rows.length} students.`}
        {!nextToMark ? " Nothing handed in is waiting to be marked." : ""}
      </p>
      <p id={ids.help} className="text-sm text-muted no-print">
        Keyboard: ↑ and ↓ move between students, Enter opens the write-up. Select a column heading to sort by it.
      </p>

      <div className="overflow-x-auto rounded-lg border border-line bg-surface">
        <table className="w-full border-collapse text-left text-[0.97rem]" aria-describedby={ids.help}>
          <caption className="sr-only">
            Students of {data.labSession.className}: status, calculation checks and marks
          </caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h, hi) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}
                      className={cn("min-w-24 border-b border-line bg-sunken px-3 py-2 align-bottom font-semibold", hi === 0 && "sticky left-0 z-10")}
                    >
                      <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex min-h-9 items-end gap-1 text-left hover:text-brand">
                        <span>{flexRender(h.column.columnDef.header, h.getContext())}</span>
                        <span aria-hidden="true" className="w-3 text-muted">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-muted">
                  No students match. Change the search or the filters.
                </td>
              </tr>
            ) : (
              rows.map((row, i) => {
                const active = i === activeIndex;
                return (
                  <tr
                    key={row.id}
                    ref={(el) => {
                      if (el) rowRefs.current.set(row.id, el);
                      else rowRefs.current.delete(row.id);
                    }}
                    tabIndex={active ? 0 : -1}
                    data-active={active || undefined}
                    data-row-id={row.id}
                    onFocus={() => setActiveId(row.id)}
                    onClick={() => setActiveId(row.id)}
                    onDoubleClick={() => open(row.original)}
                    onKeyDown={(e) => onRowKey(e, i)}
                    className={cn("group cursor-default outline-offset-[-3px] hover:bg-paper focus:bg-brand-soft", needsMarking(row.original.status) && "font-medium")}
                  >
                    {row.getVisibleCells().map((cell, ci) => (
                      <td key={cell.id} className={cn("border-b border-line px-3 py-2 align-middle", ci === 0 && "sticky left-0 z-10 bg-surface group-hover:bg-paper group-focus:bg-brand-soft")}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    ))}
                  </tr>
                );
              })
            )}
          </tbody>
        </table>
      </div>

      {data.checks.length ? (
        <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm text-muted">
          <span className="font-semibold">Check verdicts:</span>
          {VERDICTS.map((v) => (
            <span key={v} className="inline-flex items-center gap-1">
              <VerdictShape verdict={v} /> {VERDICT_LABELS[v]}
            </span>
          ))}
        </div>
      ) : null}
    </div>
  );
}

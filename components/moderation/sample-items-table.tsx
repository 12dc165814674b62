import Link from "next/link";
import { formatMarks } from "@/components/marking/status";
import type { SampleItemJson } from "@/components/marking/types";
import { cn } from "@/lib/utils";
import { ORIGIN_WORDS, signed } from "./words";

/** A padlock: the teacher's mark is there but not shown yet. */
export function HiddenShape() {
  return (
    <svg width="14" height="14" viewBox="0 0 16 16" aria-hidden="true" focusable="false" className="shrink-0">
      <rect x="3" y="7" width="10" height="7" rx="1.5" fill="none" stroke="currentColor" strokeWidth="1.7" />
      <path d="M5.5 7V5a2.5 2.5 0 0 1 5 0v2" fill="none" stroke="currentColor" strokeWidth="1.7" />
    </svg>
  );
}

function SecondMarking({ m }: { m: SampleItemJson["moderation"] }) {
  if (!m) return <span className="text-muted">Not started</span>;
  if (!m.completed) return <span className="font-semibold text-warn">In progress</span>;
  return <span className="font-semibold text-good">Finished</span>;
}

/**
 * The work in a moderation sample: why each piece is there, how far second marking has got,
 * and the teacher's total beside the moderator's. While the sample is blind, a teacher's total
 * stays hidden until that piece is second-marked, and the table says so.
 */
export function SampleItemsTable({ sampleId, items, blind, showClass, youAreModerator }: { sampleId: string; items: SampleItemJson[]; blind: boolean; showClass: boolean; youAreModerator: boolean }) {
  const who = youAreModerator ? "you finish" : "the moderator finishes";
  const teacherTotal = (it: SampleItemJson) =>
    it.teacherTotal !== null ? (
      <span className="tabular-nums">{formatMarks(it.teacherTotal)}</span>
    ) : blind ? (
      <span className="inline-flex items-start gap-1 text-sm text-muted">
        <HiddenShape />
        <span>Hidden until {who} second-marking this piece</span>
      </span>
    ) : (
      <span className="text-muted">—</span>
    );
  return (
    <>
      {/* On a phone: one card per piece, so nothing scrolls sideways. */}
      <ul className="flex flex-col gap-2 md:hidden" aria-label="Work in this sample">
        {items.map((it) => (
          <li key={it.writeUpId} data-item-card={it.writeUpId} className="flex flex-col gap-1 rounded-lg border border-line bg-surface p-3">
            <p className="flex flex-wrap items-baseline justify-between gap-x-3">
              <Link href={`/moderation/${sampleId}/${it.writeUpId}`} className="font-semibold">
                {it.studentName}
              </Link>
              <SecondMarking m={it.moderation} />
            </p>
            <p className="text-sm text-muted">
              {showClass ? `${it.className} · ` : ""}Marked by {it.markerName ?? "someone not recorded"}
            </p>
            <p className="text-sm">
              <span className="font-semibold">{ORIGIN_WORDS[it.origin]}</span>
              {it.note ? <span className="text-muted">: {it.note}</span> : null}
            </p>
            <dl className="grid grid-cols-3 gap-2 text-sm">
              <div>
                <dt className="text-muted">Teacher&apos;s total</dt>
                <dd>{teacherTotal(it)}</dd>
              </div>
              <div>
                <dt className="text-muted">Second total</dt>
                <dd className="tabular-nums">{it.moderation ? formatMarks(it.moderation.total) : <span className="text-muted">—</span>}</dd>
              </div>
              <div>
                <dt className="text-muted">Difference</dt>
                <dd className={cn("tabular-nums", it.difference !== null && it.difference !== 0 && "font-semibold")}>{it.difference !== null ? signed(it.difference, 0) : <span className="text-muted">—</span>}</dd>
              </div>
            </dl>
          </li>
        ))}
      </ul>
    <div className="hidden overflow-x-auto rounded-lg border border-line bg-surface md:block">
      <table className="w-full border-collapse text-left text-[0.97rem]">
        <caption className="sr-only">Work in this sample</caption>
        <thead>
          <tr>
            {["Student", ...(showClass ? ["Class"] : []), "Marked by", "Why it is in the sample", "Second marking", "Teacher's total", "Second total", "Difference"].map((h) => (
              <th key={h} scope="col" className="border-b border-line bg-sunken px-3 py-2 align-bottom font-semibold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {items.map((it) => (
            <tr key={it.writeUpId} data-item={it.writeUpId}>
              <td className="border-b border-line px-3 py-2">
                <Link href={`/moderation/${sampleId}/${it.writeUpId}`} className="font-semibold whitespace-nowrap">
                  {it.studentName}
                </Link>
              </td>
              {showClass ? <td className="border-b border-line px-3 py-2 whitespace-nowrap">{it.className}</td> : null}
              <td className="border-b border-line px-3 py-2">{it.markerName ?? <span className="text-muted">not recorded</span>}</td>
              <td className="border-b border-line px-3 py-2">
                <span className="block font-semibold">{ORIGIN_WORDS[it.origin]}</span>
                {it.note ? <span className="block text-sm text-muted">{it.note}</span> : null}
              </td>
              <td className="border-b border-line px-3 py-2">
                <SecondMarking m={it.moderation} />
              </td>
              <td className="border-b border-line px-3 py-2">{teacherTotal(it)}</td>
              <td className="border-b border-line px-3 py-2 tabular-nums">{it.moderation ? formatMarks(it.moderation.total) : <span className="text-muted">—</span>}</td>
              <td className={cn("border-b border-line px-3 py-2 tabular-nums", it.difference !== null && it.difference !== 0 && "font-semibold")}>
                {it.difference !== null ? signed(it.difference, 0) : <span className="text-muted">—</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
    </>
  );
}

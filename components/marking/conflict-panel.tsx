"use client";

import { useEffect, useRef } from "react";
import { Button } from "@/components/ui/button";
import { formatDateTime } from "@/lib/utils";
import { totalOf, type MarkDraft } from "./draft";
import type { Rubric, TeacherMarkJson } from "./types";

function levelName(rubric: Rubric | null, criterionId: string, levelId: string | undefined) {
  const c = rubric?.criteria.find((x) => x.id === criterionId);
  const l = c?.levels.find((x) => x.id === levelId);
  return l ? `${l.label} (${l.marks})` : "no level";
}

/**
 * Shown when someone else saved marks for this write-up after it was opened here: their marks
 * and these side by side. Nothing is thrown away until the teacher chooses.
 */
export function ConflictPanel({
  rubric,
  mine,
  theirs,
  busy,
  onUseTheirs,
  onKeepMine,
}: {
  rubric: Rubric | null;
  mine: MarkDraft;
  theirs: TeacherMarkJson | null;
  busy: boolean;
  onUseTheirs: () => void;
  onKeepMine: () => void;
}) {
  const ref = useRef<HTMLHeadingElement>(null);
  useEffect(() => ref.current?.focus(), []);
  const myTotal = totalOf(mine, rubric).total;
  return (
    <section aria-labelledby="conflict-heading" className="flex flex-col gap-3 rounded-lg border-2 border-warn bg-warn-soft p-3 no-print">
      <h2 id="conflict-heading" ref={ref} tabIndex={-1} className="font-bold">
        Someone else saved marks for this write-up
      </h2>
      <p className="text-[0.97rem]">
        {theirs?.markedAt ? `Their marks were saved ${formatDateTime(theirs.markedAt)}. ` : ""}Yours are not saved yet and are still on this page. Compare them, then choose.
      </p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse bg-surface text-sm">
          <caption className="sr-only">Their marks and yours</caption>
          <thead>
            <tr>
              <th scope="col" className="border border-line px-2 py-1 text-left">
                Criterion
              </th>
              <th scope="col" className="border border-line px-2 py-1 text-left">
                Saved by the other marker
              </th>
              <th scope="col" className="border border-line px-2 py-1 text-left">
                Yours (not saved)
              </th>
            </tr>
          </thead>
          <tbody>
            {(rubric?.criteria ?? []).map((c) => {
              const a = theirs?.criteria[c.id]?.levelId;
              const b = mine.criteria[c.id]?.levelId;
              return (
                <tr key={c.id} className={a !== b ? "font-semibold" : undefined}>
                  <th scope="row" className="border border-line px-2 py-1 text-left font-semibold">
                    {c.title}
                    {a !== b ? <span className="ml-1 font-normal text-warn">(differs)</span> : null}
                  </th>
                  <td className="border border-line px-2 py-1">{levelName(rubric, c.id, a)}</td>
                  <td className="border border-line px-2 py-1">{levelName(rubric, c.id, b)}</td>
                </tr>
              );
            })}
            <tr>
              <th scope="row" className="border border-line px-2 py-1 text-left">
                Total
              </th>
              <td className="border border-line px-2 py-1">{theirs ? theirs.total : "—"}</td>
              <td className="border border-line px-2 py-1">{myTotal}</td>
            </tr>
            <tr>
              <th scope="row" className="border border-line px-2 py-1 text-left align-top">
                Feedback
              </th>
              <td className="border border-line px-2 py-1 align-top whitespace-pre-wrap">{theirs?.feedback || <span className="text-muted">none</span>}</td>
              <td className="border border-line px-2 py-1 align-top whitespace-pre-wrap">{mine.feedback || <span className="text-muted">none</span>}</td>
            </tr>
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={onUseTheirs} disabled={busy}>
          Load their marks (set mine aside)
        </Button>
        <Button onClick={onKeepMine} disabled={busy}>
          Save mine over theirs
        </Button>
      </div>
    </section>
  );
}

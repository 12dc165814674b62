"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useRef, useState, type ReactNode } from "react";
import { CommentBox } from "@/components/marking/comment-box";
import { LevelPicker } from "@/components/marking/level-picker";
import { formatMarks } from "@/components/marking/status";
import type { CriterionChoice, ModerationItemJson, ModerationMarkSaved } from "@/components/marking/types";
import { WriteUpReader } from "@/components/marking/write-up-reader";
import { Badge } from "@/components/ui/badge";
import { Button, buttonClasses } from "@/components/ui/button";
import { Textarea } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { cn } from "@/lib/utils";
import { HiddenShape } from "./sample-items-table";
import { signed } from "./words";

export type SamplePiece = { writeUpId: string; studentName: string; finished: boolean };

type Notice = { tone: "good" | "bad" | "info"; text: ReactNode };
const NOTICE_TONE = { good: "border-good/40 bg-good-soft", bad: "border-bad/40 bg-bad-soft", info: "border-line bg-sunken" } as const;

const levelsOf = (m: ModerationItemJson["moderationMark"]): Record<string, CriterionChoice> =>
  Object.fromEntries(Object.entries(m?.criteria ?? {}).map(([id, c]) => [id, { levelId: c.levelId, overrideReason: "" }]));

const keyOf = (levels: Record<string, CriterionChoice>, comment: string) =>
  JSON.stringify({ levels: Object.fromEntries(Object.entries(levels).map(([k, v]) => [k, v.levelId]).sort(([a], [b]) => a!.localeCompare(b!))), comment: comment.trim() });

/** The teacher's levels beside the moderator's, once the piece is finished and the marks are shown. */
function Comparison({ item }: { item: ModerationItemJson }) {
  const teacher = item.view.mark;
  const mine = item.moderationMark;
  if (!teacher || !mine || !item.rubric) return null;
  const levelLabel = (cid: string, levelId: string | undefined) => item.rubric!.criteria.find((c) => c.id === cid)?.levels.find((l) => l.id === levelId)?.label ?? "—";
  const teacherTotal = teacher.teacherTotal;
  return (
    <section aria-labelledby="comparison-heading" className="flex flex-col gap-2 rounded-lg border border-line bg-surface p-3 sm:p-4">
      <h2 id="comparison-heading" className="text-xl font-bold">
        Your marks beside the teacher&apos;s
      </h2>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-sm sm:text-[0.97rem]">
          <caption className="sr-only">Each criterion: the teacher&apos;s level and marks, yours, and the difference</caption>
          <thead>
            <tr>
              {["Criterion", "Teacher", "You", "Difference"].map((h) => (
                <th key={h} scope="col" className="border-b border-line bg-sunken px-2 py-2 sm:px-3 font-semibold">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {item.rubric.criteria.map((c) => {
              const t = teacher.criteria[c.id];
              const m = mine.criteria[c.id];
              const diff = t && m ? m.marks - t.marks : null;
              return (
                <tr key={c.id}>
                  <th scope="row" className="border-b border-line px-2 py-2 sm:px-3 font-semibold">
                    {c.title}
                  </th>
                  <td className="border-b border-line px-2 py-2 sm:px-3">
                    {levelLabel(c.id, t?.levelId)} <span className="text-sm text-muted tabular-nums">({t ? t.marks : "—"})</span>
                  </td>
                  <td className="border-b border-line px-2 py-2 sm:px-3">
                    {levelLabel(c.id, m?.levelId)} <span className="text-sm text-muted tabular-nums">({m ? m.marks : "—"})</span>
                  </td>
                  <td className={cn("border-b border-line px-2 py-2 sm:px-3 tabular-nums", diff ? "font-semibold" : "text-muted")}>{diff === null ? "—" : diff === 0 ? "same" : signed(diff, 0)}</td>
                </tr>
              );
            })}
            <tr>
              <th scope="row" className="px-2 py-2 sm:px-3 font-bold">
                Total
              </th>
              <td className="px-2 py-2 sm:px-3 font-semibold tabular-nums">{formatMarks(teacherTotal)}</td>
              <td className="px-2 py-2 sm:px-3 font-semibold tabular-nums">{formatMarks(mine.total)}</td>
              <td className="px-2 py-2 sm:px-3 font-semibold tabular-nums">{mine.total === teacherTotal ? "same" : signed(mine.total - teacherTotal, 0)}</td>
            </tr>
          </tbody>
        </table>
      </div>
      {teacher.feedback.trim() ? (
        <p className="rounded-md border-l-4 border-accent bg-accent-soft px-2 py-2 sm:px-3">
          <span className="font-semibold">Teacher&apos;s feedback: </span>
          {teacher.feedback}
        </p>
      ) : null}
    </section>
  );
}

/**
 * One sampled write-up for its moderator: the student's work on one side, the rubric on the
 * other. Second marks are a separate record (the teacher's marks are never edited here). In a
 * blind sample the teacher's marks and comments stay hidden until the moderator finishes the
 * piece; then they are shown beside the moderator's. On a phone the rubric is a drawer at the
 * foot of the screen.
 */
export function SecondMarkingDesk({ sampleId, initial, order }: { sampleId: string; initial: ModerationItemJson; order: SamplePiece[] }) {
  const writeUpId = initial.view.writeUp.id;
  const queryClient = useQueryClient();
  const url = `/api/moderation/samples/${sampleId}/items/${writeUpId}`;
  const query = useQuery({ queryKey: ["moderation-item", sampleId, writeUpId], queryFn: () => fetchJson<ModerationItemJson>(url), initialData: initial });
  const item = query.data;
  const { view, rubric } = item;
  const studentName = view.writeUp.studentName;

  const [levels, setLevels] = useState(() => levelsOf(initial.moderationMark));
  const [comment, setComment] = useState(initial.moderationMark?.comment ?? "");
  const [savedKey, setSavedKey] = useState(() => keyOf(levelsOf(initial.moderationMark), initial.moderationMark?.comment ?? ""));
  const [revision, setRevision] = useState(initial.moderationMark?.revision ?? 0);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]>>({});
  const [notice, setNotice] = useState<Notice | null>(null);
  const [drawerOpen, setDrawerOpen] = useState(false);
  const asideRef = useRef<HTMLElement>(null);

  const dirty = keyOf(levels, comment) !== savedKey;
  const finished = !!item.moderationMark?.completedAt;
  const criteria = rubric?.criteria ?? [];
  const chosen = criteria.filter((c) => c.levels.some((l) => l.id === levels[c.id]?.levelId)).length;
  const total = criteria.reduce((sum, c) => sum + (c.levels.find((l) => l.id === levels[c.id]?.levelId)?.marks ?? 0), 0);
  const maxTotal = criteria.reduce((sum, c) => sum + Math.max(0, ...c.levels.map((l) => l.marks)), 0);
  const here = order.findIndex((p) => p.writeUpId === writeUpId);
  const previous = here > 0 ? order[here - 1] : undefined;
  const next = here >= 0 ? order[here + 1] : undefined;

  useEffect(() => {
    if (!dirty || !item.canMark) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty, item.canMark]);

  const save = useMutation({
    mutationFn: ({ complete }: { complete: boolean; snapshot: string }) =>
      fetchJson<ModerationMarkSaved>(url, { method: "PUT", json: { revision, criteria: Object.fromEntries(Object.entries(levels).map(([id, c]) => [id, { levelId: c.levelId }])), comment, complete } }),
    onSuccess: async (res, { snapshot }) => {
      setRevision(res.revision);
      setSavedKey(snapshot);
      setFieldErrors({});
      const wasHidden = item.teacherMarksHidden;
      setNotice({
        tone: "good",
        text: res.completed
          ? `Second marking finished: ${formatMarks(res.total)} out of ${maxTotal}.${wasHidden ? " The teacher's marks are shown now, beside yours." : ""}`
          : `Saved for later: ${formatMarks(res.total)} out of ${maxTotal} so far.${criteria.length - chosen ? ` ${criteria.length - chosen} criterion${criteria.length - chosen === 1 ? "" : "s"} still to mark.` : ""}`,
      });
      await queryClient.invalidateQueries({ queryKey: ["moderation-item", sampleId, writeUpId] });
      await queryClient.invalidateQueries({ queryKey: ["sample", sampleId] });
      await queryClient.invalidateQueries({ queryKey: ["samples"] });
    },
    onError: (e) => {
      if (e instanceof ApiError && e.status === 400) {
        setFieldErrors(e.fieldErrors);
        setDrawerOpen(true);
        setNotice({ tone: "bad", text: `Not saved. ${[e.message, ...(e.fieldErrors._form ?? [])].join(" ")}` });
        return;
      }
      setNotice({ tone: "bad", text: `Not saved. ${e instanceof ApiError ? e.message : "Something went wrong. Please try again."}` });
    },
  });

  const submit = (complete: boolean) => {
    if (complete && chosen < criteria.length) {
      const missing = Object.fromEntries(criteria.filter((c) => !levels[c.id]).map((c) => [`criteria.${c.id}.levelId`, ["Choose a level before finishing."]]));
      setFieldErrors(missing);
      setDrawerOpen(true);
      setNotice({ tone: "bad", text: `Not finished: choose a level for every criterion first (${criteria.length - chosen} to go).` });
      requestAnimationFrame(() => asideRef.current?.querySelector<HTMLElement>("fieldset[aria-invalid=true] input")?.focus());
      return;
    }
    save.mutate({ complete, snapshot: keyOf(levels, comment) });
  };

  const teacherComment = (key: string) => {
    const text = view.mark?.comments[key];
    return text ? <CommentBox sectionKey={key} label="" value={text} onChange={() => {}} disabled /> : null;
  };

  const statusLine = !item.canMark
    ? "You can read this piece; only the sample's moderator second-marks it, while the sample is in progress."
    : dirty
      ? "You have changes that are not saved."
      : finished
        ? "Finished. You can still change your levels while the sample is in progress."
        : item.moderationMark
          ? "Saved for later, not finished."
          : "Not second-marked yet.";

  return (
    <div className="flex flex-col gap-4 pb-28 lg:pb-0">
      <nav aria-label="Pieces in this sample" className="flex flex-wrap items-center justify-between gap-2">
        <Link href={`/moderation/${sampleId}`}>← Moderation sample</Link>
        <div className="flex flex-wrap items-center gap-2">
          {previous ? (
            <Link href={`/moderation/${sampleId}/${previous.writeUpId}`} className={buttonClasses("secondary", "sm")} aria-label={`Previous piece: ${previous.studentName}`}>
              ← Previous
            </Link>
          ) : null}
          {next ? (
            <Link href={`/moderation/${sampleId}/${next.writeUpId}`} className={buttonClasses("secondary", "sm")} aria-label={`Next piece: ${next.studentName}`}>
              Next →
            </Link>
          ) : null}
        </div>
      </nav>
      <header className="flex flex-col gap-1">
        <p className="text-sm font-semibold tracking-wide text-accent uppercase">Second marking · {item.sample.scope}</p>
        <h1 className="text-2xl font-bold sm:text-3xl">{studentName}</h1>
        <p className="flex flex-wrap items-center gap-2">
          {finished ? <Badge tone="good">Second marking finished</Badge> : item.moderationMark ? <Badge tone="warn">In progress</Badge> : <Badge tone="neutral">Not started</Badge>}
          {here >= 0 ? (
            <span className="text-muted">
              Piece {here + 1} of {order.length}
            </span>
          ) : null}
        </p>
      </header>
      {item.teacherMarksHidden ? (
        <p className="flex items-start gap-2 rounded-md border border-line bg-sunken p-3">
          <HiddenShape />
          <span>
            <strong>Blind second marking.</strong> The teacher&apos;s marks, comments and feedback are hidden until you finish second-marking this piece. Mark it as you would your own.
          </span>
        </p>
      ) : null}
      {!item.teacherMarksHidden && finished ? <Comparison item={item} /> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_25rem]">
        <WriteUpReader view={view} comment={teacherComment} />
        <aside
          ref={asideRef}
          aria-label="Second marking"
          className={cn(
            "fixed inset-x-0 bottom-0 z-30 flex max-h-[85vh] flex-col border-t-2 border-brand bg-surface shadow-[0_-6px_18px_rgba(0,0,0,0.12)]",
            "lg:sticky lg:top-4 lg:z-auto lg:max-h-[calc(100vh-2rem)] lg:self-start lg:rounded-lg lg:border lg:border-line lg:shadow-none",
          )}
        >
          <div className="flex items-center justify-between gap-3 border-b border-line px-4 py-2 lg:py-3">
            <h2 className="text-lg font-bold">
              Your marks <span className="font-normal text-muted">· {total} / {maxTotal}</span>
            </h2>
            <Button variant="secondary" size="sm" className="lg:hidden" aria-expanded={drawerOpen} aria-controls="second-marking-body" onClick={() => setDrawerOpen((o) => !o)}>
              {drawerOpen ? "Hide rubric" : "Show rubric"}
            </Button>
          </div>
          <div role="status" aria-live="polite" className="border-b border-line px-4 py-2">
            {notice ? <p className={cn("rounded-md border p-2 text-[0.97rem]", NOTICE_TONE[notice.tone])}>{notice.text}</p> : <p className="text-sm text-muted">{statusLine}</p>}
          </div>
          <div id="second-marking-body" className={cn("flex flex-col gap-3 overflow-y-auto p-4 lg:flex", drawerOpen ? "flex" : "hidden")}>
            {rubric ? (
              rubric.criteria.map((c) => (
                <LevelPicker
                  key={c.id}
                  idPrefix="second"
                  criterion={c}
                  value={levels[c.id]}
                  onChange={(choice) => {
                    setLevels((l) => ({ ...l, [c.id]: choice }));
                    setFieldErrors(({ [`criteria.${c.id}.levelId`]: _gone, ...rest }) => rest);
                  }}
                  disabled={!item.canMark}
                  levelError={fieldErrors[`criteria.${c.id}.levelId`]}
                />
              ))
            ) : (
              <p className="rounded-md border border-line bg-sunken p-3">This practical has no rubric, so there is nothing to second-mark against.</p>
            )}
            <div className="flex flex-col gap-1">
              <label htmlFor="second-comment" className="font-semibold">
                Your note on the marking <span className="font-normal text-muted">(optional)</span>
              </label>
              <Textarea id="second-comment" value={comment} maxLength={2000} disabled={!item.canMark} onChange={(e) => setComment(e.target.value)} aria-describedby="second-comment-hint" className="min-h-20" />
              <p id="second-comment-hint" className="text-sm text-muted">
                For the record of the sample; the student does not see it.
              </p>
            </div>
            <p className="text-lg">
              <span className="font-bold">Total: {total}</span> out of {maxTotal}
              <span className="block text-sm text-muted">
                {chosen} of {criteria.length} criteria have a level.
              </span>
            </p>
            {item.canMark ? (
              <div className="flex flex-wrap gap-2">
                <Button onClick={() => submit(true)} disabled={save.isPending || (finished && !dirty)}>
                  {save.isPending ? "Saving…" : finished ? "Save changes" : "Finish second marking"}
                </Button>
                {!finished ? (
                  <Button variant="secondary" onClick={() => submit(false)} disabled={save.isPending || !dirty}>
                    Save for later
                  </Button>
                ) : null}
              </div>
            ) : null}
          </div>
        </aside>
      </div>
    </div>
  );
}

"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Textarea } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { cn, formatDateTime } from "@/lib/utils";
import { CommentBox } from "./comment-box";
import { ConflictPanel } from "./conflict-panel";
import { draftFrom, draftKey, markRequest, totalOf, type MarkDraft } from "./draft";
import { LevelPicker } from "./level-picker";
import { formatMarks, StatusBadge } from "./status";
import type { BenchStatus, CriterionChoice, MarkingItemJson, MarkSaved, TeacherMarkJson } from "./types";
import { WriteUpReader } from "./write-up-reader";

type Notice = { tone: "good" | "bad" | "info"; text: ReactNode };

const NOTICE_TONE = { good: "border-good/40 bg-good-soft", bad: "border-bad/40 bg-bad-soft", info: "border-line bg-sunken" } as const;

const isTyping = (el: EventTarget | null) =>
  el instanceof HTMLTextAreaElement || el instanceof HTMLSelectElement || (el instanceof HTMLInputElement && !["radio", "checkbox", "button", "submit"].includes(el.type)) || (el instanceof HTMLElement && el.isContentEditable);

const time = (d: Date) => d.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" });

function benchStatus(status: MarkingItemJson["view"]["writeUp"]["status"], late: boolean): BenchStatus {
  return status === "submitted" && late ? "late" : status;
}

/**
 * One write-up beside its rubric: read the student's work (with a comment box under each part),
 * choose a level per criterion (pre-filled from the calculation checks where the rubric links
 * them), give feedback, save, and return the work to the student. Two columns on a wide screen;
 * on a phone the rubric is a drawer at the foot of the screen. J/K or Alt+←/→ move to the
 * previous or next handed-in write-up; prints as a clean marked copy.
 */
export function MarkingDesk({ initial }: { initial: MarkingItemJson }) {
  const writeUpId = initial.view.writeUp.id;
  const labSessionId = initial.view.labSession.id;
  const router = useRouter();
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: ["marking", writeUpId],
    queryFn: () => fetchJson<MarkingItemJson>(`/api/write-ups/${writeUpId}/marking`),
    initialData: initial,
  });
  const item = query.data;
  const { view, rubric, suggestions } = item;
  const studentName = view.writeUp.studentName;

  const [draft, setDraft] = useState<MarkDraft>(() => draftFrom(initial.mark, initial.suggestions, initial.rubric));
  const [savedKey, setSavedKey] = useState(() => (initial.mark ? draftKey(draftFrom(initial.mark, initial.suggestions, initial.rubric)) : null));
  const [revision, setRevision] = useState(initial.mark?.revision ?? 0);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]>>({});
  const [notice, setNotice] = useState<Notice | null>(null);
  const [conflict, setConflict] = useState<{ theirs: TeacherMarkJson | null } | null>(null);
  const [pendingMove, setPendingMove] = useState<string | null>(null);
  const [drawerOpen, setDrawerOpen] = useState(false);
  const rubricRef = useRef<HTMLElement>(null);

  const dirty = savedKey === null ? Object.keys(draft.criteria).length > 0 || draft.feedback.trim() !== "" || Object.values(draft.comments).some((c) => c.trim()) : draftKey(draft) !== savedKey;
  const { total, chosen, criteria: criteriaCount } = totalOf(draft, rubric);
  const status = view.writeUp.status;
  const handedIn = status !== "draft";
  const editable = item.canMark && handedIn;

  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);

  const refresh = async () => {
    await queryClient.invalidateQueries({ queryKey: ["bench", labSessionId] });
    await queryClient.invalidateQueries({ queryKey: ["marking", writeUpId] });
  };

  const save = useMutation({
    mutationFn: ({ body }: { body: ReturnType<typeof markRequest>; snapshot: MarkDraft }) => fetchJson<MarkSaved>(`/api/write-ups/${writeUpId}/mark`, { method: "PUT", json: body }),
    onSuccess: async (res, { snapshot }) => {
      setRevision(res.revision);
      setSavedKey(draftKey(snapshot));
      setFieldErrors({});
      setConflict(null);
      const left = criteriaCount - Object.keys(snapshot.criteria).length;
      setNotice({
        tone: "good",
        text: `Saved at ${time(new Date())}: ${formatMarks(res.total)} out of ${res.maxTotal}. ${res.complete ? (res.status === "returned" ? "The student sees these marks now." : "Every criterion is marked, so you can return it.") : `${left} criterion${left === 1 ? "" : "s"} still to mark.`}`,
      });
      await refresh();
    },
    onError: (e) => {
      if (e instanceof ApiError && e.status === 409 && e.body.reason === "stale") {
        setConflict({ theirs: (e.body.current as TeacherMarkJson | null | undefined) ?? null });
        setDrawerOpen(true);
        setNotice({ tone: "bad", text: "Not saved: someone else saved marks for this write-up since you opened it. Compare them below." });
        return;
      }
      if (e instanceof ApiError && e.status === 400) {
        const fe = e.fieldErrors;
        setFieldErrors(fe);
        setDrawerOpen(true);
        const known = (k: string) => k.startsWith("criteria.") || k.startsWith("comments.") || k === "feedback";
        const other = Object.entries(fe)
          .filter(([k]) => !known(k))
          .flatMap(([, v]) => v);
        setNotice({ tone: "bad", text: `Not saved. ${e.message}${other.length ? ` ${other.join(" ")}` : ""}` });
        requestAnimationFrame(() => rubricRef.current?.closest("main")?.querySelector<HTMLElement>("[aria-invalid=true]")?.focus());
        return;
      }
      setNotice({ tone: "bad", text: `Not saved. ${e instanceof ApiError ? e.message : "Something went wrong. Please try again."}` });
    },
  });

  const doSave = (rev = revision, snapshot = draft) => save.mutate({ body: markRequest(snapshot, rev, suggestions), snapshot });

  const giveBack = useMutation({
    mutationFn: () => fetchJson<{ returnedAt: string; emailed: number; emailFailures: number }>(`/api/write-ups/${writeUpId}/return`, { method: "POST" }),
    onSuccess: async (res) => {
      setNotice({
        tone: "good",
        text: `Returned to ${studentName}. ${res.emailed === 0 ? "No e-mails were sent (nobody has them turned on)." : `${res.emailed} e-mail${res.emailed === 1 ? " was" : "s were"} sent to the student and the parents who get them.`}${res.emailFailures ? ` ${res.emailFailures} could not be sent; the school's outbox has the details.` : ""}`,
      });
      await refresh();
    },
    onError: (e) => setNotice({ tone: "bad", text: `Not returned. ${e instanceof ApiError ? e.message : "Something went wrong. Please try again."}` }),
  });

  const reopen = useMutation({
    mutationFn: () => fetchJson(`/api/write-ups/${writeUpId}/reopen`, { method: "POST" }),
    onSuccess: async () => {
      setNotice({ tone: "good", text: `Reopened: ${studentName} can change the write-up and hand it in again. Your marks are kept. The reopening is recorded in the audit trail.` });
      await refresh();
    },
    onError: (e) => setNotice({ tone: "bad", text: `Not reopened. ${e instanceof ApiError ? e.message : "Something went wrong. Please try again."}` }),
  });

  const goTo = (id: string | null) => {
    if (!id) return;
    if (dirty && editable) {
      setPendingMove(id);
      return;
    }
    router.push(`/marking/${labSessionId}/${id}`);
  };

  const moveRef = useRef(goTo);
  useEffect(() => {
    moveRef.current = goTo;
  });
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.ctrlKey || e.metaKey || isTyping(e.target)) return;
      const previous = (!e.altKey && !e.shiftKey && e.key.toLowerCase() === "k") || (e.altKey && e.key === "ArrowLeft");
      const next = (!e.altKey && !e.shiftKey && e.key.toLowerCase() === "j") || (e.altKey && e.key === "ArrowRight");
      if (!previous && !next) return;
      e.preventDefault();
      moveRef.current(previous ? item.previousId : item.nextId);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [item.previousId, item.nextId]);

  const setChoice = (criterionId: string, choice: CriterionChoice) => {
    setDraft((d) => ({ ...d, criteria: { ...d.criteria, [criterionId]: choice } }));
    setFieldErrors((fe) => {
      const { [`criteria.${criterionId}.levelId`]: _a, [`criteria.${criterionId}.overrideReason`]: _b, ...rest } = fe;
      return rest;
    });
  };

  const comment = (key: string, label: string) =>
    item.canMark ? (
      <CommentBox sectionKey={key} label={label} value={draft.comments[key] ?? ""} onChange={(v) => setDraft((d) => ({ ...d, comments: { ...d.comments, [key]: v } }))} error={fieldErrors[`comments.${key}`]} disabled={!editable} />
    ) : draft.comments[key] ? (
      <CommentBox sectionKey={key} label={label} value={draft.comments[key]!} onChange={() => {}} disabled />
    ) : null;

  const savedMark = item.mark;
  const statusLine = useMemo(() => {
    if (!handedIn) return `${studentName} has not handed this in yet, so it cannot be marked.`;
    if (dirty) return savedMark ? "You have changes that are not saved." : "Not saved yet. Levels suggested by the checks are pre-filled; save to keep them.";
    if (savedMark) return `Saved${savedMark.markedAt ? "" : " (not every criterion has a level yet)"}.`;
    return "Not marked yet.";
  }, [handedIn, dirty, savedMark, studentName]);

  const rubricBody = (
    <div className="flex flex-col gap-3">
      {conflict ? (
        <ConflictPanel
          rubric={rubric}
          mine={draft}
          theirs={conflict.theirs}
          busy={save.isPending}
          onUseTheirs={() => {
            const theirs = draftFrom(conflict.theirs, suggestions, rubric);
            setDraft(theirs);
            setSavedKey(conflict.theirs ? draftKey(theirs) : null);
            setRevision(conflict.theirs?.revision ?? 0);
            setConflict(null);
            setNotice({ tone: "info", text: "The other marker's marks are loaded. Yours were set aside." });
          }}
          onKeepMine={() => doSave(conflict.theirs?.revision ?? 0)}
        />
      ) : null}
      {rubric ? (
        rubric.criteria.map((c) => (
          <LevelPicker
            key={c.id}
            idPrefix="mark"
            criterion={c}
            value={draft.criteria[c.id]}
            onChange={(choice) => setChoice(c.id, choice)}
            suggestion={suggestions[c.id] ?? null}
            disabled={!editable}
            levelError={fieldErrors[`criteria.${c.id}.levelId`] ?? fieldErrors[`criteria.${c.id}`]}
            reasonError={fieldErrors[`criteria.${c.id}.overrideReason`]}
          />
        ))
      ) : (
        <p className="rounded-md border border-line bg-sunken p-3">This practical has no rubric, so there is nothing to mark against.</p>
      )}
      <div className="flex flex-col gap-1">
        <label htmlFor="mark-feedback" className="font-semibold">
          Feedback for {studentName}
        </label>
        <Textarea
          id="mark-feedback"
          value={draft.feedback}
          maxLength={4000}
          disabled={!editable}
          onChange={(e) => setDraft((d) => ({ ...d, feedback: e.target.value }))}
          aria-invalid={fieldErrors.feedback ? true : undefined}
          aria-describedby={fieldErrors.feedback ? "mark-feedback-error" : undefined}
          className="min-h-28 print:hidden"
        />
        <p className="hidden whitespace-pre-wrap print:block">{draft.feedback || "No feedback."}</p>
        {fieldErrors.feedback ? (
          <p id="mark-feedback-error" className="text-sm font-semibold text-bad">
            {fieldErrors.feedback.join(" ")}
          </p>
        ) : null}
      </div>
      <p className="text-lg">
        <span className="font-bold">Total: {total}</span> out of {item.maxTotal}
        <span className="block text-sm text-muted print:hidden">
          {chosen} of {criteriaCount} criteria have a level.
        </span>
      </p>
      {savedMark?.adjustedTotal != null ? (
        <p className="rounded-md border border-accent/40 bg-accent-soft p-2 text-sm">
          <Badge tone="accent">adjusted</Badge> Moderation adjusted this total to <strong>{formatMarks(savedMark.adjustedTotal)}</strong>; the marks you gave ({savedMark.total}) are kept beside it.
        </p>
      ) : null}
      {item.canMark ? (
        <div className="flex flex-col gap-2 no-print">
          <div className="flex flex-wrap gap-2">
            <Button onClick={() => doSave()} disabled={!editable || save.isPending || !!conflict}>
              {save.isPending ? "Saving…" : "Save marks"}
            </Button>
            {status !== "returned" ? (
              <Button variant="secondary" onClick={() => giveBack.mutate()} disabled={giveBack.isPending || dirty} aria-describedby="return-note">
                {giveBack.isPending ? "Returning…" : "Return to the student"}
              </Button>
            ) : null}
          </div>
          <p id="return-note" className="text-sm text-muted">
            {status === "returned"
              ? `Returned ${savedMark?.returnedAt ? formatDateTime(savedMark.returnedAt) : ""}. Marks you save now are seen by the student straight away.`
              : dirty
                ? "Save your marks before returning: the student gets what is saved."
                : "Returning e-mails the student (and parents who get e-mails) and shows them the marks and feedback."}
          </p>
        </div>
      ) : (
        <p className="rounded-md border border-line bg-sunken p-2 text-sm no-print">You can read these marks; only the class&apos;s teachers can mark.</p>
      )}
      {view.canReopen ? (
        <div className="border-t border-line pt-3 no-print">
          <ConfirmButton
            label="Reopen for the student"
            variant="secondary"
            size="sm"
            question={`Reopen this write-up so ${studentName} can change it and hand it in again? Your marks are kept, and the reopening is recorded in the audit trail.`}
            confirmLabel="Reopen it"
            busy={reopen.isPending}
            onConfirm={() => reopen.mutate()}
          />
        </div>
      ) : null}
    </div>
  );

  return (
    <div className="flex flex-col gap-4 pb-28 lg:pb-0 print:pb-0">
      <nav aria-label="Write-ups in this lab session" className="flex flex-wrap items-center justify-between gap-2 no-print">
        <Link href={`/marking/${labSessionId}`}>← Marking bench: {view.labSession.className}</Link>
        <div className="flex flex-wrap items-center gap-2">
          <Button variant="secondary" size="sm" onClick={() => goTo(item.previousId)} disabled={!item.previousId} aria-keyshortcuts="K Alt+ArrowLeft">
            ← Previous
          </Button>
          <Button variant="secondary" size="sm" onClick={() => goTo(item.nextId)} disabled={!item.nextId} aria-keyshortcuts="J Alt+ArrowRight">
            Next →
          </Button>
          <Button variant="ghost" size="sm" onClick={() => window.print()}>
            Print marked write-up
          </Button>
        </div>
      </nav>
      <header className="flex flex-col gap-1">
        <p className="text-sm font-semibold tracking-wide text-accent uppercase">
          {view.labSession.className} · {view.practical.title}
        </p>
        <h1 className="text-2xl font-bold sm:text-3xl">{studentName}</h1>
        <p className="flex flex-wrap items-center gap-2">
          <StatusBadge status={benchStatus(status, view.writeUp.late)} />
          {view.writeUp.late && status !== "submitted" ? <Badge tone="warn">Handed in late</Badge> : null}
          <span className="text-muted">{view.writeUp.submittedAt ? `Handed in ${formatDateTime(view.writeUp.submittedAt)}` : "Not handed in"}</span>
        </p>
        <p className="text-sm text-muted no-print">Keys: J next, K previous (or Alt+→ and Alt+←); with a criterion focused, 1–9 choose its level.</p>
      </header>
      {pendingMove ? (
        <div role="alertdialog" aria-labelledby="leave-question" className="flex flex-col gap-2 rounded-lg border-2 border-warn bg-warn-soft p-3 no-print">
          <p id="leave-question" className="font-semibold">
            Your marks for {studentName} are not saved. Leave this write-up anyway?
          </p>
          <div className="flex flex-wrap gap-2">
            <Button size="sm" onClick={() => setPendingMove(null)} autoFocus>
              Stay and save
            </Button>
            <Button
              size="sm"
              variant="danger"
              onClick={() => {
                const to = pendingMove;
                setPendingMove(null);
                router.push(`/marking/${labSessionId}/${to}`);
              }}
            >
              Leave without saving
            </Button>
          </div>
        </div>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_27rem] print:block">
        <WriteUpReader view={view} comment={comment} />
        <aside
          ref={rubricRef}
          aria-label="Rubric and marks"
          className={cn(
            "fixed inset-x-0 bottom-0 z-30 flex max-h-[85vh] flex-col border-t-2 border-brand bg-surface shadow-[0_-6px_18px_rgba(0,0,0,0.12)]",
            "lg:sticky lg:top-4 lg:z-auto lg:max-h-[calc(100vh-2rem)] lg:self-start lg:rounded-lg lg:border lg:border-line lg:shadow-none",
            "print:static print:mt-8 print:max-h-none print:border-0 print:shadow-none",
          )}
        >
          <div className="flex items-center justify-between gap-3 border-b border-line px-4 py-2 lg:py-3">
            <h2 className="text-lg font-bold">
              Rubric <span className="font-normal text-muted">· {total} / {item.maxTotal}</span>
            </h2>
            <Button variant="secondary" size="sm" className="lg:hidden no-print" aria-expanded={drawerOpen} aria-controls="rubric-body" onClick={() => setDrawerOpen((o) => !o)}>
              {drawerOpen ? "Hide rubric" : "Show rubric"}
            </Button>
          </div>
          <div role="status" aria-live="polite" className="border-b border-line px-4 py-2 no-print">
            {notice ? <p className={cn("rounded-md border p-2 text-[0.97rem]", NOTICE_TONE[notice.tone])}>{notice.text}</p> : <p className="text-sm text-muted">{statusLine}</p>}
          </div>
          <div id="rubric-body" className={cn("overflow-y-auto p-4 lg:block", drawerOpen ? "block" : "hidden", "print:block print:overflow-visible")}>
            {rubricBody}
          </div>
        </aside>
      </div>
    </div>
  );
}

"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useState, type ReactNode } from "react";
import { RichEditorLazy } from "@/components/editor/rich-editor-lazy";
import { EvidencePanel } from "@/components/evidence/evidence-panel";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { CheckSpec } from "@/lib/validation/practicals";
import type { RichTextDoc } from "@/lib/validation/rich-text";
import type { FilledTable, GroupTables, StoredAnswer, WriteUpContent } from "@/lib/validation/write-ups";
import { clockTime, describeSave, hasUnsaved, STATUS_SEVERITY, type SaveProblem } from "@/lib/write-ups/autosave";
import { clearLocalDraft } from "@/lib/write-ups/local-draft";
import { answerFingerprint, checkDataFingerprint } from "@/lib/write-ups/stale";
import { validateTable } from "@/lib/write-ups/table-validation";
import { cn } from "@/lib/utils";
import { CheckPanel, resultIsStale, type CheckResultEntry, type TangentPoints } from "./check-panel";
import { boundGraph, isPerRowCheck, isTangentCheck } from "./check-words";
import { contentParts, groupTableParts, SECTIONS, type SectionKey } from "./compare";
import { EMPTY_TABLE, isEmptyDoc, isGroupTables, isWriteUpContent, rowHasReading, sameDoc } from "./content-helpers";
import { HandInPanel, type HandInItem } from "./hand-in-panel";
import { GraphPanelLazy } from "./lazy-panels";
import { ResultsGrid } from "./results-grid";
import { SaveStatus } from "./save-status";
import type { CheckStateJson, SaveAnswer, WriteUpViewJson } from "./types";
import { useAutosave } from "./use-autosave";
import { VersionChooser } from "./version-chooser";

const EMPTY: RichTextDoc = { type: "doc", content: [] };
const BLANK_ANSWER: StoredAnswer = { value: "", unit: "", working: null, tangent: null };

/** What to write in each section, in plain words. */
const SECTION_PROMPTS: Record<SectionKey, string> = {
  plan: "Say what you will change, what you will measure and how, and what you will keep the same so the test is fair. Include how you will work safely.",
  observations: "What did you see, hear or feel? Colour changes, fizzing, warmth, anything you did not expect.",
  conclusion: "What do your results show? Use numbers from your table and graph, and explain the pattern with the science you know.",
  evaluation: "How good were your results? Point out anomalous readings, sources of error and uncertainty, and say how you would improve the method.",
};

type Tangent = NonNullable<WriteUpContent["graphs"][string]["tangent"]>;
const points = (t: Tangent | null | undefined): TangentPoints | null => (t ? { x1: t.x1, y1: t.y1, x2: t.x2, y2: t.y2 } : null);

function initialResults(view: WriteUpViewJson): Record<string, CheckResultEntry> {
  const out: Record<string, CheckResultEntry> = {};
  for (const spec of view.practical.content.checks) {
    const state = view.checks[spec.id];
    if (!state) continue;
    // A result that was current when the page loaded was run on exactly what loaded.
    out[spec.id] = {
      state,
      basis: state.stale ? null : { dataHash: checkDataFingerprint(spec, view.tables), answerHash: answerFingerprint(view.writeUp.content.answers[spec.id]) },
    };
  }
  return out;
}

/** Why a save cannot go through right now, for a Check or Hand in that needs everything saved first. */
function saveBlockedReason(p: SaveProblem<unknown> | null): string {
  if (!p) return "Your work is still saving. Try again in a moment.";
  switch (p.kind) {
    case "offline":
      return "You are offline. Your work is kept on this device; try again when you are back online.";
    case "conflict":
      return "First choose which version of your work to keep (see the message at the top).";
    case "locked":
      return "This write-up is locked, so nothing more can be saved.";
    case "closed":
      return "This lab session has closed, so nothing more can be saved.";
    case "error":
      return `Your work could not be saved: ${p.message}`;
  }
}

function requestError(e: unknown): string {
  if (e instanceof ApiError) {
    if (e.status === 0) return "You are offline. Try again when you are back online; your work is kept on this device.";
    return e.message;
  }
  return "Something went wrong. Please try again.";
}

export type WriteUpLabels = {
  /** "Due Tue 8 Dec 2026, 16:00", formatted on the server in the school's time. */
  due: string;
  /** The late rule in a sentence, or null when the session is not past due. */
  lateRule: string | null;
  /** Whether handing in now is late (decided on the server when the page loaded). */
  lateNow: boolean;
};

/**
 * The student's write-up: safety first, then plan, observations, results, graphs, calculations,
 * conclusion and evaluation, with autosave, checks and handing in. The practical's own text and
 * safety section come in already rendered (`practicalIntro`, `safetyDetails`), so formulas are
 * drawn on the server and KaTeX stays out of this page's first load.
 */
export function WriteUpEditor({ initialView, practicalIntro, safetyDetails, labels }: { initialView: WriteUpViewJson; practicalIntro: ReactNode; safetyDetails: ReactNode; labels: WriteUpLabels }) {
  const id = initialView.writeUp.id;
  const router = useRouter();
  const queryClient = useQueryClient();
  const { data: view } = useQuery({
    queryKey: ["write-up", id],
    queryFn: () => fetchJson<WriteUpViewJson>(`/api/write-ups/${id}`),
    initialData: initialView,
    staleTime: Infinity,
  });
  const practical = view.practical.content;
  const group = initialView.group;
  const evidenceTarget = useMemo(() => ({ writeUpId: id }), [id]);
  const enabled = view.canEdit;

  const main = useAutosave<WriteUpContent>({
    writeUpId: id,
    part: "content",
    initial: { revision: initialView.writeUp.revision, content: initialView.writeUp.content, updatedAt: initialView.writeUp.updatedAt },
    enabled,
    send: (revision, content) => fetchJson<SaveAnswer>(`/api/write-ups/${id}`, { method: "PUT", json: { revision, content } }),
    fetchCurrent: async () => {
      const v = await fetchJson<WriteUpViewJson>(`/api/write-ups/${id}`);
      return { revision: v.writeUp.revision, content: v.writeUp.content, updatedAt: v.writeUp.updatedAt };
    },
    readCurrent: (c) => (isWriteUpContent(c.content) ? c.content : undefined),
    isContent: isWriteUpContent,
  });
  const groupSave = useAutosave<GroupTables>({
    writeUpId: id,
    part: "group-tables",
    initial: { revision: group?.revision ?? 0, content: initialView.tables, updatedAt: null },
    enabled: enabled && !!group,
    send: (revision, tables) => fetchJson<SaveAnswer>(`/api/write-ups/${id}/group-tables`, { method: "PUT", json: { revision, tables } }),
    fetchCurrent: async () => {
      const v = await fetchJson<WriteUpViewJson>(`/api/write-ups/${id}`);
      return { revision: v.group?.revision ?? 0, content: v.tables, updatedAt: null };
    },
    readCurrent: (c) => (isGroupTables(c.tables) ? c.tables : undefined),
    isContent: isGroupTables,
  });

  const content = main.state.content;
  const tables: GroupTables = group ? groupSave.state.content : content.tables;
  const epoch = main.state.epoch;

  // Safety first: the results tables unlock once the student confirms they have read it.
  const [safetyAt, setSafetyAt] = useState<string | null>(initialView.writeUp.safetyAcknowledgedAt);
  const [safetyBusy, setSafetyBusy] = useState(false);
  const [safetyError, setSafetyError] = useState<string | null>(null);
  const acknowledge = async () => {
    setSafetyBusy(true);
    setSafetyError(null);
    try {
      await fetchJson(`/api/write-ups/${id}/safety`, { method: "POST" });
      setSafetyAt(new Date().toISOString());
      void queryClient.invalidateQueries({ queryKey: ["write-up", id] });
    } catch (e) {
      setSafetyError(requestError(e));
    } finally {
      setSafetyBusy(false);
    }
  };
  const safetyOk = !!safetyAt;

  // Changes.
  const setSection = (key: SectionKey, doc: RichTextDoc) => main.edit((c) => (sameDoc(c.sections[key], doc) ? c : { ...c, sections: { ...c.sections, [key]: doc } }));
  const setTable = (tableId: string, filled: FilledTable) => {
    if (group) groupSave.edit((t) => ({ ...t, [tableId]: filled }));
    else main.edit((c) => ({ ...c, tables: { ...c.tables, [tableId]: filled } }));
  };
  const setTangent = (graphId: string, tangent: Tangent | null) =>
    main.edit((c) => {
      const answers = { ...c.answers };
      // The tangent is part of the answer of every tangent check that reads this graph, so
      // moving it marks their results "needs checking again" here and on the server.
      for (const spec of practical.checks) {
        if (boundGraph(spec, practical.graphs)?.id === graphId) answers[spec.id] = { ...BLANK_ANSWER, ...c.answers[spec.id], tangent: points(tangent) };
      }
      return { ...c, graphs: { ...c.graphs, [graphId]: { tangent } }, answers };
    });
  const setAnswer = (checkId: string, next: { value: string; unit: string }) => main.edit((c) => ({ ...c, answers: { ...c.answers, [checkId]: { ...BLANK_ANSWER, ...c.answers[checkId], ...next } } }));
  const setWorking = (checkId: string, doc: RichTextDoc) =>
    main.edit((c) => (sameDoc(c.answers[checkId]?.working, doc) ? c : { ...c, answers: { ...c.answers, [checkId]: { ...BLANK_ANSWER, ...c.answers[checkId], working: doc } } }));

  // Calculation checks.
  const [results, setResults] = useState<Record<string, CheckResultEntry>>(() => initialResults(initialView));
  const [checkBusy, setCheckBusy] = useState<string | null>(null);
  const [checkErrors, setCheckErrors] = useState<Record<string, string | null>>({});
  const runCheck = async (spec: CheckSpec) => {
    setCheckBusy(spec.id);
    setCheckErrors((e) => ({ ...e, [spec.id]: null }));
    try {
      // Checks read the saved data, so everything is saved first.
      const savedMain = await main.flush();
      const savedGroup = group ? await groupSave.flush() : true;
      if (!savedMain || !savedGroup) {
        setCheckErrors((e) => ({ ...e, [spec.id]: `Not checked. ${saveBlockedReason(!savedMain ? main.current().problem : groupSave.current().problem)}` }));
        return;
      }
      const c = main.current().content;
      const t = group ? groupSave.current().content : c.tables;
      const a = c.answers[spec.id];
      const graph = boundGraph(spec, practical.graphs);
      const answer = isPerRowCheck(spec)
        ? { value: "", unit: "" }
        : { value: a?.value ?? "", unit: a?.unit ?? "", ...(isTangentCheck(spec) ? { tangent: points(graph ? c.graphs[graph.id]?.tangent : null) } : {}) };
      const state = await fetchJson<CheckStateJson>(`/api/write-ups/${id}/checks/${spec.id}`, { method: "POST", json: { answer } });
      setResults((r) => ({ ...r, [spec.id]: { state, basis: { dataHash: checkDataFingerprint(spec, t), answerHash: answerFingerprint(answer) } } }));
    } catch (e) {
      setCheckErrors((x) => ({ ...x, [spec.id]: `Not checked. ${requestError(e)}` }));
    } finally {
      setCheckBusy(null);
    }
  };

  // Saving status: the worse of the write-up's and the group's.
  const mainStatus = describeSave(main.state, clockTime);
  const groupStatus = group ? describeSave(groupSave.state, clockTime) : null;
  const status = groupStatus && STATUS_SEVERITY[groupStatus.kind] > STATUS_SEVERITY[mainStatus.kind] ? { ...groupStatus, text: `Group results: ${groupStatus.text}` } : mainStatus;
  const unsaved = hasUnsaved(main.state) || !!main.state.inFlight || (!!group && (hasUnsaved(groupSave.state) || !!groupSave.state.inFlight));
  const saveProblem = main.state.problem ?? groupSave.state.problem;

  useEffect(() => {
    if (!unsaved) return;
    const warn = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      // Older browsers show the prompt only when returnValue is set.
      e.returnValue = "";
    };
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [unsaved]);

  // Photos still uploading hold up handing in (a handed-in write-up takes no more).
  const [photosBusy, setPhotosBusy] = useState(0);

  // Handing in.
  const [handInBusy, setHandInBusy] = useState(false);
  const [handInError, setHandInError] = useState<string | null>(null);
  const [handedIn, setHandedIn] = useState<{ at: string; late: boolean } | null>(null);
  const flushAll = async () => (await main.flush()) && (group ? await groupSave.flush() : true);
  const handIn = async () => {
    setHandInBusy(true);
    setHandInError(null);
    try {
      for (let attempt = 0; attempt < 2; attempt++) {
        if (!(await flushAll())) {
          setHandInError(`Not handed in. ${saveBlockedReason(main.current().problem ?? groupSave.current().problem)}`);
          return;
        }
        try {
          const res = await fetchJson<{ submittedAt: string; late: boolean }>(`/api/write-ups/${id}/submit`, { method: "POST", json: { revision: main.current().revision } });
          clearLocalDraft(id, "content");
          clearLocalDraft(id, "group-tables");
          setHandedIn({ at: res.submittedAt, late: res.late });
          router.refresh();
          return;
        } catch (e) {
          // A save that landed between the flush and the hand-in: save again and retry once.
          if (attempt === 0 && e instanceof ApiError && e.status === 409 && e.body.reason === "stale") continue;
          throw e;
        }
      }
    } catch (e) {
      setHandInError(`Not handed in. ${requestError(e)}`);
    } finally {
      setHandInBusy(false);
    }
  };

  const tableIssues = useMemo(
    () => practical.tables.reduce((n, t) => n + validateTable(t, tables[t.id] ?? EMPTY_TABLE).issues.filter((i) => i.level === "error").length, 0),
    [practical.tables, tables],
  );
  const emptySections = SECTIONS.filter((s) => isEmptyDoc(content.sections[s.key])).map((s) => s.label);
  const dataHashes = Object.fromEntries(practical.checks.map((spec) => [spec.id, checkDataFingerprint(spec, tables)]));
  const answerOf = (spec: CheckSpec) => {
    const a = content.answers[spec.id];
    return { value: a?.value ?? "", unit: a?.unit ?? "" };
  };
  const tangentOf = (spec: CheckSpec) => {
    const g = boundGraph(spec, practical.graphs);
    return isTangentCheck(spec) && g ? points(content.graphs[g.id]?.tangent) : null;
  };
  const notChecked = practical.checks.filter((spec) => !results[spec.id]).map((s) => s.label);
  const staleChecks = practical.checks
    .filter((spec) => resultIsStale(results[spec.id], dataHashes[spec.id]!, isPerRowCheck(spec) ? { value: "", unit: "" } : { ...answerOf(spec), tangent: isTangentCheck(spec) ? tangentOf(spec) : undefined }))
    .map((s) => s.label);
  const handInItems: HandInItem[] = [
    { ok: safetyOk, blocking: true, text: safetyOk ? "You have confirmed the safety section." : "Confirm the safety section at the top." },
    saveProblem
      ? { ok: false, blocking: true, text: `Your work must be saved first. ${saveBlockedReason(saveProblem)}` }
      : { ok: true, blocking: true, text: unsaved ? "Your latest changes are saved first when you hand in." : "Everything is saved." },
    ...(photosBusy ? [{ ok: false, blocking: true, text: `Wait for your photos to finish uploading (${photosBusy} still going).` }] : []),
    ...(tableIssues ? [{ ok: false, blocking: false, text: `Your results have ${tableIssues} reading${tableIssues === 1 ? "" : "s"} to fix.` }] : []),
    ...(emptySections.length ? [{ ok: false, blocking: false, text: `Still empty: ${emptySections.join(", ")}.` }] : []),
    ...(notChecked.length ? [{ ok: false, blocking: false, text: `Not checked yet: ${notChecked.join("; ")}.` }] : []),
    ...(staleChecks.length ? [{ ok: false, blocking: false, text: `Needs checking again: ${staleChecks.join("; ")}.` }] : []),
  ];

  const nav = [
    { id: "safety", label: "Safety first" },
    ...SECTIONS.slice(0, 2).map((s) => ({ id: s.key, label: s.label })),
    { id: "photos", label: "Photos" },
    { id: "results", label: "Results" },
    ...(practical.graphs.length ? [{ id: "graphs", label: "Graphs" }] : []),
    ...(practical.checks.length ? [{ id: "calculations", label: "Calculations" }] : []),
    ...SECTIONS.slice(2).map((s) => ({ id: s.key, label: s.label })),
    { id: "hand-in", label: "Hand in" },
  ];
  const jump = (target: string) => {
    const heading = document.getElementById(`wu-${target}-title`);
    heading?.scrollIntoView({ block: "start" });
    heading?.focus({ preventScroll: true });
  };

  const problem = main.state.problem;
  const groupProblem = groupSave.state.problem;
  const lockedOrClosed = problem?.kind === "locked" || problem?.kind === "closed" ? problem : groupProblem?.kind === "locked" || groupProblem?.kind === "closed" ? groupProblem : null;

  const sectionEditor = (key: SectionKey) => (
    <RichEditorLazy key={`${key}-${epoch}`} id={`wu-${key}-editor`} labelId={`wu-${key}-title`} describedBy={`wu-${key}-prompt`} value={content.sections[key] ?? EMPTY} onChange={(doc) => setSection(key, doc)} />
  );

  if (handedIn) {
    return (
      <Alert tone="good" title={`Handed in at ${clockTime(handedIn.at)}${handedIn.late ? " (late)" : ""}`}>
        Your write-up is with your teacher. Loading the handed-in version…
      </Alert>
    );
  }

  return (
    <div className="lg:grid lg:grid-cols-[12rem_minmax(0,1fr)] lg:gap-8">
      <nav aria-label="Parts of your write-up" className="hidden lg:block">
        <div className="sticky top-4 flex flex-col gap-2">
          <p className="text-sm font-bold tracking-wide text-muted uppercase">Contents</p>
          <ol className="flex flex-col gap-1 border-l-2 border-line">
            {nav.map((n) => (
              <li key={n.id}>
                <a href={`#wu-${n.id}`} className="-ml-0.5 block border-l-2 border-transparent py-1 pl-3 text-ink no-underline hover:border-brand hover:text-brand" onClick={(e) => { e.preventDefault(); jump(n.id); }}>
                  {n.label}
                </a>
              </li>
            ))}
          </ol>
        </div>
      </nav>

      <div className="flex min-w-0 max-w-3xl flex-col gap-8">
        <div className="sticky top-0 z-30 -mx-4 flex flex-wrap items-center justify-between gap-2 border-b border-line bg-paper/95 px-4 py-2 backdrop-blur sm:mx-0 sm:rounded-b-md sm:border-x">
          <SaveStatus kind={status.kind} text={status.text} id="wu-save-status" />
          <label className="lg:hidden">
            <span className="sr-only">Jump to a part of your write-up</span>
            <select
              className="min-h-11 rounded-md border border-line bg-surface px-2 text-base"
              value=""
              onChange={(e) => {
                if (e.target.value) jump(e.target.value);
              }}
            >
              <option value="">Jump to…</option>
              {nav.map((n) => (
                <option key={n.id} value={n.id}>
                  {n.label}
                </option>
              ))}
            </select>
          </label>
        </div>

        {main.offer ? (
          <VersionChooser
            title="We found changes on this device that were not saved"
            intro={
              main.offer.kind === "newer" ? (
                <p>They were made on this device ({clockTime(new Date(main.offer.draft.keptAt).toISOString())}) and never reached Meniscus. Keep them to save them now, or keep the saved version.</p>
              ) : (
                <p>They were made on this device before your write-up was saved somewhere else. Choose which version to keep; the other is discarded.</p>
              )
            }
            mineLabel="On this device"
            otherLabel="Saved version"
            mine={contentParts(main.offer.draft.content, practical, { includeTables: !group })}
            other={contentParts(content, practical, { includeTables: !group })}
            keepMineLabel="Keep the changes on this device"
            keepOtherLabel="Keep the saved version"
            onKeepMine={main.acceptOffer}
            onKeepOther={main.dismissOffer}
          />
        ) : null}
        {groupSave.offer ? (
          <VersionChooser
            title="We found results on this device that were not saved"
            intro={<p>These readings for your group&apos;s table were typed on this device and never reached Meniscus.</p>}
            mineLabel="On this device"
            otherLabel="Your group's saved results"
            mine={groupTableParts(groupSave.offer.draft.content, practical)}
            other={groupTableParts(groupSave.state.content, practical)}
            keepMineLabel="Keep the results on this device"
            keepOtherLabel="Keep the saved results"
            onKeepMine={groupSave.acceptOffer}
            onKeepOther={groupSave.dismissOffer}
          />
        ) : null}
        {problem?.kind === "conflict" ? (
          <VersionChooser
            title="Your write-up was changed somewhere else"
            intro={
              <p>
                It was saved from another tab or device{problem.current?.updatedAt ? ` at ${clockTime(problem.current.updatedAt)}` : ""} while you were working here. Nothing is lost yet: choose which
                version to keep.
              </p>
            }
            mineLabel="Yours (this device)"
            otherLabel="Saved version"
            mine={contentParts(content, practical, { includeTables: !group })}
            other={problem.current ? contentParts(problem.current.content, practical, { includeTables: !group }) : []}
            keepMineLabel="Keep mine"
            keepOtherLabel="Keep the saved version"
            onKeepMine={main.keepMine}
            onKeepOther={main.keepSaved}
            busy={!problem.current}
          />
        ) : null}
        {groupProblem?.kind === "conflict" ? (
          <VersionChooser
            title="Someone in your group saved the results"
            intro={<p>Your group&apos;s table was saved from another device while you were typing here. Choose which version to keep.</p>}
            mineLabel="Yours (this device)"
            otherLabel="Your group's saved version"
            mine={groupTableParts(groupSave.state.content, practical)}
            other={groupProblem.current ? groupTableParts(groupProblem.current.content, practical) : []}
            keepMineLabel="Keep mine"
            keepOtherLabel="Keep the group's version"
            onKeepMine={groupSave.keepMine}
            onKeepOther={groupSave.keepSaved}
            busy={!groupProblem.current}
          />
        ) : null}
        {lockedOrClosed ? (
          <Alert tone="bad" title={lockedOrClosed.kind === "locked" ? "This write-up is locked" : "This lab session has closed"}>
            <p>{lockedOrClosed.message} Your latest changes were not saved; they are kept on this device.</p>
            <Button variant="secondary" size="sm" className="mt-2" onClick={() => router.refresh()}>
              See the saved write-up
            </Button>
          </Alert>
        ) : null}

        <Section id="safety" title="Safety first">
          {safetyDetails}
          <div className={cn("flex flex-col gap-2 rounded-md border-2 p-3", safetyOk ? "border-good/50 bg-good-soft" : "border-accent bg-accent-soft")}>
            <label className="flex min-h-11 cursor-pointer items-start gap-3 font-semibold">
              <input
                type="checkbox"
                className="mt-0.5 size-6 shrink-0 accent-brand"
                // Ticked at once while it is being recorded; unticked again if that fails.
                checked={safetyOk || safetyBusy}
                disabled={safetyOk || safetyBusy || !enabled}
                onChange={(e) => {
                  if (e.target.checked) void acknowledge();
                }}
              />
              <span>I have read the hazards and control measures</span>
            </label>
            <div aria-live="polite">
              {safetyOk ? (
                <p className="text-[0.95rem]" suppressHydrationWarning>
                  Confirmed{safetyAt ? ` at ${clockTime(safetyAt)}` : ""}. Your results tables are unlocked.
                </p>
              ) : safetyBusy ? (
                <p className="text-[0.95rem]">Saving…</p>
              ) : (
                <p className="text-[0.95rem]">Tick this once you have read them: your results tables unlock when you do.</p>
              )}
              {safetyError ? (
                <p role="alert" className="font-semibold text-bad">
                  {safetyError}
                </p>
              ) : null}
            </div>
          </div>
        </Section>

        <Section id="plan" title="Plan" prompt={SECTION_PROMPTS.plan}>
          <details className="rounded-md border border-line bg-surface p-3">
            <summary className="cursor-pointer font-semibold">The practical&apos;s aim and method</summary>
            <div className="mt-2">{practicalIntro}</div>
          </details>
          {sectionEditor("plan")}
        </Section>

        <Section id="observations" title="Observations" prompt={SECTION_PROMPTS.observations}>
          {sectionEditor("observations")}
        </Section>

        <Section id="photos" title="Photos" prompt="Photograph your apparatus, colour changes or results, and say in a caption what each photo shows.">
          <EvidencePanel target={evidenceTarget} editable={enabled} onBusyChange={setPhotosBusy} empty={<p className="text-muted">No photos yet.</p>} />
        </Section>

        <Section id="results" title="Results">
          {group ? (
            <div className="rounded-md border border-line bg-surface p-3">
              <p>
                <strong>Shared with {group.name}:</strong> {group.members.map((m) => m.name).join(", ")}. Anyone in the group can fill in these results; they save on their own.
              </p>
              {groupStatus ? <SaveStatus kind={groupStatus.kind} text={`Group results: ${groupStatus.text}`} className="mt-1 text-[0.95rem]" /> : null}
            </div>
          ) : null}
          {!safetyOk ? (
            <Alert tone="warn" title="Locked until you confirm the safety section">
              <a href="#wu-safety" onClick={(e) => { e.preventDefault(); jump("safety"); }}>
                Read the hazards and tick the box
              </a>{" "}
              to unlock your results tables.
            </Alert>
          ) : null}
          {practical.tables.length ? (
            practical.tables.map((t) => (
              <div key={t.id} id={`table-${t.id}`} className="min-w-0">
                <ResultsGrid table={t} value={tables[t.id] ?? EMPTY_TABLE} onChange={(next) => setTable(t.id, next)} readOnly={!safetyOk || !enabled} id={`grid-${t.id}`} />
              </div>
            ))
          ) : (
            <p className="text-muted">This practical has no results table.</p>
          )}
        </Section>

        {practical.graphs.length ? (
          <Section id="graphs" title="Graphs">
            {practical.graphs.map((g) => {
              const t = practical.tables.find((x) => x.id === g.tableId);
              if (!t) return null;
              return (
                <div key={g.id} id={`graph-${g.id}`} className="min-w-0 scroll-mt-20">
                  <GraphPanelLazy
                    graph={g}
                    table={t}
                    filled={tables[g.tableId] ?? EMPTY_TABLE}
                    tangent={content.graphs[g.id]?.tangent ?? null}
                    onTangentChange={(tangent: Tangent | null) => setTangent(g.id, tangent)}
                    readOnly={!enabled}
                    suggestedAt={practical.checks.find((spec): spec is Extract<CheckSpec, { kind: "rate-at" }> => isTangentCheck(spec) && boundGraph(spec, practical.graphs)?.id === g.id)?.at}
                  />
                </div>
              );
            })}
          </Section>
        ) : null}

        {practical.checks.length ? (
          <Section id="calculations" title="Calculations" prompt="Work out each answer, then press Check. The check uses your saved results, so your work is saved first.">
            {practical.checks.map((spec) => {
              const table = practical.tables.find((t) => t.id === spec.tableId);
              return (
                <CheckPanel
                  key={spec.id}
                  spec={spec}
                  table={table}
                  graph={boundGraph(spec, practical.graphs)}
                  answer={answerOf(spec)}
                  tangent={tangentOf(spec)}
                  dataHash={dataHashes[spec.id]!}
                  result={results[spec.id] ?? null}
                  busy={checkBusy === spec.id}
                  error={checkErrors[spec.id] ?? null}
                  readOnly={!enabled}
                  onAnswerChange={(next) => setAnswer(spec.id, next)}
                  onCheck={() => void runCheck(spec)}
                  rowHasData={(i) => rowHasReading(table, tables[spec.tableId], i)}
                  working={
                    <div className="flex flex-col gap-1">
                      <p id={`check-${spec.id}-working-label`} className="font-semibold">
                        Your working
                      </p>
                      <RichEditorLazy
                        key={`working-${spec.id}-${epoch}`}
                        id={`check-${spec.id}-working`}
                        labelId={`check-${spec.id}-working-label`}
                        value={content.answers[spec.id]?.working ?? EMPTY}
                        onChange={(doc) => setWorking(spec.id, doc)}
                      />
                    </div>
                  }
                />
              );
            })}
          </Section>
        ) : null}

        <Section id="conclusion" title="Conclusion" prompt={SECTION_PROMPTS.conclusion}>
          {sectionEditor("conclusion")}
        </Section>

        <Section id="evaluation" title="Evaluation" prompt={SECTION_PROMPTS.evaluation}>
          {sectionEditor("evaluation")}
        </Section>

        <Section id="hand-in" title="Hand in">
          {labels.lateRule ? <p className="font-semibold text-warn">{labels.lateRule}</p> : null}
          <HandInPanel
            items={handInItems}
            dueText={labels.due}
            lateNote={labels.lateNow ? "The due date has passed, so it will be recorded as handed in late." : null}
            busy={handInBusy}
            error={handInError}
            onHandIn={() => void handIn()}
          />
        </Section>
      </div>
    </div>
  );
}

function Section({ id, title, prompt, children }: { id: string; title: string; prompt?: string; children: ReactNode }) {
  return (
    <section id={`wu-${id}`} aria-labelledby={`wu-${id}-title`} className="flex scroll-mt-16 flex-col gap-3">
      <h2 id={`wu-${id}-title`} tabIndex={-1} className="scroll-mt-16 border-b border-line pb-1 text-2xl font-bold">
        {title}
      </h2>
      {prompt ? (
        <p id={`wu-${id}-prompt`} className="text-muted">
          {prompt}
        </p>
      ) : null}
      {children}
    </section>
  );
}

"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { formatDateTime } from "@/lib/utils";
import type { PracticalContent } from "@/lib/validation/practicals";
import { draftPublishProblems, errorCountsBySection, fieldDomIdCandidates, mergeErrors, SECTIONS, type FieldErrors, type SectionKey } from "../draft";
import { clearLocalCopies } from "../local-copy";
import { PreviewStoreContext, type PreviewInput } from "./check-preview";
import { ConflictPanel } from "./conflict-panel";
import { EditorErrorsContext } from "./fields";
import { ProblemsSummary } from "./problems-summary";
import { ReferencePhotos } from "./reference-photos";
import { SaveStatusText } from "./save-status";
import { SectionNav } from "./section-nav";
import { AimSection, MethodSection } from "./sections/aim-section";
import { ChecksSection } from "./sections/checks-section";
import { DetailsSection } from "./sections/details-section";
import { GraphsSection } from "./sections/graphs-section";
import { RubricSection } from "./sections/rubric-section";
import { SafetySection } from "./sections/safety-section";
import { SectionFrame } from "./sections/section-frame";
import { TablesSection } from "./sections/tables-section";
import { VariablesSection } from "./sections/variables-section";
import { draftOf, useDraftSaver } from "./use-draft-saver";

export type EditableVersion = {
  id: string;
  practicalId: string;
  version: number;
  title: string;
  topic: string;
  subject: string;
  yearGroup: number;
  content: PracticalContent;
  revision: number;
  updatedAt: string | null;
};

const LEADS: Record<SectionKey, string> = {
  details: "The practical's name and where it sits in the library.",
  aim: "What students will find out, and the background they need.",
  method: "The steps students follow.",
  variables: "What changes, what is measured, what stays the same, and what students need.",
  safety: "Hazards, control measures and protective equipment. A practical cannot be published without them.",
  tables: "The results tables students fill in, with the units and precision of each column.",
  graphs: "The graphs students draw from their results.",
  checks: "The calculations Meniscus recomputes from each student's own data, and how close an answer must be.",
  rubric: "How write-ups are judged.",
};

/**
 * Moves focus to the first of these elements that exists, waiting a little for a section (or a
 * rich editor, which loads lazily) to appear.
 */
function focusWhenReady(ids: string[], triesLeft = 20) {
  setTimeout(() => {
    const el = ids.map((id) => document.getElementById(id)).find(Boolean);
    if (el) {
      el.scrollIntoView({ block: "center" });
      el.focus({ preventScroll: true });
    } else if (triesLeft > 0) focusWhenReady(ids, triesLeft - 1);
  }, 75);
}

function isSection(s: string): s is SectionKey {
  return SECTIONS.some((x) => x.key === s);
}

/**
 * The editor for one draft of a practical: a section list, the section being edited, a save bar
 * that saves by itself, and publishing. Nothing typed is lost: invalid fields block a save but
 * stay as typed, conflicts are resolved by the teacher, and a copy waits in the browser.
 */
export function PracticalEditor({ version, topics }: { version: EditableVersion; topics: string[] }) {
  const router = useRouter();
  const initial = useMemo(() => draftOf(version), [version]);
  const saver = useDraftSaver({ versionId: version.id, initial, initialRevision: version.revision, initialUpdatedAt: version.updatedAt });
  const { draft, change, status } = saver;
  const [section, setSection] = useState<SectionKey>("details");
  const headingRef = useRef<HTMLHeadingElement>(null);
  const [publishAttempted, setPublishAttempted] = useState(false);
  const [publishing, setPublishing] = useState(false);
  const [publishMessage, setPublishMessage] = useState<string | null>(null);
  const [carrying, setCarrying] = useState(false);
  const [lastChangeAt, setLastChangeAt] = useState<Date | null>(null);
  const previews = useRef(new Map<string, PreviewInput>());
  const [, setPreviewTick] = useState(0);
  const previewStore = useMemo(
    () => ({
      get: (id: string) => previews.current.get(id),
      set: (id: string, input: PreviewInput) => {
        previews.current.set(id, input);
        setPreviewTick((t) => t + 1);
      },
    }),
    [],
  );

  const trackedChange = useCallback<typeof change>(
    (updater) => {
      setLastChangeAt(new Date());
      change(updater);
    },
    [change],
  );

  useEffect(() => {
    const fromHash = window.location.hash.slice(1);
    // The section to open comes from the address, which only the browser knows.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    if (isSection(fromHash)) setSection(fromHash);
  }, []);

  const openSection = (key: SectionKey, focusHeading = true) => {
    setSection(key);
    window.history.replaceState(null, "", `#${key}`);
    if (focusHeading) setTimeout(() => headingRef.current?.focus(), 0);
  };

  const goToField = (key: SectionKey, path: string) => {
    setSection(key);
    window.history.replaceState(null, "", `#${key}`);
    focusWhenReady(fieldDomIdCandidates(path));
  };

  const publishProblems: FieldErrors = publishAttempted ? draftPublishProblems(draft) : {};
  const errors = mergeErrors(saver.clientErrors, saver.serverErrors, publishProblems);
  const counts = errorCountsBySection(errors);
  const fixingErrors = mergeErrors(saver.clientErrors, saver.serverErrors);

  const save = async () => {
    setPublishMessage(null);
    const ok = await saver.save(true);
    if (!ok) setTimeout(() => document.getElementById("problems-summary")?.focus(), 0);
  };

  const publish = async () => {
    setPublishing(true);
    setPublishMessage(null);
    try {
      const saved = await saver.save(true);
      if (!saved) {
        setPublishMessage("The draft could not be saved, so it was not published. Fix what is listed, then press Publish again.");
        setTimeout(() => document.getElementById("problems-summary")?.focus(), 0);
        return;
      }
      await fetchJson(`/api/practical-versions/${version.id}/publish`, { method: "POST", json: { revision: saver.revision() } });
      clearLocalCopies(version.id);
      router.push(`/practicals/${version.practicalId}`);
      router.refresh();
    } catch (e) {
      if (e instanceof ApiError && e.status === 400) {
        setPublishAttempted(true);
        if (!Object.keys(e.fieldErrors).length) setPublishMessage(e.message);
        setTimeout(() => document.getElementById("problems-summary")?.focus(), 0);
      } else setPublishMessage(e instanceof ApiError ? e.message : "Could not publish. Please try again.");
    } finally {
      setPublishing(false);
    }
  };

  /** This version was published elsewhere: open (or start) the next draft and put these changes into it. */
  const carryIntoNewDraft = async () => {
    setCarrying(true);
    setPublishMessage(null);
    try {
      const next = await fetchJson<{ versionId: string }>(`/api/practicals/${version.practicalId}/drafts`, { method: "POST", json: {} });
      const current = await fetchJson<{ revision: number }>(`/api/practical-versions/${next.versionId}`);
      await fetchJson(`/api/practical-versions/${next.versionId}`, { method: "PUT", json: { ...draft, revision: current.revision } });
      clearLocalCopies(version.id);
      router.push(`/practicals/${version.practicalId}/versions/${next.versionId}/edit`);
    } catch (e) {
      setPublishMessage(e instanceof ApiError ? e.message : "Could not copy your changes into a new draft. They are still kept in this browser.");
      setCarrying(false);
    }
  };

  const sectionIndex = SECTIONS.findIndex((s) => s.key === section);
  const next = SECTIONS[sectionIndex + 1];
  const previous = SECTIONS[sectionIndex - 1];
  const current = SECTIONS[sectionIndex]!;

  return (
    <EditorErrorsContext.Provider value={errors}>
      <PreviewStoreContext.Provider value={previewStore}>
        <div className="flex flex-col gap-4">
          <div className="sticky top-0 z-20 -mx-4 flex flex-col gap-2 border-b border-line bg-paper/95 px-4 py-2 backdrop-blur sm:flex-row sm:items-center sm:justify-between">
            <SaveStatusText status={status} />
            <div className="flex flex-wrap gap-2">
              <Button size="sm" variant="secondary" onClick={save} disabled={status.kind === "saving" || status.kind === "conflict" || status.kind === "published"}>
                Save
              </Button>
              <Button size="sm" onClick={publish} disabled={publishing || status.kind === "conflict" || status.kind === "published"}>
                {publishing ? "Publishing…" : "Publish"}
              </Button>
            </div>
          </div>

          {saver.restoreOffer ? (
            <Alert tone="warn" title="Unsaved changes were found in this browser">
              <p>
                From {formatDateTime(saver.restoreOffer.savedAt)}, made on this draft but never saved (perhaps the browser closed or the connection dropped).
              </p>
              <div className="mt-2 flex flex-wrap gap-2">
                <Button size="sm" onClick={saver.restoreLocal}>
                  Restore them
                </Button>
                <Button size="sm" variant="ghost" onClick={saver.discardLocal}>
                  Discard them
                </Button>
              </div>
            </Alert>
          ) : null}

          {saver.conflict ? <ConflictPanel mine={draft} mineChangedAt={lastChangeAt} saved={saver.conflict} onKeepMine={saver.keepMine} onTakeSaved={saver.takeSaved} /> : null}

          {status.kind === "published" ? (
            <Alert tone="bad" title="This version has been published, so it can no longer change">
              <p>Your changes are kept in this browser. Copy them into a new draft to carry on.</p>
              <div className="mt-2">
                <Button size="sm" onClick={carryIntoNewDraft} disabled={carrying}>
                  {carrying ? "Copying…" : "Copy my changes into a new draft"}
                </Button>
              </div>
            </Alert>
          ) : null}

          {publishMessage ? <Alert tone="bad">{publishMessage}</Alert> : null}

          {Object.keys(publishProblems).length ? (
            <ProblemsSummary
              title="Before this practical can be published"
              intro="Students work from published practicals, so these must be in place. Each link takes you to the field."
              errors={publishProblems}
              draft={draft}
              onGo={goToField}
              prepHref={`/practicals/${version.practicalId}/prep`}
            />
          ) : null}
          {Object.keys(fixingErrors).length ? (
            <ProblemsSummary
              title="Not saved yet: finish these first"
              intro="What you typed is kept. Each link takes you to the field."
              errors={fixingErrors}
              draft={draft}
              onGo={goToField}
              prepHref={`/practicals/${version.practicalId}/prep`}
            />
          ) : null}
          {status.kind === "invalid" && !Object.keys(fixingErrors).length ? (
            <p className="text-sm">
              <Button size="sm" variant="ghost" onClick={saver.showErrors}>
                Show what needs finishing
              </Button>
            </p>
          ) : null}

          <div className="grid grid-cols-1 gap-4 md:grid-cols-[15rem_minmax(0,1fr)] md:gap-6">
            <div className="min-w-0 md:sticky md:top-16 md:self-start">
              <SectionNav active={section} onSelect={(k) => openSection(k)} problems={counts} />
              <p className="mt-3 hidden text-sm md:block">
                <Link href={`/practicals/${version.practicalId}/prep`}>Prep list for technicians</Link>
              </p>
            </div>
            <div key={`${section}-${saver.generation}`} className="min-w-0 rounded-lg border border-line bg-surface p-4 sm:p-6">
              <SectionFrame ref={headingRef} id={`section-${section}`} title={current.label} lead={LEADS[section]}>
                {section === "details" ? <DetailsSection draft={draft} change={trackedChange} topics={topics} /> : null}
                {section === "aim" ? <AimSection draft={draft} change={trackedChange} generation={saver.generation} /> : null}
                {section === "method" ? <MethodSection draft={draft} change={trackedChange} generation={saver.generation} /> : null}
                {section === "method" ? <ReferencePhotos practicalId={version.practicalId} /> : null}
                {section === "variables" ? <VariablesSection draft={draft} change={trackedChange} /> : null}
                {section === "safety" ? <SafetySection draft={draft} change={trackedChange} /> : null}
                {section === "tables" ? <TablesSection draft={draft} change={trackedChange} /> : null}
                {section === "graphs" ? <GraphsSection draft={draft} change={trackedChange} onGoToTables={() => openSection("tables")} /> : null}
                {section === "checks" ? <ChecksSection draft={draft} change={trackedChange} onGoToTables={() => openSection("tables")} /> : null}
                {section === "rubric" ? <RubricSection draft={draft} change={trackedChange} /> : null}
              </SectionFrame>
              <div className="mt-8 flex flex-wrap justify-between gap-2 border-t border-line pt-4">
                {previous ? (
                  <Button variant="ghost" onClick={() => openSection(previous.key)}>
                    ← {previous.label}
                  </Button>
                ) : (
                  <span />
                )}
                {next ? (
                  <Button variant="secondary" onClick={() => openSection(next.key)}>
                    Next: {next.label} →
                  </Button>
                ) : (
                  <Button onClick={publish} disabled={publishing || status.kind === "conflict" || status.kind === "published"}>
                    {publishing ? "Publishing…" : "Publish this practical"}
                  </Button>
                )}
              </div>
            </div>
          </div>
        </div>
      </PreviewStoreContext.Provider>
    </EditorErrorsContext.Provider>
  );
}

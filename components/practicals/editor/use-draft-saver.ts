"use client";

import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { PracticalContent } from "@/lib/validation/practicals";
import { cleanForSave, sameDraft, validateDraft, type Draft, type FieldErrors } from "../draft";
import { clearLocalCopies, readLocalCopies, writeLocalCopy, type LocalCopy } from "../local-copy";

/** The version as the server holds it, when a save finds that someone else saved first. */
export type SavedVersion = { revision: number; title: string; topic: string; yearGroup: number; subject: string; content: PracticalContent; updatedAt: string };

export type SaveStatus =
  | { kind: "saved"; at: Date | null }
  | { kind: "unsaved" }
  | { kind: "saving" }
  | { kind: "invalid"; count: number; message?: string }
  | { kind: "error"; message: string }
  | { kind: "conflict" }
  | { kind: "published"; message: string };

export function draftOf(v: { title: string; topic: string; yearGroup: number; subject: string; content: PracticalContent }): Draft {
  return { title: v.title, topic: v.topic, yearGroup: v.yearGroup, subject: v.subject, content: v.content };
}

const LOCAL_COPY_DELAY_MS = 400;
const RETRY_AFTER_ERROR_MS = 15_000;

/**
 * Keeps a draft and saves it: a few seconds after the teacher stops typing, and at once when
 * asked. Every save sends the revision it started from; a 409 brings back the saved version for
 * the teacher to compare. A 400 puts the server's messages at the fields. While changes are
 * unsaved a copy stays in this browser, offered back if the page is opened again.
 */
export function useDraftSaver({
  versionId,
  initial,
  initialRevision,
  initialUpdatedAt,
  autosaveMs = 3000,
}: {
  versionId: string;
  initial: Draft;
  initialRevision: number;
  initialUpdatedAt: string | null;
  autosaveMs?: number;
}) {
  const [draft, setDraft] = useState(initial);
  const [status, setStatus] = useState<SaveStatus>({ kind: "saved", at: initialUpdatedAt ? new Date(initialUpdatedAt) : null });
  const [serverErrors, setServerErrors] = useState<FieldErrors>({});
  const [showClientErrors, setShowClientErrors] = useState(false);
  const [conflict, setConflict] = useState<SavedVersion | null>(null);
  const [restoreOffer, setRestoreOffer] = useState<LocalCopy | null>(null);
  /** Bumped when the draft is replaced from outside the editors (restore, take the saved one), so rich editors start afresh. */
  const [generation, setGeneration] = useState(0);

  const draftRef = useRef(initial);
  const revisionRef = useRef(initialRevision);
  const editSeq = useRef(0);
  const savedSeq = useRef(0);
  const inFlight = useRef<Promise<boolean> | null>(null);
  const blocked = useRef(false);
  const autosaveTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const localTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const saveRef = useRef<(manual: boolean) => Promise<boolean>>(async () => false);

  const clientErrors = useMemo(() => (showClientErrors ? validateDraft(draft, 0) : {}), [draft, showClientErrors]);

  const clearTimer = () => {
    if (autosaveTimer.current) clearTimeout(autosaveTimer.current);
    autosaveTimer.current = null;
  };
  const scheduleSave = useCallback(
    (delay = autosaveMs) => {
      clearTimer();
      autosaveTimer.current = setTimeout(() => void saveRef.current(false), delay);
    },
    [autosaveMs],
  );
  const scheduleLocalCopy = useCallback(() => {
    if (localTimer.current) clearTimeout(localTimer.current);
    localTimer.current = setTimeout(() => {
      if (editSeq.current !== savedSeq.current) writeLocalCopy(versionId, revisionRef.current, draftRef.current);
    }, LOCAL_COPY_DELAY_MS);
  }, [versionId]);

  const replaceDraft = (next: Draft) => {
    draftRef.current = next;
    setDraft(next);
  };

  /** Applies a change made in the editor. */
  const change = useCallback(
    (updater: (d: Draft) => Draft) => {
      replaceDraft(updater(draftRef.current));
      editSeq.current++;
      if (!blocked.current) {
        setStatus({ kind: "unsaved" });
        scheduleSave();
      }
      scheduleLocalCopy();
    },
    [scheduleLocalCopy, scheduleSave],
  );

  const save = useCallback(
    async (manual: boolean): Promise<boolean> => {
      clearTimer();
      if (blocked.current) return false;
      while (inFlight.current) await inFlight.current;
      if (editSeq.current === savedSeq.current) {
        if (manual) setShowClientErrors(false);
        return true;
      }
      const seq = editSeq.current;
      const revision = revisionRef.current;
      const toSend = cleanForSave(draftRef.current);
      const problems = validateDraft(toSend, revision);
      const count = Object.keys(problems).length;
      if (count) {
        setStatus({ kind: "invalid", count });
        if (manual) setShowClientErrors(true);
        return false;
      }
      setStatus({ kind: "saving" });
      const attempt = (async () => {
        try {
          const res = await fetchJson<{ revision: number; updatedAt: string }>(`/api/practical-versions/${versionId}`, { method: "PUT", json: { ...toSend, revision } });
          revisionRef.current = res.revision;
          savedSeq.current = seq;
          setServerErrors({});
          setShowClientErrors(false);
          clearLocalCopies(versionId);
          if (editSeq.current !== seq) {
            writeLocalCopy(versionId, revisionRef.current, draftRef.current);
            setStatus({ kind: "unsaved" });
            scheduleSave();
          } else setStatus({ kind: "saved", at: new Date(res.updatedAt) });
          return true;
        } catch (e) {
          if (e instanceof ApiError && e.status === 409) {
            const body = e.body as { reason?: string; current?: SavedVersion };
            if (body.reason === "stale" && body.current) {
              blocked.current = true;
              setConflict(body.current);
              setStatus({ kind: "conflict" });
            } else {
              blocked.current = true;
              setStatus({ kind: "published", message: e.message });
            }
          } else if (e instanceof ApiError && e.status === 400) {
            setServerErrors(e.fieldErrors);
            setStatus({ kind: "invalid", count: Math.max(1, Object.keys(e.fieldErrors).length), message: e.message });
          } else {
            const message = e instanceof ApiError ? e.message : "Could not save. Please try again.";
            setStatus({ kind: "error", message });
            if (!(e instanceof ApiError) || e.status === 0 || e.status >= 500) scheduleSave(RETRY_AFTER_ERROR_MS);
          }
          return false;
        }
      })();
      inFlight.current = attempt;
      try {
        return await attempt;
      } finally {
        inFlight.current = null;
      }
    },
    [scheduleSave, versionId],
  );
  useEffect(() => {
    saveRef.current = save;
  }, [save]);

  /** Someone saved first: put this editor's version on top of theirs (the prep list, edited on its own page, stays theirs). */
  const keepMine = useCallback(async () => {
    if (!conflict) return false;
    revisionRef.current = conflict.revision;
    replaceDraft({ ...draftRef.current, content: { ...draftRef.current.content, prep: conflict.content.prep } });
    editSeq.current++;
    blocked.current = false;
    setConflict(null);
    return save(true);
  }, [conflict, save]);

  /** Someone saved first: drop this editor's changes and carry on from the saved version. */
  const takeSaved = useCallback(() => {
    if (!conflict) return;
    revisionRef.current = conflict.revision;
    replaceDraft(draftOf(conflict));
    savedSeq.current = ++editSeq.current;
    blocked.current = false;
    clearLocalCopies(versionId);
    setConflict(null);
    setServerErrors({});
    setShowClientErrors(false);
    setGeneration((g) => g + 1);
    setStatus({ kind: "saved", at: new Date(conflict.updatedAt) });
  }, [conflict, versionId]);

  /** Puts back the copy kept in this browser. It keeps the revision it was made on, so a save after someone else's shows both versions. */
  const restoreLocal = useCallback(() => {
    if (!restoreOffer) return;
    revisionRef.current = restoreOffer.revision;
    replaceDraft(restoreOffer.draft);
    editSeq.current++;
    setRestoreOffer(null);
    setGeneration((g) => g + 1);
    setStatus({ kind: "unsaved" });
    scheduleSave(500);
  }, [restoreOffer, scheduleSave]);

  const discardLocal = useCallback(() => {
    clearLocalCopies(versionId);
    setRestoreOffer(null);
  }, [versionId]);

  useEffect(() => {
    const newest = readLocalCopies(versionId)[0];
    if (!newest) return;
    if (sameDraft(newest.draft, initial)) {
      clearLocalCopies(versionId);
      return;
    }
    // Reading browser storage can only happen after mounting; the offer is shown from then on.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setRestoreOffer(newest);
  }, [versionId, initial]);

  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (editSeq.current !== savedSeq.current) {
        writeLocalCopy(versionId, revisionRef.current, draftRef.current);
        e.preventDefault();
      }
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    return () => window.removeEventListener("beforeunload", onBeforeUnload);
  }, [versionId]);

  useEffect(
    () => () => {
      clearTimer();
      if (localTimer.current) clearTimeout(localTimer.current);
      // Leaving the editor inside the app with changes unsaved: keep the browser copy, and send
      // one last save that outlives the page if the draft is complete enough to be accepted.
      if (editSeq.current !== savedSeq.current && !blocked.current) {
        writeLocalCopy(versionId, revisionRef.current, draftRef.current);
        const toSend = cleanForSave(draftRef.current);
        if (!Object.keys(validateDraft(toSend, revisionRef.current)).length) {
          void fetch(`/api/practical-versions/${versionId}`, {
            method: "PUT",
            keepalive: true,
            headers: { "Content-Type": "application/json", Accept: "application/json" },
            body: JSON.stringify({ ...toSend, revision: revisionRef.current }),
          }).catch(() => undefined);
        }
      }
    },
    [versionId],
  );

  const dirty = status.kind !== "saved";
  return {
    draft,
    change,
    status,
    dirty,
    save,
    revision: () => revisionRef.current,
    hasUnsavedChanges: () => editSeq.current !== savedSeq.current,
    clientErrors,
    serverErrors,
    showErrors: () => setShowClientErrors(true),
    conflict,
    keepMine,
    takeSaved,
    restoreOffer,
    restoreLocal,
    discardLocal,
    generation,
  };
}

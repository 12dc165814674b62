"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { ApiError } from "@/lib/fetch-json";
import {
  classifySaveError,
  DEFAULT_TIMING,
  hasUnsaved,
  initialAutosave,
  isSettled,
  nextSaveAt,
  reduceAutosave,
  type AutosaveEvent,
  type AutosaveState,
  type AutosaveTiming,
  type SavedVersion,
} from "@/lib/write-ups/autosave";
import { clearLocalDraft, draftOffer, readLocalDraft, writeLocalDraft, type DraftPart, type LocalDraft } from "@/lib/write-ups/local-draft";

export type DraftOffer<C> = { draft: LocalDraft<C>; kind: "newer" | "older" };

/**
 * Runs the autosave state machine (lib/write-ups/autosave.ts) for one part of a write-up: owns
 * the timer and the request, keeps the copy on this device in step, and listens to the browser's
 * online/offline events. Everything about *when* and *what* lives in the state machine.
 */
export function useAutosave<C>({
  writeUpId,
  part,
  initial,
  enabled,
  send,
  fetchCurrent,
  readCurrent,
  isContent,
  timing = DEFAULT_TIMING,
}: {
  writeUpId: string;
  part: DraftPart;
  initial: SavedVersion<C>;
  /** False when the write-up cannot be changed: nothing is sent and no copy is offered. */
  enabled: boolean;
  send: (revision: number, content: C) => Promise<{ revision: number; updatedAt: string }>;
  /** The saved version, for a "stale" refusal that did not carry it. */
  fetchCurrent: () => Promise<SavedVersion<C>>;
  readCurrent: (current: Record<string, unknown>) => C | undefined;
  isContent: (value: unknown) => value is C;
  timing?: AutosaveTiming;
}) {
  const [state, setState] = useState<AutosaveState<C>>(() => initialAutosave(initial));
  const store = useRef(state);
  const waiters = useRef<((ok: boolean) => void)[]>([]);
  const sendRef = useRef(send);
  const fetchCurrentRef = useRef(fetchCurrent);
  const readCurrentRef = useRef(readCurrent);
  useEffect(() => {
    sendRef.current = send;
    fetchCurrentRef.current = fetchCurrent;
    readCurrentRef.current = readCurrent;
  });

  /** The copy found on this device when the page loaded, until the person decides about it. */
  const [offer, setOffer] = useState<DraftOffer<C> | null>(null);
  /** The copy is only written or cleared once any earlier copy has been offered and decided on. */
  const [draftChecked, setDraftChecked] = useState(false);

  const dispatch = useCallback(
    (e: AutosaveEvent<C>) => {
      const next = reduceAutosave(store.current, e, timing);
      store.current = next;
      setState(next);
      if (waiters.current.length) {
        const done = !hasUnsaved(next) && !next.inFlight;
        const failed = e.type === "save-failed" || (next.problem !== null && next.problem.kind !== "offline" && !(next.problem.kind === "error" && next.problem.retry) && !next.inFlight);
        if (done || failed) {
          const list = waiters.current;
          waiters.current = [];
          list.forEach((w) => w(done));
        }
      }
    },
    [timing],
  );

  // The save itself: started by the timer below whenever the state machine says one is due.
  const saving = useRef(false);
  const runSave = useCallback(async () => {
    if (saving.current) return;
    const at = nextSaveAt(store.current, timing);
    if (at === null || at > Date.now()) return;
    saving.current = true;
    dispatch({ type: "save-started", now: Date.now() });
    const flight = store.current.inFlight;
    if (!flight) {
      saving.current = false;
      return;
    }
    try {
      const res = await sendRef.current(flight.revision, flight.content);
      dispatch({ type: "save-succeeded", revision: res.revision, savedAt: res.updatedAt, now: Date.now() });
    } catch (e) {
      const err = e instanceof ApiError ? e : null;
      const failure = classifySaveError<C>(err ? err.status : 0, err?.body as Record<string, unknown> | undefined, (c) => readCurrentRef.current(c));
      dispatch({ type: "save-failed", failure, now: Date.now() });
      if (failure.kind === "stale" && !failure.current) {
        fetchCurrentRef
          .current()
          .then((current) => dispatch({ type: "conflict-loaded", current }))
          .catch(() => undefined);
      }
    } finally {
      saving.current = false;
    }
  }, [dispatch, timing]);

  useEffect(() => {
    if (!enabled) return;
    const at = nextSaveAt(state, timing);
    if (at === null) return;
    const timer = window.setTimeout(() => void runSave(), Math.max(0, at - Date.now()));
    return () => window.clearTimeout(timer);
  }, [state, enabled, timing, runSave]);

  useEffect(() => {
    const on = () => dispatch({ type: "online", now: Date.now() });
    const off = () => dispatch({ type: "offline" });
    if (!navigator.onLine) off();
    window.addEventListener("online", on);
    window.addEventListener("offline", off);
    return () => {
      window.removeEventListener("online", on);
      window.removeEventListener("offline", off);
    };
  }, [dispatch]);

  // On loading: is there a copy on this device the server does not have?
  useEffect(() => {
    const found = readLocalDraft(writeUpId, part, isContent);
    const kind = draftOffer(found, { revision: initial.revision, updatedAt: initial.updatedAt, content: initial.content });
    if (found && kind) {
      // Reading localStorage can only happen in the browser, after the first render.
      // eslint-disable-next-line react-hooks/set-state-in-effect -- the offer depends on this device's storage, unknown to the server render
      setOffer({ draft: found, kind });
    } else {
      if (found && enabled) clearLocalDraft(writeUpId, part);
      setDraftChecked(true);
    }
    // Only on loading: later changes of `initial` are the server catching up, not a new page.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [writeUpId, part]);

  // Keep the copy on this device in step: written on every change, cleared once the server has it.
  useEffect(() => {
    if (!draftChecked) return;
    if (hasUnsaved(state) || (state.problem && state.problem.kind !== "offline")) {
      writeLocalDraft<C>({ writeUpId, part, baseRevision: state.revision, keptAt: Date.now(), content: state.content });
    } else if (enabled && isSettled(state)) {
      clearLocalDraft(writeUpId, part);
    }
  }, [state, draftChecked, enabled, writeUpId, part]);

  /** Applies a change; an update that returns the same object is not a change. */
  const edit = useCallback(
    (update: (prev: C) => C) => {
      const prev = store.current.content;
      const next = update(prev);
      if (next !== prev) dispatch({ type: "edit", content: next, now: Date.now() });
    },
    [dispatch],
  );
  /** The state as it is right now (after awaiting a flush, the rendered state may be older). */
  const current = useCallback(() => store.current, []);

  /**
   * Saves now and resolves true once the server has everything, or false as soon as a save
   * fails or a decision (conflict, lock) stands in the way.
   */
  const flush = useCallback((): Promise<boolean> => {
    const s = store.current;
    if (!hasUnsaved(s) && !s.inFlight) return Promise.resolve(true);
    const p = s.problem;
    if (p && (p.kind === "conflict" || p.kind === "locked" || p.kind === "closed" || (p.kind === "error" && !p.retry))) return Promise.resolve(false);
    return new Promise((resolve) => {
      waiters.current.push(resolve);
      dispatch({ type: "flush", now: Date.now() });
    });
  }, [dispatch]);

  const keepMine = useCallback(() => dispatch({ type: "keep-mine", now: Date.now() }), [dispatch]);
  const keepSaved = useCallback(() => dispatch({ type: "keep-saved" }), [dispatch]);

  const acceptOffer = useCallback(() => {
    if (!offer) return;
    dispatch({ type: "restore", content: offer.draft.content, now: Date.now() });
    setOffer(null);
    setDraftChecked(true);
  }, [offer, dispatch]);

  const dismissOffer = useCallback(() => {
    clearLocalDraft(writeUpId, part);
    setOffer(null);
    setDraftChecked(true);
  }, [writeUpId, part]);

  return { state, current, edit, flush, keepMine, keepSaved, offer, acceptOffer, dismissOffer };
}

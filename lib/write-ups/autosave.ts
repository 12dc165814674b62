/**
 * The autosave state machine for a write-up (and, separately, for a group's shared tables).
 *
 * It is plain TypeScript with no timers and no React: `reduceAutosave` moves from one state to
 * the next on an event, `nextSaveAt` says when the next save should start, and `describeSave`
 * turns a state into the words the page shows. A thin hook (components/write-up/use-autosave.ts)
 * owns the timer and the network call.
 *
 * The rules that keep work from being lost:
 * - every edit is kept in `content` whatever happens to the network; a failed save never
 *   discards or rolls back an edit;
 * - a save carries the edit count it was taken at, so edits made while it was on its way stay
 *   unsaved and are sent next;
 * - a refusal because the saved version moved on ("stale") stops saving until the person
 *   chooses which version to keep; a lock or a closed lab session stops it for good;
 * - network failures and server errors are retried with a growing wait (2 s, 4 s, 8 s… up to
 *   30 s), and at once when the browser says it is back online.
 */

export type SavedVersion<C> = { revision: number; content: C; updatedAt: string | null };

export type SaveFailure<C> =
  /** The request never reached the server (no connection, or the connection dropped). */
  | { kind: "offline" }
  /** The saved version moved on since this page's revision; `current` is the saved one when the server sent it. */
  | { kind: "stale"; current: SavedVersion<C> | null }
  /** Handed in: the server refuses changes until a teacher reopens it. */
  | { kind: "locked"; message: string }
  /** The lab session's late window has ended. */
  | { kind: "closed"; message: string }
  /** The server refused the content itself (400): sending it again will not help, the next edit might. */
  | { kind: "invalid"; message: string }
  /** Anything else (5xx, a lapsed sign-in): worth trying again later. */
  | { kind: "server"; message: string };

export type SaveProblem<C> =
  | { kind: "offline" }
  | { kind: "error"; message: string; retry: boolean }
  | { kind: "conflict"; current: SavedVersion<C> | null }
  | { kind: "locked"; message: string }
  | { kind: "closed"; message: string };

export type AutosaveState<C> = {
  /** What the person has now: always their latest edit. */
  content: C;
  /** Edits so far; a save acknowledges every edit up to the count it was taken at. */
  editCount: number;
  savedEditCount: number;
  /** The server revision the next save builds on. */
  revision: number;
  /** When the server last stored this content (ISO text from the server), if known. */
  savedAt: string | null;
  /** When the oldest edit that no save has carried yet was made (for the longest wait). */
  firstUnsavedAt: number | null;
  /** When the latest edit was made (for the pause after typing). */
  lastEditAt: number | null;
  /** The save on its way, with what it carries. */
  inFlight: { editCount: number; content: C; revision: number; firstUnsavedAt: number | null } | null;
  /** Someone asked for everything to be saved now (Check, Hand in, leaving the page). */
  flushRequested: boolean;
  /** What the browser last said about the connection. */
  online: boolean;
  problem: SaveProblem<C> | null;
  /** Failed attempts in a row, for the growing wait between retries. */
  failures: number;
  retryAt: number | null;
  /** Goes up whenever the content is replaced from outside (keep the saved version, recover a draft): editors start again from it. */
  epoch: number;
};

export type AutosaveEvent<C> =
  | { type: "edit"; content: C; now: number }
  | { type: "save-started"; now: number }
  | { type: "save-succeeded"; revision: number; savedAt: string | null; now: number }
  | { type: "save-failed"; failure: SaveFailure<C>; now: number }
  /** The saved version, fetched after a "stale" refusal that did not include it. */
  | { type: "conflict-loaded"; current: SavedVersion<C> }
  | { type: "flush"; now: number }
  | { type: "online"; now: number }
  | { type: "offline" }
  /** Keep what is on this device: it is saved on top of the saved version's revision. */
  | { type: "keep-mine"; now: number }
  /** Keep the saved version: this device's content is replaced by it. */
  | { type: "keep-saved" }
  /** Replace the content with a copy recovered from this device; it is saved like any edit. */
  | { type: "restore"; content: C; now: number };

export type AutosaveTiming = {
  /** Pause after the last edit before saving. */
  debounceMs: number;
  /** Longest an edit waits while typing goes on. */
  maxWaitMs: number;
  /** First retry wait; it doubles after each failure up to `maxRetryMs`. */
  retryBaseMs: number;
  maxRetryMs: number;
};

export const DEFAULT_TIMING: AutosaveTiming = { debounceMs: 2_000, maxWaitMs: 10_000, retryBaseMs: 2_000, maxRetryMs: 30_000 };

export function initialAutosave<C>(saved: SavedVersion<C>, online = true): AutosaveState<C> {
  return {
    content: saved.content,
    editCount: 0,
    savedEditCount: 0,
    revision: saved.revision,
    savedAt: saved.updatedAt,
    firstUnsavedAt: null,
    lastEditAt: null,
    inFlight: null,
    flushRequested: false,
    online,
    problem: null,
    failures: 0,
    retryAt: null,
    epoch: 0,
  };
}

/** Whether there are edits the server does not have yet. */
export function hasUnsaved<C>(s: AutosaveState<C>): boolean {
  return s.editCount > s.savedEditCount;
}

/** Whether everything is saved and nothing is on its way or waiting for a decision. */
export function isSettled<C>(s: AutosaveState<C>): boolean {
  return !hasUnsaved(s) && !s.inFlight && (s.problem === null || s.problem.kind === "offline");
}

/** The wait before retry number `failures` (1 = the first retry). */
export function retryDelay(failures: number, timing: AutosaveTiming = DEFAULT_TIMING): number {
  return Math.min(timing.maxRetryMs, timing.retryBaseMs * 2 ** Math.max(0, failures - 1));
}

function minDefined(a: number | null, b: number | null): number | null {
  if (a === null) return b;
  if (b === null) return a;
  return Math.min(a, b);
}

export function reduceAutosave<C>(s: AutosaveState<C>, e: AutosaveEvent<C>, timing: AutosaveTiming = DEFAULT_TIMING): AutosaveState<C> {
  switch (e.type) {
    case "edit": {
      // A refusal of the content itself may be fixed by this edit, so saving starts again.
      const problem = s.problem?.kind === "error" && !s.problem.retry ? null : s.problem;
      return { ...s, content: e.content, editCount: s.editCount + 1, lastEditAt: e.now, firstUnsavedAt: s.firstUnsavedAt ?? e.now, problem };
    }
    case "save-started": {
      if (s.inFlight || !hasUnsaved(s)) return s;
      return { ...s, inFlight: { editCount: s.editCount, content: s.content, revision: s.revision, firstUnsavedAt: s.firstUnsavedAt }, firstUnsavedAt: null, retryAt: null };
    }
    case "save-succeeded": {
      if (!s.inFlight) return s;
      const savedEditCount = s.inFlight.editCount;
      const clean = savedEditCount === s.editCount;
      return {
        ...s,
        revision: e.revision,
        savedAt: e.savedAt,
        savedEditCount,
        inFlight: null,
        // Edits made while the save was on its way keep their own first-unsaved time.
        firstUnsavedAt: clean ? null : (s.firstUnsavedAt ?? e.now),
        flushRequested: clean ? false : s.flushRequested,
        problem: null,
        failures: 0,
        retryAt: null,
      };
    }
    case "save-failed": {
      const firstUnsavedAt = minDefined(s.inFlight?.firstUnsavedAt ?? null, s.firstUnsavedAt);
      const base = { ...s, inFlight: null, firstUnsavedAt };
      const f = e.failure;
      switch (f.kind) {
        case "offline":
        case "server": {
          const failures = s.failures + 1;
          const problem: SaveProblem<C> = f.kind === "offline" ? { kind: "offline" } : { kind: "error", message: f.message, retry: true };
          return { ...base, problem, failures, retryAt: e.now + retryDelay(failures, timing) };
        }
        case "invalid":
          return { ...base, problem: { kind: "error", message: f.message, retry: false }, retryAt: null };
        case "stale":
          return { ...base, problem: { kind: "conflict", current: f.current }, retryAt: null, failures: 0 };
        case "locked":
          return { ...base, problem: { kind: "locked", message: f.message }, retryAt: null, flushRequested: false };
        case "closed":
          return { ...base, problem: { kind: "closed", message: f.message }, retryAt: null, flushRequested: false };
      }
      return base;
    }
    case "conflict-loaded":
      return s.problem?.kind === "conflict" ? { ...s, problem: { kind: "conflict", current: e.current } } : s;
    case "flush": {
      const retryNow = s.problem?.kind === "offline" || (s.problem?.kind === "error" && s.problem.retry);
      return { ...s, flushRequested: hasUnsaved(s) || !!s.inFlight, retryAt: retryNow ? e.now : s.retryAt };
    }
    case "online":
      return { ...s, online: true, retryAt: s.problem?.kind === "offline" || (s.problem?.kind === "error" && s.problem.retry) ? e.now : s.retryAt };
    case "offline":
      return { ...s, online: false };
    case "keep-mine": {
      if (s.problem?.kind !== "conflict" || !s.problem.current) return s;
      // Saved on top of the version that won, so nothing of it is overwritten silently: the person chose.
      const unsaved = hasUnsaved(s);
      return {
        ...s,
        revision: s.problem.current.revision,
        problem: null,
        failures: 0,
        retryAt: null,
        // If every edit had already gone out in the refused save, one more edit count makes it unsaved again.
        editCount: unsaved ? s.editCount : s.editCount + 1,
        firstUnsavedAt: s.firstUnsavedAt ?? e.now,
        flushRequested: true,
      };
    }
    case "keep-saved": {
      if (s.problem?.kind !== "conflict" || !s.problem.current) return s;
      const current = s.problem.current;
      const editCount = s.editCount + 1;
      return {
        ...s,
        content: current.content,
        revision: current.revision,
        savedAt: current.updatedAt,
        editCount,
        savedEditCount: editCount,
        firstUnsavedAt: null,
        flushRequested: false,
        problem: null,
        failures: 0,
        retryAt: null,
        epoch: s.epoch + 1,
      };
    }
    case "restore":
      return { ...s, content: e.content, editCount: s.editCount + 1, lastEditAt: e.now, firstUnsavedAt: s.firstUnsavedAt ?? e.now, epoch: s.epoch + 1 };
  }
}

/**
 * When the next save should start (a time in ms, possibly already past), or null when no save
 * is due: nothing unsaved, a save already on its way, or a decision or lock in the way.
 */
export function nextSaveAt<C>(s: AutosaveState<C>, timing: AutosaveTiming = DEFAULT_TIMING): number | null {
  if (s.inFlight || !hasUnsaved(s)) return null;
  const p = s.problem;
  if (p && (p.kind === "conflict" || p.kind === "locked" || p.kind === "closed")) return null;
  if (p?.kind === "error" && !p.retry) return null;
  if (p && s.retryAt !== null) return s.retryAt;
  if (s.flushRequested) return 0;
  const afterPause = (s.lastEditAt ?? 0) + timing.debounceMs;
  const longest = s.firstUnsavedAt === null ? afterPause : s.firstUnsavedAt + timing.maxWaitMs;
  return Math.min(afterPause, longest);
}

export type SaveStatusKind = "saved" | "pending" | "saving" | "offline" | "error" | "conflict" | "locked" | "closed";

/** Clock time as the status line shows it: 10:42. */
export function clockTime(iso: string | null): string | null {
  if (!iso) return null;
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return null;
  return d.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" });
}

/** The status line: one short sentence in plain words, and its kind (for the icon). */
export function describeSave<C>(s: AutosaveState<C>, formatTime: (iso: string | null) => string | null = clockTime): { kind: SaveStatusKind; text: string } {
  const at = formatTime(s.savedAt);
  const p = s.problem;
  if (p?.kind === "locked") return { kind: "locked", text: "Not saved — this write-up is locked. Your changes are kept on this device." };
  if (p?.kind === "closed") return { kind: "closed", text: "Not saved — this lab session has closed. Your changes are kept on this device." };
  if (p?.kind === "conflict") return { kind: "conflict", text: "Not saved — it was changed on another tab or device. Choose which version to keep." };
  if (s.inFlight) return { kind: "saving", text: "Saving…" };
  if (p?.kind === "offline" || (!s.online && hasUnsaved(s))) return { kind: "offline", text: "Offline — changes kept on this device" };
  if (p?.kind === "error") return { kind: "error", text: `Not saved — ${p.message}${p.retry ? " Trying again…" : ""}` };
  if (hasUnsaved(s)) return { kind: "pending", text: "Changes waiting to save…" };
  if (!s.online) return { kind: "offline", text: at ? `Offline — everything was saved at ${at}` : "Offline — nothing to save yet" };
  return { kind: "saved", text: at ? `Saved at ${at}` : "Nothing to save yet" };
}

/** How bad a status is, to show the worst of several (the write-up and its group's tables). */
export const STATUS_SEVERITY: Record<SaveStatusKind, number> = { saved: 0, pending: 1, saving: 2, offline: 3, error: 4, conflict: 5, closed: 6, locked: 7 };

/**
 * Sorts a failed request into what the state machine needs to know. `status` is the HTTP status
 * (0 when the request never got an answer), `body` the error body the server sent, and
 * `readCurrent` picks the saved content out of a "stale" refusal's `current` (the write-up's
 * `content`, or a group's `tables`); it returns undefined when that part is missing.
 */
export function classifySaveError<C>(
  status: number,
  body: { message?: unknown; reason?: unknown; current?: unknown } | null | undefined,
  readCurrent: (current: Record<string, unknown>) => C | undefined,
): SaveFailure<C> {
  const message = typeof body?.message === "string" ? body.message : "";
  if (status === 0) return { kind: "offline" };
  if (status === 409) {
    if (body?.reason === "locked") return { kind: "locked", message: message || "This write-up has been handed in, so it is locked." };
    if (body?.reason === "closed") return { kind: "closed", message: message || "This lab session has closed." };
    const c = body?.current;
    if (c && typeof c === "object" && typeof (c as { revision?: unknown }).revision === "number") {
      const raw = c as Record<string, unknown>;
      const content = readCurrent(raw);
      if (content !== undefined) return { kind: "stale", current: { revision: raw.revision as number, content, updatedAt: typeof raw.updatedAt === "string" ? raw.updatedAt : null } };
    }
    return { kind: "stale", current: null };
  }
  if (status === 400 || status === 413 || status === 415) return { kind: "invalid", message: message || "Meniscus could not accept this content." };
  if (status === 401) return { kind: "server", message: "You have been signed out. Sign in again in another tab; your changes are kept on this device." };
  return { kind: "server", message: message || "Meniscus could not save just now." };
}

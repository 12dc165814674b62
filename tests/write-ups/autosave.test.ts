import { describe, expect, it } from "vitest";
import {
  classifySaveError,
  DEFAULT_TIMING,
  describeSave,
  hasUnsaved,
  initialAutosave,
  isSettled,
  nextSaveAt,
  reduceAutosave,
  retryDelay,
  type AutosaveEvent,
  type AutosaveState,
} from "@/lib/write-ups/autosave";

type Doc = { text: string };

const start = (text = "", revision = 3) => initialAutosave<Doc>({ revision, content: { text }, updatedAt: "2026-12-03T10:40:00.000Z" });
const run = (s: AutosaveState<Doc>, ...events: AutosaveEvent<Doc>[]) => events.reduce((acc, e) => reduceAutosave(acc, e), s);
const edit = (text: string, now: number): AutosaveEvent<Doc> => ({ type: "edit", content: { text }, now });
const fixedTime = (iso: string | null) => (iso ? iso.slice(11, 16) : null);

describe("autosave: when a save starts", () => {
  it("waits for a 2 s pause after the last edit", () => {
    let s = run(start(), edit("a", 1_000));
    expect(nextSaveAt(s)).toBe(3_000);
    s = run(s, edit("ab", 2_500));
    expect(nextSaveAt(s)).toBe(4_500);
  });

  it("does not wait longer than 10 s from the first unsaved edit while typing goes on", () => {
    let s = start();
    for (let t = 0; t <= 9_000; t += 1_000) s = run(s, edit(`x${t}`, t));
    // Typing every second never leaves a 2 s pause, so the longest wait decides.
    expect(nextSaveAt(s)).toBe(10_000);
  });

  it("is not due when nothing has changed, and at once when a flush is asked for", () => {
    const s = start("same");
    expect(nextSaveAt(s)).toBeNull();
    expect(nextSaveAt(run(s, { type: "flush", now: 5 }))).toBeNull();
    const dirty = run(s, edit("changed", 100), { type: "flush", now: 150 });
    expect(nextSaveAt(dirty)).toBe(0);
  });

  it("sends one save at a time, and sends edits made meanwhile in the next one", () => {
    let s = run(start("", 3), edit("first", 0), { type: "save-started", now: 2_000 });
    expect(s.inFlight).toMatchObject({ editCount: 1, content: { text: "first" }, revision: 3 });
    expect(nextSaveAt(s)).toBeNull();
    s = run(s, edit("first and second", 2_500));
    s = run(s, { type: "save-succeeded", revision: 4, savedAt: "2026-12-03T10:42:05.000Z", now: 2_600 });
    expect(s.revision).toBe(4);
    expect(hasUnsaved(s)).toBe(true);
    expect(s.content.text).toBe("first and second");
    // The second edit keeps its own time: its pause ends 2 s after it.
    expect(nextSaveAt(s)).toBe(4_500);
    s = run(s, { type: "save-started", now: 4_500 });
    expect(s.inFlight).toMatchObject({ revision: 4, content: { text: "first and second" } });
    s = run(s, { type: "save-succeeded", revision: 5, savedAt: "2026-12-03T10:42:08.000Z", now: 4_600 });
    expect(isSettled(s)).toBe(true);
    expect(describeSave(s, fixedTime)).toEqual({ kind: "saved", text: "Saved at 10:42" });
  });
});

describe("autosave: offline and server trouble", () => {
  it("keeps every edit and retries with a growing wait, then at once when back online", () => {
    let s = run(start(), edit("typed on the bench", 0), { type: "save-started", now: 2_000 });
    s = run(s, { type: "save-failed", failure: { kind: "offline" }, now: 2_100 });
    expect(s.content.text).toBe("typed on the bench");
    expect(hasUnsaved(s)).toBe(true);
    expect(describeSave(s).text).toBe("Offline — changes kept on this device");
    expect(nextSaveAt(s)).toBe(2_100 + 2_000);
    s = run(s, { type: "save-started", now: 4_100 }, { type: "save-failed", failure: { kind: "offline" }, now: 4_200 });
    expect(nextSaveAt(s)).toBe(4_200 + 4_000);
    s = run(s, edit("typed on the bench, more", 5_000), { type: "offline" });
    // Edits while offline are kept; the retry keeps its time rather than hammering the network.
    expect(s.content.text).toBe("typed on the bench, more");
    expect(nextSaveAt(s)).toBe(8_200);
    s = run(s, { type: "online", now: 6_000 });
    expect(nextSaveAt(s)).toBe(6_000);
    s = run(s, { type: "save-started", now: 6_000 });
    expect(s.inFlight?.content.text).toBe("typed on the bench, more");
    s = run(s, { type: "save-succeeded", revision: 4, savedAt: null, now: 6_100 });
    expect(isSettled(s)).toBe(true);
    expect(s.failures).toBe(0);
  });

  it("caps the wait between retries at 30 s", () => {
    expect([1, 2, 3, 4, 5, 6, 12].map((n) => retryDelay(n))).toEqual([2_000, 4_000, 8_000, 16_000, 30_000, 30_000, 30_000]);
  });

  it("keeps the first unsaved time of a failed save, so the 10 s limit still counts from the first edit", () => {
    let s = run(start(), edit("a", 1_000), { type: "save-started", now: 3_000 }, edit("ab", 3_500));
    s = run(s, { type: "save-failed", failure: { kind: "server", message: "The server is busy." }, now: 3_600 });
    expect(s.firstUnsavedAt).toBe(1_000);
    expect(describeSave(s).text).toBe("Not saved — The server is busy. Trying again…");
  });

  it("stops retrying content the server refused (400) until the next edit", () => {
    let s = run(start(), edit("bad", 0), { type: "save-started", now: 2_000 }, { type: "save-failed", failure: { kind: "invalid", message: "A table can have at most 60 rows." }, now: 2_100 });
    expect(nextSaveAt(s)).toBeNull();
    expect(describeSave(s).text).toBe("Not saved — A table can have at most 60 rows.");
    expect(s.content.text).toBe("bad");
    s = run(s, edit("fixed", 3_000));
    expect(s.problem).toBeNull();
    expect(nextSaveAt(s)).toBe(5_000);
  });

  it("says offline when the browser is offline with unsaved edits, before any save has failed", () => {
    const s = run(start(), { type: "offline" }, edit("x", 10));
    expect(describeSave(s).kind).toBe("offline");
    const clean = run(start(), { type: "offline" });
    expect(describeSave(clean, fixedTime).text).toBe("Offline — everything was saved at 10:40");
  });
});

describe("autosave: conflicts (409 stale)", () => {
  const conflicted = () => {
    const s = run(start("mine", 3), edit("mine, edited", 0), { type: "save-started", now: 2_000 });
    return run(s, { type: "save-failed", failure: { kind: "stale", current: { revision: 5, content: { text: "saved elsewhere" }, updatedAt: "2026-12-03T10:45:00.000Z" } }, now: 2_100 });
  };

  it("stops saving and keeps both versions until the person chooses", () => {
    const s = run(conflicted(), edit("mine, edited again", 3_000));
    expect(s.problem).toMatchObject({ kind: "conflict", current: { revision: 5, content: { text: "saved elsewhere" } } });
    expect(s.content.text).toBe("mine, edited again");
    expect(nextSaveAt(s)).toBeNull();
    expect(describeSave(s).kind).toBe("conflict");
    // A flush (Check, Hand in) does not get round the decision.
    expect(nextSaveAt(run(s, { type: "flush", now: 3_100 }))).toBeNull();
  });

  it("keep mine: saves this device's version at once, on top of the saved revision", () => {
    let s = run(conflicted(), { type: "keep-mine", now: 4_000 });
    expect(s.problem).toBeNull();
    expect(s.revision).toBe(5);
    expect(nextSaveAt(s)).toBe(0);
    s = run(s, { type: "save-started", now: 4_000 });
    expect(s.inFlight).toMatchObject({ revision: 5, content: { text: "mine, edited" } });
  });

  it("keep the saved version: replaces this device's content, is clean, and restarts the editors", () => {
    const before = conflicted();
    const s = run(before, { type: "keep-saved" });
    expect(s.content.text).toBe("saved elsewhere");
    expect(s.revision).toBe(5);
    expect(isSettled(s)).toBe(true);
    expect(s.epoch).toBe(before.epoch + 1);
  });

  it("waits for the saved version when the refusal did not carry it", () => {
    let s = run(start(), edit("x", 0), { type: "save-started", now: 1 }, { type: "save-failed", failure: { kind: "stale", current: null }, now: 2 });
    expect(run(s, { type: "keep-mine", now: 3 }).problem?.kind).toBe("conflict");
    s = run(s, { type: "conflict-loaded", current: { revision: 9, content: { text: "y" }, updatedAt: null } });
    expect(run(s, { type: "keep-mine", now: 4 }).revision).toBe(9);
  });
});

describe("autosave: locked and closed", () => {
  it("a lock stops saving for good and keeps the edits", () => {
    let s = run(start(), edit("after hand-in", 0), { type: "flush", now: 1 }, { type: "save-started", now: 1 });
    s = run(s, { type: "save-failed", failure: { kind: "locked", message: "This write-up has been handed in, so it is locked." }, now: 2 });
    expect(s.content.text).toBe("after hand-in");
    expect(hasUnsaved(s)).toBe(true);
    expect(s.flushRequested).toBe(false);
    s = run(s, edit("more", 3), { type: "online", now: 4 }, { type: "flush", now: 5 });
    expect(nextSaveAt(s)).toBeNull();
    expect(describeSave(s).text).toMatch(/^Not saved — this write-up is locked\. Your changes are kept on this device\.$/);
  });

  it("a closed lab session stops saving too", () => {
    const s = run(start(), edit("late", 0), { type: "save-started", now: 1 }, { type: "save-failed", failure: { kind: "closed", message: "closed" }, now: 2 });
    expect(nextSaveAt(s)).toBeNull();
    expect(describeSave(s).kind).toBe("closed");
  });
});

describe("autosave: restoring a copy from this device", () => {
  it("puts the copy in place as an unsaved edit and restarts the editors", () => {
    const s = run(start("server"), { type: "restore", content: { text: "from this device" }, now: 100 });
    expect(s.content.text).toBe("from this device");
    expect(s.epoch).toBe(1);
    expect(nextSaveAt(s)).toBe(2_100);
    expect(DEFAULT_TIMING.debounceMs).toBe(2_000);
  });
});

describe("classifySaveError", () => {
  const read = (c: Record<string, unknown>) => (typeof c.content === "object" && c.content ? (c.content as Doc) : undefined);
  it("sorts the server's answers", () => {
    expect(classifySaveError<Doc>(0, null, read)).toEqual({ kind: "offline" });
    expect(classifySaveError<Doc>(409, { reason: "locked", message: "Locked." }, read)).toEqual({ kind: "locked", message: "Locked." });
    expect(classifySaveError<Doc>(409, { reason: "closed", message: "Closed." }, read)).toEqual({ kind: "closed", message: "Closed." });
    expect(classifySaveError<Doc>(409, { reason: "stale", current: { revision: 4, content: { text: "s" }, updatedAt: "2026-12-03T10:00:00.000Z" } }, read)).toEqual({
      kind: "stale",
      current: { revision: 4, content: { text: "s" }, updatedAt: "2026-12-03T10:00:00.000Z" },
    });
    expect(classifySaveError<Doc>(409, { reason: "stale" }, read)).toEqual({ kind: "stale", current: null });
    expect(classifySaveError<Doc>(400, { message: "Bad table." }, read)).toEqual({ kind: "invalid", message: "Bad table." });
    expect(classifySaveError<Doc>(503, { message: "Disk full." }, read)).toEqual({ kind: "server", message: "Disk full." });
    expect(classifySaveError<Doc>(401, { message: "x" }, read).kind).toBe("server");
  });
});

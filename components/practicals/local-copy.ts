import type { Draft } from "./draft";

/**
 * A copy of the draft kept in this browser while it has unsaved changes, so that a crash, a
 * closed tab or a lost connection does not lose work. One entry per version and revision the
 * changes were made on; a successful save removes them.
 */
export type LocalCopy = { versionId: string; revision: number; savedAt: number; draft: Draft };

const PREFIX = "meniscus:practical-draft:";

export function localCopyKey(versionId: string, revision: number): string {
  return `${PREFIX}${versionId}:${revision}`;
}

function storage(): Storage | null {
  try {
    return typeof window === "undefined" ? null : window.localStorage;
  } catch {
    return null;
  }
}

/** Keeps the draft; returns false when the browser refuses (storage full or disabled). */
export function writeLocalCopy(versionId: string, revision: number, draft: Draft, now = Date.now()): boolean {
  const s = storage();
  if (!s) return false;
  const entry: LocalCopy = { versionId, revision, savedAt: now, draft };
  try {
    s.setItem(localCopyKey(versionId, revision), JSON.stringify(entry));
    return true;
  } catch {
    return false;
  }
}

function isCopy(value: unknown): value is LocalCopy {
  if (!value || typeof value !== "object") return false;
  const v = value as Partial<LocalCopy>;
  return typeof v.versionId === "string" && typeof v.revision === "number" && typeof v.savedAt === "number" && !!v.draft && typeof v.draft === "object" && typeof v.draft.title === "string" && !!v.draft.content;
}

/** Every copy kept for this version, newest first. Unreadable entries are skipped. */
export function readLocalCopies(versionId: string): LocalCopy[] {
  const s = storage();
  if (!s) return [];
  const out: LocalCopy[] = [];
  for (let i = 0; i < s.length; i++) {
    const key = s.key(i);
    if (!key?.startsWith(`${PREFIX}${versionId}:`)) continue;
    try {
      const value: unknown = JSON.parse(s.getItem(key) ?? "null");
      if (isCopy(value) && value.versionId === versionId) out.push(value);
    } catch {
      // A damaged entry is of no use to anyone; it is left for clearLocalCopies to remove.
    }
  }
  return out.sort((a, b) => b.savedAt - a.savedAt);
}

/** Removes every copy of this version (after a save, or when the teacher discards them). */
export function clearLocalCopies(versionId: string): void {
  const s = storage();
  if (!s) return;
  const keys: string[] = [];
  for (let i = 0; i < s.length; i++) {
    const key = s.key(i);
    if (key?.startsWith(`${PREFIX}${versionId}:`)) keys.push(key);
  }
  for (const key of keys) s.removeItem(key);
}

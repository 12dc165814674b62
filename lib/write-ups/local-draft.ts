import { stableStringify } from "./stale";

/**
 * A copy of a write-up kept in this browser's localStorage on every change until the server
 * has it, so that a lost connection, a crash or a closed tab never loses a student's work.
 * One entry per write-up and part: the write-up itself, and (in group lab sessions) the
 * group's shared results tables, which save separately.
 */
export type DraftPart = "content" | "group-tables";

export type LocalDraft<C> = {
  writeUpId: string;
  part: DraftPart;
  /** The server revision the changes were made on. */
  baseRevision: number;
  /** When this device last changed it (ms since 1970, this device's clock). */
  keptAt: number;
  content: C;
};

const PREFIX = "meniscus:write-up-draft:";

export function localDraftKey(writeUpId: string, part: DraftPart): string {
  return `${PREFIX}${writeUpId}:${part}`;
}

function storage(): Storage | null {
  try {
    return typeof window === "undefined" ? null : window.localStorage;
  } catch {
    return null;
  }
}

/** Keeps a copy; false when the browser refuses (storage full, or turned off). */
export function writeLocalDraft<C>(draft: LocalDraft<C>): boolean {
  const s = storage();
  if (!s) return false;
  try {
    s.setItem(localDraftKey(draft.writeUpId, draft.part), JSON.stringify(draft));
    return true;
  } catch {
    return false;
  }
}

/** The copy kept for a write-up's part, if there is a readable one whose content passes `isContent`. */
export function readLocalDraft<C>(writeUpId: string, part: DraftPart, isContent: (value: unknown) => value is C): LocalDraft<C> | null {
  const s = storage();
  if (!s) return null;
  let value: unknown;
  try {
    value = JSON.parse(s.getItem(localDraftKey(writeUpId, part)) ?? "null");
  } catch {
    return null;
  }
  if (!value || typeof value !== "object") return null;
  const v = value as Partial<LocalDraft<unknown>>;
  if (v.writeUpId !== writeUpId || v.part !== part || typeof v.baseRevision !== "number" || typeof v.keptAt !== "number" || !isContent(v.content)) return null;
  return v as LocalDraft<C>;
}

export function clearLocalDraft(writeUpId: string, part: DraftPart): void {
  try {
    storage()?.removeItem(localDraftKey(writeUpId, part));
  } catch {
    // Nothing more can be done when the browser refuses; the copy is harmless.
  }
}

/**
 * Whether a copy found on this device should be offered back when the page loads, and how to
 * describe it: "newer" when it holds changes made on the latest saved version (or after the
 * last save), "older" when the write-up was saved somewhere else since. A copy identical to what
 * the server has is not worth offering.
 */
export function draftOffer<C>(draft: LocalDraft<C> | null, server: { revision: number; updatedAt: string | null; content: C }): "newer" | "older" | null {
  if (!draft) return null;
  if (stableStringify(draft.content) === stableStringify(server.content)) return null;
  const savedAt = server.updatedAt ? Date.parse(server.updatedAt) : NaN;
  if (draft.baseRevision >= server.revision) return "newer";
  if (Number.isFinite(savedAt) && draft.keptAt > savedAt) return "newer";
  return "older";
}

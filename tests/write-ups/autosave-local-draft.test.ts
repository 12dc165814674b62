// @vitest-environment jsdom
import { afterEach, describe, expect, it } from "vitest";
import { clearLocalDraft, draftOffer, localDraftKey, readLocalDraft, writeLocalDraft, type LocalDraft } from "@/lib/write-ups/local-draft";

type Doc = { text: string };
const isDoc = (v: unknown): v is Doc => !!v && typeof v === "object" && typeof (v as Doc).text === "string";
const draft = (over: Partial<LocalDraft<Doc>> = {}): LocalDraft<Doc> => ({ writeUpId: "w1", part: "content", baseRevision: 4, keptAt: Date.parse("2026-12-03T10:50:00Z"), content: { text: "on this device" }, ...over });

afterEach(() => localStorage.clear());

describe("the copy kept on this device", () => {
  it("is written, read back and cleared per write-up and part", () => {
    expect(writeLocalDraft(draft())).toBe(true);
    expect(writeLocalDraft(draft({ part: "group-tables", content: { text: "group" } }))).toBe(true);
    expect(readLocalDraft("w1", "content", isDoc)?.content.text).toBe("on this device");
    expect(readLocalDraft("w1", "group-tables", isDoc)?.content.text).toBe("group");
    expect(readLocalDraft("w2", "content", isDoc)).toBeNull();
    clearLocalDraft("w1", "content");
    expect(readLocalDraft("w1", "content", isDoc)).toBeNull();
    expect(readLocalDraft("w1", "group-tables", isDoc)).not.toBeNull();
  });

  it("ignores damaged or foreign entries instead of failing", () => {
    localStorage.setItem(localDraftKey("w1", "content"), "{not json");
    expect(readLocalDraft("w1", "content", isDoc)).toBeNull();
    localStorage.setItem(localDraftKey("w1", "content"), JSON.stringify({ ...draft(), content: { text: 7 } }));
    expect(readLocalDraft("w1", "content", isDoc)).toBeNull();
    localStorage.setItem(localDraftKey("w1", "content"), JSON.stringify(draft({ writeUpId: "other" })));
    expect(readLocalDraft("w1", "content", isDoc)).toBeNull();
  });

  it("is offered back only when it differs from the saved version, saying whether it is newer", () => {
    const server = { revision: 4, updatedAt: "2026-12-03T10:45:00.000Z", content: { text: "saved" } };
    expect(draftOffer(null, server)).toBeNull();
    expect(draftOffer(draft({ content: { text: "saved" } }), server)).toBeNull();
    expect(draftOffer(draft(), server)).toBe("newer");
    // Saved somewhere else after this device's changes: still offered, as older.
    expect(draftOffer(draft({ baseRevision: 2, keptAt: Date.parse("2026-12-03T10:30:00Z") }), server)).toBe("older");
    expect(draftOffer(draft({ baseRevision: 2, keptAt: Date.parse("2026-12-03T10:55:00Z") }), server)).toBe("newer");
  });
});

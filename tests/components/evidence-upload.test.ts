import { describe, expect, it, vi } from "vitest";
import { busyCount, contentTypeFor, describeFailure, formatBytes, newItem, nextToStart, percentOf, StorageUploadError, UploadCancelled, uploadsReducer, type UploadItem } from "@/components/evidence/upload-core";
import { UploadQueue, type UploadTransport } from "@/components/evidence/upload-queue";
import { ApiError } from "@/lib/fetch-json";

const file = (name: string, size = 1000, type = "image/jpeg") => new File([new Uint8Array(size)], name, { type });
const apiError = (status: number, message: string, extra: Record<string, unknown> = {}) => new ApiError(status, { code: String(status), message, ...extra });

describe("upload helpers", () => {
  it("declares the browser's type, or guesses from the name when the browser gives none", () => {
    expect(contentTypeFor({ name: "a.JPG", type: "IMAGE/JPEG" })).toBe("image/jpeg");
    expect(contentTypeFor({ name: "IMG_0042.HEIC", type: "" })).toBe("image/heic");
    expect(contentTypeFor({ name: "scan.webp", type: "" })).toBe("image/webp");
    expect(contentTypeFor({ name: "notes", type: "" })).toBe("application/octet-stream");
    // The browser's own type wins over the name: the server checks the bytes anyway.
    expect(contentTypeFor({ name: "drawing.png", type: "image/svg+xml" })).toBe("image/svg+xml");
  });

  it("writes sizes and percentages as people read them", () => {
    expect(formatBytes(1)).toBe("1 byte");
    expect(formatBytes(512)).toBe("512 bytes");
    expect(formatBytes(820 * 1024)).toBe("820 KB");
    expect(formatBytes(3.44 * 1024 * 1024)).toBe("3.4 MB");
    expect(percentOf(0, 0)).toBe(0);
    expect(percentOf(999, 1000)).toBe(99);
    expect(percentOf(1500, 1000)).toBe(100);
    expect(percentOf(-5, 1000)).toBe(0);
  });

  it("moves a file through the queue, keeping progress within the file", () => {
    let items: UploadItem[] = [];
    items = uploadsReducer(items, { type: "add", items: [{ key: "a", file: file("a.jpg") }, { key: "b", file: file("b.jpg") }] });
    expect(items.map((i) => i.phase)).toEqual(["waiting", "waiting"]);
    expect(busyCount(items)).toBe(2);
    items = uploadsReducer(items, { type: "begin", key: "a" });
    items = uploadsReducer(items, { type: "progress", key: "a", loaded: 10 });
    expect(items[0]!.loaded).toBe(0); // not uploading yet: progress is ignored
    items = uploadsReducer(items, { type: "started", key: "a", evidenceId: "e1" });
    items = uploadsReducer(items, { type: "progress", key: "a", loaded: 5000 });
    expect(items[0]).toMatchObject({ phase: "uploading", evidenceId: "e1", loaded: 1000 });
    items = uploadsReducer(items, { type: "fail", key: "a", stage: "put", message: "dropped", retryable: true });
    items = uploadsReducer(items, { type: "fail", key: "b", stage: "start", message: "Not a photo.", retryable: false });
    expect(items.map((i) => i.phase)).toEqual(["failed", "refused"]);
    expect(busyCount(items)).toBe(0);
    // Only failures that may work next time go back in the queue.
    items = uploadsReducer(items, { type: "retry-all" });
    expect(items.map((i) => i.phase)).toEqual(["waiting", "refused"]);
    items = uploadsReducer(items, { type: "retry", key: "b" });
    expect(items[1]!.phase).toBe("refused");
    // A photo that reached storage but whose check failed goes straight back to checking.
    items = uploadsReducer(items, { type: "fail", key: "a", stage: "confirm", message: "storage", retryable: true });
    items = uploadsReducer(items, { type: "retry", key: "a" });
    items = uploadsReducer(items, { type: "begin", key: "a" });
    expect(items[0]!.phase).toBe("checking");
    items = uploadsReducer(items, { type: "remove", key: "a" });
    expect(items.map((i) => i.key)).toEqual(["b"]);
  });

  it("starts no more than the parallel limit", () => {
    const items = ["a", "b", "c", "d"].map((k) => newItem(k, file(`${k}.jpg`)));
    expect(nextToStart(items, 2).map((i) => i.key)).toEqual(["a", "b"]);
    items[0]!.phase = "uploading";
    expect(nextToStart(items, 2).map((i) => i.key)).toEqual(["b"]);
    items[1]!.phase = "checking";
    expect(nextToStart(items, 2)).toEqual([]);
  });

  it("says why an upload failed and whether trying again can help", () => {
    expect(describeFailure(new StorageUploadError(0, "x"), "put")).toMatchObject({ retryable: true, stage: "put", message: expect.stringMatching(/connection dropped/) });
    expect(describeFailure(new StorageUploadError(403, "x"), "put")).toMatchObject({ retryable: true, stage: "put" });
    expect(describeFailure(apiError(0, "offline"), "confirm")).toMatchObject({ retryable: true, stage: "confirm" });
    expect(describeFailure(apiError(503, "Photo storage is not answering just now.", { retry: true }), "confirm")).toEqual({ retryable: true, stage: "confirm", message: "Photo storage is not answering just now." });
    expect(describeFailure(apiError(409, "The photo did not finish uploading. Try again.", { reason: "not-uploaded", retry: true }), "confirm")).toMatchObject({ retryable: true, stage: "put" });
    // The server's own reason is shown for a refusal, and retrying would not change it.
    expect(describeFailure(apiError(415, "Only photos can be added: JPEG, PNG or WebP."), "start")).toEqual({ retryable: false, stage: "start", message: "Only photos can be added: JPEG, PNG or WebP." });
    expect(describeFailure(apiError(409, "This write-up is handed in or closed, so photos can no longer be added.", { reason: "locked" }), "start").retryable).toBe(false);
  });
});

/** A transport whose every request waits until the test lets it go. */
function fakeTransport() {
  type Pending = { resolve: (v?: unknown) => void; reject: (e: unknown) => void };
  const waiting: Record<string, Pending[]> = { start: [], put: [], confirm: [] };
  const progress: ((loaded: number) => void)[] = [];
  let n = 0;
  const wait = (kind: string) => new Promise<never>((resolve, reject) => waiting[kind]!.push({ resolve: resolve as (v?: unknown) => void, reject }));
  const calls = { start: [] as { filename: string; caption: string }[], put: 0, confirm: [] as string[], caption: [] as [string, string][], discard: [] as string[] };
  const transport: UploadTransport = {
    start: async (input) => {
      calls.start.push({ filename: input.filename, caption: input.caption });
      await wait("start");
      n += 1;
      return { id: `e${n}`, uploadUrl: `http://storage.test/e${n}`, method: "PUT", headers: { "content-type": input.contentType } };
    },
    put: (_url, _file, _headers, { onProgress, signal }) => {
      calls.put += 1;
      progress.push(onProgress);
      return new Promise((resolve, reject) => {
        waiting.put!.push({ resolve: resolve as (v?: unknown) => void, reject });
        signal.addEventListener("abort", () => reject(new UploadCancelled()));
      });
    },
    confirm: async (id) => {
      calls.confirm.push(id);
      await wait("confirm");
      return { id, status: "ready" };
    },
    caption: async (id, caption) => {
      calls.caption.push([id, caption]);
    },
    discard: async (id) => {
      calls.discard.push(id);
    },
  };
  const settle = () => new Promise((r) => setTimeout(r, 0));
  const release = async (kind: "start" | "put" | "confirm", error?: unknown) => {
    const p = waiting[kind]!.shift();
    if (!p) throw new Error(`nothing is waiting on ${kind}`);
    if (error) p.reject(error);
    else p.resolve();
    await settle();
  };
  return { transport, calls, release, progress, settle };
}

const noPreview = { create: () => "", revoke: () => {} };

describe("the upload queue", () => {
  it("uploads one at a time within the limit, shows progress, saves a caption typed meanwhile, and hands the photo to the gallery", async () => {
    const t = fakeTransport();
    const q = new UploadQueue({ writeUpId: "w1" }, t.transport, noPreview, 1);
    const uploaded: string[] = [];
    const said: string[] = [];
    q.setHooks({ onUploaded: (item) => void uploaded.push(item.evidenceId!), announce: (m) => void said.push(m) });
    q.add([file("flask.jpg"), file("syringe.jpg")]);
    expect(q.getSnapshot().map((i) => i.phase)).toEqual(["starting", "waiting"]);
    await t.release("start");
    expect(q.getSnapshot()[0]).toMatchObject({ phase: "uploading", evidenceId: "e1" });
    t.progress[0]!(400);
    expect(q.getSnapshot()[0]!.loaded).toBe(400);
    q.setCaption(q.getSnapshot()[0]!.key, "  Flask after 30 s ");
    await t.release("put");
    expect(q.getSnapshot()[0]!.phase).toBe("checking");
    expect(q.busy).toBe(2);
    await t.release("confirm");
    expect(t.calls.caption).toEqual([["e1", "Flask after 30 s"]]);
    expect(uploaded).toEqual(["e1"]);
    expect(said).toContain("flask.jpg added.");
    // The first is done and gone; the second has started.
    expect(q.getSnapshot().map((i) => [i.name, i.phase])).toEqual([["syringe.jpg", "starting"]]);
    expect(t.calls.start.map((s) => s.filename)).toEqual(["flask.jpg", "syringe.jpg"]);
  });

  it("retries after a dropped connection with a fresh upload, dropping the unfinished one", async () => {
    const t = fakeTransport();
    const q = new UploadQueue({ writeUpId: "w1" }, t.transport, noPreview);
    q.add([file("results.png", 2000, "image/png")]);
    await t.release("start");
    await t.release("put", new StorageUploadError(0, "dropped"));
    const [failed] = q.getSnapshot();
    expect(failed).toMatchObject({ phase: "failed", failedAt: "put" });
    expect(failed!.message).toMatch(/connection dropped/);
    q.retryAll();
    await t.settle();
    expect(t.calls.discard).toEqual(["e1"]);
    await t.release("start");
    expect(q.getSnapshot()[0]!.evidenceId).toBe("e2");
    await t.release("put");
    await t.release("confirm");
    expect(q.getSnapshot()).toEqual([]);
    expect(t.calls.confirm).toEqual(["e2"]);
  });

  it("after a storage hiccup at the check, tries the check again without sending the file twice", async () => {
    const t = fakeTransport();
    const q = new UploadQueue({ practicalId: "p1" }, t.transport, noPreview);
    q.add([file("setup.jpg")]);
    await t.release("start");
    await t.release("put");
    await t.release("confirm", apiError(503, "Photo storage is not answering just now.", { retry: true }));
    expect(q.getSnapshot()[0]).toMatchObject({ phase: "failed", failedAt: "confirm", message: "Photo storage is not answering just now." });
    q.retry(q.getSnapshot()[0]!.key);
    expect(q.getSnapshot()[0]!.phase).toBe("checking");
    await t.release("confirm");
    expect(q.getSnapshot()).toEqual([]);
    expect(t.calls.put).toBe(1);
    expect(t.calls.start).toHaveLength(1);
    expect(t.calls.confirm).toEqual(["e1", "e1"]);
  });

  it("keeps a refusal on the list with the server's reason until it is dismissed", async () => {
    const t = fakeTransport();
    const q = new UploadQueue({ writeUpId: "w1" }, t.transport, noPreview);
    const said: string[] = [];
    q.setHooks({ onUploaded: () => {}, announce: (m) => void said.push(m) });
    q.add([file("diagram.svg", 300, "image/svg+xml")]);
    await t.release("start", apiError(415, "Only photos can be added: JPEG, PNG or WebP."));
    expect(q.getSnapshot()[0]).toMatchObject({ phase: "refused", message: "Only photos can be added: JPEG, PNG or WebP." });
    expect(said).toEqual(["diagram.svg was not added: Only photos can be added: JPEG, PNG or WebP."]);
    q.retryAll();
    expect(q.getSnapshot()[0]!.phase).toBe("refused");
    q.cancel(q.getSnapshot()[0]!.key);
    expect(q.getSnapshot()).toEqual([]);
  });

  it("cancels an upload in flight and drops the server's record of it", async () => {
    const t = fakeTransport();
    const q = new UploadQueue({ writeUpId: "w1" }, t.transport, noPreview);
    const listener = vi.fn();
    q.subscribe(listener);
    q.add([file("big.jpg", 5000)]);
    await t.release("start");
    t.progress[0]!(2500);
    q.cancel(q.getSnapshot()[0]!.key);
    await t.settle();
    expect(q.getSnapshot()).toEqual([]);
    expect(t.calls.discard).toEqual(["e1"]);
    expect(t.calls.confirm).toEqual([]);
    expect(listener).toHaveBeenCalled();
  });
});

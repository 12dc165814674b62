import { fetchJson } from "@/lib/fetch-json";
import type { EvidencePhotoJson, EvidenceTarget, UploadStartJson } from "./types";
import { busyCount, describeFailure, nextToStart, PARALLEL_UPLOADS, putFile, UploadCancelled, uploadsReducer, type UploadAction, type UploadItem, type UploadStage } from "./upload-core";

/** The requests an upload makes; the browser's by default, fakes in tests. */
export type UploadTransport = {
  start(input: EvidenceTarget & { filename: string; contentType: string; size: number; caption: string }, signal: AbortSignal): Promise<UploadStartJson>;
  put(url: string, file: File, headers: Record<string, string>, options: { onProgress: (loaded: number) => void; signal: AbortSignal }): Promise<void>;
  confirm(evidenceId: string): Promise<Pick<EvidencePhotoJson, "id" | "status">>;
  caption(evidenceId: string, caption: string): Promise<void>;
  /** Drops an upload that will not be finished (cancelled, or replaced by a retry). */
  discard(evidenceId: string): Promise<void>;
};

export const browserTransport: UploadTransport = {
  start: (input, signal) => fetchJson<UploadStartJson>("/api/evidence", { method: "POST", json: input, signal }),
  put: (url, file, headers, { onProgress, signal }) => putFile(url, file, headers, { onProgress: (loaded) => onProgress(loaded), signal }),
  confirm: (id) => fetchJson(`/api/evidence/${encodeURIComponent(id)}/confirm`, { method: "POST" }),
  caption: async (id, caption) => {
    await fetchJson(`/api/evidence/${encodeURIComponent(id)}`, { method: "PATCH", json: { caption } });
  },
  discard: async (id) => {
    await fetchJson(`/api/evidence/${encodeURIComponent(id)}`, { method: "DELETE" });
  },
};

export type UploadHooks = {
  /** A photo was checked and stored; resolve once the gallery shows it. */
  onUploaded: (item: UploadItem) => Promise<void> | void;
  /** A sentence for screen readers (added, refused, cancelled). */
  announce: (message: string) => void;
};

const isAbort = (e: unknown) => e instanceof UploadCancelled || (e instanceof DOMException && e.name === "AbortError");

/**
 * The photos being added to one write-up or practical. Lives outside React (the component reads
 * it with useSyncExternalStore) so uploads keep their place in the queue across renders; at most
 * PARALLEL_UPLOADS run at once.
 */
export class UploadQueue {
  private items: UploadItem[] = [];
  private readonly listeners = new Set<() => void>();
  private readonly controllers = new Map<string, AbortController>();
  /** The caption sent when the upload started, to know whether it changed while uploading. */
  private readonly sentCaption = new Map<string, string>();
  private counter = 0;
  private hooks: UploadHooks = { onUploaded: () => {}, announce: () => {} };

  constructor(
    private readonly target: EvidenceTarget,
    private readonly transport: UploadTransport = browserTransport,
    private readonly preview: { create: (file: File) => string; revoke: (url: string) => void } = {
      create: (file) => (typeof URL !== "undefined" && URL.createObjectURL ? URL.createObjectURL(file) : ""),
      revoke: (url) => {
        if (url && typeof URL !== "undefined" && URL.revokeObjectURL) URL.revokeObjectURL(url);
      },
    },
    private readonly parallel = PARALLEL_UPLOADS,
  ) {}

  setHooks(hooks: UploadHooks) {
    this.hooks = hooks;
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = () => this.items;

  get busy(): number {
    return busyCount(this.items);
  }

  private dispatch(action: UploadAction) {
    const before = this.items;
    this.items = uploadsReducer(this.items, action);
    if (action.type === "remove") for (const gone of before.filter((i) => i.key === action.key)) this.preview.revoke(gone.previewUrl);
    if (this.items !== before) for (const l of this.listeners) l();
  }

  private find(key: string) {
    return this.items.find((i) => i.key === key);
  }

  add(files: readonly File[]) {
    if (!files.length) return;
    this.dispatch({ type: "add", items: files.map((file) => ({ key: `u${++this.counter}`, file, previewUrl: this.preview.create(file) })) });
    this.pump();
  }

  setCaption(key: string, caption: string) {
    this.dispatch({ type: "caption", key, caption });
  }

  /** Stops an upload (or takes a queued, failed or refused one off the list). */
  cancel(key: string) {
    const item = this.find(key);
    if (!item) return;
    const controller = this.controllers.get(key);
    if (controller) {
      // run() sees the abort, drops the server's record and removes the item.
      controller.abort();
      return;
    }
    if (item.evidenceId && item.phase === "failed") void this.transport.discard(item.evidenceId).catch(() => {});
    this.dispatch({ type: "remove", key });
    if (item.phase !== "refused") this.hooks.announce(`${item.name} was not added.`);
  }

  retry(key: string) {
    this.dispatch({ type: "retry", key });
    this.pump();
  }

  /** Back online: try every upload that failed for want of a connection. */
  retryAll() {
    this.dispatch({ type: "retry-all" });
    this.pump();
  }

  private pump() {
    for (const item of nextToStart(this.items, this.parallel)) {
      this.dispatch({ type: "begin", key: item.key });
      void this.run(item.key);
    }
  }

  private async run(key: string) {
    const controller = new AbortController();
    this.controllers.set(key, controller);
    let stage: UploadStage = "start";
    try {
      let item = this.find(key)!;
      if (!(item.failedAt === "confirm" && item.evidenceId)) {
        // A fresh start: a record left by an earlier attempt is dropped so it does not count against the limit.
        if (item.evidenceId) void this.transport.discard(item.evidenceId).catch(() => {});
        const caption = item.caption.trim();
        const started = await this.transport.start({ ...this.target, filename: item.name, contentType: item.contentType, size: item.size, caption }, controller.signal);
        this.sentCaption.set(key, caption);
        this.dispatch({ type: "started", key, evidenceId: started.id });
        stage = "put";
        await this.transport.put(started.uploadUrl, item.file, started.headers, { onProgress: (loaded) => this.dispatch({ type: "progress", key, loaded }), signal: controller.signal });
        if (controller.signal.aborted) throw new UploadCancelled();
      }
      stage = "confirm";
      this.dispatch({ type: "checking", key });
      item = this.find(key)!;
      await this.transport.confirm(item.evidenceId!);
      // A caption typed while the photo uploaded is saved now.
      const now = (this.find(key)?.caption ?? "").trim();
      if (now !== (this.sentCaption.get(key) ?? "")) {
        try {
          await this.transport.caption(item.evidenceId!, now);
        } catch {
          this.hooks.announce(`${item.name} was added, but its caption was not saved. Type it again under the photo.`);
        }
      }
      try {
        await this.hooks.onUploaded(this.find(key) ?? item);
      } finally {
        this.dispatch({ type: "remove", key });
        this.sentCaption.delete(key);
      }
      this.hooks.announce(`${item.name} added.`);
    } catch (e) {
      const item = this.find(key);
      if (!item) return;
      if (controller.signal.aborted || isAbort(e)) {
        if (item.evidenceId) void this.transport.discard(item.evidenceId).catch(() => {});
        this.dispatch({ type: "remove", key });
        this.hooks.announce(`Upload of ${item.name} cancelled.`);
        return;
      }
      const f = describeFailure(e, stage);
      this.dispatch({ type: "fail", key, stage: f.stage, message: f.message, retryable: f.retryable });
      this.hooks.announce(`${item.name} was not added: ${f.message}`);
    } finally {
      this.controllers.delete(key);
      this.pump();
    }
  }
}

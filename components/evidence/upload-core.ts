import { ApiError } from "@/lib/fetch-json";

/*
 * The upload queue without React: what each file is doing, what to say when it fails, and the
 * one request that has to be an XMLHttpRequest (fetch() cannot report upload progress).
 *
 * A photo goes: waiting → starting (POST /api/evidence, which answers with a presigned URL) →
 * uploading (PUT straight to object storage, with progress) → checking (POST …/confirm: the
 * server reads it back, checks it and re-encodes it) → gone from the queue and shown in the
 * gallery. A refusal stays in the queue with the server's reason; a dropped connection or a
 * storage hiccup can be retried.
 */

/** How many photos upload at once; the rest wait their turn. */
export const PARALLEL_UPLOADS = 2;

export type UploadPhase = "waiting" | "starting" | "uploading" | "checking" | "failed" | "refused";
/** Where an upload failed: "confirm" means the file reached storage and only the check is left. */
export type UploadStage = "start" | "put" | "confirm";

export type UploadItem = {
  key: string;
  file: File;
  /** A local object URL for a preview while it uploads (empty when none could be made). */
  previewUrl: string;
  name: string;
  size: number;
  contentType: string;
  caption: string;
  phase: UploadPhase;
  /** Bytes sent so far (uploading). */
  loaded: number;
  /** The server's record for this upload, once started. */
  evidenceId: string | null;
  failedAt: UploadStage | null;
  message: string | null;
};

export type UploadAction =
  | { type: "add"; items: { key: string; file: File; previewUrl?: string }[] }
  | { type: "caption"; key: string; caption: string }
  | { type: "begin"; key: string }
  | { type: "started"; key: string; evidenceId: string }
  | { type: "progress"; key: string; loaded: number }
  | { type: "checking"; key: string }
  | { type: "fail"; key: string; stage: UploadStage; message: string; retryable: boolean }
  | { type: "retry"; key: string }
  | { type: "retry-all" }
  | { type: "remove"; key: string };

/** The type to declare for a file: the browser's, or one guessed from the name when it gives none (HEIC on some systems). */
export function contentTypeFor(file: { name: string; type: string }): string {
  if (file.type) return file.type.toLowerCase();
  const ext = file.name.toLowerCase().match(/\.([a-z0-9]+)$/)?.[1] ?? "";
  const byExt: Record<string, string> = { jpg: "image/jpeg", jpeg: "image/jpeg", png: "image/png", webp: "image/webp", heic: "image/heic", heif: "image/heif" };
  return byExt[ext] ?? "application/octet-stream";
}

/** 512 bytes, 820 KB, 3.4 MB. */
export function formatBytes(n: number): string {
  if (!Number.isFinite(n) || n < 0) return "";
  if (n < 1024) return `${n} byte${n === 1 ? "" : "s"}`;
  if (n < 1024 * 1024) return `${Math.round(n / 1024)} KB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}

/** Whole percent of an upload, 0–100. */
export function percentOf(loaded: number, total: number): number {
  if (!(total > 0)) return 0;
  return Math.max(0, Math.min(100, Math.floor((loaded / total) * 100)));
}

export function newItem(key: string, file: File, previewUrl = ""): UploadItem {
  return { key, file, previewUrl, name: file.name || "photo", size: file.size, contentType: contentTypeFor(file), caption: "", phase: "waiting", loaded: 0, evidenceId: null, failedAt: null, message: null };
}

export function uploadsReducer(items: UploadItem[], action: UploadAction): UploadItem[] {
  const patch = (key: string, change: (i: UploadItem) => UploadItem) => items.map((i) => (i.key === key ? change(i) : i));
  switch (action.type) {
    case "add":
      return [...items, ...action.items.map(({ key, file, previewUrl }) => newItem(key, file, previewUrl))];
    case "caption":
      return patch(action.key, (i) => ({ ...i, caption: action.caption }));
    case "begin":
      return patch(action.key, (i) => ({ ...i, phase: i.failedAt === "confirm" && i.evidenceId ? "checking" : "starting", message: null }));
    case "started":
      return patch(action.key, (i) => ({ ...i, phase: "uploading", evidenceId: action.evidenceId, loaded: 0, failedAt: null }));
    case "progress":
      return patch(action.key, (i) => (i.phase === "uploading" ? { ...i, loaded: Math.min(action.loaded, i.size) } : i));
    case "checking":
      return patch(action.key, (i) => ({ ...i, phase: "checking", loaded: i.size }));
    case "fail":
      return patch(action.key, (i) => ({ ...i, phase: action.retryable ? "failed" : "refused", failedAt: action.stage, message: action.message }));
    case "retry":
      return patch(action.key, (i) => (i.phase === "failed" ? { ...i, phase: "waiting" } : i));
    case "retry-all":
      return items.map((i) => (i.phase === "failed" ? { ...i, phase: "waiting" } : i));
    case "remove":
      return items.filter((i) => i.key !== action.key);
  }
}

/** Uploads still going (or queued): handing in waits for these. */
export function busyCount(items: readonly UploadItem[]): number {
  return items.filter((i) => i.phase === "waiting" || i.phase === "starting" || i.phase === "uploading" || i.phase === "checking").length;
}

/** The next queued photos to start, keeping at most PARALLEL_UPLOADS going. */
export function nextToStart(items: readonly UploadItem[], parallel = PARALLEL_UPLOADS): UploadItem[] {
  const active = items.filter((i) => i.phase === "starting" || i.phase === "uploading" || i.phase === "checking").length;
  return items.filter((i) => i.phase === "waiting").slice(0, Math.max(0, parallel - active));
}

/** A PUT to object storage that did not succeed; status 0 means the connection dropped. */
export class StorageUploadError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
    this.name = "StorageUploadError";
  }
}

export class UploadCancelled extends Error {
  constructor() {
    super("Upload cancelled.");
    this.name = "UploadCancelled";
  }
}

/** What to tell the person about a failed step, and whether trying again can help. */
export function describeFailure(error: unknown, stage: UploadStage): { message: string; retryable: boolean; stage: UploadStage } {
  if (error instanceof StorageUploadError) {
    if (error.status === 0) return { message: "The connection dropped while the photo was uploading. It is still on this device: try again.", retryable: true, stage: "put" };
    if (error.status === 403) return { message: "The upload link was refused or had expired. Try again for a fresh one.", retryable: true, stage: "put" };
    return { message: `Photo storage did not take the file (HTTP ${error.status}). Try again in a moment.`, retryable: true, stage: "put" };
  }
  if (error instanceof ApiError) {
    if (error.status === 0) return { message: "You seem to be offline. The photo is still on this device: it is tried again when you are back online.", retryable: true, stage };
    // The file never reached storage (say, the tab was closed mid-upload): send it again.
    if (error.body.reason === "not-uploaded") return { message: error.message, retryable: true, stage: "put" };
    if (error.status === 503 || error.status >= 500 || error.body.retry === true) return { message: error.message, retryable: true, stage };
    // 4xx: refused for a reason the server gives (not a photo, too large, locked, too many).
    return { message: error.message, retryable: false, stage };
  }
  return { message: "Something went wrong. Try again.", retryable: true, stage };
}

/**
 * PUTs a file to a presigned URL, reporting progress. Rejects with StorageUploadError (status 0
 * for a dropped connection) or UploadCancelled when the signal aborts.
 */
export function putFile(url: string, file: Blob, headers: Record<string, string>, { onProgress, signal }: { onProgress?: (loaded: number, total: number) => void; signal?: AbortSignal } = {}): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(new UploadCancelled());
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (e) => onProgress?.(e.loaded, e.lengthComputable ? e.total : file.size);
    const onAbort = () => xhr.abort();
    signal?.addEventListener("abort", onAbort, { once: true });
    const done = (fn: () => void) => {
      signal?.removeEventListener("abort", onAbort);
      fn();
    };
    xhr.onload = () => done(() => (xhr.status >= 200 && xhr.status < 300 ? resolve() : reject(new StorageUploadError(xhr.status, `HTTP ${xhr.status}`))));
    xhr.onerror = () => done(() => reject(new StorageUploadError(0, "The connection dropped.")));
    xhr.ontimeout = () => done(() => reject(new StorageUploadError(0, "The upload timed out.")));
    xhr.onabort = () => done(() => reject(new UploadCancelled()));
    xhr.send(file);
  });
}

/** The query string that names what the photos belong to. */
export function targetQuery(target: { writeUpId: string } | { practicalId: string }): string {
  return "writeUpId" in target ? `writeUpId=${encodeURIComponent(target.writeUpId)}` : `practicalId=${encodeURIComponent(target.practicalId)}`;
}

export function evidenceQueryKey(target: { writeUpId: string } | { practicalId: string }) {
  return "writeUpId" in target ? (["evidence", "write-up", target.writeUpId] as const) : (["evidence", "practical", target.practicalId] as const);
}

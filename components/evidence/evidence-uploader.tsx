"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useId, useRef, useState, useSyncExternalStore, type DragEvent } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/lib/utils";
import type { EvidenceTarget } from "./types";
import { evidenceQueryKey, formatBytes, percentOf, type UploadItem } from "./upload-core";
import { UploadQueue } from "./upload-queue";

const NO_ITEMS: UploadItem[] = [];
/** The server's limit (lib/images/process-photo.ts), said up front. */
const LIMIT_TEXT = "JPEG, PNG or WebP, up to 12 MB each";

/**
 * Adding photos: choose several files, drop them here, or take one with a phone's camera. Each
 * file gets its own progress bar, can be cancelled, retried after a dropped connection and
 * captioned while it uploads; refusals say why. A stored photo leaves this list for the gallery.
 */
export function EvidenceUploader({ target, onBusyChange, what = "photos" }: { target: EvidenceTarget; onBusyChange?: (busy: number) => void; what?: string }) {
  const queryClient = useQueryClient();
  const [queue] = useState(() => new UploadQueue(target));
  const items = useSyncExternalStore(queue.subscribe, queue.getSnapshot, () => NO_ITEMS);
  const [announcement, setAnnouncement] = useState("");
  const [dragging, setDragging] = useState(false);
  const pickRef = useRef<HTMLInputElement>(null);
  const cameraRef = useRef<HTMLInputElement>(null);
  const hintId = useId();

  useEffect(() => {
    queue.setHooks({
      onUploaded: () => queryClient.invalidateQueries({ queryKey: evidenceQueryKey(target) }),
      announce: setAnnouncement,
    });
  }, [queue, queryClient, target]);

  // Back online: uploads that failed for want of a connection go again by themselves.
  useEffect(() => {
    const again = () => queue.retryAll();
    window.addEventListener("online", again);
    return () => window.removeEventListener("online", again);
  }, [queue]);

  // Uploads in flight are not stopped when this unmounts (say, the practical editor shows another
  // section): they finish and the gallery picks them up. Leaving the page ends them, and the
  // server sweeps the unfinished records.

  const busy = queue.busy;
  useEffect(() => {
    onBusyChange?.(busy);
  }, [busy, onBusyChange]);

  const addFiles = (list: FileList | null) => {
    if (!list?.length) return;
    queue.add(Array.from(list));
  };

  const onDrop = (e: DragEvent<HTMLDivElement>) => {
    e.preventDefault();
    setDragging(false);
    addFiles(e.dataTransfer.files);
  };

  return (
    <div className="flex flex-col gap-3">
      <div
        className={cn("flex flex-col gap-2 rounded-md border-2 border-dashed p-4 transition-colors", dragging ? "border-brand bg-brand-soft" : "border-line bg-surface")}
        onDragOver={(e) => {
          if (!Array.from(e.dataTransfer.types).includes("Files")) return;
          e.preventDefault();
          e.dataTransfer.dropEffect = "copy";
          setDragging(true);
        }}
        onDragLeave={(e) => {
          if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setDragging(false);
        }}
        onDrop={onDrop}
      >
        <p id={hintId} className="text-[0.95rem]">
          <span className="pointer-coarse:hidden">Drag {what} here, or choose them. </span>
          <span className="hidden pointer-coarse:inline">Take a photo or choose from your gallery. </span>
          <span className="text-muted">{LIMIT_TEXT}. Location and camera details are removed before anyone sees them.</span>
        </p>
        <div className="flex flex-wrap gap-2">
          <Button className="hidden pointer-coarse:inline-flex" onClick={() => cameraRef.current?.click()} aria-describedby={hintId}>
            <CameraIcon />
            Take a photo
          </Button>
          <Button variant="secondary" onClick={() => pickRef.current?.click()} aria-describedby={hintId}>
            Choose {what}
          </Button>
        </div>
        <input
          ref={pickRef}
          type="file"
          accept="image/*"
          multiple
          hidden
          aria-label={`Choose ${what} to add`}
          onChange={(e) => {
            addFiles(e.currentTarget.files);
            e.currentTarget.value = "";
          }}
        />
        <input
          ref={cameraRef}
          type="file"
          accept="image/*"
          capture="environment"
          hidden
          aria-label="Take a photo with the camera"
          onChange={(e) => {
            addFiles(e.currentTarget.files);
            e.currentTarget.value = "";
          }}
        />
      </div>

      {items.length ? (
        <ul className="flex flex-col gap-2" aria-label={`${what[0]!.toUpperCase()}${what.slice(1)} being added`}>
          {items.map((item) => (
            <UploadRow key={item.key} item={item} onCaption={(c) => queue.setCaption(item.key, c)} onCancel={() => queue.cancel(item.key)} onRetry={() => queue.retry(item.key)} />
          ))}
        </ul>
      ) : null}
      <p aria-live="polite" className="sr-only">
        {announcement}
      </p>
    </div>
  );
}

function UploadRow({ item, onCaption, onCancel, onRetry }: { item: UploadItem; onCaption: (caption: string) => void; onCancel: () => void; onRetry: () => void }) {
  const captionId = useId();
  const pct = percentOf(item.loaded, item.size);
  const refused = item.phase === "refused";
  return (
    <li className={cn("flex gap-3 rounded-md border p-3", item.phase === "refused" ? "border-bad/50 bg-bad-soft" : item.phase === "failed" ? "border-warn/50 bg-warn-soft" : "border-line bg-surface")} data-upload-phase={item.phase}>
      {refused ? null : (
        <div className="size-16 shrink-0 overflow-hidden rounded bg-sunken">
          {/* A local preview of the file being sent (an object URL, never a stored photo). */}
          {item.previewUrl ? (
            // eslint-disable-next-line @next/next/no-img-element
            <img src={item.previewUrl} alt="" className="size-full object-cover" onError={(e) => (e.currentTarget.style.visibility = "hidden")} />
          ) : null}
        </div>
      )}
      <div className="flex min-w-0 flex-1 flex-col gap-1.5">
        <p className="flex flex-wrap items-baseline gap-x-2">
          <span className="min-w-0 font-semibold break-all">{item.name}</span>
          <span className="text-sm text-muted">{formatBytes(item.size)}</span>
        </p>
        {item.phase === "waiting" ? <p className="text-sm text-muted">Waiting to upload…</p> : null}
        {item.phase === "starting" ? <p className="text-sm text-muted">Starting…</p> : null}
        {item.phase === "uploading" ? (
          <div className="flex flex-col gap-1">
            <div role="progressbar" aria-label={`Uploading ${item.name}`} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} aria-valuetext={`${pct}% of ${formatBytes(item.size)}`} className="h-2.5 overflow-hidden rounded-full bg-sunken">
              <div className="h-full rounded-full bg-brand transition-[width] duration-200" style={{ width: `${pct}%` }} />
            </div>
            <p className="text-sm text-muted">
              Uploading: {pct}% of {formatBytes(item.size)}
            </p>
          </div>
        ) : null}
        {item.phase === "checking" ? (
          <div className="flex flex-col gap-1">
            <div role="progressbar" aria-label={`Checking ${item.name}`} className="h-2.5 overflow-hidden rounded-full bg-sunken">
              <div className="h-full w-full animate-pulse rounded-full bg-brand/60" />
            </div>
            <p className="text-sm text-muted">Checking the photo and removing location details…</p>
          </div>
        ) : null}
        {item.phase === "failed" ? (
          <p role="alert" className="text-[0.95rem] font-semibold text-warn">
            Not uploaded yet. {item.message}
          </p>
        ) : null}
        {item.phase === "refused" ? (
          <p role="alert" className="text-[0.95rem] font-semibold text-bad">
            Not added. {item.message}
          </p>
        ) : null}
        {item.phase !== "refused" ? (
          <div className="flex flex-col gap-0.5">
            <label htmlFor={captionId} className="text-sm font-semibold">
              Caption <span className="font-normal text-muted">(what does it show?)</span>
            </label>
            <input
              id={captionId}
              value={item.caption}
              maxLength={200}
              onChange={(e) => onCaption(e.target.value)}
              className="min-h-11 w-full rounded-md border border-line bg-surface px-3 py-2 text-base"
            />
          </div>
        ) : null}
        <div className="flex flex-wrap gap-2">
          {item.phase === "failed" ? (
            <Button size="sm" onClick={onRetry}>
              Try again
            </Button>
          ) : null}
          {item.phase === "waiting" || item.phase === "starting" || item.phase === "uploading" ? (
            <Button size="sm" variant="secondary" onClick={onCancel} aria-label={`Cancel uploading ${item.name}`}>
              Cancel
            </Button>
          ) : null}
          {item.phase === "failed" || item.phase === "refused" ? (
            <Button size="sm" variant="ghost" onClick={onCancel} aria-label={`Remove ${item.name} from the list`}>
              {item.phase === "refused" ? "Dismiss" : "Remove"}
            </Button>
          ) : null}
        </div>
      </div>
    </li>
  );
}

function CameraIcon() {
  return (
    <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true" focusable="false">
      <path d="M3 6.5h3l1.5-2h5L14 6.5h3v9H3z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
      <circle cx="10" cy="11" r="3" fill="none" stroke="currentColor" strokeWidth="1.6" />
    </svg>
  );
}

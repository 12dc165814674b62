"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { EvidencePhotoJson, EvidenceTarget } from "./types";
import { evidenceQueryKey, formatBytes, targetQuery } from "./upload-core";

/** Links to stored photos expire after five minutes; fetch fresh ones before that. */
const REFRESH_MS = 4 * 60_000;

export function useEvidence(target: EvidenceTarget) {
  return useQuery({
    queryKey: evidenceQueryKey(target),
    queryFn: () => fetchJson<{ photos: EvidencePhotoJson[] }>(`/api/evidence?${targetQuery(target)}`).then((r) => r.photos),
    staleTime: 60_000,
    refetchInterval: REFRESH_MS,
  });
}

const photoName = (p: EvidencePhotoJson, i: number) => (p.caption ? `photo ${i + 1}: ${p.caption}` : `photo ${i + 1}`);

/**
 * Thumbnails with captions; a thumbnail opens a larger view. `editable` lets the person who
 * added a photo change its caption and delete it (the server decides whether they still may).
 */
export function EvidenceGallery({
  target,
  editable = false,
  label = "Photos",
  heading,
  empty,
}: {
  target: EvidenceTarget;
  editable?: boolean;
  /** The list's accessible name. */
  label?: string;
  /** Shown above the thumbnails, only when there are some. */
  heading?: ReactNode;
  /** Shown when there are no photos; nothing at all when null. */
  empty?: ReactNode;
}) {
  const query = useEvidence(target);
  const [open, setOpen] = useState<number | null>(null);
  const retried = useRef(new Set<string>());
  const photos = query.data ?? [];

  // A link that no longer loads has most likely expired: fetch fresh links, once per link.
  const onBroken = (url: string) => {
    if (retried.current.has(url)) return;
    retried.current.add(url);
    void query.refetch();
  };

  if (query.isPending) {
    return (
      <p role="status" className="text-muted">
        Loading photos…
      </p>
    );
  }
  if (query.isError) {
    return (
      <div role="alert" className="flex flex-wrap items-center gap-2 rounded-md border border-warn/40 bg-warn-soft p-3">
        <span>Photos could not be loaded. {query.error instanceof ApiError ? query.error.message : ""}</span>
        <Button size="sm" variant="secondary" onClick={() => void query.refetch()}>
          Try again
        </Button>
      </div>
    );
  }
  if (!photos.length) return empty === undefined ? <p className="text-muted italic">No photos.</p> : empty;

  return (
    <>
      {heading}
      {/* Columns follow the space the gallery has (a write-up column, the marking desk, a full page). */}
      <div className="@container">
        <ul aria-label={label} className="grid grid-cols-2 gap-3 @md:grid-cols-3 @4xl:grid-cols-4">
          {photos.map((p, i) => (
            <li key={p.id} className="min-w-0">
              <figure className="flex h-full flex-col gap-1.5 rounded-md border border-line bg-surface p-1.5">
                <button
                  type="button"
                  className="group block overflow-hidden rounded bg-sunken focus-visible:outline-3 focus-visible:outline-offset-2"
                  onClick={() => setOpen(i)}
                  aria-label={`Larger view of ${photoName(p, i)}`}
                >
                  {/* Short-lived presigned links: next/image cannot cache or resize them. */}
                  {/* eslint-disable-next-line @next/next/no-img-element */}
                  <img
                    src={p.thumbUrl}
                    alt=""
                    loading="lazy"
                    width={p.width ?? undefined}
                    height={p.height ?? undefined}
                    className="aspect-[4/3] h-auto w-full object-cover transition-transform group-hover:scale-[1.02]"
                    onError={() => onBroken(p.thumbUrl)}
                  />
                </button>
                {/* One's own photos show the caption in its box, ready to change. */}
                <figcaption className={editable && p.canDelete ? "sr-only" : "px-1 text-[0.95rem] break-words"}>{p.caption ? p.caption : <span className="text-muted italic">No caption</span>}</figcaption>
                {editable && p.canDelete ? <OwnPhotoControls target={target} photo={p} index={i} /> : null}
              </figure>
            </li>
          ))}
        </ul>
      </div>
      <PhotoViewer photos={photos} index={open} onIndex={setOpen} onBroken={onBroken} />
    </>
  );
}

function OwnPhotoControls({ target, photo, index }: { target: EvidenceTarget; photo: EvidencePhotoJson; index: number }) {
  const queryClient = useQueryClient();
  const id = useId();
  const [caption, setCaption] = useState(photo.caption);
  const [saved, setSaved] = useState(photo.caption);
  const [status, setStatus] = useState<{ tone: "good" | "bad" | "muted"; text: string } | null>(null);
  const [deleting, setDeleting] = useState(false);

  const saveCaption = async () => {
    const next = caption.trim();
    if (next === saved) return;
    setStatus({ tone: "muted", text: "Saving…" });
    try {
      await fetchJson(`/api/evidence/${encodeURIComponent(photo.id)}`, { method: "PATCH", json: { caption: next } });
      setSaved(next);
      setStatus({ tone: "good", text: "Caption saved." });
      void queryClient.invalidateQueries({ queryKey: evidenceQueryKey(target) });
    } catch (e) {
      setStatus({ tone: "bad", text: `Not saved. ${e instanceof ApiError ? e.message : "Try again."}` });
    }
  };

  const remove = async () => {
    setDeleting(true);
    setStatus(null);
    try {
      await fetchJson(`/api/evidence/${encodeURIComponent(photo.id)}`, { method: "DELETE" });
      await queryClient.invalidateQueries({ queryKey: evidenceQueryKey(target) });
    } catch (e) {
      setStatus({ tone: "bad", text: `Not deleted. ${e instanceof ApiError ? e.message : "Try again."}` });
      setDeleting(false);
    }
  };

  return (
    <div className="flex flex-col gap-1.5 px-1 pb-1">
      <label htmlFor={id} className="text-sm font-semibold">
        Caption<span className="sr-only"> for photo {index + 1}</span>
      </label>
      <textarea
        id={id}
        value={caption}
        maxLength={200}
        rows={2}
        placeholder="What does it show?"
        onChange={(e) => setCaption(e.target.value)}
        onBlur={() => void saveCaption()}
        onKeyDown={(e) => {
          if (e.key === "Enter") {
            e.preventDefault();
            void saveCaption();
          }
        }}
        className="field-sizing-content min-h-11 w-full resize-y rounded-md border border-line bg-surface px-2 py-1.5 text-[0.95rem]"
      />
      <div aria-live="polite" className="text-sm">
        {status ? <p className={status.tone === "bad" ? "font-semibold text-bad" : status.tone === "good" ? "text-good" : "text-muted"}>{status.text}</p> : null}
      </div>
      <ConfirmButton size="sm" label={deleting ? "Deleting…" : `Delete`} busy={deleting} question={`Delete photo ${index + 1}? It is removed for good.`} confirmLabel="Delete photo" onConfirm={() => void remove()} className="self-start" />
    </div>
  );
}

/** The larger view: one photo at a time in a dialog, with previous and next (also ← and →). */
function PhotoViewer({ photos, index, onIndex, onBroken }: { photos: EvidencePhotoJson[]; index: number | null; onIndex: (i: number | null) => void; onBroken: (url: string) => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const photo = index !== null ? photos[index] : undefined;

  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (photo && !d.open) d.showModal();
    if (!photo && d.open) d.close();
  }, [photo]);

  const go = (step: number) => {
    if (index === null || !photos.length) return;
    onIndex((index + step + photos.length) % photos.length);
  };

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={() => onIndex(null)}
      onKeyDown={(e) => {
        if (e.key === "ArrowLeft") go(-1);
        if (e.key === "ArrowRight") go(1);
      }}
      className="m-auto w-[min(96vw,64rem)] max-w-none rounded-lg border border-line bg-surface p-0 text-ink backdrop:bg-black/75"
    >
      {photo && index !== null ? (
        <div className="flex flex-col gap-3 p-3 sm:p-4">
          <div className="flex items-start justify-between gap-3">
            <h2 id={titleId} className="text-lg font-bold">
              Photo {index + 1} of {photos.length}
            </h2>
            <Button size="sm" variant="secondary" onClick={() => onIndex(null)} autoFocus>
              Close
            </Button>
          </div>
          <figure className="flex flex-col gap-2">
            <div className="flex justify-center rounded bg-sunken">
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img
                key={photo.imageUrl}
                src={photo.imageUrl}
                alt={photo.caption || `Photo ${index + 1}, no caption`}
                width={photo.width ?? undefined}
                height={photo.height ?? undefined}
                className="h-auto max-h-[70vh] w-auto max-w-full object-contain"
                onError={() => onBroken(photo.imageUrl)}
              />
            </div>
            <figcaption className="flex flex-col gap-0.5">
              <span className={photo.caption ? "" : "text-muted italic"}>{photo.caption || "No caption"}</span>
              <span className="text-sm text-muted">
                {photo.width && photo.height ? `${photo.width} × ${photo.height} pixels` : ""}
                {photo.size ? ` · ${formatBytes(photo.size)}` : ""}
              </span>
            </figcaption>
          </figure>
          <div className="flex flex-wrap items-center justify-between gap-2">
            <div className="flex gap-2">
              {photos.length > 1 ? (
                <>
                  <Button size="sm" variant="secondary" onClick={() => go(-1)}>
                    ← Previous
                  </Button>
                  <Button size="sm" variant="secondary" onClick={() => go(1)}>
                    Next →
                  </Button>
                </>
              ) : null}
            </div>
            <a href={photo.imageUrl} target="_blank" rel="noopener noreferrer" className="text-sm">
              Open full size (the link works for a few minutes)
            </a>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}

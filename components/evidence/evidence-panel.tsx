"use client";

import type { ReactNode } from "react";
import { EvidenceGallery } from "./evidence-gallery";
import { EvidenceUploader } from "./evidence-uploader";
import type { EvidenceTarget } from "./types";

/**
 * Photos where they can still be added: the gallery (captions and delete on your own photos),
 * then the uploader. When `editable` is false (handed in, closed) only the gallery shows.
 */
export function EvidencePanel({
  target,
  editable,
  onBusyChange,
  label = "Photos",
  empty,
  what,
}: {
  target: EvidenceTarget;
  editable: boolean;
  onBusyChange?: (busy: number) => void;
  label?: string;
  empty?: ReactNode;
  what?: string;
}) {
  return (
    <div className="flex flex-col gap-3">
      <EvidenceGallery target={target} editable={editable} label={label} empty={empty ?? <p className="text-muted">No photos yet.</p>} />
      {editable ? <EvidenceUploader target={target} onBusyChange={onBusyChange} what={what} /> : null}
    </div>
  );
}

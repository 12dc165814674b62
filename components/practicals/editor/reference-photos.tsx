"use client";

import { useMemo } from "react";
import { EvidencePanel } from "@/components/evidence/evidence-panel";

/**
 * The teacher's reference photos (the set-up, what a colour change should look like). They belong
 * to the practical, not to this draft: they are stored as soon as they are added and show on
 * every version, and students see them beside the method.
 */
export function ReferencePhotos({ practicalId }: { practicalId: string }) {
  const target = useMemo(() => ({ practicalId }), [practicalId]);
  return (
    <section aria-labelledby="reference-photos-heading" className="flex flex-col gap-2 border-t border-line pt-5">
      <h3 id="reference-photos-heading" className="text-xl font-bold">
        Reference photos
      </h3>
      <p className="max-w-3xl text-muted">
        Show the apparatus set up, or what students should see. Photos belong to the practical rather than this draft: they are saved as soon as they are added, every version shows them, and students see them with the method.
      </p>
      <EvidencePanel target={target} editable label="Reference photos" what="photos" empty={<p className="text-muted">No reference photos yet.</p>} />
    </section>
  );
}

"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { formatDateTime } from "@/lib/utils";
import { sectionDiff, type Draft } from "../draft";
import { draftOf, type SavedVersion } from "./use-draft-saver";

/**
 * Shown when someone saved this draft while the teacher was editing it: both versions side by
 * side (title, when, and which sections differ), and a choice of which to keep.
 */
export function ConflictPanel({ mine, mineChangedAt, saved, onKeepMine, onTakeSaved }: { mine: Draft; mineChangedAt: Date | null; saved: SavedVersion; onKeepMine: () => Promise<boolean>; onTakeSaved: () => void }) {
  const [busy, setBusy] = useState(false);
  const diff = sectionDiff(mine, draftOf(saved));
  const differing = diff.filter((d) => d.differs);
  return (
    <section aria-labelledby="conflict-title" className="flex flex-col gap-3 rounded-lg border-2 border-bad/60 bg-surface p-4" tabIndex={-1} id="conflict-panel">
      <h2 id="conflict-title" className="text-lg font-bold">
        Someone else saved this practical while you were editing
      </h2>
      <p>Nothing has been overwritten. Compare the two versions and choose which one to keep.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="rounded-md border border-line p-3">
          <h3 className="font-bold">Yours (in this browser)</h3>
          <p className="break-words">{mine.title || <span className="text-muted">(no title)</span>}</p>
          <p className="text-sm text-muted">Last changed {mineChangedAt ? formatDateTime(mineChangedAt) : "just now"}</p>
        </div>
        <div className="rounded-md border border-line p-3">
          <h3 className="font-bold">The saved one</h3>
          <p className="break-words">{saved.title || <span className="text-muted">(no title)</span>}</p>
          <p className="text-sm text-muted">Saved {formatDateTime(saved.updatedAt)}</p>
        </div>
      </div>
      <div>
        <h3 className="font-bold">Section by section</h3>
        <ul className="mt-1 grid gap-1 sm:grid-cols-2">
          {diff.map((d) => (
            <li key={d.key} className="flex items-center gap-2">
              <span aria-hidden="true" className={d.differs ? "text-bad" : "text-good"}>
                {d.differs ? "≠" : "="}
              </span>
              <span>
                {d.label}: <strong>{d.differs ? "differs" : "the same"}</strong>
              </span>
            </li>
          ))}
        </ul>
        {differing.length === 0 ? <p className="mt-1 text-sm text-muted">The two versions say the same thing; keeping either is safe.</p> : null}
      </div>
      <p className="text-sm text-muted">The prep list is edited on its own page, so the saved prep list is kept whichever you choose.</p>
      <div className="flex flex-wrap gap-2">
        <Button
          disabled={busy}
          onClick={async () => {
            setBusy(true);
            await onKeepMine();
            setBusy(false);
          }}
        >
          Keep mine (save it over theirs)
        </Button>
        <Button variant="secondary" disabled={busy} onClick={onTakeSaved}>
          Take the saved one (drop my changes)
        </Button>
      </div>
    </section>
  );
}

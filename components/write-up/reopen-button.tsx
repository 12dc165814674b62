"use client";

import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";

/** "Reopen for the student": asks first, then unlocks the write-up so the student can change it (logged). */
export function ReopenButton({ writeUpId, studentName, canReopen }: { writeUpId: string; studentName: string; canReopen: boolean }) {
  const id = useId();
  const router = useRouter();
  const dialogRef = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState(false);

  useEffect(() => {
    const d = dialogRef.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);

  const reopen = async () => {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/write-ups/${writeUpId}/reopen`, { method: "POST" });
      setDone(true);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? (e.status === 0 ? "Could not reach Meniscus. Check your connection and try again." : e.message) : "Something went wrong. Please try again.");
    } finally {
      setBusy(false);
    }
  };

  // Kept mounted after reopening (the page refreshes and can no longer reopen), so the confirmation stays in view.
  if (!canReopen && !done) return null;
  return (
    <div className="flex flex-col gap-2">
      {done ? null : (
        <div>
          <Button variant="secondary" onClick={() => setOpen(true)} disabled={busy}>
            {busy ? "Reopening…" : "Reopen for the student"}
          </Button>
        </div>
      )}
      <div aria-live="polite">
        {done ? <p className="font-semibold text-good">Reopened: {studentName} can change the write-up and hand it in again.</p> : null}
        {error ? (
          <p role="alert" className="font-semibold text-bad">
            {error}
          </p>
        ) : null}
      </div>
      <dialog
        ref={dialogRef}
        aria-labelledby={`${id}-title`}
        className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-line bg-surface p-5 text-ink shadow-xl backdrop:bg-black/40"
        onClose={() => setOpen(false)}
      >
        <h2 id={`${id}-title`} className="text-xl font-bold">
          Reopen this write-up?
        </h2>
        <p className="mt-2">
          {studentName} will be able to change it and must hand it in again. Any mark already given stays on record, and the reopening is logged.
        </p>
        <div className="mt-4 flex flex-wrap gap-2">
          <Button
            onClick={() => {
              setOpen(false);
              void reopen();
            }}
          >
            Reopen it
          </Button>
          <Button variant="secondary" autoFocus onClick={() => setOpen(false)}>
            Keep it locked
          </Button>
        </div>
      </dialog>
    </div>
  );
}

"use client";

import { useEffect, useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";

export type HandInItem = { ok: boolean; text: string; blocking: boolean };

/**
 * Handing in: a short checklist (what must be done first, and what is only advice), then a
 * confirmation that says the write-up locks and whether it will count as late.
 */
export function HandInPanel({
  items,
  dueText,
  lateNote,
  busy,
  error,
  onHandIn,
}: {
  items: HandInItem[];
  dueText: string;
  /** Said in the confirmation when handing in now would be late; null when on time. */
  lateNote: string | null;
  busy: boolean;
  error: string | null;
  onHandIn: () => void;
}) {
  const id = useId();
  const dialogRef = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState(false);
  const blocked = items.some((i) => i.blocking && !i.ok);

  useEffect(() => {
    const d = dialogRef.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);

  return (
    <div className="flex flex-col gap-3">
      <p>{dueText}</p>
      <ul className="flex flex-col gap-1.5" aria-label="Before you hand in">
        {items.map((item, i) => (
          <li key={i} className="flex items-start gap-2">
            <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className={item.ok ? "mt-0.5 shrink-0 text-good" : item.blocking ? "mt-0.5 shrink-0 text-bad" : "mt-0.5 shrink-0 text-warn"}>
              {item.ok ? (
                <path d="M4 10.5 8 14.5 16 6" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
              ) : item.blocking ? (
                <path d="M5 5l10 10M15 5 5 15" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
              ) : (
                <>
                  <circle cx="10" cy="10" r="7.5" fill="none" stroke="currentColor" strokeWidth="1.8" />
                  <path d="M10 6v5" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
                  <circle cx="10" cy="14" r="1" fill="currentColor" />
                </>
              )}
            </svg>
            <span>
              <span className="sr-only">{item.ok ? "Done: " : item.blocking ? "Needed first: " : "Worth a look: "}</span>
              {item.text}
            </span>
          </li>
        ))}
      </ul>
      <div>
        <Button onClick={() => setOpen(true)} disabled={blocked || busy}>
          {busy ? "Handing in…" : "Hand in"}
        </Button>
      </div>
      <div aria-live="polite">
        {error ? (
          <p role="alert" className="font-semibold text-bad">
            {error}
          </p>
        ) : null}
      </div>
      <dialog
        ref={dialogRef}
        aria-labelledby={`${id}-title`}
        aria-describedby={`${id}-text`}
        className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-line bg-surface p-5 text-ink shadow-xl backdrop:bg-black/40"
        onClose={() => setOpen(false)}
      >
        <h2 id={`${id}-title`} className="text-xl font-bold">
          Hand in your write-up?
        </h2>
        <div id={`${id}-text`} className="mt-2 flex flex-col gap-2">
          <p>Once it is handed in you cannot change it, unless your teacher reopens it for you.</p>
          {lateNote ? <p className="font-semibold text-warn">{lateNote}</p> : null}
        </div>
        <div className="mt-4 flex flex-wrap gap-2">
          <Button
            autoFocus
            onClick={() => {
              setOpen(false);
              onHandIn();
            }}
          >
            Hand it in
          </Button>
          <Button variant="secondary" onClick={() => setOpen(false)}>
            Not yet
          </Button>
        </div>
      </dialog>
    </div>
  );
}

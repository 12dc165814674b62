"use client";

import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Textarea } from "@/components/ui/field";

const MAX = 1500;

/**
 * The teacher's comment on one part of the write-up. Closed until asked for (or until there is a
 * comment), so the write-up stays easy to read; prints as plain text.
 */
export function CommentBox({
  sectionKey,
  label,
  value,
  onChange,
  error,
  disabled = false,
}: {
  sectionKey: string;
  label: string;
  value: string;
  onChange: (next: string) => void;
  error?: string[];
  disabled?: boolean;
}) {
  const [open, setOpen] = useState(value.trim() !== "" || !!error?.length);
  const [focusOnOpen, setFocusOnOpen] = useState(false);
  const ref = useRef<HTMLTextAreaElement>(null);
  const id = `comment-${sectionKey.replace(/[^A-Za-z0-9_-]/g, "-")}`;
  useEffect(() => {
    if (open && focusOnOpen) ref.current?.focus();
  }, [open, focusOnOpen]);

  if (!open || disabled) {
    if (disabled && !value.trim()) return null;
    if (disabled) {
      return (
        <p className="rounded-md border-l-4 border-accent bg-accent-soft px-3 py-2">
          <span className="font-semibold">Teacher&apos;s comment: </span>
          {value}
        </p>
      );
    }
    return (
      <div className="no-print">
        <Button
          variant="ghost"
          size="sm"
          onClick={() => {
            setFocusOnOpen(true);
            setOpen(true);
          }}
        >
          Comment on {label}
        </Button>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-1 rounded-md border-l-4 border-accent bg-accent-soft p-2" data-comment={sectionKey}>
      <label htmlFor={id} className="text-sm font-semibold">
        Your comment on {label}
      </label>
      <Textarea
        ref={ref}
        id={id}
        value={value}
        maxLength={MAX}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error?.length ? true : undefined}
        aria-describedby={error?.length ? `${id}-error` : undefined}
        className="min-h-20 print:hidden"
      />
      <p className="hidden whitespace-pre-wrap print:block">{value}</p>
      <div className="flex items-center justify-between gap-2 text-xs text-muted print:hidden">
        <span>
          {value.length} / {MAX}
        </span>
        {!value.trim() ? (
          <Button variant="ghost" size="sm" onClick={() => setOpen(false)}>
            Close
          </Button>
        ) : null}
      </div>
      <div aria-live="polite">
        {error?.length ? (
          <p id={`${id}-error`} className="text-sm font-semibold text-bad">
            {error.join(" ")}
          </p>
        ) : null}
      </div>
    </div>
  );
}

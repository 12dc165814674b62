"use client";

import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { cn } from "@/lib/utils";

const TONES = {
  /** Deleting, removing, archiving: red, and a red button acts. */
  danger: { box: "border-bad/50 bg-bad-soft", confirm: "danger" },
  /** A change to something already in use (a practical's contents): amber. */
  caution: { box: "border-warn/50 bg-warn-soft", confirm: "primary" },
  /** Worth a second thought but not harmful (finishing a sample, returning marks). */
  neutral: { box: "border-brand/40 bg-brand-soft", confirm: "primary" },
} as const satisfies Record<string, { box: string; confirm: ButtonVariant }>;

/**
 * A button for something hard to undo. The first press asks the question in place, with the
 * consequence spelled out; only the second, clearly named button acts. Escape or the back-out
 * button leaves things as they were, and focus goes back to where it was.
 */
export function ConfirmButton({
  label,
  question,
  confirmLabel,
  backOutLabel = "Keep it as it is",
  onConfirm,
  busy = false,
  variant = "danger",
  size = "md",
  tone = variant === "danger" ? "danger" : "neutral",
  className,
}: {
  label: ReactNode;
  question: ReactNode;
  confirmLabel: string;
  backOutLabel?: string;
  onConfirm: () => void;
  busy?: boolean;
  /** The first button's look. */
  variant?: ButtonVariant;
  size?: "sm" | "md";
  /** The question's look; by default red for a danger button, otherwise blue. */
  tone?: keyof typeof TONES;
  className?: string;
}) {
  const [asking, setAsking] = useState(false);
  const boxRef = useRef<HTMLDivElement>(null);
  const triggerRef = useRef<HTMLButtonElement>(null);
  const wasAsking = useRef(false);
  const questionId = useId();

  useEffect(() => {
    if (asking) boxRef.current?.focus();
    else if (wasAsking.current) triggerRef.current?.focus();
    wasAsking.current = asking;
  }, [asking]);

  if (!asking) {
    return (
      <Button ref={triggerRef} variant={variant} size={size} className={className} onClick={() => setAsking(true)} disabled={busy}>
        {label}
      </Button>
    );
  }
  return (
    <div
      ref={boxRef}
      tabIndex={-1}
      role="group"
      aria-labelledby={questionId}
      className={cn("flex w-full flex-col gap-2 rounded-md border p-3 sm:w-auto sm:min-w-60", TONES[tone].box, className)}
      onKeyDown={(e) => {
        if (e.key === "Escape") setAsking(false);
      }}
    >
      <p id={questionId} className="font-semibold text-ink">
        {question}
      </p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant={TONES[tone].confirm}
          size="sm"
          disabled={busy}
          onClick={() => {
            setAsking(false);
            onConfirm();
          }}
        >
          {confirmLabel}
        </Button>
        <Button variant="secondary" size="sm" onClick={() => setAsking(false)}>
          {backOutLabel}
        </Button>
      </div>
    </div>
  );
}

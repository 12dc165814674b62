"use client";

import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { cn } from "@/lib/utils";

/**
 * A button for a change that is hard to undo: the first press asks "are you sure?" in place, with
 * the consequence spelled out; only the second, clearly labelled button acts. Escape cancels.
 */
export function ConfirmAction({
  label,
  question,
  confirmLabel,
  onConfirm,
  busy = false,
  variant = "danger",
  size = "md",
  className,
}: {
  label: ReactNode;
  question: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  busy?: boolean;
  variant?: ButtonVariant;
  size?: "sm" | "md";
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
      className={cn("flex min-w-60 flex-col gap-2 rounded-md border p-3", variant === "danger" ? "border-bad/50 bg-bad-soft" : "border-brand/40 bg-brand-soft", className)}
      onKeyDown={(e) => {
        if (e.key === "Escape") setAsking(false);
      }}
    >
      <p id={questionId} className="font-semibold text-ink">
        {question}
      </p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant={variant === "danger" ? "danger" : "primary"}
          size="sm"
          disabled={busy}
          onClick={() => {
            onConfirm();
            setAsking(false);
          }}
        >
          {confirmLabel}
        </Button>
        <Button variant="secondary" size="sm" onClick={() => setAsking(false)}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

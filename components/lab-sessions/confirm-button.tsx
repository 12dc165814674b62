"use client";

import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { cn } from "@/lib/utils";

/**
 * A button for something hard to undo. The first press asks the question in place, saying what
 * will happen; only the second, clearly named button acts. Escape or "Keep it" backs out.
 */
export function ConfirmButton({
  label,
  question,
  confirmLabel,
  backOutLabel = "Keep it",
  onConfirm,
  busy = false,
  variant = "danger",
  size = "md",
  className,
}: {
  label: ReactNode;
  question: ReactNode;
  confirmLabel: string;
  backOutLabel?: string;
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
      className={cn("flex flex-col gap-2 rounded-md border border-bad/50 bg-bad-soft p-3", className)}
      onKeyDown={(e) => {
        if (e.key === "Escape") setAsking(false);
      }}
    >
      <p id={questionId} className="font-semibold text-ink">
        {question}
      </p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant="danger"
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

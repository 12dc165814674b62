"use client";

import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { cn } from "@/lib/utils";

/**
 * A button that asks first: the first press shows the question in place with the consequence
 * spelled out; only the second, clearly named button acts. Escape or "Keep it" backs out.
 */
export function ConfirmButton({
  label,
  question,
  confirmLabel,
  onConfirm,
  busy = false,
  variant = "secondary",
  className,
}: {
  label: ReactNode;
  question: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  busy?: boolean;
  variant?: ButtonVariant;
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
      <Button ref={triggerRef} size="sm" variant={variant} className={className} disabled={busy} onClick={() => setAsking(true)}>
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
      className={cn("flex w-full flex-col gap-2 rounded-md border border-warn/50 bg-warn-soft p-3", className)}
      onKeyDown={(e) => {
        if (e.key === "Escape") setAsking(false);
      }}
    >
      <p id={questionId} className="font-semibold">
        {question}
      </p>
      <div className="flex flex-wrap gap-2">
        <Button
          size="sm"
          variant="primary"
          disabled={busy}
          onClick={() => {
            onConfirm();
            setAsking(false);
          }}
        >
          {confirmLabel}
        </Button>
        <Button size="sm" variant="ghost" onClick={() => setAsking(false)}>
          Keep it as it is
        </Button>
      </div>
    </div>
  );
}

"use client";

import { useEffect, useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/lib/utils";
import { ANOMALY_RULE, type AnomalyFlag } from "@/lib/write-ups/table-validation";

/**
 * The student's decision about one anomalous reading: leave it out of the mean or keep it in,
 * always with a reason. Non-modal: it sits under the grid so it is never clipped on a phone, and
 * Escape or Cancel returns to the cell.
 */
export function DecisionPanel({
  heading,
  row,
  reading,
  anomaly,
  onSave,
  onRemove,
  onClose,
}: {
  heading: string;
  row: number;
  reading: string;
  anomaly: AnomalyFlag;
  onSave: (decision: { include: boolean; reason: string }) => void;
  onRemove: (() => void) | null;
  onClose: () => void;
}) {
  const id = useId();
  const [include, setInclude] = useState<boolean>(anomaly.decision ? anomaly.decision.include : !anomaly.excludedByRule);
  const [reason, setReason] = useState(anomaly.decision?.reason ?? "");
  const [error, setError] = useState<string | null>(null);
  const first = useRef<HTMLInputElement>(null);

  useEffect(() => {
    first.current?.focus();
  }, []);

  const save = () => {
    if (!reason.trim()) {
      setError(include ? "Say why you are keeping this reading in, so your teacher can follow your thinking." : "Say why you are leaving this reading out, for example what went wrong in that run.");
      return;
    }
    onSave({ include, reason: reason.trim() });
  };

  return (
    <div
      role="dialog"
      aria-modal="false"
      aria-labelledby={`${id}-title`}
      aria-describedby={`${id}-why`}
      className="rounded-lg border-2 border-accent bg-surface p-4"
      onKeyDown={(e) => {
        if (e.key === "Escape") {
          e.stopPropagation();
          onClose();
        }
      }}
    >
      <h4 id={`${id}-title`} className="font-bold">
        Row {row + 1}, {heading}: {reading}
      </h4>
      <p id={`${id}-why`} className="mt-1">
        {anomaly.message}
      </p>
      {anomaly.excludedByRule ? <p className="mt-1 text-sm text-muted">{ANOMALY_RULE}</p> : null}
      <fieldset className="mt-3">
        <legend className="font-semibold">What should happen to this reading?</legend>
        <div className="mt-1 flex flex-col gap-1 sm:flex-row sm:gap-4">
          <label className="flex min-h-11 items-center gap-2">
            <input ref={first} type="radio" name={`${id}-choice`} className="size-5 accent-[var(--brand)]" checked={!include} onChange={() => setInclude(false)} />
            Leave it out of the mean
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" name={`${id}-choice`} className="size-5 accent-[var(--brand)]" checked={include} onChange={() => setInclude(true)} />
            Keep it in the mean
          </label>
        </div>
      </fieldset>
      <label htmlFor={`${id}-reason`} className="mt-2 block font-semibold">
        Why?
      </label>
      <textarea
        id={`${id}-reason`}
        value={reason}
        maxLength={300}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        onChange={(e) => {
          setReason(e.target.value);
          if (error && e.target.value.trim()) setError(null);
        }}
        placeholder={include ? "For example: the other runs were done at a different temperature" : "For example: I started the stopwatch late on this run"}
        className={cn("mt-1 min-h-20 w-full rounded-md border border-line bg-surface px-3 py-2 text-base text-ink placeholder:text-muted", error && "border-bad")}
      />
      <div aria-live="polite">
        {error ? (
          <p id={`${id}-error`} className="text-sm font-semibold text-bad">
            {error}
          </p>
        ) : null}
      </div>
      <div className="mt-3 flex flex-wrap gap-2">
        <Button onClick={save}>Save decision</Button>
        <Button variant="secondary" onClick={onClose}>
          Cancel
        </Button>
        {onRemove ? (
          <Button variant="ghost" onClick={onRemove}>
            Remove my decision
          </Button>
        ) : null}
      </div>
    </div>
  );
}

"use client";

import { useId } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/lib/utils";
import type { ColumnTemplate } from "@/lib/validation/practicals";
import type { TangentVerdict } from "@/lib/write-ups/graph-data";
import { columnHeading } from "@/lib/write-ups/table-validation";
import { draftNumber, type TangentDraft } from "./tangent-draft";

const input =
  "min-h-11 w-full rounded-md border border-line bg-surface px-3 py-2 text-right text-base tabular-nums text-ink aria-[invalid=true]:border-bad read-only:bg-sunken";

/**
 * The tangent's numbers as boxes (the keyboard way to draw it): the chosen time and the two
 * points, with the gradient of the line and whether it touches the curve.
 */
export function TangentControls({
  x,
  y,
  draft,
  placing,
  hasPoints,
  readOnly,
  gradientText,
  verdict,
  onDraftChange,
  onPlace,
  onRemove,
}: {
  x: ColumnTemplate;
  y: ColumnTemplate;
  draft: TangentDraft;
  placing: 0 | 1 | 2;
  hasPoints: boolean;
  readOnly: boolean;
  gradientText: string | null;
  verdict: TangentVerdict | null;
  onDraftChange: (next: TangentDraft) => void;
  onPlace: () => void;
  onRemove: (() => void) | null;
}) {
  const id = useId();
  const name = x.symbol.trim() || x.quantity;
  const bad = (field: keyof TangentDraft) => draft[field].trim() !== "" && draftNumber(draft[field]) === null;
  const x1 = draftNumber(draft.x1);
  const x2 = draftNumber(draft.x2);
  const sameX = x1 !== null && x1 === x2;
  const field = (key: keyof TangentDraft, label: string) => (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={`${id}-${key}`} className="text-sm font-semibold">
        {label}
      </label>
      <input
        id={`${id}-${key}`}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        maxLength={24}
        className={input}
        value={draft[key]}
        readOnly={readOnly}
        aria-invalid={bad(key) || undefined}
        aria-describedby={bad(key) ? `${id}-${key}-error` : undefined}
        onChange={(e) => onDraftChange({ ...draft, [key]: e.target.value })}
      />
      {bad(key) ? (
        <p id={`${id}-${key}-error`} className="text-sm font-semibold text-bad">
          Type a number, like 12.5.
        </p>
      ) : null}
    </div>
  );

  return (
    <fieldset className="rounded-lg border border-line p-3">
      <legend className="px-1 font-bold">Your tangent</legend>
      {!readOnly ? (
        <p className="text-sm text-muted">
          Type the {x.quantity} where you want the tangent. Then tap or click the graph twice to put two points on a straight line that just touches the curve there, and drag
          them to adjust; or type their coordinates below. Points far apart make a big triangle and a more accurate gradient.
        </p>
      ) : null}
      <div className="mt-2 grid max-w-xs">{field("at", `Tangent at ${name} / ${x.unit || "no unit"}`)}</div>
      <div className="mt-3 grid grid-cols-2 items-end gap-x-3 gap-y-2 sm:grid-cols-4">
        {field("x1", `Point 1: ${columnHeading(x)}`)}
        {field("y1", `Point 1: ${columnHeading(y)}`)}
        {field("x2", `Point 2: ${columnHeading(x)}`)}
        {field("y2", `Point 2: ${columnHeading(y)}`)}
      </div>
      {sameX ? <p className="mt-1 text-sm font-semibold text-bad">The two points have the same {x.quantity}, so the line has no gradient. Move them apart sideways.</p> : null}
      {!readOnly ? (
        <div className="mt-3 flex flex-wrap items-center gap-2">
          <Button variant="secondary" size="sm" onClick={onPlace} aria-pressed={placing !== 0}>
            {placing !== 0 ? "Stop placing points" : hasPoints ? "Place the points again" : "Place the points on the graph"}
          </Button>
          {onRemove ? (
            <Button variant="ghost" size="sm" onClick={onRemove}>
              Remove the tangent
            </Button>
          ) : null}
          <p className="text-sm text-muted" aria-live="polite">
            {placing === 1 ? "Tap or click the graph to place point 1." : placing === 2 ? "Now tap or click the graph to place point 2." : ""}
          </p>
        </div>
      ) : null}
      {gradientText ? (
        <p className="mt-3">
          <span className="font-semibold">Gradient of your tangent:</span> {gradientText}
        </p>
      ) : null}
      {verdict ? (
        <p
          role="status"
          className={cn(
            "mt-2 flex items-start gap-2 rounded-md border px-3 py-2",
            verdict.touches === true ? "border-good/40 bg-good-soft" : verdict.touches === false ? "border-warn/40 bg-warn-soft" : "border-line bg-sunken",
          )}
        >
          <span aria-hidden="true" className="font-bold">
            {verdict.touches === true ? "✓" : verdict.touches === false ? "!" : "i"}
          </span>
          <span>{verdict.message}</span>
        </p>
      ) : null}
    </fieldset>
  );
}

"use client";

import { useRef, type KeyboardEvent } from "react";
import { Textarea } from "@/components/ui/field";
import { cn } from "@/lib/utils";
import type { CriterionChoice, RubricCriterion } from "./types";

const isTyping = (el: EventTarget) => el instanceof HTMLTextAreaElement || (el instanceof HTMLInputElement && el.type !== "radio" && el.type !== "checkbox");

/**
 * One rubric criterion as a group of radio buttons, lowest level first, each with its marks and
 * descriptor. When the calculation checks suggest a level it is pre-chosen and labelled, with the
 * reason; choosing another level asks why (the server insists on it too). With the focus anywhere
 * in the group, a digit picks that level: 1 is the lowest.
 */
export function LevelPicker({
  criterion,
  idPrefix,
  value,
  onChange,
  suggestion,
  disabled = false,
  levelError,
  reasonError,
}: {
  criterion: Pick<RubricCriterion, "id" | "title" | "description" | "levels">;
  idPrefix: string;
  value: CriterionChoice | undefined;
  onChange: (next: CriterionChoice) => void;
  /** The level the calculation checks suggest, with why; absent when nothing is linked or nothing ran. */
  suggestion?: { levelId: string; reason: string } | null;
  disabled?: boolean;
  levelError?: string[];
  reasonError?: string[];
}) {
  const groupRef = useRef<HTMLFieldSetElement>(null);
  const max = Math.max(...criterion.levels.map((l) => l.marks));
  const name = `${idPrefix}-${criterion.id}`;
  const overridden = !!suggestion && !!value && value.levelId !== suggestion.levelId;
  const suggested = suggestion ? criterion.levels.find((l) => l.id === suggestion.levelId) : undefined;
  const ids = { description: `${name}-description`, suggestion: `${name}-suggestion`, levelError: `${name}-level-error`, reason: `${name}-reason` };

  const choose = (levelId: string) => onChange({ levelId, overrideReason: value?.overrideReason ?? "" });

  const onKeyDown = (e: KeyboardEvent<HTMLFieldSetElement>) => {
    if (disabled || e.altKey || e.ctrlKey || e.metaKey || isTyping(e.target) || !/^[1-9]$/.test(e.key)) return;
    const level = criterion.levels[Number(e.key) - 1];
    if (!level) return;
    e.preventDefault();
    choose(level.id);
    groupRef.current?.querySelector<HTMLInputElement>(`input[value="${CSS.escape(level.id)}"]`)?.focus();
  };

  const describedBy = [criterion.description ? ids.description : null, suggestion ? ids.suggestion : null, levelError?.length ? ids.levelError : null].filter(Boolean).join(" ") || undefined;

  return (
    <fieldset ref={groupRef} onKeyDown={onKeyDown} aria-describedby={describedBy} aria-invalid={levelError?.length ? true : undefined} className="flex flex-col gap-2 rounded-lg border border-line bg-surface p-3 focus-within:border-brand print:break-inside-avoid" data-criterion={criterion.id}>
      <legend className="px-1 font-bold">
        {criterion.title} <span className="font-normal text-muted">(out of {max})</span>
      </legend>
      {criterion.description ? (
        <p id={ids.description} className="text-sm text-muted">
          {criterion.description}
        </p>
      ) : null}
      {suggestion && suggested ? (
        <p id={ids.suggestion} className="rounded-md border border-brand/30 bg-brand-soft px-2 py-1 text-sm">
          <span className="font-semibold">The calculation checks suggest “{suggested.label}”.</span> {suggestion.reason}
        </p>
      ) : null}
      <div className="flex flex-col gap-1.5">
        {criterion.levels.map((l, i) => {
          const checked = value?.levelId === l.id;
          const id = `${name}-${l.id}`;
          return (
            <label
              key={l.id}
              htmlFor={id}
              className={cn(
                "flex cursor-pointer items-start gap-2 rounded-md border px-2 py-1.5",
                checked ? "border-brand bg-brand-soft" : "border-line hover:border-brand",
                disabled && "cursor-default hover:border-line",
                !checked && "print:hidden",
              )}
            >
              <input
                type="radio"
                id={id}
                name={name}
                value={l.id}
                checked={checked}
                disabled={disabled}
                onChange={() => choose(l.id)}
                className="mt-1 size-4 shrink-0 accent-brand"
              />
              <span className="flex min-w-0 flex-1 flex-col">
                <span className="flex flex-wrap items-center gap-x-2">
                  <span className="font-semibold">{l.label}</span>
                  <span className="text-sm text-muted">
                    {l.marks} mark{l.marks === 1 ? "" : "s"}
                  </span>
                  {suggestion?.levelId === l.id ? <span className="rounded border border-brand/40 px-1 text-xs font-semibold text-brand-strong">suggested</span> : null}
                </span>
                {l.descriptor ? <span className="text-sm">{l.descriptor}</span> : null}
              </span>
              {!disabled && i < 9 ? (
                <kbd aria-hidden="true" className="shrink-0 rounded border border-line bg-paper px-1.5 text-xs text-muted print:hidden">
                  {i + 1}
                </kbd>
              ) : null}
            </label>
          );
        })}
      </div>
      <div aria-live="polite">
        {levelError?.length ? (
          <p id={ids.levelError} className="text-sm font-semibold text-bad">
            {levelError.join(" ")}
          </p>
        ) : null}
      </div>
      {overridden ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={ids.reason} className="text-sm font-semibold">
            Why “{criterion.levels.find((l) => l.id === value?.levelId)?.label}” rather than the suggested “{suggested?.label}”?
          </label>
          <Textarea
            id={ids.reason}
            value={value?.overrideReason ?? ""}
            maxLength={400}
            disabled={disabled}
            onChange={(e) => onChange({ levelId: value!.levelId, overrideReason: e.target.value })}
            aria-invalid={reasonError?.length ? true : undefined}
            aria-describedby={`${ids.reason}-hint${reasonError?.length ? ` ${ids.reason}-error` : ""}`}
            className="min-h-16"
          />
          <p id={`${ids.reason}-hint`} className="text-xs text-muted print:hidden">
            Needed because you chose a different level from the checks. It is kept with the mark.
          </p>
          <div aria-live="polite">
            {reasonError?.length ? (
              <p id={`${ids.reason}-error`} className="text-sm font-semibold text-bad">
                {reasonError.join(" ")}
              </p>
            ) : null}
          </div>
        </div>
      ) : null}
    </fieldset>
  );
}

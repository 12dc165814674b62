"use client";

import type { ReactNode } from "react";
import { cn } from "@/lib/utils";

/**
 * A labelled set of checkboxes that edits a list of values. Its legend names the group; an error
 * is linked to the group and announced.
 */
export function CheckboxGroup({
  id,
  legend,
  hint,
  options,
  value,
  onChange,
  error,
  columns = false,
}: {
  id: string;
  legend: ReactNode;
  hint?: ReactNode;
  options: { value: string; label: ReactNode; description?: ReactNode }[];
  value: readonly string[];
  onChange: (next: string[]) => void;
  error?: string;
  columns?: boolean;
}) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset id={id} className="flex flex-col gap-1" aria-describedby={[hintId, errorId].filter(Boolean).join(" ") || undefined} aria-invalid={error ? true : undefined}>
      <legend className="mb-1 font-semibold">{legend}</legend>
      {hint ? (
        <p id={hintId} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      <div className={cn("flex flex-col gap-1", columns && "sm:grid sm:grid-cols-2 sm:gap-x-4")}>
        {options.map((o) => {
          const optionId = `${id}-${o.value}`;
          const checked = value.includes(o.value);
          return (
            <div key={o.value} className="flex items-start gap-3 rounded-md px-1 hover:bg-sunken">
              <input
                id={optionId}
                type="checkbox"
                className="mt-3 size-5 shrink-0 cursor-pointer accent-brand"
                checked={checked}
                aria-describedby={o.description ? `${optionId}-description` : undefined}
                onChange={(e) => onChange(e.target.checked ? [...value, o.value] : value.filter((v) => v !== o.value))}
              />
              <div className="flex min-h-11 flex-1 flex-col justify-center py-2">
                <label htmlFor={optionId} className="cursor-pointer">
                  {o.label}
                </label>
                {o.description ? (
                  <span id={`${optionId}-description`} className="text-sm text-muted">
                    {o.description}
                  </span>
                ) : null}
              </div>
            </div>
          );
        })}
      </div>
      <div aria-live="polite">
        {error ? (
          <p id={errorId} className="text-sm font-semibold text-bad">
            {error}
          </p>
        ) : null}
      </div>
    </fieldset>
  );
}

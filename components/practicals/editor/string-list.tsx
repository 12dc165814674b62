"use client";

import { useId, useRef } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { fieldDomId } from "../draft";
import { PathErrors } from "./fields";
import { removeAt, replaceAt } from "./state";

/**
 * A list of short texts (apparatus, controlled variables, protective equipment). Blank lines are
 * allowed while typing and left out when the draft is saved. Enter in a line adds the next one.
 */
export function StringList({
  path,
  legend,
  hint,
  itemLabel,
  addLabel,
  items,
  onChange,
  maxItems,
  maxLength,
  placeholder,
}: {
  path: string;
  legend: string;
  hint?: string;
  itemLabel: string;
  addLabel: string;
  items: string[];
  onChange: (items: string[]) => void;
  maxItems: number;
  maxLength: number;
  placeholder?: string;
}) {
  const baseId = useId();
  const refs = useRef<(HTMLInputElement | null)[]>([]);
  const focusSoon = (i: number) => setTimeout(() => refs.current[i]?.focus(), 0);
  const add = () => {
    if (items.length >= maxItems) return;
    onChange([...items, ""]);
    focusSoon(items.length);
  };
  return (
    <fieldset id={fieldDomId(path)} tabIndex={-1} className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold">{legend}</legend>
      {hint ? <p className="-mt-1 text-sm text-muted">{hint}</p> : null}
      {items.length ? (
        <ul className="flex flex-col gap-2">
          {items.map((item, i) => (
            <li key={i} className="flex items-center gap-2">
              <label htmlFor={`${baseId}-${i}`} className="sr-only">
                {itemLabel} {i + 1}
              </label>
              <Input
                ref={(el) => {
                  refs.current[i] = el;
                }}
                id={`${baseId}-${i}`}
                value={item}
                maxLength={maxLength}
                placeholder={placeholder}
                onChange={(e) => onChange(replaceAt(items, i, e.target.value))}
                onKeyDown={(e) => {
                  if (e.key === "Enter") {
                    e.preventDefault();
                    if (i === items.length - 1) add();
                    else refs.current[i + 1]?.focus();
                  }
                }}
              />
              <Button size="sm" variant="ghost" aria-label={`Remove ${itemLabel.toLowerCase()} ${i + 1}${item.trim() ? ` (${item.trim()})` : ""}`} onClick={() => onChange(removeAt(items, i))}>
                Remove
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-muted">None yet.</p>
      )}
      <PathErrors path={path} />
      <div>
        <Button size="sm" variant="secondary" onClick={add} disabled={items.length >= maxItems}>
          {addLabel}
        </Button>
      </div>
    </fieldset>
  );
}

"use client";

import { useEffect, useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";

/**
 * Checks a link address the way the server does (http, https or mailto only). A bare address
 * like "www.example.org" gets https:// in front; anything else (javascript:, data:, file:) is
 * refused with a message.
 */
export function normaliseHref(raw: string): { ok: true; href: string } | { ok: false; message: string } {
  const text = raw.trim();
  if (!text) return { ok: false, message: "Type the address of the page, for example https://www.example.org/safety." };
  if (/^(https?:\/\/)[^\s]+$/i.test(text)) return { ok: true, href: text };
  if (/^mailto:[^\s@]+@[^\s@]+$/i.test(text)) return { ok: true, href: text };
  if (/^[a-z][a-z0-9+.-]*:/i.test(text)) return { ok: false, message: "Links must start with http://, https:// or mailto:." };
  if (/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(text)) return { ok: true, href: `mailto:${text}` };
  if (/^[^\s/]+\.[^\s]+$/.test(text)) return { ok: true, href: `https://${text}` };
  return { ok: false, message: "That does not look like a web address. Links must start with http://, https:// or mailto:." };
}

export function LinkPanel({ initial, hasLink, onApply, onRemove, onCancel }: { initial: string; hasLink: boolean; onApply: (href: string) => void; onRemove: () => void; onCancel: () => void }) {
  const id = useId();
  const [text, setText] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  useEffect(() => inputRef.current?.focus(), []);
  const apply = () => {
    const result = normaliseHref(text);
    if (!result.ok) {
      setError(result.message);
      inputRef.current?.focus();
      return;
    }
    onApply(result.href);
  };
  return (
    <div
      role="group"
      aria-labelledby={`${id}-label`}
      className="flex flex-col gap-2 border-b border-line bg-brand-soft/50 p-3"
      onKeyDown={(e) => {
        if (e.key === "Escape") {
          e.preventDefault();
          e.stopPropagation();
          onCancel();
        }
      }}
    >
      <label id={`${id}-label`} htmlFor={`${id}-input`} className="font-semibold">
        Link address
      </label>
      <Input
        ref={inputRef}
        id={`${id}-input`}
        value={text}
        inputMode="url"
        placeholder="https://"
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        onChange={(e) => {
          setText(e.target.value);
          setError(null);
        }}
        onKeyDown={(e) => {
          if (e.key === "Enter") {
            e.preventDefault();
            apply();
          }
        }}
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-bad" role="alert">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button size="sm" onClick={apply}>
          {hasLink ? "Update link" : "Add link"}
        </Button>
        {hasLink ? (
          <Button size="sm" variant="secondary" onClick={onRemove}>
            Remove link
          </Button>
        ) : null}
        <Button size="sm" variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

"use client";

import { RichEditorLazy } from "@/components/editor/rich-editor-lazy";
import type { RichTextDoc } from "@/lib/validation/rich-text";
import { fieldDomId, type Draft } from "../../draft";
import { PathErrors, TextAreaField, useFieldErrors } from "../fields";
import { changeContent, type Change } from "../state";

/** A labelled rich-text field, with its errors under it. */
export function RichField({ path, label, hint, value, onChange, generation }: { path: string; label: string; hint?: string; value: RichTextDoc; onChange: (doc: RichTextDoc) => void; generation: number }) {
  const id = fieldDomId(path);
  const errors = useFieldErrors(path);
  return (
    <div className="flex flex-col gap-1">
      <p id={`${id}-label`} className="font-semibold">
        {label}
      </p>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      <RichEditorLazy
        key={generation}
        id={id}
        labelId={`${id}-label`}
        value={value}
        onChange={onChange}
        invalid={!!errors}
        describedBy={[hint ? `${id}-hint` : "", errors ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined}
      />
      <PathErrors path={path} />
    </div>
  );
}

export function AimSection({ draft, change, generation }: { draft: Draft; change: Change; generation: number }) {
  return (
    <div className="flex flex-col gap-5">
      <TextAreaField
        path="content.aim"
        label="Aim"
        hint="One or two sentences: what students will find out. For example “Find how the rate of reaction changes as the acid gets more concentrated.”"
        rows={3}
        value={draft.content.aim}
        onChange={(aim) => changeContent(change, "aim", () => aim)}
      />
      <RichField
        path="content.introduction"
        label="Introduction"
        hint="Background students need before they start: the reaction, the idea being tested, what to look out for."
        value={draft.content.introduction}
        generation={generation}
        onChange={(doc) => changeContent(change, "introduction", () => doc)}
      />
    </div>
  );
}

export function MethodSection({ draft, change, generation }: { draft: Draft; change: Change; generation: number }) {
  return (
    <RichField
      path="content.method"
      label="Method"
      hint="Numbered steps work best. Use the Formula button for anything like rate = k[A]² or k = A e^(−Ea/RT)."
      value={draft.content.method}
      generation={generation}
      onChange={(doc) => changeContent(change, "method", () => doc)}
    />
  );
}

"use client";

import { useEffect, useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Textarea } from "@/components/ui/field";
import { checkLatex, latexToHtml } from "./katex-html";

export type FormulaTarget = { mode: "insert"; block: boolean } | { mode: "edit"; type: "inlineMath" | "blockMath"; pos: number; latex: string };

/** Formulas a science teacher often needs, to start from or learn the notation by. */
export const FORMULA_EXAMPLES = [
  { label: "Rate equation", latex: "\\text{rate} = k[\\mathrm{A}]^2" },
  { label: "Arrhenius", latex: "k = A e^{-E_a/RT}" },
  { label: "Mean rate", latex: "\\text{mean rate} = \\frac{\\Delta V}{\\Delta t}" },
  { label: "ln form", latex: "\\ln k = \\ln A - \\frac{E_a}{R}\\cdot\\frac{1}{T}" },
  { label: "Percentage uncertainty", latex: "\\%\\,\\text{uncertainty} = \\frac{\\text{uncertainty}}{\\text{value}} \\times 100" },
] as const;

const MAX_LATEX = 2000;

/**
 * Typing a formula in LaTeX, with a live preview of how it will look. Used to insert a new
 * formula or to change one that was clicked in the text.
 */
export function FormulaPanel({ target, onDone, onCancel }: { target: FormulaTarget; onDone: (result: { latex: string; block: boolean } | null) => void; onCancel: () => void }) {
  const id = useId();
  const [latex, setLatex] = useState(target.mode === "edit" ? target.latex : "");
  const [block, setBlock] = useState(target.mode === "edit" ? target.type === "blockMath" : target.block);
  const [error, setError] = useState<string | null>(null);
  const inputRef = useRef<HTMLTextAreaElement>(null);
  useEffect(() => inputRef.current?.focus(), []);

  const trimmed = latex.trim();
  const check = trimmed ? checkLatex(trimmed) : null;
  const previewHtml = trimmed ? latexToHtml(trimmed, block) : "";

  const done = () => {
    if (!trimmed) {
      setError("Type a formula first, or press Cancel.");
      inputRef.current?.focus();
      return;
    }
    if (trimmed.length > MAX_LATEX) {
      setError(`A formula can be at most ${MAX_LATEX} characters.`);
      return;
    }
    if (check && !check.ok) {
      setError(`KaTeX cannot read this yet: ${check.message}`);
      inputRef.current?.focus();
      return;
    }
    onDone({ latex: trimmed, block });
  };

  return (
    <div
      role="group"
      aria-labelledby={`${id}-title`}
      className="flex flex-col gap-2 border-b border-line bg-brand-soft/50 p-3"
      onKeyDown={(e) => {
        if (e.key === "Escape") {
          e.preventDefault();
          e.stopPropagation();
          onCancel();
        }
      }}
    >
      <p id={`${id}-title`} className="font-semibold">
        {target.mode === "edit" ? "Change formula" : "Insert formula"}
      </p>
      <label htmlFor={`${id}-latex`} className="font-semibold">
        Formula (LaTeX)
      </label>
      <p id={`${id}-hint`} className="text-sm text-muted">
        <code>x^2</code> raises, <code>x_2</code> lowers, <code>{"\\frac{a}{b}"}</code> makes a fraction, <code>{"e^{-E_a/RT}"}</code> groups with braces.
      </p>
      <Textarea
        ref={inputRef}
        id={`${id}-latex`}
        value={latex}
        rows={2}
        className="min-h-16 font-mono"
        spellCheck={false}
        autoCapitalize="off"
        aria-describedby={[`${id}-hint`, error ? `${id}-error` : ""].filter(Boolean).join(" ")}
        aria-invalid={error ? true : undefined}
        onChange={(e) => {
          setLatex(e.target.value);
          setError(null);
        }}
        onKeyDown={(e) => {
          if (e.key === "Enter" && (e.ctrlKey || e.metaKey)) {
            e.preventDefault();
            done();
          }
        }}
      />
      <div className="flex flex-wrap items-center gap-1 text-sm">
        <span className="text-muted">Start from:</span>
        {FORMULA_EXAMPLES.map((ex) => (
          <button
            key={ex.label}
            type="button"
            className="rounded border border-line bg-surface px-2 py-1 hover:border-brand"
            onClick={() => {
              setLatex(ex.latex);
              setError(null);
              inputRef.current?.focus();
            }}
          >
            {ex.label}
          </button>
        ))}
      </div>
      <label className="flex items-center gap-2">
        <input type="checkbox" className="size-5 accent-brand" checked={block} onChange={(e) => setBlock(e.target.checked)} />
        Show it on its own line
      </label>
      <div className="rounded-md border border-line bg-surface p-2">
        <p className="text-sm font-semibold text-muted">Preview</p>
        <div aria-live="polite" className="min-h-8 overflow-x-auto">
          {previewHtml ? <div data-testid="formula-preview" dangerouslySetInnerHTML={{ __html: previewHtml }} /> : <p className="text-sm text-muted">The formula appears here as you type.</p>}
          {check && !check.ok ? <p className="text-sm text-warn">Not finished yet: {check.message}</p> : null}
        </div>
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-semibold text-bad">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button size="sm" onClick={done}>
          {target.mode === "edit" ? "Update formula" : "Insert formula"}
        </Button>
        {target.mode === "edit" ? (
          <Button size="sm" variant="danger" onClick={() => onDone(null)}>
            Remove formula
          </Button>
        ) : null}
        <Button size="sm" variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

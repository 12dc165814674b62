"use client";

import "katex/dist/katex.min.css";
import { Extension } from "@tiptap/core";
import { Mathematics } from "@tiptap/extension-mathematics";
import { Subscript } from "@tiptap/extension-subscript";
import { Superscript } from "@tiptap/extension-superscript";
import { EditorContent, useEditor, useEditorState, type Editor } from "@tiptap/react";
import { StarterKit } from "@tiptap/starter-kit";
import { useEffect, useId, useRef, useState, type KeyboardEvent, type ReactNode } from "react";
import type { RichTextDoc } from "@/lib/validation/rich-text";
import { cn } from "@/lib/utils";
import { FormulaPanel, type FormulaTarget } from "./formula-panel";
import { LinkPanel, normaliseHref } from "./link-panel";
import styles from "./rich-editor.module.css";

export type RichEditorProps = {
  /** DOM id of the editing area, so an error list can take the teacher straight to it. */
  id: string;
  /** Id of the visible label that names this editor. */
  labelId: string;
  value: RichTextDoc;
  onChange: (doc: RichTextDoc) => void;
  describedBy?: string;
  invalid?: boolean;
  className?: string;
};

/**
 * Lists indent with Ctrl+] and outdent with Ctrl+[ (⌘ on a Mac), so that Tab keeps its usual job
 * of moving to the next control and nobody is trapped inside the editor.
 */
const ListIndentKeys = Extension.create({
  name: "listIndentKeys",
  addKeyboardShortcuts() {
    return {
      "Mod-]": () => this.editor.commands.sinkListItem("listItem"),
      "Mod-[": () => this.editor.commands.liftListItem("listItem"),
    };
  },
});

type Panel = { kind: "formula"; target: FormulaTarget } | { kind: "link" } | null;

type ToolButton = {
  key: string;
  label: string;
  glyph: ReactNode;
  run: () => void;
  active?: boolean;
  disabled?: boolean;
};

function useToolbarState(editor: Editor) {
  return useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      bold: e.isActive("bold"),
      italic: e.isActive("italic"),
      strike: e.isActive("strike"),
      code: e.isActive("code"),
      subscript: e.isActive("subscript"),
      superscript: e.isActive("superscript"),
      h2: e.isActive("heading", { level: 2 }),
      h3: e.isActive("heading", { level: 3 }),
      h4: e.isActive("heading", { level: 4 }),
      bulletList: e.isActive("bulletList"),
      orderedList: e.isActive("orderedList"),
      blockquote: e.isActive("blockquote"),
      link: e.isActive("link"),
      canUndo: e.can().undo(),
      canRedo: e.can().redo(),
    }),
  });
}

/**
 * The rich-text editor used for a practical's introduction and method (and, later, students'
 * write-ups). It stores the editor's JSON, which the server checks against its allow-list:
 * headings 2–4, lists, bold, italic, strike-through, code, quotes, lines, links (http, https and
 * mailto only), sub- and superscript, and formulas typed as LaTeX.
 */
export function RichEditor({ id, labelId, value, onChange, describedBy, invalid, className }: RichEditorProps) {
  const [panel, setPanel] = useState<Panel>(null);

  const editor = useEditor({
    immediatelyRender: true,
    shouldRerenderOnTransaction: false,
    extensions: [
      StarterKit.configure({
        heading: { levels: [2, 3, 4] },
        link: { openOnClick: false, autolink: false, protocols: ["mailto"], isAllowedUri: (url) => normaliseHref(url).ok },
      }),
      Subscript,
      Superscript,
      ListIndentKeys,
      Mathematics.configure({
        katexOptions: { throwOnError: false, trust: false, strict: "ignore" },
        inlineOptions: { onClick: (node, pos) => setPanel({ kind: "formula", target: { mode: "edit", type: "inlineMath", pos, latex: String(node.attrs.latex ?? "") } }) },
        blockOptions: { onClick: (node, pos) => setPanel({ kind: "formula", target: { mode: "edit", type: "blockMath", pos, latex: String(node.attrs.latex ?? "") } }) },
      }),
    ],
    content: value,
    editorProps: {
      attributes: { id, role: "textbox", "aria-multiline": "true", "aria-labelledby": labelId, spellcheck: "true" },
    },
  });

  useEffect(() => {
    if (!editor) return;
    const report = () => onChange(editor.getJSON() as RichTextDoc);
    editor.on("update", report);
    return () => {
      editor.off("update", report);
    };
  }, [editor, onChange]);

  useEffect(() => {
    if (!editor) return;
    const attributes: Record<string, string> = { id, role: "textbox", "aria-multiline": "true", "aria-labelledby": labelId, spellcheck: "true" };
    if (describedBy) attributes["aria-describedby"] = describedBy;
    if (invalid) attributes["aria-invalid"] = "true";
    editor.setOptions({ editorProps: { ...editor.options.editorProps, attributes } });
  }, [editor, id, labelId, describedBy, invalid]);

  if (!editor) return null;
  return (
    <div className={cn("rounded-md border border-line bg-surface focus-within:border-brand", invalid && "border-bad", className)}>
      <Toolbar editor={editor} labelId={labelId} onOpenPanel={setPanel} panelOpen={panel?.kind ?? null} />
      {panel?.kind === "formula" ? (
        <FormulaPanel
          target={panel.target}
          onCancel={() => {
            setPanel(null);
            editor.commands.focus();
          }}
          onDone={(result) => {
            applyFormula(editor, panel.target, result);
            setPanel(null);
          }}
        />
      ) : null}
      {panel?.kind === "link" ? (
        <LinkPanel
          initial={String(editor.getAttributes("link").href ?? "")}
          hasLink={editor.isActive("link")}
          onCancel={() => {
            setPanel(null);
            editor.commands.focus();
          }}
          onApply={(href) => {
            const chain = editor.chain().focus().extendMarkRange("link");
            if (editor.state.selection.empty && !editor.isActive("link")) {
              chain.insertContent({ type: "text", text: href, marks: [{ type: "link", attrs: { href } }] }).run();
            } else chain.setLink({ href }).run();
            setPanel(null);
          }}
          onRemove={() => {
            editor.chain().focus().extendMarkRange("link").unsetLink().run();
            setPanel(null);
          }}
        />
      ) : null}
      <div
        className={styles.content}
        onKeyDownCapture={(e) => {
          // Tab moves on to the next control (lists indent with Ctrl+] instead).
          if (e.key === "Tab" && !e.ctrlKey && !e.metaKey && !e.altKey) e.stopPropagation();
        }}
      >
        <EditorContent editor={editor} />
      </div>
      <p className="border-t border-line px-3 py-1.5 text-sm text-muted">
        Tip: type formulas with the Formula button. In a list, Ctrl+] indents an item and Ctrl+[ brings it back.
      </p>
    </div>
  );
}

function applyFormula(editor: Editor, target: FormulaTarget, result: { latex: string; block: boolean } | null) {
  const type = result?.block ? "blockMath" : "inlineMath";
  if (target.mode === "insert") {
    if (!result) return;
    const chain = editor.chain().focus();
    if (type === "blockMath") chain.insertBlockMath({ latex: result.latex }).run();
    else chain.insertInlineMath({ latex: result.latex }).run();
    return;
  }
  if (!result) {
    if (target.type === "blockMath") editor.chain().focus().deleteBlockMath({ pos: target.pos }).run();
    else editor.chain().focus().deleteInlineMath({ pos: target.pos }).run();
    return;
  }
  if (type === target.type) {
    if (type === "blockMath") editor.chain().focus().updateBlockMath({ latex: result.latex, pos: target.pos }).run();
    else editor.chain().focus().updateInlineMath({ latex: result.latex, pos: target.pos }).run();
    return;
  }
  const node = editor.state.doc.nodeAt(target.pos);
  if (!node) return;
  editor
    .chain()
    .focus()
    .deleteRange({ from: target.pos, to: target.pos + node.nodeSize })
    .insertContentAt(target.pos, { type, attrs: { latex: result.latex } })
    .run();
}

function Toolbar({ editor, labelId, onOpenPanel, panelOpen }: { editor: Editor; labelId: string; onOpenPanel: (p: Panel) => void; panelOpen: "formula" | "link" | null }) {
  const s = useToolbarState(editor);
  const toolbarId = useId();
  const [focusIndex, setFocusIndex] = useState(0);
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const chain = () => editor.chain().focus();

  const selectedMath = (): FormulaTarget | null => {
    const sel = editor.state.selection as { node?: { type: { name: string }; attrs: Record<string, unknown> }; from: number };
    const name = sel.node?.type.name;
    if (name === "inlineMath" || name === "blockMath") return { mode: "edit", type: name, pos: sel.from, latex: String(sel.node!.attrs.latex ?? "") };
    return null;
  };

  const groups: ToolButton[][] = [
    [
      { key: "h2", label: "Heading", glyph: "H2", active: s.h2, run: () => chain().toggleHeading({ level: 2 }).run() },
      { key: "h3", label: "Subheading", glyph: "H3", active: s.h3, run: () => chain().toggleHeading({ level: 3 }).run() },
      { key: "h4", label: "Small heading", glyph: "H4", active: s.h4, run: () => chain().toggleHeading({ level: 4 }).run() },
    ],
    [
      { key: "bold", label: "Bold", glyph: <strong>B</strong>, active: s.bold, run: () => chain().toggleBold().run() },
      { key: "italic", label: "Italic", glyph: <em className="font-serif">I</em>, active: s.italic, run: () => chain().toggleItalic().run() },
      { key: "strike", label: "Strike through", glyph: <s>S</s>, active: s.strike, run: () => chain().toggleStrike().run() },
      { key: "code", label: "Code", glyph: <span className="font-mono text-sm">{"</>"}</span>, active: s.code, run: () => chain().toggleCode().run() },
      { key: "sub", label: "Subscript", glyph: <span>x<sub>2</sub></span>, active: s.subscript, run: () => chain().toggleSubscript().run() },
      { key: "sup", label: "Superscript", glyph: <span>x<sup>2</sup></span>, active: s.superscript, run: () => chain().toggleSuperscript().run() },
    ],
    [
      { key: "ul", label: "Bulleted list", glyph: "• ≡", active: s.bulletList, run: () => chain().toggleBulletList().run() },
      { key: "ol", label: "Numbered list", glyph: "1. ≡", active: s.orderedList, run: () => chain().toggleOrderedList().run() },
      { key: "quote", label: "Quote", glyph: "❝", active: s.blockquote, run: () => chain().toggleBlockquote().run() },
      { key: "hr", label: "Dividing line", glyph: "—", run: () => chain().setHorizontalRule().run() },
    ],
    [
      { key: "link", label: s.link ? "Edit link" : "Link", glyph: "Link", active: s.link || panelOpen === "link", run: () => onOpenPanel({ kind: "link" }) },
      {
        key: "formula",
        label: "Formula",
        glyph: (
          <span>
            <span className="font-serif italic">f</span>(x)
          </span>
        ),
        active: panelOpen === "formula",
        run: () => onOpenPanel({ kind: "formula", target: selectedMath() ?? { mode: "insert", block: false } }),
      },
      { key: "formula-block", label: "Formula on its own line", glyph: "∑ line", run: () => onOpenPanel({ kind: "formula", target: { mode: "insert", block: true } }) },
    ],
    [
      { key: "undo", label: "Undo", glyph: "↶", disabled: !s.canUndo, run: () => chain().undo().run() },
      { key: "redo", label: "Redo", glyph: "↷", disabled: !s.canRedo, run: () => chain().redo().run() },
    ],
  ];
  const flat = groups.flat();

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const keys: Record<string, number> = { ArrowRight: 1, ArrowDown: 1, ArrowLeft: -1, ArrowUp: -1 };
    let next: number | null = null;
    if (e.key in keys) next = (focusIndex + keys[e.key]! + flat.length) % flat.length;
    if (e.key === "Home") next = 0;
    if (e.key === "End") next = flat.length - 1;
    if (next === null) return;
    e.preventDefault();
    setFocusIndex(next);
    refs.current[next]?.focus();
  };

  let index = -1;
  return (
    <div
      id={toolbarId}
      role="toolbar"
      aria-labelledby={labelId}
      aria-orientation="horizontal"
      className="flex flex-wrap items-center gap-1 border-b border-line bg-sunken/60 px-1.5 py-1.5"
      onKeyDown={onKeyDown}
    >
      {groups.map((group, gi) => (
        <div key={gi} className="flex flex-wrap items-center gap-0.5 pr-1 [&:not(:last-child)]:border-r [&:not(:last-child)]:border-line">
          {group.map((b) => {
            index++;
            const i = index;
            const toggles = b.active !== undefined && !["link", "formula"].includes(b.key);
            return (
              <button
                key={b.key}
                ref={(el) => {
                  refs.current[i] = el;
                }}
                type="button"
                tabIndex={i === focusIndex ? 0 : -1}
                aria-label={b.label}
                title={b.label}
                aria-pressed={toggles ? !!b.active : undefined}
                disabled={b.disabled}
                onMouseDown={(e) => e.preventDefault()}
                onFocus={() => setFocusIndex(i)}
                onClick={b.run}
                className={cn(
                  "inline-flex min-h-9 min-w-9 items-center justify-center rounded px-2 text-sm text-ink hover:bg-brand-soft disabled:opacity-40",
                  b.active && "bg-brand text-on-brand hover:bg-brand-strong",
                )}
              >
                {b.glyph}
              </button>
            );
          })}
        </div>
      ))}
    </div>
  );
}

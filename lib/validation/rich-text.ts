import { z } from "zod";

/**
 * Rich text is stored as the editor's JSON document, never as HTML. This schema is the
 * allow-list: known node and mark types with checked attributes, bounded depth and size.
 * Anything else (script-carrying HTML, unknown nodes, javascript: links) is refused.
 */
export const RICH_TEXT_MAX_CHARS = 60_000;
const MAX_DEPTH = 12;

const BLOCK_NODES = ["paragraph", "heading", "bulletList", "orderedList", "listItem", "blockquote", "blockMath", "horizontalRule", "codeBlock"] as const;
const INLINE_NODES = ["text", "hardBreak", "inlineMath"] as const;
const MARKS = ["bold", "italic", "underline", "strike", "code", "subscript", "superscript", "link"] as const;

export type RichTextNode = {
  type: string;
  text?: string;
  attrs?: Record<string, unknown>;
  marks?: { type: string; attrs?: Record<string, unknown> }[];
  content?: RichTextNode[];
};
export type RichTextDoc = { type: "doc"; content?: RichTextNode[] };

const safeHref = z
  .string()
  .max(2000)
  .refine((h) => /^(https?:|mailto:)/i.test(h.trim()), "Links must start with http://, https:// or mailto:.");

const markSchema = z.discriminatedUnion("type", [
  ...MARKS.filter((m) => m !== "link").map((m) => z.object({ type: z.literal(m) }).strict()),
  z.object({ type: z.literal("link"), attrs: z.object({ href: safeHref }).passthrough().transform(({ href }) => ({ href })) }),
] as unknown as [z.ZodObject, z.ZodObject]);

const latex = z.string().max(2000, "A formula can be at most 2000 characters.");

function nodeAttrs(type: string, attrs: unknown): Record<string, unknown> | undefined {
  const a = (attrs ?? {}) as Record<string, unknown>;
  switch (type) {
    case "heading": {
      const level = Number(a.level);
      return { level: [2, 3, 4].includes(level) ? level : 3 };
    }
    case "orderedList":
      return { start: Number.isInteger(a.start) && (a.start as number) > 0 && (a.start as number) < 10_000 ? a.start : 1 };
    case "inlineMath":
    case "blockMath":
      return { latex: latex.parse(typeof a.latex === "string" ? a.latex : "") };
    default:
      return undefined;
  }
}

export class RichTextError extends Error {}

/** Checks and cleans a document; throws RichTextError with a plain message. */
export function sanitizeRichText(input: unknown): RichTextDoc {
  let chars = 0;
  const walk = (node: unknown, depth: number): RichTextNode => {
    if (depth > MAX_DEPTH) throw new RichTextError("The text is nested too deeply.");
    if (!node || typeof node !== "object" || Array.isArray(node)) throw new RichTextError("The text is not in the editor's format.");
    const n = node as Record<string, unknown>;
    const type = n.type;
    if (typeof type !== "string" || (!(BLOCK_NODES as readonly string[]).includes(type) && !(INLINE_NODES as readonly string[]).includes(type))) {
      throw new RichTextError(`The text contains something the editor does not allow (${String(type).slice(0, 40)}).`);
    }
    const out: RichTextNode = { type };
    if (type === "text") {
      if (typeof n.text !== "string" || n.text.length === 0) throw new RichTextError("The text is not in the editor's format.");
      chars += n.text.length;
      out.text = n.text;
    }
    const attrs = nodeAttrs(type, n.attrs);
    if (attrs) out.attrs = attrs;
    if (n.marks !== undefined) {
      if (!Array.isArray(n.marks) || n.marks.length > 8) throw new RichTextError("The text has formatting the editor does not allow.");
      out.marks = n.marks.map((m) => {
        const parsed = markSchema.safeParse(m);
        if (!parsed.success) throw new RichTextError("The text has formatting the editor does not allow (links must start with http:// or https://).");
        return parsed.data as { type: string; attrs?: Record<string, unknown> };
      });
    }
    if (n.content !== undefined) {
      if (!Array.isArray(n.content) || n.content.length > 2000) throw new RichTextError("The text is not in the editor's format.");
      if (type === "text") throw new RichTextError("The text is not in the editor's format.");
      out.content = n.content.map((c) => walk(c, depth + 1));
    }
    if (chars > RICH_TEXT_MAX_CHARS) throw new RichTextError(`The text is too long: keep it under ${RICH_TEXT_MAX_CHARS.toLocaleString("en-GB")} characters.`);
    return out;
  };
  if (!input || typeof input !== "object" || (input as { type?: unknown }).type !== "doc") throw new RichTextError("The text is not in the editor's format.");
  const content = (input as { content?: unknown }).content;
  if (content !== undefined && !Array.isArray(content)) throw new RichTextError("The text is not in the editor's format.");
  return { type: "doc", content: (content ?? []).map((c: unknown) => walk(c, 1)) };
}

/** zod wrapper so documents validate inside larger schemas with a field-level message. */
export const richTextSchema = z.unknown().transform((v, ctx) => {
  try {
    return sanitizeRichText(v ?? { type: "doc", content: [] });
  } catch (e) {
    ctx.addIssue({ code: "custom", message: e instanceof RichTextError ? e.message : "The text is not in the editor's format." });
    return z.NEVER;
  }
});

export const EMPTY_DOC: RichTextDoc = { type: "doc", content: [] };

/** Plain text of a document (for search, previews and PDF). */
export function richTextToPlain(doc: RichTextDoc | null | undefined): string {
  const parts: string[] = [];
  const walk = (n: RichTextNode) => {
    if (n.type === "text") parts.push(n.text ?? "");
    else if (n.type === "inlineMath" || n.type === "blockMath") parts.push(String(n.attrs?.latex ?? ""));
    else if (n.type === "hardBreak") parts.push("\n");
    n.content?.forEach(walk);
    if (["paragraph", "heading", "listItem", "blockMath", "blockquote"].includes(n.type)) parts.push("\n");
  };
  doc?.content?.forEach(walk);
  return parts.join("").replace(/\n{3,}/g, "\n\n").trim();
}

import "katex/dist/katex.min.css";
import type { ReactNode } from "react";
import type { RichTextDoc, RichTextNode } from "@/lib/validation/rich-text";
import { cn } from "@/lib/utils";
import { latexToHtml } from "./katex-html";

const SAFE_HREF = /^(https?:|mailto:)/i;

function withMarks(text: ReactNode, marks: RichTextNode["marks"], key: string): ReactNode {
  let out = text;
  (marks ?? []).forEach((m, i) => {
    const k = `${key}-m${i}`;
    switch (m.type) {
      case "bold":
        out = <strong key={k}>{out}</strong>;
        break;
      case "italic":
        out = <em key={k}>{out}</em>;
        break;
      case "underline":
        out = <u key={k}>{out}</u>;
        break;
      case "strike":
        out = <s key={k}>{out}</s>;
        break;
      case "code":
        out = (
          <code key={k} className="rounded bg-sunken px-1 font-mono text-[0.92em]">
            {out}
          </code>
        );
        break;
      case "subscript":
        out = <sub key={k}>{out}</sub>;
        break;
      case "superscript":
        out = <sup key={k}>{out}</sup>;
        break;
      case "link": {
        const href = typeof m.attrs?.href === "string" ? m.attrs.href.trim() : "";
        if (SAFE_HREF.test(href)) {
          out = (
            <a key={k} href={href} rel="noopener noreferrer nofollow" target="_blank">
              {out}
            </a>
          );
        }
        break;
      }
    }
  });
  return out;
}

function Formula({ latex, display }: { latex: string; display: boolean }) {
  const html = latexToHtml(latex, display);
  // KaTeX output of a formula (trust: false, so no links or raw HTML can come through); the
  // document's own text is never inserted as HTML.
  return display ? (
    <div className="my-3 overflow-x-auto" dangerouslySetInnerHTML={{ __html: html }} />
  ) : (
    <span dangerouslySetInnerHTML={{ __html: html }} />
  );
}

function renderNodes(nodes: RichTextNode[] | undefined, offset: number, prefix: string): ReactNode[] {
  return (nodes ?? []).map((n, i) => renderNode(n, offset, `${prefix}-${i}`));
}

function renderNode(node: RichTextNode, offset: number, key: string): ReactNode {
  const children = () => renderNodes(node.content, offset, key);
  switch (node.type) {
    case "text":
      return <span key={key}>{withMarks(node.text ?? "", node.marks, key)}</span>;
    case "hardBreak":
      return <br key={key} />;
    case "inlineMath":
      return <Formula key={key} latex={String(node.attrs?.latex ?? "")} display={false} />;
    case "blockMath":
      return <Formula key={key} latex={String(node.attrs?.latex ?? "")} display />;
    case "paragraph":
      return (
        <p key={key} className="my-2 min-h-[1lh]">
          {children()}
        </p>
      );
    case "heading": {
      const level = Math.min(6, Math.max(2, Number(node.attrs?.level ?? 3) + offset));
      const Tag = `h${level}` as "h2" | "h3" | "h4" | "h5" | "h6";
      const size = level <= 3 ? "text-lg" : "text-base";
      return (
        <Tag key={key} className={cn("mt-4 mb-1 font-bold", size)}>
          {children()}
        </Tag>
      );
    }
    case "bulletList":
      return (
        <ul key={key} className="my-2 list-disc pl-6">
          {children()}
        </ul>
      );
    case "orderedList": {
      const start = Number(node.attrs?.start ?? 1);
      return (
        <ol key={key} start={Number.isInteger(start) && start > 0 ? start : 1} className="my-2 list-decimal pl-6">
          {children()}
        </ol>
      );
    }
    case "listItem":
      return (
        <li key={key} className="my-0.5 [&>p]:my-0.5">
          {children()}
        </li>
      );
    case "blockquote":
      return (
        <blockquote key={key} className="my-3 border-l-4 border-line pl-3 text-muted">
          {children()}
        </blockquote>
      );
    case "horizontalRule":
      return <hr key={key} className="my-4 border-line" />;
    case "codeBlock":
      return (
        <pre key={key} className="my-3 overflow-x-auto rounded-md bg-sunken p-3 font-mono text-sm">
          <code>{children()}</code>
        </pre>
      );
    default:
      return null;
  }
}

/**
 * A stored rich-text document, rendered as React elements (never as HTML from the document).
 * `headingOffset` moves the document's headings down the page outline: a heading stored as
 * level 2 shows as an h3 when the page already uses h2 for its own sections.
 */
export function RichTextView({ doc, headingOffset = 1, className, empty }: { doc: RichTextDoc | null | undefined; headingOffset?: number; className?: string; empty?: ReactNode }) {
  const nodes = doc?.content ?? [];
  const hasText = nodes.some((n) => n.type !== "paragraph" || (n.content?.length ?? 0) > 0);
  if (!hasText) return empty ? <>{empty}</> : null;
  return <div className={cn("rich-text max-w-prose", className)}>{renderNodes(nodes, headingOffset, "n")}</div>;
}

import type { RichTextDoc, RichTextNode } from "@/lib/validation/rich-text";
import type { PracticalContent } from "@/lib/validation/practicals";
import type { GroupTables, WriteUpContent } from "@/lib/validation/write-ups";

/** The write-up's text sections, in page order, with their headings. */
export const SECTIONS = [
  { key: "plan", label: "Plan" },
  { key: "observations", label: "Observations" },
  { key: "conclusion", label: "Conclusion" },
  { key: "evaluation", label: "Evaluation" },
] as const;
export type SectionKey = (typeof SECTIONS)[number]["key"];

/** Plain text of a stored document: words and formulas, for comparing versions. */
export function plainText(doc: RichTextDoc | null | undefined): string {
  const parts: string[] = [];
  const walk = (n: RichTextNode) => {
    if (n.type === "text") parts.push(n.text ?? "");
    else if (n.type === "inlineMath" || n.type === "blockMath") parts.push(` ${String(n.attrs?.latex ?? "")} `);
    else if (n.type === "hardBreak") parts.push(" ");
    n.content?.forEach(walk);
    if (n.type !== "text" && n.type !== "inlineMath" && n.type !== "hardBreak") parts.push(" ");
  };
  doc?.content?.forEach(walk);
  return parts.join("").replace(/\s+/g, " ").trim();
}

export function wordCount(text: string): number {
  return text ? text.split(/\s+/).filter(Boolean).length : 0;
}

const isBlank = (v: unknown) => v === null || v === undefined || (typeof v === "string" && !v.trim());

/** Cells with something typed in a filled table. */
export function filledCellCount(t: { rows?: Record<string, unknown>[] } | undefined): number {
  return (t?.rows ?? []).reduce((n, r) => n + Object.values(r ?? {}).filter((v) => !isBlank(v)).length, 0);
}

/** One part of a write-up as a comparison shows it. */
export type ComparedPart = { key: string; label: string; summary: string; detail: string };

const excerpt = (text: string, max = 180) => (text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text);

function tableParts(tables: GroupTables, practical: PracticalContent): ComparedPart[] {
  return practical.tables.map((t) => {
    const filled = tables[t.id];
    const n = filledCellCount(filled);
    const left = Object.values(filled?.decisions ?? {}).filter((d) => !d.include).length;
    return {
      key: `table:${t.id}`,
      label: t.title,
      summary: n === 0 ? "No readings" : `${n} cell${n === 1 ? "" : "s"} filled${left ? `, ${left} reading${left === 1 ? "" : "s"} left out` : ""}`,
      // The cells themselves decide whether two versions differ, not only their count.
      detail: JSON.stringify(filled?.rows ?? []) + JSON.stringify(filled?.decisions ?? {}),
    };
  });
}

/** The parts of a write-up that a person can tell apart at a glance: sections, tables, tangents, answers. */
export function contentParts(content: WriteUpContent, practical: PracticalContent, { includeTables = true }: { includeTables?: boolean } = {}): ComparedPart[] {
  const parts: ComparedPart[] = SECTIONS.map(({ key, label }) => {
    const text = plainText(content.sections?.[key]);
    const words = wordCount(text);
    return { key: `section:${key}`, label, summary: words === 0 ? "Empty" : `${words} word${words === 1 ? "" : "s"}: “${excerpt(text)}”`, detail: text };
  });
  if (includeTables) parts.push(...tableParts(content.tables ?? {}, practical));
  for (const g of practical.graphs) {
    const t = content.graphs?.[g.id]?.tangent;
    parts.push({ key: `graph:${g.id}`, label: `Tangent on “${g.title}”`, summary: t ? `Drawn at ${t.at}` : "Not drawn", detail: JSON.stringify(t ?? null) });
  }
  for (const c of practical.checks) {
    const a = content.answers?.[c.id];
    const value = a?.value?.trim() ? `${a.value.trim()}${a.unit?.trim() ? ` ${a.unit.trim()}` : ""}` : "";
    const working = plainText(a?.working ?? null);
    const words = wordCount(working);
    parts.push({
      key: `answer:${c.id}`,
      label: c.label,
      summary: `${value ? `Answer ${value}` : "No answer"}${words ? `; working ${words} word${words === 1 ? "" : "s"}` : ""}`,
      detail: `${value}|${working}`,
    });
  }
  return parts;
}

/** A group's shared tables, compared table by table. */
export function groupTableParts(tables: GroupTables, practical: PracticalContent): ComparedPart[] {
  return tableParts(tables, practical);
}

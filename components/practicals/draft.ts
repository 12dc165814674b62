import { z } from "zod";
import { practicalContentSchema, practicalDraftSchema, publishProblems, type PracticalContent } from "@/lib/validation/practicals";
import { CHECK_KIND_LABELS } from "./check-kinds";

/** Everything the editor changes in one version of a practical. */
export type Draft = {
  title: string;
  topic: string;
  yearGroup: number;
  subject: string;
  content: PracticalContent;
};

export type FieldErrors = Record<string, string[]>;

export const SECTIONS = [
  { key: "details", label: "Details" },
  { key: "aim", label: "Aim and introduction" },
  { key: "method", label: "Method" },
  { key: "variables", label: "Variables and apparatus" },
  { key: "safety", label: "Safety" },
  { key: "tables", label: "Results tables" },
  { key: "graphs", label: "Graphs" },
  { key: "checks", label: "Calculation checks" },
  { key: "rubric", label: "Rubric" },
] as const;
export type SectionKey = (typeof SECTIONS)[number]["key"];

/** Sections compared when two versions of a draft meet; the prep list has its own page. */
export const COMPARED_SECTIONS = [...SECTIONS.map((s) => ({ key: s.key as SectionKey | "prep", label: s.label as string })), { key: "prep" as const, label: "Prep list" }];

/** The section of the editor where the field at this error path lives ("prep" is edited elsewhere). */
export function sectionOfPath(path: string): SectionKey | "prep" {
  const [head, part] = path.split(".");
  if (head !== "content") return "details";
  switch (part) {
    case "aim":
    case "introduction":
      return "aim";
    case "method":
      return "method";
    case "variables":
    case "apparatus":
      return "variables";
    case "safety":
      return "safety";
    case "prep":
      return "prep";
    case "tables":
      return "tables";
    case "graphs":
      return "graphs";
    case "checks":
      return "checks";
    case "rubric":
      return "rubric";
    default:
      return "details";
  }
}

/** The DOM id of the control (or card) for an error path: "content.checks.0.y" → "f-content-checks-0-y". */
export function fieldDomId(path: string): string {
  return `f-${path.replace(/[^A-Za-z0-9]+/g, "-")}`;
}

/** The ids to try, most specific first, when taking a teacher to the field of an error. */
export function fieldDomIdCandidates(path: string): string[] {
  const parts = path.split(".");
  const out: string[] = [];
  for (let n = parts.length; n >= 1; n--) out.push(fieldDomId(parts.slice(0, n).join(".")));
  return out;
}

const FIELD_NAMES: Record<string, string> = {
  title: "Title",
  topic: "Topic",
  yearGroup: "Year group",
  subject: "Subject",
  aim: "Aim",
  introduction: "Introduction",
  method: "Method",
  independent: "Independent variable",
  dependent: "Dependent variable",
  controlled: "Controlled variables",
  apparatus: "Apparatus",
  hazards: "Hazards",
  substance: "Substance or activity",
  pictograms: "Pictograms",
  signalWord: "Signal word",
  hazardStatements: "Hazard statements",
  controls: "Control measures",
  eyeProtection: "Eye protection",
  otherPpe: "Other protective equipment",
  emergency: "If something goes wrong",
  riskAssessmentRef: "Risk assessment reference",
  tables: "Results tables",
  columns: "Columns",
  quantity: "Quantity",
  symbol: "Symbol",
  unit: "Unit",
  role: "Role",
  resolution: "Resolution",
  decimalPlaces: "Decimal places",
  rangeMin: "Lowest reading",
  rangeMax: "Highest reading",
  meanOf: "Repeat columns",
  derivedFrom: "Calculated from",
  formula: "Formula",
  rowCount: "Number of rows",
  presetRows: "Planned values",
  graphs: "Graphs",
  tableId: "Table",
  xColumn: "x-axis",
  yColumn: "y-axis",
  checks: "Calculation checks",
  label: "Name",
  tolerancePercent: "Tolerance",
  sigFigs: "Significant figures",
  min: "Fewest",
  max: "Most",
  expectedUnit: "Expected unit",
  from: "Start of the interval",
  to: "End of the interval",
  at: "Time of the tangent",
  rubric: "Rubric",
  criteria: "Criteria",
  levels: "Levels",
  marks: "Marks",
  descriptor: "Descriptor",
  description: "Description",
  checkIds: "Linked checks",
  reagents: "Reagents",
  prep: "Prep list",
  name: "Name",
  concentration: "Concentration",
  concentrationUnit: "Concentration unit",
  amountPerGroup: "Amount per group",
  amountUnit: "Unit of the amount",
  notes: "Notes",
  perGroup: "Number per group",
  spareMarginPercent: "Spare margin",
  technicianNotes: "Notes for the technician",
};

/** Names of a calculation check's own fields (some share a name with fields elsewhere). */
const CHECK_FIELD_NAMES: Record<string, string> = {
  t: "Time column",
  answerColumn: "Answer column",
  repeats: "Repeat columns",
  concentration: "Concentration column",
  rate: "Rate column",
  temperature: "Temperature column",
  temperatureUnit: "Temperature unit",
  rateIs: "What the rate column holds",
  reading: "Reading column",
  readingsPerValue: "Readings for each value",
  resolution: "Instrument resolution",
  model: "Curve used",
  throughOrigin: "Through the origin",
  x: "x column",
  y: "y column",
};

/**
 * Where an error path points, in words: "Safety › Hazard 1 (dilute acid) › Control measures".
 * Used by the list of problems at the top of the editor.
 */
export function describeErrorPath(path: string, draft: Draft): string {
  const parts = path.split(".");
  if (parts[0] !== "content") return FIELD_NAMES[parts[0]!] ?? "Details";
  const section = sectionOfPath(path);
  const out: string[] = [section === "prep" ? "Prep list" : (SECTIONS.find((s) => s.key === section)?.label ?? "Details")];
  const c = draft.content;
  const rest = parts.slice(1);
  const label = (kind: string, i: number, name?: string) => `${kind} ${i + 1}${name?.trim() ? ` (${name.trim()})` : ""}`;
  for (let i = 0; i < rest.length; i++) {
    const key = rest[i]!;
    const next = rest[i + 1];
    const index = next !== undefined && /^\d+$/.test(next) ? Number(next) : null;
    if (i === 0 && (key === "tables" || key === "graphs" || key === "checks") && index !== null) {
      if (key === "tables") out.push(label("Table", index, c.tables[index]?.title));
      if (key === "graphs") out.push(label("Graph", index, c.graphs[index]?.title));
      if (key === "checks") {
        const chk = c.checks[index];
        out.push(label("Check", index, chk ? chk.label || CHECK_KIND_LABELS[chk.kind] : undefined));
      }
      i++;
      continue;
    }
    if (key === "reagents" && index !== null) {
      out.push(label("Reagent", index, c.prep.reagents[index]?.name));
      i++;
      continue;
    }
    if (key === "hazards" && index !== null) {
      out.push(label("Hazard", index, c.safety.hazards[index]?.substance));
      i++;
      continue;
    }
    if (key === "columns" && index !== null) {
      const ti = Number(rest[1]);
      out.push(label("Column", index, c.tables[ti]?.columns[index]?.quantity));
      i++;
      continue;
    }
    if (key === "criteria" && index !== null) {
      out.push(label("Criterion", index, c.rubric?.criteria[index]?.title));
      i++;
      continue;
    }
    if (key === "levels" && index !== null) {
      const ci = Number(rest[2]);
      out.push(label("Level", index, c.rubric?.criteria[ci]?.levels[index]?.label));
      i++;
      continue;
    }
    if (/^\d+$/.test(key)) {
      out.push(`item ${Number(key) + 1}`);
      continue;
    }
    if (i === 0 && (key === "safety" || key === "variables")) continue;
    if (i === 0 && (key === "rubric" || key === "prep") && rest.length > 1) continue;
    out.push((section === "checks" ? CHECK_FIELD_NAMES[key] : undefined) ?? FIELD_NAMES[key] ?? key);
  }
  const unique = out.filter((p, i) => p !== out[i - 1]);
  return unique.join(" › ");
}

/** Messages for exactly this path. */
export function errorsAt(errors: FieldErrors, path: string): string[] | undefined {
  const list = errors[path];
  return list && list.length ? list : undefined;
}

/** Number of error paths in each section, for the section list. */
export function errorCountsBySection(errors: FieldErrors): Partial<Record<SectionKey | "prep", number>> {
  const out: Partial<Record<SectionKey | "prep", number>> = {};
  for (const path of Object.keys(errors)) {
    const s = sectionOfPath(path);
    out[s] = (out[s] ?? 0) + 1;
  }
  return out;
}

/** Merges several error maps, keeping each message once. */
export function mergeErrors(...maps: (FieldErrors | null | undefined)[]): FieldErrors {
  const out: FieldErrors = {};
  for (const m of maps) {
    if (!m) continue;
    for (const [k, v] of Object.entries(m)) {
      const list = (out[k] ??= []);
      for (const msg of v) if (!list.includes(msg)) list.push(msg);
    }
  }
  return out;
}

function issuesToErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_form";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/**
 * Checks a draft with the same schema the server uses, so the teacher sees problems at the
 * fields before anything is sent. Keys match the server's field errors ("content.checks.0.y").
 */
export function validateDraft(draft: Draft, revision: number): FieldErrors {
  const parsed = practicalDraftSchema.safeParse({ ...cleanForSave(draft), revision });
  if (parsed.success) return {};
  const out: FieldErrors = {};
  for (const [key, messages] of Object.entries(issuesToErrors(parsed.error))) {
    // A planned value that is not a number: one plain message for the whole planned-values field.
    const preset = /^(content\.tables\.\d+\.presetRows)\./.exec(key);
    if (preset) {
      out[preset[1]!] = ["Planned values must be numbers, separated by commas."];
      continue;
    }
    out[key] = messages;
  }
  return out;
}

/**
 * The draft as it is sent: blank lines in the short lists (apparatus, controlled variables,
 * protective equipment) are left out, so a line added and not yet filled in never blocks a save.
 */
export function cleanForSave(draft: Draft): Draft {
  const keep = (list: string[]) => list.filter((x) => x.trim() !== "");
  const c = draft.content;
  return {
    ...draft,
    content: {
      ...c,
      apparatus: keep(c.apparatus),
      variables: { ...c.variables, controlled: keep(c.variables.controlled) },
      safety: { ...c.safety, otherPpe: keep(c.safety.otherPpe) },
    },
  };
}

/**
 * What still stands between a draft and publishing, worked out in the browser with the server's
 * own rule (the server checks again when asked to publish).
 */
export function draftPublishProblems(draft: Draft): FieldErrors {
  const parsed = practicalContentSchema.safeParse(draft.content);
  return publishProblems({ title: draft.title }, parsed.success ? parsed.data : draft.content);
}

/** JSON with object keys sorted, so two equal documents give the same text. */
export function stableStringify(value: unknown): string {
  if (value === undefined) return "null";
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableStringify(v)}`).join(",")}}`;
}

/** Content as the server would store it (defaults filled, rich text cleaned), when it is valid. */
function normalContent(content: PracticalContent): unknown {
  const parsed = practicalContentSchema.safeParse(content);
  return parsed.success ? parsed.data : content;
}

function sectionSlice(draft: Draft, content: Record<string, unknown>, key: SectionKey | "prep"): unknown {
  switch (key) {
    case "details":
      return { title: draft.title.trim(), topic: draft.topic.trim(), yearGroup: draft.yearGroup, subject: draft.subject.trim() };
    case "aim":
      return { aim: content.aim, introduction: content.introduction };
    case "method":
      return content.method;
    case "variables":
      return { variables: content.variables, apparatus: content.apparatus };
    default:
      return content[key];
  }
}

/** Section by section, whether two versions of a practical differ. */
export function sectionDiff(mine: Draft, theirs: Draft): { key: SectionKey | "prep"; label: string; differs: boolean }[] {
  const a = normalContent(mine.content) as Record<string, unknown>;
  const b = normalContent(theirs.content) as Record<string, unknown>;
  return COMPARED_SECTIONS.map((s) => ({
    key: s.key,
    label: s.label,
    differs: stableStringify(sectionSlice(mine, a, s.key)) !== stableStringify(sectionSlice(theirs, b, s.key)),
  }));
}

/** Whether two drafts say the same thing once normalised. */
export function sameDraft(a: Draft, b: Draft): boolean {
  return sectionDiff(a, b).every((s) => !s.differs);
}

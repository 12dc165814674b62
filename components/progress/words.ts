import { GLOSSARY, SKILL_WORDS, type SkillStatus } from "@/lib/progress/summary";
import { chartDate } from "./chart-data";
import type { ComingPractical, Reader, SkillView, StudentProgressView, WriteUpStatus } from "./types";

/** The order skills are listed in: strengths first, then what is improving, then what to practise. */
export const SKILL_ORDER: SkillStatus[] = ["secure", "developing", "focus"];

/** Skills grouped under their plain words (SKILL_WORDS), every group present even when empty. */
export function skillGroups(skills: readonly SkillView[]): { status: SkillStatus; label: string; meaning: string; skills: SkillView[] }[] {
  return SKILL_ORDER.map((status) => ({ status, ...SKILL_WORDS[status], skills: skills.filter((s) => s.status === status) }));
}

/** A percentage as a whole number, for people rather than spreadsheets. */
export function wholePercent(p: number): string {
  return `${Math.round(p)}%`;
}

/** "6 out of 8 marks (75%)"; a write-up with no marks available says so instead of dividing by zero. */
export function marksSentence(total: number, maxTotal: number): string {
  if (!(maxTotal > 0)) return `${total} mark${total === 1 ? "" : "s"}`;
  return `${total} out of ${maxTotal} marks (${wholePercent((100 * total) / maxTotal)})`;
}

/** The name a report uses for the student: "you" for the student, their first name for everyone else. */
export function firstNameOf(name: string): string {
  return name.trim().split(/\s+/)[0] ?? name;
}

export function subjectFor(reader: Reader, name: string): string {
  return reader === "student" ? "You" : firstNameOf(name);
}

const WRITE_UP_WORDS: Record<WriteUpStatus, string> = {
  "not-started": "Not started yet",
  draft: "Started, not handed in yet",
  submitted: "Handed in, waiting to be marked",
  marked: "Marked, to be handed back soon",
  returned: "Marked and handed back",
};

function isWriteUpStatus(s: string): s is WriteUpStatus {
  return Object.hasOwn(WRITE_UP_WORDS, s);
}

/** Where a piece of coming work stands, in words a parent understands, and how it is shown. */
export function writeUpWords(status: string, state: ComingPractical["state"]): { text: string; tone: "neutral" | "warn" | "good" | "bad" } {
  const s: WriteUpStatus = isWriteUpStatus(status) ? status : "not-started";
  const handedIn = s === "submitted" || s === "marked" || s === "returned";
  return { text: WRITE_UP_WORDS[s], tone: handedIn ? "good" : state === "late" ? "bad" : s === "draft" ? "warn" : "neutral" };
}

/** The dates line for a practical that is open, coming up or past its due date. */
export function dueWords(c: Pick<ComingPractical, "state" | "opensAt" | "dueAt">, formatDate: (d: Date) => string): string {
  if (c.state === "upcoming") return `Starts ${formatDate(c.opensAt)}, due ${formatDate(c.dueAt)}`;
  if (c.state === "late") return `Was due ${formatDate(c.dueAt)}: it can still be handed in, and will be marked as late`;
  return `Due ${formatDate(c.dueAt)}`;
}

/**
 * A kind of calculation in words that encourage: strong, nearly there, or one to practise. The
 * thresholds are our own rule: three in four right first time is strong; fewer than half is the
 * one to practise.
 */
export function calculationWords(k: { checks: number; rightFirstTime: number }, reader: Reader): { headline: string; tone: "good" | "brand" | "warn" } {
  const share = k.checks ? k.rightFirstTime / k.checks : 0;
  const you = reader === "student";
  if (share >= 0.75) return { headline: you ? "You are strong at this" : "Strong at this", tone: "good" };
  if (share >= 0.5) return { headline: you ? "Nearly there: usually right first time" : "Usually right first time", tone: "brand" };
  return { headline: you ? "One to practise: the hints help you get there" : "One to practise", tone: "warn" };
}

/** "3 of 4 right first time". */
export function rightFirstTimeWords(k: { checks: number; rightFirstTime: number }): string {
  return `${k.rightFirstTime} of ${k.checks} right first time`;
}

/** "came up 3 times". */
export function timesWords(n: number): string {
  return n === 1 ? "came up once" : n === 2 ? "came up twice" : `came up ${n} times`;
}

/** A date as families read it: "8 Dec 2026" (the school's time zone). */
export function dayWords(d: Date | string): string {
  return chartDate(new Date(d).getTime());
}

/**
 * The report's opening lines: how much marked work there is, what is going well, what to work on
 * next, and what is due next. Written for the reader: "You" for the student, the first name otherwise.
 */
export function summaryLines(p: Pick<StudentProgressView, "student" | "returned" | "skills" | "coming" | "missed">, reader: Reader): string[] {
  const who = subjectFor(reader, p.student.name);
  const has = reader === "student" ? "have" : "has";
  const n = p.returned.length;
  const lines = [
    n
      ? `${who} ${has} had ${n} practical${n === 1 ? "" : "s"} marked and handed back.`
      : `${who} ${has} no marked practicals handed back yet. Marks appear here once the teacher hands the work back.`,
  ];
  const names = (status: SkillView["status"]) =>
    p.skills
      .filter((s) => s.status === status)
      .map((s) => s.title.toLowerCase())
      .join(", ");
  const strong = names("secure");
  const next = names("focus");
  if (strong) lines.push(`${SKILL_WORDS.secure.label}: ${strong}.`);
  if (next) lines.push(`${SKILL_WORDS.focus.label}: ${next}.`);
  const due = p.coming.filter((c) => c.state !== "upcoming" && c.writeUp !== "submitted" && c.writeUp !== "marked" && c.writeUp !== "returned");
  if (due.length) lines.push(`Still to hand in: ${due.map((c) => `${c.title} (due ${dayWords(c.dueAt)})`).join("; ")}.`);
  if (p.missed.length) lines.push(`Not handed in before the deadline: ${p.missed.map((m) => m.title).join("; ")}.`);
  return lines;
}

/**
 * The glossary worded for its reader: it is written for families ("your child's"), so a student
 * reads "your" and staff read "the student's".
 */
export function glossaryFor(reader: Reader): { term: string; meaning: string }[] {
  if (reader === "family") return GLOSSARY;
  const replacement = reader === "student" ? { lower: "your", upper: "Your" } : { lower: "the student's", upper: "The student's" };
  return GLOSSARY.map((g) => ({ term: g.term, meaning: g.meaning.replace(/\b(Y|y)our child's\b/g, (_m, y: string) => (y === "Y" ? replacement.upper : replacement.lower)) }));
}

import { checkKinds, slipMessages } from "@/lib/marking";
import type { Verdict } from "@/lib/checks/types";

/** One piece of returned, marked work, as the progress report reads it. */
export type ReturnedWork = {
  writeUpId: string;
  title: string;
  returnedAt: Date;
  total: number;
  maxTotal: number;
  criteria: { title: string; marks: number; max: number; level: string }[];
};

export type SkillStatus = "secure" | "developing" | "focus";

export const SKILL_WORDS: Record<SkillStatus, { label: string; meaning: string }> = {
  secure: { label: "Doing well", meaning: "Usually at or near the top level." },
  developing: { label: "Getting there", meaning: "Often at the middle levels: improving." },
  focus: { label: "Work on next", meaning: "Often at the lower levels: the thing to practise next." },
};

export type SkillProgress = {
  title: string;
  points: { date: Date; percent: number; practical: string }[];
  averagePercent: number;
  latestPercent: number;
  status: SkillStatus;
};

/**
 * Achievement per rubric criterion over time, grouped by the criterion's name (criteria with the
 * same name in different practicals are the same skill). Our rule for the plain words: an average
 * of 70 % or more of the marks available is "doing well", below 45 % "work on next", otherwise
 * "getting there"; a latest result far above the average lifts the word by one step.
 */
export function skillProgress(work: readonly ReturnedWork[]): SkillProgress[] {
  const byTitle = new Map<string, SkillProgress["points"]>();
  const sorted = [...work].sort((a, b) => a.returnedAt.getTime() - b.returnedAt.getTime());
  for (const w of sorted) {
    for (const c of w.criteria) {
      if (!(c.max > 0)) continue;
      const key = c.title.trim();
      const list = byTitle.get(key) ?? [];
      list.push({ date: w.returnedAt, percent: (100 * c.marks) / c.max, practical: w.title });
      byTitle.set(key, list);
    }
  }
  return [...byTitle.entries()]
    .map(([title, points]) => {
      const averagePercent = points.reduce((s, p) => s + p.percent, 0) / points.length;
      const latestPercent = points[points.length - 1]!.percent;
      let status: SkillStatus = averagePercent >= 70 ? "secure" : averagePercent < 45 ? "focus" : "developing";
      if (latestPercent - averagePercent >= 25 && status !== "secure") status = status === "focus" ? "developing" : "secure";
      return { title, points, averagePercent, latestPercent, status };
    })
    .sort((a, b) => a.title.localeCompare(b.title));
}

export type CheckAttemptRow = { writeUpId: string; checkId: string; kind: string; verdict: string; slipCode: string | null; at: Date };

export type CheckHistory = {
  kinds: { kind: string; label: string; checks: number; rightFirstTime: number; share: number }[];
  slips: { code: string; message: string; count: number }[];
};

/**
 * Which kinds of calculation a student gets right first time (the first attempt at each check of
 * each write-up agrees), and which slips recur (counted over every attempt, most frequent first).
 */
export function checkHistory(attempts: readonly CheckAttemptRow[]): CheckHistory {
  const first = new Map<string, CheckAttemptRow>();
  for (const a of [...attempts].sort((x, y) => x.at.getTime() - y.at.getTime())) {
    const key = `${a.writeUpId}:${a.checkId}`;
    if (!first.has(key)) first.set(key, a);
  }
  const kinds = checkKinds
    .map((k) => {
      const firsts = [...first.values()].filter((a) => a.kind === k.kind);
      const right = firsts.filter((a) => (a.verdict as Verdict) === "agrees").length;
      return { kind: k.kind, label: k.label, checks: firsts.length, rightFirstTime: right, share: firsts.length ? right / firsts.length : 0 };
    })
    .filter((k) => k.checks > 0);
  const counts = new Map<string, number>();
  for (const a of attempts) if (a.slipCode) counts.set(a.slipCode, (counts.get(a.slipCode) ?? 0) + 1);
  const slips = [...counts.entries()]
    .map(([code, count]) => ({ code, count, message: (slipMessages as Record<string, string>)[code] ?? code }))
    .sort((a, b) => b.count - a.count || a.code.localeCompare(b.code));
  return { kinds, slips };
}

/** School terms in England and Wales (common practice): autumn September–December, spring January–Easter (to March), summer April–August. */
export function termOf(d: Date): { name: string; from: Date; to: Date } {
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth();
  if (m >= 8) return { name: `Autumn term ${y}`, from: new Date(Date.UTC(y, 8, 1)), to: new Date(Date.UTC(y + 1, 0, 1)) };
  if (m <= 2) return { name: `Spring term ${y}`, from: new Date(Date.UTC(y, 0, 1)), to: new Date(Date.UTC(y, 3, 1)) };
  return { name: `Summer term ${y}`, from: new Date(Date.UTC(y, 3, 1)), to: new Date(Date.UTC(y, 8, 1)) };
}

/** Trade words used in reports, explained in our own plain words for families. */
export const GLOSSARY: { term: string; meaning: string }[] = [
  { term: "Practical", meaning: "A hands-on science activity in the lab, such as timing a reaction or measuring a gas." },
  { term: "Write-up", meaning: "Your child's record of a practical: the plan, the results, graphs, calculations and what they concluded." },
  { term: "Rubric and criteria", meaning: "The list of skills the teacher marks a write-up against, each with levels from 'not yet' to the top level." },
  { term: "Results table", meaning: "The table of measurements taken in the lab, with the unit in each column heading." },
  { term: "Gradient", meaning: "How steep a line on a graph is: how much one quantity changes for each step in the other." },
  { term: "Tangent", meaning: "A straight line drawn to just touch a curve at one point, used to find how fast something is changing at that moment." },
  { term: "Rate of reaction", meaning: "How quickly a chemical reaction happens, for example how many cm³ of gas are made each second." },
  { term: "Mean and anomaly", meaning: "The mean is the average of repeated readings; an anomaly is a reading that does not fit the others and is left out." },
  { term: "Significant figures", meaning: "How many digits of an answer are meaningful; answers should not claim more precision than the measurements had." },
  { term: "Uncertainty", meaning: "How far a measurement could be from the true value, because every instrument has limits." },
  { term: "Moderation", meaning: "Another teacher re-marks a sample of work to make sure marking is fair and consistent." },
];

import "server-only";
import Papa from "papaparse";
import { and, eq, inArray } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { suggestLevel } from "@/lib/checks/prefill";
import type { Verdict } from "@/lib/checks/types";
import { appUrl } from "@/lib/config";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { sendMail, simpleHtml } from "@/lib/mail";
import type { MarkSaveInput } from "@/lib/validation/marking";
import type { PracticalContent } from "@/lib/validation/practicals";
import { getDb, type DbOrTx } from "../client";
import { classes, labSessions, marks, parentLinks, practicalVersions, users, writeUps, type CriterionMark, type Mark } from "../schema";
import { recordAudit } from "./audit";
import { teachesClass } from "./classes";
import { getWriteUp, listSessionWriteUps, type WriteUpView } from "./write-ups";

type Rubric = NonNullable<PracticalContent["rubric"]>;

export function rubricMax(rubric: Rubric | null): number {
  return rubric ? rubric.criteria.reduce((s, c) => s + Math.max(...c.levels.map((l) => l.marks)), 0) : 0;
}

function requireMarker(db: DbOrTx, actor: Actor, classId: string) {
  if (!hasRole(actor, "teacher") || !teachesClass(db, actor, classId)) throw forbidden("Only the class's teacher can mark this work.");
}

/** Bench statuses a teacher works through. */
export type BenchStatus = "not-started" | "draft" | "submitted" | "late" | "marked" | "returned";

/**
 * The marking bench for a lab session: every student with the state of their work, check
 * verdicts at a glance and marks per criterion. Teachers of the class (and admins, read-only).
 */
export function getMarkingBench({ actor, labSessionId }: { actor: Actor; labSessionId: string }) {
  const db = getDb();
  const s = db.select().from(labSessions).where(and(eq(labSessions.id, labSessionId), eq(labSessions.schoolId, actor.schoolId))).get();
  if (!s) throw notFound("That lab session");
  const canMark = hasRole(actor, "teacher") && teachesClass(db, actor, s.classId);
  if (!canMark && !hasRole(actor, "admin")) throw forbidden("This lab session is not for one of your classes.");
  const { rows, content } = listSessionWriteUps({ actor, labSessionId });
  const ids = rows.map((r) => r.writeUpId).filter((x): x is string => !!x);
  const markRows = ids.length ? db.select().from(marks).where(inArray(marks.writeUpId, ids)).all() : [];
  const byWriteUp = new Map(markRows.map((m) => [m.writeUpId, m]));
  const version = db.select({ title: practicalVersions.title }).from(practicalVersions).where(eq(practicalVersions.id, s.practicalVersionId)).get();
  const cls = db.select({ name: classes.name }).from(classes).where(eq(classes.id, s.classId)).get();
  const rubric = content.rubric;
  return {
    labSession: { id: s.id, title: version?.title ?? "", className: cls?.name ?? "", dueAt: s.dueAt },
    canMark,
    rubric: rubric ? { title: rubric.title, style: rubric.style, criteria: rubric.criteria.map((c) => ({ id: c.id, title: c.title, max: Math.max(...c.levels.map((l) => l.marks)), levels: c.levels.map((l) => ({ id: l.id, label: l.label, marks: l.marks })) })) } : null,
    maxTotal: rubricMax(rubric),
    checks: content.checks.map((c) => ({ id: c.id, label: c.label })),
    rows: rows.map((r) => {
      const m = r.writeUpId ? byWriteUp.get(r.writeUpId) : undefined;
      const status: BenchStatus = r.status === "submitted" && r.late ? "late" : (r.status as BenchStatus);
      return {
        studentId: r.studentId,
        studentName: r.studentName,
        writeUpId: r.writeUpId,
        status,
        late: r.late,
        submittedAt: r.submittedAt,
        checks: Object.fromEntries(Object.entries(r.checks).map(([k, v]) => [k, v.verdict])) as Record<string, Verdict>,
        marks: Object.fromEntries(Object.entries(m?.criteria ?? {}).map(([k, v]) => [k, v.marks])) as Record<string, number>,
        total: m && Object.keys(m.criteria).length ? (m.adjustedTotal ?? m.total) : null,
        adjusted: m?.adjustedTotal != null,
      };
    }),
  };
}

function loadForMarking(db: DbOrTx, actor: Actor, writeUpId: string) {
  const w = db.select().from(writeUps).where(and(eq(writeUps.id, writeUpId), eq(writeUps.schoolId, actor.schoolId))).get();
  if (!w) throw notFound("That write-up");
  const s = db.select().from(labSessions).where(eq(labSessions.id, w.labSessionId)).get()!;
  const version = db.select({ content: practicalVersions.content, title: practicalVersions.title }).from(practicalVersions).where(eq(practicalVersions.id, w.practicalVersionId)).get()!;
  return { w, s, content: version.content, title: version.title };
}

function suggestionsFor(content: PracticalContent, view: WriteUpView) {
  const verdicts = Object.fromEntries(Object.entries(view.checks).map(([k, v]) => [k, v.stale ? undefined : v.verdict]));
  const out: Record<string, { levelId: string; reason: string }> = {};
  for (const c of content.rubric?.criteria ?? []) {
    const s = suggestLevel(c, verdicts);
    if (s) out[c.id] = s;
  }
  return out;
}

function markDto(m: Mark | undefined) {
  return m
    ? { criteria: m.criteria, comments: m.comments, feedback: m.feedback, total: m.total, maxTotal: m.maxTotal, adjustedTotal: m.adjustedTotal, revision: m.revision, markedAt: m.markedAt, returnedAt: m.returnedAt }
    : null;
}

/** One write-up beside its rubric, with the levels the checks suggest and the neighbours to move to. */
export function getMarkingItem({ actor, writeUpId }: { actor: Actor; writeUpId: string }) {
  const db = getDb();
  const { w, s, content } = loadForMarking(db, actor, writeUpId);
  const canMark = hasRole(actor, "teacher") && teachesClass(db, actor, s.classId);
  if (!canMark && !hasRole(actor, "admin")) throw notFound("That write-up");
  const view = getWriteUp({ actor, writeUpId });
  const m = db.select().from(marks).where(eq(marks.writeUpId, w.id)).get();
  const order = listSessionWriteUps({ actor, labSessionId: s.id }).rows.filter((r) => r.writeUpId && r.status !== "draft");
  const at = order.findIndex((r) => r.writeUpId === w.id);
  return {
    view,
    canMark,
    rubric: content.rubric,
    maxTotal: rubricMax(content.rubric),
    mark: markDto(m),
    suggestions: suggestionsFor(content, view),
    previousId: at > 0 ? order[at - 1]!.writeUpId : null,
    nextId: at >= 0 && at < order.length - 1 ? order[at + 1]!.writeUpId : null,
  };
}

/**
 * Saves the teacher's marks for one write-up. Levels must exist; marks come from the level;
 * choosing a different level from the one the checks suggested needs a reason. The revision
 * stops two teachers overwriting each other. Writes the audit log with before and after.
 */
export function saveMark({ actor, writeUpId, input, now = new Date() }: { actor: Actor; writeUpId: string; input: MarkSaveInput; now?: Date }) {
  return getDb().transaction((db) => {
    const { w, s, content } = loadForMarking(db, actor, writeUpId);
    requireMarker(db, actor, s.classId);
    if (w.status === "draft") throw new AppError("conflict", "This write-up has not been handed in yet, so it cannot be marked.", { detail: { reason: "not-submitted" } });
    const rubric = content.rubric;
    if (!rubric) throw new AppError("bad_request", "This practical has no rubric to mark against.");
    const existing = db.select().from(marks).where(eq(marks.writeUpId, w.id)).get();
    const currentRevision = existing?.revision ?? 0;
    if (input.revision !== currentRevision) {
      throw new AppError("conflict", "Someone else saved marks for this write-up since you opened it. Their marks are shown; check them before saving again.", { detail: { reason: "stale", current: markDto(existing) } });
    }
    const view = getWriteUp({ actor, writeUpId });
    const suggestions = suggestionsFor(content, view);
    const fieldErrors: Record<string, string[]> = {};
    const criteria: Record<string, CriterionMark> = {};
    for (const [criterionId, chosen] of Object.entries(input.criteria)) {
      const criterion = rubric.criteria.find((c) => c.id === criterionId);
      if (!criterion) {
        fieldErrors[`criteria.${criterionId}`] = ["This criterion is not in the rubric."];
        continue;
      }
      const level = criterion.levels.find((l) => l.id === chosen.levelId);
      if (!level) {
        fieldErrors[`criteria.${criterionId}.levelId`] = [`“${criterion.title}” has no such level. Choose one of: ${criterion.levels.map((l) => l.label).join(", ")}.`];
        continue;
      }
      const suggestion = suggestions[criterionId];
      const overridden = !!suggestion && suggestion.levelId !== level.id;
      const reason = chosen.overrideReason?.trim() || null;
      if (overridden && !reason) fieldErrors[`criteria.${criterionId}.overrideReason`] = ["The calculation checks suggested another level: say why you chose this one."];
      criteria[criterionId] = { levelId: level.id, marks: level.marks, fromChecks: !!suggestion && !overridden, overrideReason: overridden ? reason : null };
    }
    for (const key of Object.keys(input.comments)) {
      const ok = ["plan", "observations", "conclusion", "evaluation", "graphs", "general"].includes(key) || /^(table|graph|check):[A-Za-z0-9_-]{1,40}$/.test(key);
      if (!ok) fieldErrors[`comments.${key}`] = ["Comments can only be left on sections of the write-up."];
    }
    if (Object.keys(fieldErrors).length) throw new AppError("bad_request", "Some marks need attention.", { fieldErrors });
    const total = Object.values(criteria).reduce((sum, c) => sum + c.marks, 0);
    const maxTotal = rubricMax(rubric);
    const complete = rubric.criteria.every((c) => criteria[c.id]);
    const values = { criteria, comments: Object.fromEntries(Object.entries(input.comments).filter(([, v]) => v)), feedback: input.feedback, total, maxTotal, markerId: actor.userId, revision: currentRevision + 1, markedAt: complete ? now : null, updatedAt: now };
    if (existing) db.update(marks).set(values).where(and(eq(marks.id, existing.id), eq(marks.revision, currentRevision))).run();
    else db.insert(marks).values({ schoolId: actor.schoolId, writeUpId: w.id, ...values, createdAt: now }).run();
    const nextStatus = complete ? (w.status === "returned" ? "returned" : "marked") : w.status === "marked" ? "submitted" : w.status;
    if (nextStatus !== w.status) db.update(writeUps).set({ status: nextStatus, updatedAt: now }).where(eq(writeUps.id, w.id)).run();
    recordAudit(db, {
      schoolId: actor.schoolId,
      actorId: actor.userId,
      action: Object.values(criteria).some((c) => c.overrideReason) ? "mark.save-with-override" : "mark.save",
      entityType: "write-up",
      entityId: w.id,
      before: existing ? { criteria: existing.criteria, total: existing.total, feedback: existing.feedback } : null,
      after: { criteria, total, feedback: input.feedback },
    });
    return { revision: currentRevision + 1, total, maxTotal, complete, status: nextStatus };
  });
}

/**
 * Returns marked work to the student, who is told by e-mail (and so are parents who want
 * e-mails). Unsubmitted or unmarked work cannot be returned.
 */
export async function returnWriteUp({ actor, writeUpId, now = new Date() }: { actor: Actor; writeUpId: string; now?: Date }) {
  const db = getDb();
  const result = db.transaction((tx) => {
    const { w, s, title } = loadForMarking(tx, actor, writeUpId);
    requireMarker(tx, actor, s.classId);
    if (w.status === "draft" || w.status === "submitted") {
      throw new AppError("conflict", w.status === "draft" ? "This write-up has not been handed in, so it cannot be returned." : "Finish marking every criterion before returning this write-up.", { detail: { reason: w.status === "draft" ? "not-submitted" : "not-marked" } });
    }
    if (w.status === "returned") throw new AppError("conflict", "This write-up has already been returned.", { detail: { reason: "already-returned" } });
    tx.update(writeUps).set({ status: "returned", updatedAt: now }).where(eq(writeUps.id, w.id)).run();
    tx.update(marks).set({ returnedAt: now }).where(eq(marks.writeUpId, w.id)).run();
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "write-up.return", entityType: "write-up", entityId: w.id, before: { status: w.status }, after: { status: "returned" } });
    const student = tx.select({ id: users.id, name: users.name, email: users.email, notify: users.emailNotifications }).from(users).where(eq(users.id, w.studentId)).get()!;
    const parents = tx
      .select({ name: users.name, email: users.email, notify: users.emailNotifications, active: users.active })
      .from(parentLinks)
      .innerJoin(users, eq(users.id, parentLinks.parentId))
      .where(eq(parentLinks.studentId, w.studentId))
      .all();
    return { student, parents, title, labSessionId: s.id };
  });
  const link = `${appUrl()}/lab-sessions/${result.labSessionId}/write-up`;
  const mails: Promise<void>[] = [];
  if (result.student.notify) {
    mails.push(
      sendMail({
        to: result.student.email,
        schoolId: actor.schoolId,
        subject: `Your write-up has been marked: ${result.title}`,
        text: `Hello ${result.student.name},\n\n${actor.name} has marked and returned your write-up for "${result.title}". Your marks and feedback are in Meniscus:\n\n${link}\n`,
        html: simpleHtml({ paragraphs: [`Hello ${result.student.name},`, `${actor.name} has marked and returned your write-up for “${result.title}”. Your marks and feedback are in Meniscus.`], link, linkText: "See my marks and feedback" }),
      }),
    );
  }
  for (const p of result.parents.filter((p) => p.notify && p.active)) {
    mails.push(
      sendMail({
        to: p.email,
        schoolId: actor.schoolId,
        subject: `${result.student.name}'s science work has been marked`,
        text: `Hello ${p.name},\n\n${result.student.name}'s write-up for the practical "${result.title}" has been marked and returned. You can see the marks and the teacher's feedback in Meniscus:\n\n${appUrl()}/\n\nYou can turn these e-mails off under Account in Meniscus.\n`,
        html: simpleHtml({ paragraphs: [`Hello ${p.name},`, `${result.student.name}'s write-up for the practical “${result.title}” has been marked and returned. You can see the marks and the teacher's feedback in Meniscus.`, "You can turn these e-mails off under Account in Meniscus."], link: `${appUrl()}/`, linkText: "Open Meniscus" }),
      }),
    );
  }
  const sent = await Promise.allSettled(mails);
  const failed = sent.filter((r) => r.status === "rejected").length;
  if (failed) console.error(`[meniscus] ${failed} return e-mail(s) could not be sent`);
  return { returnedAt: now, emailed: sent.length - failed, emailFailures: failed };
}

/** A spreadsheet cell that starts like a formula is prefixed with ' so spreadsheets show it as text. */
export function csvSafe(value: string | number | null | undefined): string {
  const s = value == null ? "" : String(value);
  return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}

/** The class's marks as CSV for the school's own records (teachers of the class and admins). */
export function exportMarksCsv({ actor, labSessionId }: { actor: Actor; labSessionId: string }): { filename: string; csv: string } {
  const bench = getMarkingBench({ actor, labSessionId });
  const criteria = bench.rubric?.criteria ?? [];
  const header = ["Student", "Status", "Handed in", ...criteria.map((c) => `${c.title} (out of ${c.max})`), `Total (out of ${bench.maxTotal})`, "Adjusted by moderation"];
  const rows = bench.rows.map((r) => [
    csvSafe(r.studentName),
    r.status,
    r.submittedAt ? new Date(r.submittedAt).toISOString().slice(0, 16).replace("T", " ") : "",
    ...criteria.map((c) => (r.marks[c.id] ?? "") as string | number),
    r.total ?? "",
    r.adjusted ? "yes" : "",
  ]);
  const csv = Papa.unparse({ fields: header.map(csvSafe), data: rows }, { quotes: true });
  const safeName = `${bench.labSession.className} ${bench.labSession.title}`.replace(/[^A-Za-z0-9 -]/g, "").replace(/\s+/g, "-").slice(0, 80);
  return { filename: `marks-${safeName || "lab-session"}.csv`, csv };
}

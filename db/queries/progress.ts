import "server-only";
import Papa from "papaparse";
import { and, asc, eq, gte, inArray, isNull, lt } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { appUrl } from "@/lib/config";
import { forbidden, notFound } from "@/lib/errors";
import { sendMail, simpleHtml } from "@/lib/mail";
import { termReportPdf } from "@/lib/reports/term-report";
import { checkHistory, skillProgress, termOf, type ReturnedWork } from "@/lib/progress/summary";
import { getDb, type DbOrTx } from "../client";
import { checkAttempts, classes, classStudents, labSessions, marks, parentLinks, practicalVersions, schools, users, writeUps, type WriteUpStatus } from "../schema";
import { recordAudit } from "./audit";
import { taughtClassIds, teachesClass } from "./classes";
import { labSessionState } from "./lab-sessions";
import { csvSafe } from "./marking";

/**
 * Who may see a student's progress: the student, their linked parents, teachers of one of their
 * classes, and admins — all within the school. Anyone else gets "not found", so guessing ids
 * reveals nothing.
 */
export function canSeeStudent(db: DbOrTx, actor: Actor, studentId: string): boolean {
  const student = db.select({ id: users.id }).from(users).where(and(eq(users.id, studentId), eq(users.schoolId, actor.schoolId))).get();
  if (!student) return false;
  if (actor.userId === studentId) return true;
  if (hasRole(actor, "admin")) return true;
  if (hasRole(actor, "parent") && db.select({ id: parentLinks.studentId }).from(parentLinks).where(and(eq(parentLinks.parentId, actor.userId), eq(parentLinks.studentId, studentId))).get()) return true;
  if (hasRole(actor, "teacher")) {
    const taught = taughtClassIds(db, actor);
    if (taught.length && db.select({ id: classStudents.classId }).from(classStudents).where(and(eq(classStudents.studentId, studentId), inArray(classStudents.classId, taught))).get()) return true;
  }
  return false;
}

function returnedWork(db: DbOrTx, studentId: string, range?: { from: Date; to: Date }) {
  const teacher = users;
  const conditions = [eq(writeUps.studentId, studentId), eq(writeUps.status, "returned")];
  if (range) conditions.push(gte(marks.returnedAt, range.from), lt(marks.returnedAt, range.to));
  const rows = db
    .select({
      writeUpId: writeUps.id,
      labSessionId: writeUps.labSessionId,
      title: practicalVersions.title,
      topic: practicalVersions.topic,
      content: practicalVersions.content,
      criteria: marks.criteria,
      total: marks.total,
      adjustedTotal: marks.adjustedTotal,
      maxTotal: marks.maxTotal,
      feedback: marks.feedback,
      returnedAt: marks.returnedAt,
      late: writeUps.late,
      markerName: teacher.name,
    })
    .from(writeUps)
    .innerJoin(marks, eq(marks.writeUpId, writeUps.id))
    .innerJoin(practicalVersions, eq(practicalVersions.id, writeUps.practicalVersionId))
    .leftJoin(teacher, eq(teacher.id, marks.markerId))
    .where(and(...conditions))
    .orderBy(asc(marks.returnedAt))
    .all();
  return rows.map((r) => {
    const criteria = (r.content.rubric?.criteria ?? []).map((c) => {
      const chosen = r.criteria[c.id];
      const level = c.levels.find((l) => l.id === chosen?.levelId);
      return { title: c.title, marks: chosen?.marks ?? 0, max: Math.max(...c.levels.map((l) => l.marks)), level: level?.label ?? "Not marked" };
    });
    return {
      writeUpId: r.writeUpId,
      labSessionId: r.labSessionId,
      title: r.title,
      topic: r.topic,
      returnedAt: r.returnedAt ?? new Date(0),
      total: r.adjustedTotal ?? r.total,
      maxTotal: r.maxTotal,
      feedback: r.feedback,
      late: r.late,
      markerName: r.markerName,
      criteria,
    };
  });
}

/**
 * A student's progress: returned work with marks and feedback (only returned work), their open and
 * coming lab sessions, each skill over time in plain words, and — for the student and their
 * teachers — which kinds of calculation they get right first time and which slips recur.
 */
export function getStudentProgress({ actor, studentId, now = new Date(), term }: { actor: Actor; studentId: string; now?: Date; term?: { from: Date; to: Date } }) {
  const db = getDb();
  if (!canSeeStudent(db, actor, studentId)) throw notFound("That student");
  const student = db.select({ id: users.id, name: users.name, yearGroup: users.yearGroup }).from(users).where(eq(users.id, studentId)).get()!;
  const studentClasses = db
    .select({ id: classes.id, name: classes.name })
    .from(classStudents)
    .innerJoin(classes, eq(classes.id, classStudents.classId))
    .where(and(eq(classStudents.studentId, studentId), eq(classes.archived, false)))
    .orderBy(asc(classes.name))
    .all();
  const work = returnedWork(db, studentId, term);
  const sessions = studentClasses.length
    ? db
        .select({ id: labSessions.id, title: practicalVersions.title, className: classes.name, opensAt: labSessions.opensAt, dueAt: labSessions.dueAt, lateWork: labSessions.lateWork, lateDays: labSessions.lateDays, cancelledAt: labSessions.cancelledAt })
        .from(labSessions)
        .innerJoin(practicalVersions, eq(practicalVersions.id, labSessions.practicalVersionId))
        .innerJoin(classes, eq(classes.id, labSessions.classId))
        .where(and(inArray(labSessions.classId, studentClasses.map((c) => c.id)), isNull(labSessions.cancelledAt)))
        .orderBy(asc(labSessions.dueAt))
        .all()
    : [];
  const own = new Map(db.select({ labSessionId: writeUps.labSessionId, status: writeUps.status }).from(writeUps).where(eq(writeUps.studentId, studentId)).all().map((w) => [w.labSessionId, w.status]));
  const coming = sessions
    .map((s) => ({ id: s.id, title: s.title, className: s.className, opensAt: s.opensAt, dueAt: s.dueAt, state: labSessionState(s, now), writeUp: (own.get(s.id) ?? "not-started") as WriteUpStatus | "not-started" }))
    .filter((s) => s.state === "open" || s.state === "upcoming" || s.state === "late");
  const missed = sessions.filter((s) => labSessionState(s, now) === "closed" && (!own.has(s.id) || own.get(s.id) === "draft")).map((s) => ({ id: s.id, title: s.title, dueAt: s.dueAt }));
  const showChecks = actor.userId === studentId || hasRole(actor, "teacher", "admin");
  const history = showChecks
    ? checkHistory(
        db
          .select({ writeUpId: checkAttempts.writeUpId, checkId: checkAttempts.checkId, kind: checkAttempts.kind, verdict: checkAttempts.verdict, slipCode: checkAttempts.slipCode, at: checkAttempts.at })
          .from(checkAttempts)
          .where(eq(checkAttempts.studentId, studentId))
          .all(),
      )
    : null;
  const forReport: ReturnedWork[] = work.map((w) => ({ writeUpId: w.writeUpId, title: w.title, returnedAt: w.returnedAt, total: w.total, maxTotal: w.maxTotal, criteria: w.criteria }));
  return { student: { ...student, classes: studentClasses }, returned: work, coming, missed, skills: skillProgress(forReport), checkHistory: history, term: term ?? null };
}

/** The parent's children with their progress (only linked children; only returned work). */
export function listChildrenProgress({ actor, now = new Date() }: { actor: Actor; now?: Date }) {
  if (!hasRole(actor, "parent")) throw forbidden("Only parents and guardians have linked children.");
  const kids = getDb()
    .select({ id: users.id })
    .from(parentLinks)
    .innerJoin(users, eq(users.id, parentLinks.studentId))
    .where(and(eq(parentLinks.parentId, actor.userId), eq(users.active, true), eq(users.schoolId, actor.schoolId)))
    .orderBy(asc(users.name))
    .all();
  return kids.map((k) => getStudentProgress({ actor, studentId: k.id, now }));
}

/** A class's progress across lab sessions: who has not handed in, who struggles with which kind of calculation. */
export function getClassProgress({ actor, classId, now = new Date() }: { actor: Actor; classId: string; now?: Date }) {
  const db = getDb();
  const cls = db.select({ id: classes.id, name: classes.name }).from(classes).where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId))).get();
  if (!cls) throw notFound("That class");
  if (!hasRole(actor, "admin") && !teachesClass(db, actor, classId)) throw forbidden("This class is not one of yours.");
  const students = db.select({ id: users.id, name: users.name }).from(classStudents).innerJoin(users, eq(users.id, classStudents.studentId)).where(eq(classStudents.classId, classId)).orderBy(asc(users.name)).all();
  const sessions = db
    .select({ id: labSessions.id, title: practicalVersions.title, opensAt: labSessions.opensAt, dueAt: labSessions.dueAt, lateWork: labSessions.lateWork, lateDays: labSessions.lateDays, cancelledAt: labSessions.cancelledAt })
    .from(labSessions)
    .innerJoin(practicalVersions, eq(practicalVersions.id, labSessions.practicalVersionId))
    .where(and(eq(labSessions.classId, classId), isNull(labSessions.cancelledAt)))
    .orderBy(asc(labSessions.dueAt))
    .all()
    .filter((s) => now.getTime() > s.dueAt.getTime());
  const ids = students.map((s) => s.id);
  const ws = ids.length && sessions.length ? db.select({ studentId: writeUps.studentId, labSessionId: writeUps.labSessionId, status: writeUps.status, id: writeUps.id }).from(writeUps).where(and(inArray(writeUps.studentId, ids), inArray(writeUps.labSessionId, sessions.map((s) => s.id)))).all() : [];
  const ms = ws.length ? db.select({ writeUpId: marks.writeUpId, total: marks.total, adjustedTotal: marks.adjustedTotal, maxTotal: marks.maxTotal }).from(marks).where(inArray(marks.writeUpId, ws.map((w) => w.id))).all() : [];
  const attempts = ids.length ? db.select({ studentId: checkAttempts.studentId, writeUpId: checkAttempts.writeUpId, checkId: checkAttempts.checkId, kind: checkAttempts.kind, verdict: checkAttempts.verdict, slipCode: checkAttempts.slipCode, at: checkAttempts.at }).from(checkAttempts).where(inArray(checkAttempts.studentId, ids)).all() : [];
  const rows = students.map((st) => {
    const mine = ws.filter((w) => w.studentId === st.id);
    const handedIn = mine.filter((w) => w.status !== "draft");
    const notHandedIn = sessions.filter((s) => !handedIn.some((w) => w.labSessionId === s.id)).map((s) => s.title);
    const marked = ms.filter((m) => handedIn.some((w) => w.id === m.writeUpId) && m.maxTotal > 0);
    const averagePercent = marked.length ? marked.reduce((s, m) => s + (100 * (m.adjustedTotal ?? m.total)) / m.maxTotal, 0) / marked.length : null;
    const history = checkHistory(attempts.filter((a) => a.studentId === st.id));
    const struggling = history.kinds.filter((k) => k.checks >= 1 && k.share < 0.5).map((k) => k.label);
    return { studentId: st.id, name: st.name, handedIn: handedIn.length, due: sessions.length, notHandedIn, averagePercent, struggling, commonSlip: history.slips[0]?.message ?? null };
  });
  return { class: cls, sessions: sessions.map((s) => ({ id: s.id, title: s.title, dueAt: s.dueAt })), rows };
}

export function classProgressCsv({ actor, classId, now = new Date() }: { actor: Actor; classId: string; now?: Date }) {
  const p = getClassProgress({ actor, classId, now });
  const csv = Papa.unparse(
    {
      fields: ["Student", "Handed in", "Due", "Not handed in", "Average mark (%)", "Calculations to practise", "Most common slip"],
      data: p.rows.map((r) => [csvSafe(r.name), r.handedIn, r.due, csvSafe(r.notHandedIn.join("; ")), r.averagePercent == null ? "" : r.averagePercent.toFixed(0), csvSafe(r.struggling.join("; ")), csvSafe(r.commonSlip ?? "")]),
    },
    { quotes: true },
  );
  return { filename: `progress-${p.class.name.replace(/[^A-Za-z0-9 -]/g, "").replace(/\s+/g, "-")}.csv`, csv };
}


/** Everything the term PDF shows for one student (only returned work in the term). */
export async function termReportFor({ actor, studentId, now = new Date() }: { actor: Actor; studentId: string; now?: Date }) {
  const term = termOf(now);
  const p = getStudentProgress({ actor, studentId, now, term });
  const school = getDb().select({ name: schools.name }).from(schools).where(eq(schools.id, actor.schoolId)).get()!;
  const pdf = await termReportPdf({
    schoolName: school.name,
    termName: term.name,
    generatedAt: now,
    student: { name: p.student.name, yearGroup: p.student.yearGroup, classes: p.student.classes },
    returned: p.returned.map((w) => ({ title: w.title, returnedAt: w.returnedAt, total: w.total, maxTotal: w.maxTotal, feedback: w.feedback, markerName: w.markerName, late: w.late, criteria: w.criteria })),
    skills: p.skills,
    coming: p.coming.map((c) => ({ title: c.title, dueAt: c.dueAt, state: c.state })),
  });
  const filename = `progress-report-${p.student.name.replace(/[^A-Za-z0-9 -]/g, "").replace(/\s+/g, "-")}-${term.name.replace(/\s+/g, "-").toLowerCase()}.pdf`;
  return { pdf, filename, studentName: p.student.name, termName: term.name };
}

/**
 * E-mails each family in a class their child's term report as a PDF (teachers of the class and
 * admins). Parents who turned e-mails off are skipped. Returns what was sent.
 */
export async function emailTermReports({ actor, classId, now = new Date() }: { actor: Actor; classId: string; now?: Date }) {
  const db = getDb();
  const cls = db.select({ id: classes.id, name: classes.name }).from(classes).where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId))).get();
  if (!cls) throw notFound("That class");
  if (!hasRole(actor, "admin") && !teachesClass(db, actor, classId)) throw forbidden("This class is not one of yours.");
  const families = db
    .select({ studentId: classStudents.studentId, parentName: users.name, parentEmail: users.email, notify: users.emailNotifications, active: users.active })
    .from(classStudents)
    .innerJoin(parentLinks, eq(parentLinks.studentId, classStudents.studentId))
    .innerJoin(users, eq(users.id, parentLinks.parentId))
    .where(eq(classStudents.classId, classId))
    .all();
  let sent = 0;
  let skipped = 0;
  let failed = 0;
  const reports = new Map<string, Awaited<ReturnType<typeof termReportFor>>>();
  for (const f of families) {
    if (!f.notify || !f.active) {
      skipped++;
      continue;
    }
    let report = reports.get(f.studentId);
    if (!report) {
      report = await termReportFor({ actor, studentId: f.studentId, now });
      reports.set(f.studentId, report);
    }
    try {
      await sendMail({
        to: f.parentEmail,
        schoolId: actor.schoolId,
        subject: `${report.studentName}'s science practical report: ${report.termName}`,
        text: `Hello ${f.parentName},\n\nAttached is ${report.studentName}'s report on practical science for the ${report.termName.toLowerCase()}: the practicals marked so far, what is going well and what to work on next, in plain words.\n\nYou can also see it at any time in Meniscus: ${appUrl()}/\n\nYou can turn these e-mails off under Account in Meniscus.\n`,
        html: simpleHtml({
          paragraphs: [`Hello ${f.parentName},`, `Attached is ${report.studentName}'s report on practical science for the ${report.termName.toLowerCase()}: the practicals marked so far, what is going well and what to work on next, in plain words.`, "You can turn these e-mails off under Account in Meniscus."],
          link: `${appUrl()}/`,
          linkText: "Open Meniscus",
        }),
        attachments: [{ filename: report.filename, content: report.pdf, contentType: "application/pdf" }],
      });
      sent++;
    } catch (e) {
      console.error("[meniscus] report e-mail failed", e);
      failed++;
    }
  }
  recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "progress.email-reports", entityType: "class", entityId: classId, after: { sent, skipped, failed } });
  return { sent, skipped, failed };
}

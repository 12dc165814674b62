import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { runPracticalCheck, studentView } from "@/lib/checks/run";
import type { CheckAnswer, CheckOutcome, StudentCheckView } from "@/lib/checks/types";
import { AppError, forbidden, notFound } from "@/lib/errors";
import type { PracticalContent } from "@/lib/validation/practicals";
import { writeUpContentSchema, type GroupTables, type WriteUpContent } from "@/lib/validation/write-ups";
import { keptInReadings, rowsForCheck } from "@/lib/write-ups/rows-for-check";
import { answerFingerprint, checkDataFingerprint, isStale } from "@/lib/write-ups/stale";
import { getDb, preparedOnce, type DbOrTx } from "../client";
import { checkAttempts, classes, classStudents, groupTables, labSessions, marks, moderationItems, moderationSamples, parentLinks, practicalVersions, users, writeUps, type LabSession, type WriteUp, type WriteUpStatus } from "../schema";
import { recordAudit } from "./audit";
import { teachesClass } from "./classes";
import { labSessionState } from "./lab-sessions";

export function emptyWriteUpContent(): WriteUpContent {
  return writeUpContentSchema.parse({});
}

type Access = "owner" | "staff";

function loadSession(db: DbOrTx, schoolId: string, labSessionId: string): LabSession {
  const s = db.select().from(labSessions).where(and(eq(labSessions.id, labSessionId), eq(labSessions.schoolId, schoolId))).get();
  if (!s) throw notFound("That lab session");
  return s;
}

function loadWriteUp(db: DbOrTx, actor: Actor, writeUpId: string): { w: WriteUp; s: LabSession; access: Access } {
  const w = db.select().from(writeUps).where(and(eq(writeUps.id, writeUpId), eq(writeUps.schoolId, actor.schoolId))).get();
  if (!w) throw notFound("That write-up");
  const s = loadSession(db, actor.schoolId, w.labSessionId);
  if (w.studentId === actor.userId) return { w, s, access: "owner" };
  if (hasRole(actor, "admin") || teachesClass(db, actor, s.classId)) return { w, s, access: "staff" };
  // Someone else's work: say nothing about whether it exists.
  throw notFound("That write-up");
}

function groupOf(s: LabSession, studentId: string) {
  return s.grouping === "groups" ? (s.groups.find((g) => g.studentIds.includes(studentId)) ?? null) : null;
}

function loadGroupTables(db: DbOrTx, s: LabSession, groupId: string) {
  return db.select().from(groupTables).where(and(eq(groupTables.labSessionId, s.id), eq(groupTables.groupId, groupId))).get() ?? null;
}

/** The tables a write-up's checks read: the group's when data are shared, otherwise the student's own. */
function effectiveTables(db: DbOrTx, s: LabSession, w: WriteUp): { tables: GroupTables; groupRevision: number | null; groupId: string | null } {
  const group = groupOf(s, w.studentId);
  if (!group) return { tables: w.content.tables, groupRevision: null, groupId: null };
  const row = loadGroupTables(db, s, group.id);
  return { tables: row?.tables ?? {}, groupRevision: row?.revision ?? 0, groupId: group.id };
}

function loadVersionContent(db: DbOrTx, versionId: string) {
  const v = db
    .select({ id: practicalVersions.id, title: practicalVersions.title, topic: practicalVersions.topic, version: practicalVersions.version, content: practicalVersions.content, practicalId: practicalVersions.practicalId })
    .from(practicalVersions)
    .where(eq(practicalVersions.id, versionId))
    .get();
  if (!v) throw notFound("That practical");
  return v;
}

function editableState(s: LabSession, now: Date) {
  return labSessionState(s, now);
}

export type CheckState = StudentCheckView & { stale: boolean; ranAt: number };

/** Everything the write-up page needs, shaped for who is looking. */
function buildView(db: DbOrTx, actor: Actor, w: WriteUp, s: LabSession, access: Access, now: Date) {
  const version = loadVersionContent(db, w.practicalVersionId);
  const { tables, groupRevision, groupId } = effectiveTables(db, s, w);
  const cls = db.select({ name: classes.name }).from(classes).where(eq(classes.id, s.classId)).get();
  const student = db.select({ name: users.name }).from(users).where(eq(users.id, w.studentId)).get();
  const released = w.status === "returned";
  const checks: Record<string, CheckState & { outcome?: CheckOutcome }> = {};
  for (const spec of version.content.checks) {
    const stored = w.checkResults[spec.id];
    if (!stored) continue;
    const stale = isStale(stored, { dataHash: checkDataFingerprint(spec, tables), answerHash: answerFingerprint(w.content.answers[spec.id]) });
    const view = studentView(stored.outcome, spec.show, released);
    checks[spec.id] = { ...view, stale, ranAt: stored.at, ...(access === "staff" ? { outcome: stored.outcome } : {}) };
  }
  const group = groupOf(s, w.studentId);
  const groupMembers = group
    ? db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, group.studentIds)).orderBy(asc(users.name)).all()
    : [];
  // Marks and feedback: the student sees them once the work is returned; staff always.
  const markRow = access === "staff" || released ? db.select().from(marks).where(eq(marks.writeUpId, w.id)).get() : undefined;
  const mark = markRow
    ? { criteria: markRow.criteria, comments: markRow.comments, feedback: markRow.feedback, total: markRow.adjustedTotal ?? markRow.total, teacherTotal: markRow.total, maxTotal: markRow.maxTotal, returnedAt: markRow.returnedAt }
    : null;
  const state = editableState(s, now);
  const canEdit = access === "owner" && w.status === "draft" && (state === "open" || state === "late");
  return {
    writeUp: {
      id: w.id,
      status: w.status,
      revision: w.revision,
      content: w.content,
      safetyAcknowledgedAt: w.safetyAcknowledgedAt,
      submittedAt: w.submittedAt,
      late: w.late,
      updatedAt: w.updatedAt,
      studentName: student?.name ?? "",
    },
    tables,
    mark,
    group: group ? { id: groupId!, name: group.name, revision: groupRevision ?? 0, members: groupMembers } : null,
    checks,
    practical: { id: version.practicalId, versionId: version.id, title: version.title, topic: version.topic, version: version.version, content: version.content },
    labSession: { id: s.id, className: cls?.name ?? "", opensAt: s.opensAt, dueAt: s.dueAt, lateWork: s.lateWork, lateDays: s.lateDays, state, notes: s.notes },
    access,
    canEdit,
    canSubmit: canEdit && !!w.safetyAcknowledgedAt,
    canReopen: access === "staff" && w.status !== "draft",
  };
}
export type WriteUpView = ReturnType<typeof buildView>;

/**
 * A student opens their write-up for a lab session: the existing one, or a new one on the
 * session's practical version once the session is open.
 */
export function openWriteUp({ actor, labSessionId, now = new Date() }: { actor: Actor; labSessionId: string; now?: Date }): WriteUpView {
  if (!hasRole(actor, "student")) throw forbidden("Only students keep write-ups.");
  return getDb().transaction((db) => {
    const s = loadSession(db, actor.schoolId, labSessionId);
    const member = db.select({ id: classStudents.studentId }).from(classStudents).where(and(eq(classStudents.classId, s.classId), eq(classStudents.studentId, actor.userId))).get();
    if (!member || s.cancelledAt) throw notFound("That lab session");
    let w = db.select().from(writeUps).where(and(eq(writeUps.labSessionId, labSessionId), eq(writeUps.studentId, actor.userId))).get();
    if (!w) {
      const state = labSessionState(s, now);
      if (state === "upcoming") throw new AppError("conflict", `This lab session opens on ${s.opensAt.toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}. Your write-up opens then.`, { detail: { reason: "not-open" } });
      if (state === "closed") throw new AppError("conflict", "This lab session has closed, so a new write-up cannot be started. Talk to your teacher.", { detail: { reason: "closed" } });
      w = db
        .insert(writeUps)
        .values({ schoolId: actor.schoolId, labSessionId, studentId: actor.userId, practicalVersionId: s.practicalVersionId, content: emptyWriteUpContent(), createdAt: now, updatedAt: now })
        .returning()
        .get();
    }
    return buildView(db, actor, w, s, "owner", now);
  });
}

/**
 * The staff-shaped view of a write-up for a reader whose permission the caller has already
 * checked (a moderator reading sampled work). Read-only: nothing here changes the write-up.
 */
export function viewWriteUpAsReader({ actor, writeUpId, now = new Date() }: { actor: Actor; writeUpId: string; now?: Date }): WriteUpView {
  const db = getDb();
  const w = db.select().from(writeUps).where(and(eq(writeUps.id, writeUpId), eq(writeUps.schoolId, actor.schoolId))).get();
  if (!w) throw notFound("That write-up");
  const s = loadSession(db, actor.schoolId, w.labSessionId);
  return { ...buildView(db, actor, w, s, "staff", now), canEdit: false, canSubmit: false, canReopen: false };
}

export type ReadAccess = "owner" | "staff" | "moderator" | "parent";

/**
 * Who may read a write-up (and its photos): its student; the class's teachers and admins; a
 * moderator whose sample includes it; a linked parent once it has been returned. Null otherwise.
 */
export function writeUpReadAccess(db: DbOrTx, actor: Actor, writeUpId: string): { access: ReadAccess; writeUp: WriteUp; session: LabSession } | null {
  const w = db.select().from(writeUps).where(and(eq(writeUps.id, writeUpId), eq(writeUps.schoolId, actor.schoolId))).get();
  if (!w) return null;
  const s = loadSession(db, actor.schoolId, w.labSessionId);
  if (w.studentId === actor.userId) return { access: "owner", writeUp: w, session: s };
  if (hasRole(actor, "admin") || teachesClass(db, actor, s.classId)) return { access: "staff", writeUp: w, session: s };
  if (
    hasRole(actor, "moderator") &&
    db
      .select({ id: moderationItems.id })
      .from(moderationItems)
      .innerJoin(moderationSamples, eq(moderationSamples.id, moderationItems.sampleId))
      .where(and(eq(moderationItems.writeUpId, w.id), isNull(moderationItems.removedAt), eq(moderationSamples.moderatorId, actor.userId)))
      .get()
  )
    return { access: "moderator", writeUp: w, session: s };
  if (w.status === "returned" && hasRole(actor, "parent") && db.select({ id: parentLinks.studentId }).from(parentLinks).where(and(eq(parentLinks.parentId, actor.userId), eq(parentLinks.studentId, w.studentId))).get())
    return { access: "parent", writeUp: w, session: s };
  return null;
}

/** Whether the student may still change the write-up now (draft, lab session open or late). */
export function isEditableNow(w: WriteUp, s: LabSession, now = new Date()): boolean {
  const state = labSessionState(s, now);
  return w.status === "draft" && (state === "open" || state === "late");
}

/** A write-up by id, for its student or their teacher (or an admin). */
export function getWriteUp({ actor, writeUpId, now = new Date() }: { actor: Actor; writeUpId: string; now?: Date }): WriteUpView {
  const db = getDb();
  const { w, s, access } = loadWriteUp(db, actor, writeUpId);
  return buildView(db, actor, w, s, access, now);
}

function assertEditable(w: Pick<WriteUp, "status">, s: Parameters<typeof labSessionState>[0], now: Date) {
  if (w.status !== "draft") {
    throw new AppError("conflict", "This write-up has been handed in, so it is locked. Ask your teacher to reopen it if you need to change something.", { detail: { reason: "locked" } });
  }
  const state = labSessionState(s, now);
  if (state === "closed" || state === "cancelled") throw new AppError("conflict", "This lab session has closed, so the write-up can no longer be changed.", { detail: { reason: "closed" } });
}

/**
 * Saves a student's write-up. The revision must match the one the page started from; otherwise
 * 409 with the saved version, so the student can choose which to keep and nothing is lost.
 */
export function saveWriteUp({ actor, writeUpId, revision, content, now = new Date() }: { actor: Actor; writeUpId: string; revision: number; content: WriteUpContent; now?: Date }) {
  return getDb().transaction((db) => {
    // The one row an autosave needs, by a query compiled once: the write-up's owner, state and
    // revision and its lab session's dates (the content is only read back for a conflict).
    const w = autosaveTargetQuery().get({ id: writeUpId, schoolId: actor.schoolId });
    if (!w || w.studentId !== actor.userId) {
      // Not the student's own: staff are told they cannot change it, anyone else that it does not exist.
      const { access } = loadWriteUp(db, actor, writeUpId);
      if (access !== "owner") throw forbidden("Only the student can change their write-up.");
      throw notFound("That write-up");
    }
    assertEditable(w, w, now);
    if (w.revision !== revision) {
      const current = db.select({ content: writeUps.content, updatedAt: writeUps.updatedAt }).from(writeUps).where(eq(writeUps.id, w.id)).get()!;
      throw new AppError("conflict", "This write-up was saved from another tab or device since this page loaded. Choose which version to keep.", {
        detail: { reason: "stale", current: { revision: w.revision, content: current.content, updatedAt: current.updatedAt } },
      });
    }
    const next = w.revision + 1;
    // Stored as the columns store them: JSON text and milliseconds.
    const res = autosaveWriteQuery().run({ content: JSON.stringify(content), next, updatedAt: now.getTime(), id: w.id, revision });
    if (res.changes !== 1) throw new AppError("conflict", "This write-up was saved elsewhere at the same moment. Reload to see it.", { detail: { reason: "stale" } });
    return { revision: next, updatedAt: now };
  });
}

const autosaveWriteQuery = preparedOnce((db) =>
  db
    .update(writeUps)
    .set({ content: sql`${sql.placeholder("content")}`, revision: sql`${sql.placeholder("next")}`, updatedAt: sql`${sql.placeholder("updatedAt")}` })
    .where(and(eq(writeUps.id, sql.placeholder("id")), eq(writeUps.revision, sql.placeholder("revision"))))
    .prepare(),
);

const autosaveTargetQuery = preparedOnce((db) =>
  db
    .select({
      id: writeUps.id,
      studentId: writeUps.studentId,
      status: writeUps.status,
      revision: writeUps.revision,
      opensAt: labSessions.opensAt,
      dueAt: labSessions.dueAt,
      lateWork: labSessions.lateWork,
      lateDays: labSessions.lateDays,
      cancelledAt: labSessions.cancelledAt,
    })
    .from(writeUps)
    .innerJoin(labSessions, and(eq(labSessions.id, writeUps.labSessionId), eq(labSessions.schoolId, writeUps.schoolId)))
    .where(and(eq(writeUps.id, sql.placeholder("id")), eq(writeUps.schoolId, sql.placeholder("schoolId"))))
    .prepare(),
);

/** Saves the results tables a group shares (group lab sessions), with their own revision. */
export function saveGroupTables({ actor, writeUpId, revision, tables, now = new Date() }: { actor: Actor; writeUpId: string; revision: number; tables: GroupTables; now?: Date }) {
  return getDb().transaction((db) => {
    const { w, s, access } = loadWriteUp(db, actor, writeUpId);
    if (access !== "owner") throw forbidden("Only members of the group can change its results.");
    assertEditable(w, s, now);
    const group = groupOf(s, w.studentId);
    if (!group) throw new AppError("bad_request", "This lab session does not share results in groups.");
    const row = loadGroupTables(db, s, group.id);
    const current = row?.revision ?? 0;
    if (current !== revision) {
      throw new AppError("conflict", "Someone in your group saved the results since this page loaded. Choose which version to keep.", {
        detail: { reason: "stale", current: { revision: current, tables: row?.tables ?? {}, updatedAt: row?.updatedAt ?? null } },
      });
    }
    if (!row) db.insert(groupTables).values({ schoolId: actor.schoolId, labSessionId: s.id, groupId: group.id, tables, revision: 1, updatedById: actor.userId, updatedAt: now }).run();
    else db.update(groupTables).set({ tables, revision: current + 1, updatedById: actor.userId, updatedAt: now }).where(and(eq(groupTables.id, row.id), eq(groupTables.revision, current))).run();
    return { revision: current + 1, updatedAt: now };
  });
}

/** Records that the student has read the hazards and control measures (needed before recording data). */
export function acknowledgeSafety({ actor, writeUpId, now = new Date() }: { actor: Actor; writeUpId: string; now?: Date }) {
  getDb().transaction((db) => {
    const { w, access } = loadWriteUp(db, actor, writeUpId);
    if (access !== "owner") throw forbidden("Only the student can confirm they have read the safety section.");
    if (w.safetyAcknowledgedAt) return;
    db.update(writeUps).set({ safetyAcknowledgedAt: now }).where(eq(writeUps.id, w.id)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "write-up.safety-acknowledged", entityType: "write-up", entityId: w.id, after: { at: now } });
  });
}

/**
 * Runs one check on the student's saved data with the answer they typed, keeps the result with
 * fingerprints of the data and answer (to tell when it goes stale), logs the attempt for progress
 * reports, and returns only what the teacher allows the student to see.
 */
export function runWriteUpCheck({ actor, writeUpId, checkId, answer, now = new Date() }: { actor: Actor; writeUpId: string; checkId: string; answer: CheckAnswer; now?: Date }): CheckState {
  return getDb().transaction((db) => {
    const { w, s, access } = loadWriteUp(db, actor, writeUpId);
    if (access !== "owner") throw forbidden("Only the student runs the checks on their write-up.");
    assertEditable(w, s, now);
    const version = loadVersionContent(db, w.practicalVersionId);
    const spec = version.content.checks.find((c) => c.id === checkId);
    if (!spec) throw notFound("That calculation check");
    const table = version.content.tables.find((t) => t.id === spec.tableId);
    if (!table) throw notFound("That results table");
    const { tables } = effectiveTables(db, s, w);
    const outcome = runPracticalCheck(spec, table, rowsForCheck(tables[spec.tableId]), answer, { keptIn: keptInReadings(tables[spec.tableId]) });
    const stored = { outcome, dataHash: checkDataFingerprint(spec, tables), answerHash: answerFingerprint(answer), at: now.getTime() };
    db.update(writeUps).set({ checkResults: { ...w.checkResults, [checkId]: stored } }).where(eq(writeUps.id, w.id)).run();
    db.insert(checkAttempts).values({ schoolId: actor.schoolId, writeUpId: w.id, studentId: w.studentId, checkId, kind: spec.kind, verdict: outcome.verdict, slipCode: outcome.likelySlip?.code ?? null, at: now }).run();
    return { ...studentView(outcome, spec.show, false), stale: false, ranAt: stored.at };
  });
}

/** Hands the write-up in: it locks. After the due date it is marked late, or refused, by the session's rule. */
export function submitWriteUp({ actor, writeUpId, revision, now = new Date() }: { actor: Actor; writeUpId: string; revision: number; now?: Date }) {
  return getDb().transaction((db) => {
    const { w, s, access } = loadWriteUp(db, actor, writeUpId);
    if (access !== "owner") throw forbidden("Only the student can hand in their write-up.");
    assertEditable(w, s, now);
    if (w.revision !== revision) throw new AppError("conflict", "Your latest changes are still saving, or were saved elsewhere. Wait a moment and try again.", { detail: { reason: "stale" } });
    if (!w.safetyAcknowledgedAt) throw new AppError("bad_request", "Read and confirm the safety section first.");
    const late = now.getTime() > s.dueAt.getTime();
    db.update(writeUps).set({ status: "submitted", submittedAt: now, late, updatedAt: now }).where(eq(writeUps.id, w.id)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "write-up.submit", entityType: "write-up", entityId: w.id, before: { status: w.status }, after: { status: "submitted", late } });
    return { status: "submitted" as WriteUpStatus, submittedAt: now, late };
  });
}

/** A teacher (or admin) reopens handed-in or marked work so the student can change it; logged. */
export function reopenWriteUp({ actor, writeUpId, now = new Date() }: { actor: Actor; writeUpId: string; now?: Date }) {
  getDb().transaction((db) => {
    const { w, access } = loadWriteUp(db, actor, writeUpId);
    if (access !== "staff") throw forbidden("Only the class's teacher can reopen a write-up.");
    if (w.status === "draft") throw new AppError("conflict", "This write-up is already open for the student.");
    db.update(writeUps).set({ status: "draft", reopenedAt: now, revision: w.revision + 1, updatedAt: now }).where(eq(writeUps.id, w.id)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "write-up.reopen", entityType: "write-up", entityId: w.id, before: { status: w.status }, after: { status: "draft" } });
  });
}

export type SessionWriteUpRow = {
  studentId: string;
  studentName: string;
  writeUpId: string | null;
  status: "not-started" | WriteUpStatus;
  late: boolean;
  submittedAt: Date | null;
  updatedAt: Date | null;
  checks: Record<string, { verdict: CheckOutcome["verdict"]; stale: boolean; slip: string | null }>;
};

/** Every student of a lab session's class with the state of their write-up (teachers and admins). */
export function listSessionWriteUps({ actor, labSessionId }: { actor: Actor; labSessionId: string }): { rows: SessionWriteUpRow[]; content: PracticalContent } {
  const db = getDb();
  const s = loadSession(db, actor.schoolId, labSessionId);
  if (!hasRole(actor, "admin") && !teachesClass(db, actor, s.classId)) throw forbidden("This lab session is not for one of your classes.");
  const version = loadVersionContent(db, s.practicalVersionId);
  const students = db
    .select({ id: users.id, name: users.name })
    .from(classStudents)
    .innerJoin(users, eq(users.id, classStudents.studentId))
    .where(eq(classStudents.classId, s.classId))
    .orderBy(asc(users.name))
    .all();
  const ws = db.select().from(writeUps).where(eq(writeUps.labSessionId, labSessionId)).all();
  const byStudent = new Map(ws.map((w) => [w.studentId, w]));
  const groupRows = s.grouping === "groups" ? db.select().from(groupTables).where(eq(groupTables.labSessionId, s.id)).all() : [];
  const rows = students.map((st) => {
    const w = byStudent.get(st.id);
    const checks: SessionWriteUpRow["checks"] = {};
    if (w) {
      const group = groupOf(s, w.studentId);
      const tables = group ? (groupRows.find((g) => g.groupId === group.id)?.tables ?? {}) : w.content.tables;
      for (const spec of version.content.checks) {
        const stored = w.checkResults[spec.id];
        if (!stored) continue;
        checks[spec.id] = {
          verdict: stored.outcome.verdict,
          stale: isStale(stored, { dataHash: checkDataFingerprint(spec, tables), answerHash: answerFingerprint(w.content.answers[spec.id]) }),
          slip: stored.outcome.likelySlip?.code ?? null,
        };
      }
    }
    return {
      studentId: st.id,
      studentName: st.name,
      writeUpId: w?.id ?? null,
      status: w ? w.status : "not-started",
      late: w?.late ?? false,
      submittedAt: w?.submittedAt ?? null,
      updatedAt: w?.updatedAt ?? null,
      checks,
    } satisfies SessionWriteUpRow;
  });
  return { rows, content: version.content };
}

/** The student's own write-up id for a lab session, if they have started one. */
export function findOwnWriteUpId(actor: Actor, labSessionId: string): string | null {
  return getDb().select({ id: writeUps.id }).from(writeUps).where(and(eq(writeUps.labSessionId, labSessionId), eq(writeUps.studentId, actor.userId))).get()?.id ?? null;
}

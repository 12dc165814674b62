import "server-only";
import { and, asc, desc, eq, gte, inArray, isNull } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import type { LabSessionInput } from "@/lib/validation/practicals";
import { getDb, type DbOrTx } from "../client";
import { classes, classStudents, labSessions, practicalVersions, users } from "../schema";
import { recordAudit } from "./audit";
import { taughtClassIds, teachesClass } from "./classes";

export type LabSessionState = "upcoming" | "open" | "late" | "closed" | "cancelled";

/** Where a lab session stands at a moment: before opening, open, in the late window, or closed. */
export function labSessionState(s: { opensAt: Date; dueAt: Date; lateWork: string; lateDays: number; cancelledAt: Date | null }, now = new Date()): LabSessionState {
  if (s.cancelledAt) return "cancelled";
  const t = now.getTime();
  if (t < s.opensAt.getTime()) return "upcoming";
  if (t <= s.dueAt.getTime()) return "open";
  if (s.lateWork !== "refuse" && t <= s.dueAt.getTime() + s.lateDays * 86_400_000) return "late";
  return "closed";
}

function requireScheduler(db: DbOrTx, actor: Actor, classId: string) {
  if (hasRole(actor, "admin")) {
    const c = db.select({ id: classes.id }).from(classes).where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId))).get();
    if (!c) throw notFound("That class");
    return;
  }
  if (!hasRole(actor, "teacher")) throw forbidden("Only teachers and admins can schedule lab sessions.");
  if (!teachesClass(db, actor, classId)) throw new AppError("forbidden", "You can only schedule lab sessions for classes you teach.", { fieldErrors: { classId: ["Choose one of your own classes."] } });
}

function checkGroups(db: DbOrTx, classId: string, input: LabSessionInput) {
  if (input.grouping !== "groups") return;
  const members = new Set(db.select({ id: classStudents.studentId }).from(classStudents).where(eq(classStudents.classId, classId)).all().map((r) => r.id));
  input.groups.forEach((g, gi) => {
    const outside = g.studentIds.filter((id) => !members.has(id));
    if (outside.length) throw new AppError("bad_request", "Groups may only include students in the class.", { fieldErrors: { [`groups.${gi}.studentIds`]: ["Everyone in a group must be in this class."] } });
  });
}

/** Schedules a published practical version for a class. */
export function scheduleLabSession({ actor, input }: { actor: Actor; input: LabSessionInput }): string {
  return getDb().transaction((db) => {
    requireScheduler(db, actor, input.classId);
    const v = db
      .select({ id: practicalVersions.id, practicalId: practicalVersions.practicalId, status: practicalVersions.status, title: practicalVersions.title })
      .from(practicalVersions)
      .where(and(eq(practicalVersions.id, input.practicalVersionId), eq(practicalVersions.schoolId, actor.schoolId)))
      .get();
    if (!v) throw new AppError("bad_request", "Choose a practical from this school's library.", { fieldErrors: { practicalVersionId: ["Choose a practical from the library."] } });
    if (v.status !== "published") throw new AppError("bad_request", "Only a published practical can be scheduled. Publish it first.", { fieldErrors: { practicalVersionId: ["Publish this practical before scheduling it."] } });
    checkGroups(db, input.classId, input);
    const id = db
      .insert(labSessions)
      .values({
        schoolId: actor.schoolId,
        classId: input.classId,
        practicalId: v.practicalId,
        practicalVersionId: v.id,
        opensAt: input.opensAt,
        dueAt: input.dueAt,
        grouping: input.grouping,
        groups: input.grouping === "groups" ? input.groups : [],
        lateWork: input.lateWork,
        lateDays: input.lateDays,
        notes: input.notes,
        createdById: actor.userId,
      })
      .returning({ id: labSessions.id })
      .get().id;
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "lab-session.schedule", entityType: "lab-session", entityId: id, after: { ...input, title: v.title } });
    return id;
  });
}

/** Changes dates, groups or late-work rules (not the practical version) of a lab session. */
export function updateLabSession({ actor, labSessionId, input }: { actor: Actor; labSessionId: string; input: LabSessionInput }) {
  getDb().transaction((db) => {
    const s = db.select().from(labSessions).where(and(eq(labSessions.id, labSessionId), eq(labSessions.schoolId, actor.schoolId))).get();
    if (!s) throw notFound("That lab session");
    requireScheduler(db, actor, s.classId);
    if (input.classId !== s.classId || input.practicalVersionId !== s.practicalVersionId) {
      throw new AppError("bad_request", "The class and practical of a lab session cannot change. Cancel it and schedule a new one.");
    }
    checkGroups(db, s.classId, input);
    db.update(labSessions)
      .set({ opensAt: input.opensAt, dueAt: input.dueAt, grouping: input.grouping, groups: input.grouping === "groups" ? input.groups : [], lateWork: input.lateWork, lateDays: input.lateDays, notes: input.notes, updatedAt: new Date() })
      .where(eq(labSessions.id, labSessionId))
      .run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "lab-session.update", entityType: "lab-session", entityId: labSessionId, before: s, after: input });
  });
}

export function cancelLabSession({ actor, labSessionId }: { actor: Actor; labSessionId: string }) {
  getDb().transaction((db) => {
    const s = db.select().from(labSessions).where(and(eq(labSessions.id, labSessionId), eq(labSessions.schoolId, actor.schoolId))).get();
    if (!s) throw notFound("That lab session");
    requireScheduler(db, actor, s.classId);
    db.update(labSessions).set({ cancelledAt: new Date(), updatedAt: new Date() }).where(eq(labSessions.id, labSessionId)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "lab-session.cancel", entityType: "lab-session", entityId: labSessionId });
  });
}

const sessionColumns = {
  id: labSessions.id,
  classId: labSessions.classId,
  className: classes.name,
  practicalId: labSessions.practicalId,
  practicalVersionId: labSessions.practicalVersionId,
  title: practicalVersions.title,
  topic: practicalVersions.topic,
  version: practicalVersions.version,
  opensAt: labSessions.opensAt,
  dueAt: labSessions.dueAt,
  grouping: labSessions.grouping,
  groups: labSessions.groups,
  lateWork: labSessions.lateWork,
  lateDays: labSessions.lateDays,
  notes: labSessions.notes,
  cancelledAt: labSessions.cancelledAt,
};

export type LabSessionSummary = {
  id: string;
  classId: string;
  className: string;
  practicalId: string;
  practicalVersionId: string;
  title: string;
  topic: string;
  version: number;
  opensAt: Date;
  dueAt: Date;
  grouping: "individual" | "groups";
  groups: { id: string; name: string; studentIds: string[] }[];
  lateWork: "accept" | "accept-flagged" | "refuse";
  lateDays: number;
  notes: string;
  cancelledAt: Date | null;
  state: LabSessionState;
};

function withState<T extends Omit<LabSessionSummary, "state">>(rows: T[], now: Date): (T & { state: LabSessionState })[] {
  return rows.map((r) => ({ ...r, state: labSessionState(r, now) }));
}

/**
 * Lab sessions the actor should see: a teacher's classes, a student's classes (not cancelled),
 * or the whole school for an admin. Recent and upcoming first.
 */
export function listLabSessions({ actor, classId, now = new Date(), includePastDays = 120 }: { actor: Actor; classId?: string; now?: Date; includePastDays?: number }): LabSessionSummary[] {
  const db = getDb();
  let classIds: string[] | "all";
  if (hasRole(actor, "admin")) classIds = "all";
  else {
    const ids = new Set(taughtClassIds(db, actor));
    if (hasRole(actor, "student")) for (const r of db.select({ id: classStudents.classId }).from(classStudents).where(eq(classStudents.studentId, actor.userId)).all()) ids.add(r.id);
    classIds = [...ids];
    if (!classIds.length) return [];
  }
  const conditions = [eq(labSessions.schoolId, actor.schoolId), gte(labSessions.dueAt, new Date(now.getTime() - includePastDays * 86_400_000))];
  if (classIds !== "all") conditions.push(inArray(labSessions.classId, classIds));
  if (classId) conditions.push(eq(labSessions.classId, classId));
  const onlyStudent = hasRole(actor, "student") && !hasRole(actor, "teacher", "admin");
  if (onlyStudent) conditions.push(isNull(labSessions.cancelledAt));
  const rows = db
    .select(sessionColumns)
    .from(labSessions)
    .innerJoin(classes, eq(classes.id, labSessions.classId))
    .innerJoin(practicalVersions, eq(practicalVersions.id, labSessions.practicalVersionId))
    .where(and(...conditions))
    .orderBy(asc(labSessions.dueAt))
    .all() as Omit<LabSessionSummary, "state">[];
  return withState(rows, now);
}

/** One lab session, for its class's teachers, admins, and the students in the class. */
export function getLabSession({ actor, labSessionId, now = new Date() }: { actor: Actor; labSessionId: string; now?: Date }) {
  const db = getDb();
  const row = db
    .select({ ...sessionColumns, createdByName: users.name })
    .from(labSessions)
    .innerJoin(classes, eq(classes.id, labSessions.classId))
    .innerJoin(practicalVersions, eq(practicalVersions.id, labSessions.practicalVersionId))
    .leftJoin(users, eq(users.id, labSessions.createdById))
    .where(and(eq(labSessions.id, labSessionId), eq(labSessions.schoolId, actor.schoolId)))
    .get() as (Omit<LabSessionSummary, "state"> & { createdByName: string | null }) | undefined;
  if (!row) throw notFound("That lab session");
  const staff = hasRole(actor, "admin") || teachesClass(db, actor, row.classId);
  const member =
    !staff &&
    hasRole(actor, "student") &&
    !!db.select({ id: classStudents.studentId }).from(classStudents).where(and(eq(classStudents.classId, row.classId), eq(classStudents.studentId, actor.userId))).get();
  if (!staff && !member) throw forbidden("This lab session is not for one of your classes.");
  if (member && row.cancelledAt) throw notFound("That lab session");
  const [withS] = withState([row], now);
  return { ...withS!, canManage: staff, groups: staff ? row.groups : row.groups.filter((g) => g.studentIds.includes(actor.userId)) };
}

/** Lab sessions that use a practical version (a used version can never change). */
export function sessionsUsingVersion(db: DbOrTx, versionId: string) {
  return db.select({ id: labSessions.id }).from(labSessions).where(eq(labSessions.practicalVersionId, versionId)).orderBy(desc(labSessions.createdAt)).all();
}

import "server-only";
import { and, asc, count, eq, inArray } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import type { ClassCreateInput, ClassUpdateInput } from "@/lib/validation/classes";
import { getDb, type DbOrTx } from "../client";
import { classes, classStudents, classTeachers, parentLinks, userRoles, users } from "../schema";
import { recordAudit } from "./audit";

/** True when the actor teaches the class (and it is in their school). */
export function teachesClass(db: DbOrTx, actor: Actor, classId: string): boolean {
  if (!hasRole(actor, "teacher")) return false;
  return !!db
    .select({ classId: classTeachers.classId })
    .from(classTeachers)
    .innerJoin(classes, eq(classes.id, classTeachers.classId))
    .where(and(eq(classTeachers.classId, classId), eq(classTeachers.teacherId, actor.userId), eq(classes.schoolId, actor.schoolId)))
    .get();
}

/** Ids of the classes the actor teaches. */
export function taughtClassIds(db: DbOrTx, actor: Actor): string[] {
  if (!hasRole(actor, "teacher")) return [];
  return db
    .select({ id: classTeachers.classId })
    .from(classTeachers)
    .innerJoin(classes, eq(classes.id, classTeachers.classId))
    .where(and(eq(classTeachers.teacherId, actor.userId), eq(classes.schoolId, actor.schoolId)))
    .all()
    .map((r) => r.id);
}

function requireAdmin(actor: Actor) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can manage classes.");
}

/** Ids of users in this school who hold the role; used to refuse ids from elsewhere. */
function idsWithRole(db: DbOrTx, schoolId: string, ids: readonly string[], role: "teacher" | "student" | "parent"): Set<string> {
  if (ids.length === 0) return new Set();
  return new Set(
    db
      .select({ id: users.id })
      .from(users)
      .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, role)))
      .where(and(eq(users.schoolId, schoolId), inArray(users.id, [...ids])))
      .all()
      .map((r) => r.id),
  );
}

export type ClassListItem = {
  id: string;
  name: string;
  subject: string;
  yearGroup: number;
  academicYear: string;
  archived: boolean;
  studentCount: number;
  teachers: { id: string; name: string }[];
};

/**
 * The classes the actor may see: every class for an admin, taught classes for a teacher, the
 * student's own classes, and a parent's children's classes.
 */
export function listClasses({ actor, includeArchived = false }: { actor: Actor; includeArchived?: boolean }): ClassListItem[] {
  const db = getDb();
  let visible: string[] | "all";
  if (hasRole(actor, "admin")) visible = "all";
  else {
    const ids = new Set<string>(taughtClassIds(db, actor));
    if (hasRole(actor, "student")) {
      for (const r of db.select({ id: classStudents.classId }).from(classStudents).where(eq(classStudents.studentId, actor.userId)).all()) ids.add(r.id);
    }
    if (hasRole(actor, "parent")) {
      for (const r of db
        .select({ id: classStudents.classId })
        .from(classStudents)
        .innerJoin(parentLinks, eq(parentLinks.studentId, classStudents.studentId))
        .where(eq(parentLinks.parentId, actor.userId))
        .all())
        ids.add(r.id);
    }
    visible = [...ids];
    if (visible.length === 0) return [];
  }
  const conditions = [eq(classes.schoolId, actor.schoolId)];
  if (visible !== "all") conditions.push(inArray(classes.id, visible));
  if (!includeArchived) conditions.push(eq(classes.archived, false));
  const rows = db
    .select({ id: classes.id, name: classes.name, subject: classes.subject, yearGroup: classes.yearGroup, academicYear: classes.academicYear, archived: classes.archived })
    .from(classes)
    .where(and(...conditions))
    .orderBy(asc(classes.yearGroup), asc(classes.name))
    .all();
  const ids = rows.map((r) => r.id);
  const counts = new Map(
    ids.length
      ? db.select({ id: classStudents.classId, n: count() }).from(classStudents).where(inArray(classStudents.classId, ids)).groupBy(classStudents.classId).all().map((r) => [r.id, r.n])
      : [],
  );
  const teacherRows = ids.length
    ? db
        .select({ classId: classTeachers.classId, id: users.id, name: users.name })
        .from(classTeachers)
        .innerJoin(users, eq(users.id, classTeachers.teacherId))
        .where(inArray(classTeachers.classId, ids))
        .orderBy(asc(users.name))
        .all()
    : [];
  return rows.map((r) => ({
    ...r,
    studentCount: counts.get(r.id) ?? 0,
    teachers: teacherRows.filter((t) => t.classId === r.id).map(({ id, name }) => ({ id, name })),
  }));
}

/**
 * One class. Admins and the class's teachers see the roster with e-mails and guardians; a student
 * in the class sees only the class and its teachers.
 */
export function getClassDetail({ actor, classId }: { actor: Actor; classId: string }) {
  const db = getDb();
  const cls = db
    .select({ id: classes.id, name: classes.name, subject: classes.subject, yearGroup: classes.yearGroup, academicYear: classes.academicYear, archived: classes.archived })
    .from(classes)
    .where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId)))
    .get();
  if (!cls) throw notFound("That class");
  const isStaff = hasRole(actor, "admin") || teachesClass(db, actor, classId);
  const isMember =
    !isStaff &&
    !!db.select({ id: classStudents.studentId }).from(classStudents).where(and(eq(classStudents.classId, classId), eq(classStudents.studentId, actor.userId))).get();
  if (!isStaff && !isMember) throw forbidden("This class is not one of yours.");
  const teachers = db
    .select({ id: users.id, name: users.name })
    .from(classTeachers)
    .innerJoin(users, eq(users.id, classTeachers.teacherId))
    .where(eq(classTeachers.classId, classId))
    .orderBy(asc(users.name))
    .all();
  if (!isStaff) return { ...cls, teachers, students: null, canManage: false };
  const students = db
    .select({ id: users.id, name: users.name, email: users.email, yearGroup: users.yearGroup, active: users.active })
    .from(classStudents)
    .innerJoin(users, eq(users.id, classStudents.studentId))
    .where(eq(classStudents.classId, classId))
    .orderBy(asc(users.name))
    .all();
  const guardianRows = students.length
    ? db
        .select({ studentId: parentLinks.studentId, name: users.name, relationship: parentLinks.relationship })
        .from(parentLinks)
        .innerJoin(users, eq(users.id, parentLinks.parentId))
        .where(inArray(parentLinks.studentId, students.map((s) => s.id)))
        .all()
    : [];
  return {
    ...cls,
    teachers,
    students: students.map((s) => ({ ...s, guardians: guardianRows.filter((g) => g.studentId === s.id).map(({ name, relationship }) => ({ name, relationship })) })),
    canManage: hasRole(actor, "admin"),
  };
}

function assertTeachers(db: DbOrTx, actor: Actor, teacherIds: readonly string[]) {
  const ok = idsWithRole(db, actor.schoolId, teacherIds, "teacher");
  const bad = teacherIds.filter((id) => !ok.has(id));
  if (bad.length) throw new AppError("bad_request", "Only teachers in this school can teach a class.", { fieldErrors: { teacherIds: ["Choose teachers from this school."] } });
}

export function createClass({ actor, input }: { actor: Actor; input: ClassCreateInput }): string {
  requireAdmin(actor);
  return getDb().transaction((db) => {
    const clash = db
      .select({ id: classes.id })
      .from(classes)
      .where(and(eq(classes.schoolId, actor.schoolId), eq(classes.name, input.name), eq(classes.academicYear, input.academicYear)))
      .get();
    if (clash) throw new AppError("conflict", "There is already a class with that name this year.", { fieldErrors: { name: ["There is already a class with that name this year."] } });
    const teacherIds = [...new Set(input.teacherIds)];
    assertTeachers(db, actor, teacherIds);
    const id = db
      .insert(classes)
      .values({ schoolId: actor.schoolId, name: input.name, subject: input.subject, yearGroup: input.yearGroup, academicYear: input.academicYear })
      .returning({ id: classes.id })
      .get().id;
    if (teacherIds.length) db.insert(classTeachers).values(teacherIds.map((teacherId) => ({ classId: id, teacherId }))).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "class.create", entityType: "class", entityId: id, after: { ...input, teacherIds } });
    return id;
  });
}

export function updateClass({ actor, classId, input }: { actor: Actor; classId: string; input: ClassUpdateInput }): void {
  requireAdmin(actor);
  getDb().transaction((db) => {
    const before = db
      .select({ name: classes.name, subject: classes.subject, yearGroup: classes.yearGroup, academicYear: classes.academicYear, archived: classes.archived })
      .from(classes)
      .where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId)))
      .get();
    if (!before) throw notFound("That class");
    const beforeTeachers = db.select({ id: classTeachers.teacherId }).from(classTeachers).where(eq(classTeachers.classId, classId)).all().map((r) => r.id);
    const { teacherIds, ...fields } = input;
    const next = { ...before, ...Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined)) };
    if (next.name !== before.name || next.academicYear !== before.academicYear) {
      const clash = db
        .select({ id: classes.id })
        .from(classes)
        .where(and(eq(classes.schoolId, actor.schoolId), eq(classes.name, next.name), eq(classes.academicYear, next.academicYear)))
        .get();
      if (clash && clash.id !== classId) throw new AppError("conflict", "There is already a class with that name this year.", { fieldErrors: { name: ["There is already a class with that name this year."] } });
    }
    db.update(classes).set(next).where(eq(classes.id, classId)).run();
    let afterTeachers = beforeTeachers;
    if (teacherIds) {
      afterTeachers = [...new Set(teacherIds)];
      assertTeachers(db, actor, afterTeachers);
      db.delete(classTeachers).where(eq(classTeachers.classId, classId)).run();
      if (afterTeachers.length) db.insert(classTeachers).values(afterTeachers.map((teacherId) => ({ classId, teacherId }))).run();
    }
    recordAudit(db, {
      schoolId: actor.schoolId,
      actorId: actor.userId,
      action: input.archived === true && !before.archived ? "class.archive" : "class.update",
      entityType: "class",
      entityId: classId,
      before: { ...before, teacherIds: beforeTeachers },
      after: { ...next, teacherIds: afterTeachers },
    });
  });
}

/** Puts students (of this school) into a class; already-enrolled ones are left as they are. */
export function enrolStudents({ actor, classId, studentIds, tx }: { actor: Actor; classId: string; studentIds: readonly string[]; tx?: DbOrTx }): number {
  requireAdmin(actor);
  const run = (db: DbOrTx) => {
    const cls = db.select({ id: classes.id }).from(classes).where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId))).get();
    if (!cls) throw notFound("That class");
    const wanted = [...new Set(studentIds)];
    const ok = idsWithRole(db, actor.schoolId, wanted, "student");
    const bad = wanted.filter((id) => !ok.has(id));
    if (bad.length) throw new AppError("bad_request", "Only students in this school can join a class.", { fieldErrors: { studentIds: ["Choose students from this school."] } });
    const present = new Set(
      db.select({ id: classStudents.studentId }).from(classStudents).where(and(eq(classStudents.classId, classId), inArray(classStudents.studentId, wanted))).all().map((r) => r.id),
    );
    const added = wanted.filter((id) => !present.has(id));
    if (added.length) db.insert(classStudents).values(added.map((studentId) => ({ classId, studentId }))).run();
    if (added.length) recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "class.enrol", entityType: "class", entityId: classId, after: { studentIds: added } });
    return added.length;
  };
  return tx ? run(tx) : getDb().transaction(run);
}

export function removeStudent({ actor, classId, studentId }: { actor: Actor; classId: string; studentId: string }): void {
  requireAdmin(actor);
  getDb().transaction((db) => {
    const cls = db.select({ id: classes.id }).from(classes).where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId))).get();
    if (!cls) throw notFound("That class");
    const res = db.delete(classStudents).where(and(eq(classStudents.classId, classId), eq(classStudents.studentId, studentId))).run();
    if (res.changes === 0) throw notFound("That student in this class");
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "class.unenrol", entityType: "class", entityId: classId, before: { studentId } });
  });
}

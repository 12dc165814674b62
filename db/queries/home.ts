import "server-only";
import { and, count, eq, gt, isNull, notInArray, sql } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { getDb } from "../client";
import { auditLog, classes, classStudents, classTeachers, invitations, userRoles, users } from "../schema";
import { listAudit } from "./audit";

/** What an admin should look at next: accounts not set up, classes with no teacher, and so on. */
export function adminOverview(actor: Actor, now = new Date()) {
  const db = getDb();
  const s = actor.schoolId;
  const byRole = db
    .select({ role: userRoles.role, n: count() })
    .from(userRoles)
    .innerJoin(users, eq(users.id, userRoles.userId))
    .where(and(eq(users.schoolId, s), eq(users.active, true)))
    .groupBy(userRoles.role)
    .all();
  const notSetUp = db
    .select({ n: count() })
    .from(users)
    .where(and(eq(users.schoolId, s), eq(users.active, true), isNull(users.passwordHash)))
    .get()!.n;
  const pendingInvitations = db
    .select({ n: count() })
    .from(invitations)
    .where(and(eq(invitations.schoolId, s), eq(invitations.kind, "invitation"), isNull(invitations.usedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, now)))
    .get()!.n;
  const classesWithoutTeacher = db
    .select({ id: classes.id, name: classes.name })
    .from(classes)
    .where(and(eq(classes.schoolId, s), eq(classes.archived, false), notInArray(classes.id, db.select({ id: classTeachers.classId }).from(classTeachers))))
    .all();
  const studentsWithoutClass = db
    .select({ n: count() })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "student")))
    .where(and(eq(users.schoolId, s), eq(users.active, true), notInArray(users.id, db.select({ id: classStudents.studentId }).from(classStudents))))
    .get()!.n;
  const classCount = db.select({ n: count() }).from(classes).where(and(eq(classes.schoolId, s), eq(classes.archived, false))).get()!.n;
  const lastWeek = db
    .select({ n: count() })
    .from(auditLog)
    .where(and(eq(auditLog.schoolId, s), sql`${auditLog.at} > ${now.getTime() - 7 * 86400_000}`))
    .get()!.n;
  return {
    byRole: Object.fromEntries(byRole.map((r) => [r.role, r.n])) as Partial<Record<string, number>>,
    notSetUp,
    pendingInvitations,
    classesWithoutTeacher,
    studentsWithoutClass,
    classCount,
    changesLastWeek: lastWeek,
    recent: hasRole(actor, "admin") ? listAudit({ actor, limit: 6 }) : [],
  };
}

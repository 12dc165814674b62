import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { getDb, type DbOrTx } from "../client";
import { classes, classStudents, parentLinks, userRoles, users } from "../schema";
import { recordAudit } from "./audit";

/** True when the actor is a parent linked to the student. */
export function isParentOf(db: DbOrTx, actor: Actor, studentId: string): boolean {
  if (!hasRole(actor, "parent")) return false;
  return !!db
    .select({ id: parentLinks.studentId })
    .from(parentLinks)
    .where(and(eq(parentLinks.parentId, actor.userId), eq(parentLinks.studentId, studentId)))
    .get();
}

function holdsRole(db: DbOrTx, schoolId: string, userId: string, role: "parent" | "student"): boolean {
  return !!db
    .select({ id: users.id })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, role)))
    .where(and(eq(users.id, userId), eq(users.schoolId, schoolId)))
    .get();
}

/** Links a parent or guardian to a student (admins only). */
export function linkParent({ actor, parentId, studentId, relationship, tx }: { actor: Actor; parentId: string; studentId: string; relationship: string; tx?: DbOrTx }): void {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can link parents to students.");
  const run = (db: DbOrTx) => {
    if (!holdsRole(db, actor.schoolId, parentId, "parent")) throw new AppError("bad_request", "Choose a parent or guardian from this school.", { fieldErrors: { parentId: ["Choose a parent or guardian from this school."] } });
    if (!holdsRole(db, actor.schoolId, studentId, "student")) throw new AppError("bad_request", "Choose a student from this school.", { fieldErrors: { studentId: ["Choose a student from this school."] } });
    if (parentId === studentId) throw new AppError("bad_request", "A person cannot be their own parent.");
    const existing = db.select({ r: parentLinks.relationship }).from(parentLinks).where(and(eq(parentLinks.parentId, parentId), eq(parentLinks.studentId, studentId))).get();
    if (existing) throw new AppError("conflict", "These two are already linked.");
    db.insert(parentLinks).values({ parentId, studentId, relationship }).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "family.link", entityType: "user", entityId: studentId, after: { parentId, relationship } });
  };
  if (tx) run(tx);
  else getDb().transaction(run);
}

export function unlinkParent({ actor, parentId, studentId }: { actor: Actor; parentId: string; studentId: string }): void {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can change family links.");
  getDb().transaction((db) => {
    const link = db
      .select({ relationship: parentLinks.relationship })
      .from(parentLinks)
      .innerJoin(users, eq(users.id, parentLinks.studentId))
      .where(and(eq(parentLinks.parentId, parentId), eq(parentLinks.studentId, studentId), eq(users.schoolId, actor.schoolId)))
      .get();
    if (!link) throw notFound("That family link");
    db.delete(parentLinks).where(and(eq(parentLinks.parentId, parentId), eq(parentLinks.studentId, studentId))).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "family.unlink", entityType: "user", entityId: studentId, before: { parentId, relationship: link.relationship } });
  });
}

/** A parent's linked children, each with their classes; only the parent's own. */
export function listChildren({ actor }: { actor: Actor }) {
  if (!hasRole(actor, "parent")) throw forbidden("Only parents and guardians have linked children.");
  const db = getDb();
  const kids = db
    .select({ id: users.id, name: users.name, yearGroup: users.yearGroup, relationship: parentLinks.relationship })
    .from(parentLinks)
    .innerJoin(users, eq(users.id, parentLinks.studentId))
    .where(and(eq(parentLinks.parentId, actor.userId), eq(users.schoolId, actor.schoolId), eq(users.active, true)))
    .orderBy(asc(users.name))
    .all();
  return kids.map((k) => ({
    ...k,
    classes: db
      .select({ id: classes.id, name: classes.name, subject: classes.subject })
      .from(classStudents)
      .innerJoin(classes, eq(classes.id, classStudents.classId))
      .where(and(eq(classStudents.studentId, k.id), eq(classes.archived, false)))
      .orderBy(asc(classes.name))
      .all(),
  }));
}

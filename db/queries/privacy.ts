import "server-only";
import { and, asc, eq, inArray, isNotNull, or } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { deleteObjects, getObjectBytes } from "@/lib/storage";
import { getDb } from "../client";
import { auditLog, checkAttempts, classes, classStudents, classTeachers, evidence, invitations, labSessions, mailMessages, parentLinks, schools, users, writeUps } from "../schema";
import { recordAudit } from "./audit";
import { getStudentProgress, listChildrenProgress } from "./progress";
import { rolesByUser } from "./users";
import { getWriteUp } from "./write-ups";

/**
 * Personal data: what Meniscus holds about the signed-in person, for them to download, and an
 * admin's erasure of a leaver's data.
 */

export const EXPORT_FORMAT = "meniscus-personal-data/1";

export type ExportFile = { path: string; bytes: Buffer };

/** Storage that does not answer is a clear, retryable 503. */
async function fromStorage<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    console.error("[meniscus] object storage error", e);
    throw new AppError("unavailable", "Photo storage is not answering just now, so the download could not be made. Try again in a few minutes.", { detail: { reason: "storage-unavailable", retry: true } });
  }
}

/**
 * Everything held about the signed-in person: their account, classes, family links, write-ups
 * with marks and feedback once returned, progress, check attempts, the audit entries about them
 * and their work, the e-mails sent to them, and their photos (as files). Only ever the actor's
 * own data: there is no way to name someone else.
 */
export async function exportOwnData({ actor, now = new Date() }: { actor: Actor; now?: Date }): Promise<{ data: Record<string, unknown>; files: ExportFile[] }> {
  const db = getDb();
  const me = db
    .select({ id: users.id, name: users.name, email: users.email, active: users.active, yearGroup: users.yearGroup, emailNotifications: users.emailNotifications, lastSignInAt: users.lastSignInAt, createdAt: users.createdAt, updatedAt: users.updatedAt, school: schools.name })
    .from(users)
    .innerJoin(schools, eq(schools.id, users.schoolId))
    .where(and(eq(users.id, actor.userId), eq(users.schoolId, actor.schoolId)))
    .get();
  if (!me) throw notFound("Your account");
  const roles = rolesByUser(db, [me.id]).get(me.id) ?? [];

  const studies = db
    .select({ id: classes.id, name: classes.name, subject: classes.subject, academicYear: classes.academicYear })
    .from(classStudents)
    .innerJoin(classes, eq(classes.id, classStudents.classId))
    .where(eq(classStudents.studentId, me.id))
    .orderBy(asc(classes.name))
    .all();
  const teaches = db
    .select({ id: classes.id, name: classes.name, subject: classes.subject, academicYear: classes.academicYear })
    .from(classTeachers)
    .innerJoin(classes, eq(classes.id, classTeachers.classId))
    .where(eq(classTeachers.teacherId, me.id))
    .orderBy(asc(classes.name))
    .all();
  const children = db
    .select({ id: users.id, name: users.name, relationship: parentLinks.relationship, linkedAt: parentLinks.createdAt })
    .from(parentLinks)
    .innerJoin(users, eq(users.id, parentLinks.studentId))
    .where(eq(parentLinks.parentId, me.id))
    .orderBy(asc(users.name))
    .all();
  const guardians = db
    .select({ id: users.id, name: users.name, relationship: parentLinks.relationship, linkedAt: parentLinks.createdAt })
    .from(parentLinks)
    .innerJoin(users, eq(users.id, parentLinks.parentId))
    .where(eq(parentLinks.studentId, me.id))
    .orderBy(asc(users.name))
    .all();

  // Write-ups, each as the student sees it (marks and feedback once returned), without the practical's own text.
  const ownWriteUps = db
    .select({ id: writeUps.id, createdAt: writeUps.createdAt })
    .from(writeUps)
    .where(and(eq(writeUps.studentId, me.id), eq(writeUps.schoolId, actor.schoolId)))
    .orderBy(asc(writeUps.createdAt))
    .all();
  const writeUpData = ownWriteUps.map(({ id }) => {
    const v = getWriteUp({ actor, writeUpId: id, now });
    return {
      id,
      practical: { title: v.practical.title, topic: v.practical.topic, version: v.practical.version },
      labSession: { className: v.labSession.className, opensAt: v.labSession.opensAt, dueAt: v.labSession.dueAt },
      status: v.writeUp.status,
      submittedAt: v.writeUp.submittedAt,
      late: v.writeUp.late,
      safetyAcknowledgedAt: v.writeUp.safetyAcknowledgedAt,
      updatedAt: v.writeUp.updatedAt,
      content: v.writeUp.content,
      tables: v.tables,
      group: v.group ? { name: v.group.name } : null,
      checks: v.checks,
      mark: v.mark,
      markNote: v.mark ? undefined : v.writeUp.status === "draft" ? undefined : "Marks and feedback are included here once the work is returned to you.",
    };
  });
  const writeUpIds = ownWriteUps.map((w) => w.id);

  const attempts = db
    .select({ writeUpId: checkAttempts.writeUpId, checkId: checkAttempts.checkId, kind: checkAttempts.kind, verdict: checkAttempts.verdict, slipCode: checkAttempts.slipCode, at: checkAttempts.at })
    .from(checkAttempts)
    .where(eq(checkAttempts.studentId, me.id))
    .orderBy(asc(checkAttempts.at))
    .all();

  // Photos: those on the person's write-ups and those they uploaded; only processed (metadata-free) images.
  const photoRows = db
    .select({ id: evidence.id, caption: evidence.caption, writeUpId: evidence.writeUpId, practicalId: evidence.practicalId, imageKey: evidence.imageKey, size: evidence.size, width: evidence.width, height: evidence.height, sha256: evidence.sha256, confirmedAt: evidence.confirmedAt })
    .from(evidence)
    .where(
      and(
        eq(evidence.schoolId, actor.schoolId),
        eq(evidence.status, "ready"),
        isNotNull(evidence.imageKey),
        writeUpIds.length ? or(eq(evidence.uploadedById, me.id), inArray(evidence.writeUpId, writeUpIds)) : eq(evidence.uploadedById, me.id),
      ),
    )
    .orderBy(asc(evidence.createdAt))
    .all();
  const files: ExportFile[] = [];
  for (const p of photoRows) files.push({ path: `photos/${p.id}.jpg`, bytes: await fromStorage(() => getObjectBytes(p.imageKey!)) });
  const photos = photoRows.map((p) => ({ id: p.id, file: `photos/${p.id}.jpg`, caption: p.caption, writeUpId: p.writeUpId, practicalId: p.practicalId, size: p.size, width: p.width, height: p.height, sha256: p.sha256, addedAt: p.confirmedAt }));

  const about = [me.id, ...writeUpIds];
  const audit = db
    .select({ at: auditLog.at, action: auditLog.action, entityType: auditLog.entityType, entityId: auditLog.entityId, actorId: auditLog.actorId, before: auditLog.before, after: auditLog.after })
    .from(auditLog)
    .where(and(eq(auditLog.schoolId, actor.schoolId), inArray(auditLog.entityId, about)))
    .orderBy(asc(auditLog.at), asc(auditLog.id))
    .all()
    .map(({ actorId, ...e }) => ({ ...e, by: actorId === me.id ? "you" : actorId ? "school staff" : "Meniscus" }));

  const mail = db
    .select({ receivedAt: mailMessages.receivedAt, subject: mailMessages.subject, text: mailMessages.text, attachments: mailMessages.attachments })
    .from(mailMessages)
    .where(and(eq(mailMessages.schoolId, actor.schoolId), eq(mailMessages.to, me.email)))
    .orderBy(asc(mailMessages.receivedAt))
    .all();

  const data = {
    format: EXPORT_FORMAT,
    exportedAt: now,
    about: "Everything Meniscus holds about you at your school, as you would see it. Photos are in the photos folder; they were re-encoded without location or camera data when you added them.",
    account: { ...me, roles },
    classes: { studies, teaches },
    family: { children, guardians },
    writeUps: writeUpData,
    checkAttempts: attempts,
    progress: hasRole(actor, "student") ? getStudentProgress({ actor, studentId: me.id, now }) : null,
    childrenProgress: hasRole(actor, "parent") ? listChildrenProgress({ actor, now }) : null,
    photos,
    auditEntries: audit,
    emails: mail,
  };
  return { data, files };
}

/**
 * An admin erases a leaver's data: a student's or parent's write-ups (with their marks, checks,
 * moderation records and photos, whose stored objects are deleted first), class places, family
 * links, invitations, the e-mails kept for them, the personal details in earlier audit entries
 * about them, and finally the account itself. One audit entry records who erased whom and when,
 * holding only the id and counts. Staff accounts are deactivated instead: their marking and
 * practicals belong to the department's record.
 */
export async function eraseLeaverData({ actor, userId, confirmName }: { actor: Actor; userId: string; confirmName: string }) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can delete a leaver's data.");
  const db = getDb();
  const person = db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(and(eq(users.id, userId), eq(users.schoolId, actor.schoolId))).get();
  if (!person) throw notFound("That person");
  if (person.id === actor.userId) throw new AppError("bad_request", "You cannot delete your own account's data.");
  const roles = rolesByUser(db, [person.id]).get(person.id) ?? [];
  if (roles.some((r) => r !== "student" && r !== "parent")) {
    throw new AppError("bad_request", "Only students' and parents' data can be deleted here. Deactivate a member of staff instead: their marking is part of the school's record.");
  }
  if (confirmName.trim().toLowerCase() !== person.name.trim().toLowerCase()) {
    throw new AppError("bad_request", "Type the person's full name to confirm.", { fieldErrors: { confirmName: ["Type the name exactly as shown."] } });
  }

  const ownWriteUpIds = db.select({ id: writeUps.id }).from(writeUps).where(eq(writeUps.studentId, person.id)).all().map((w) => w.id);
  const photos = db
    .select({ id: evidence.id, uploadKey: evidence.uploadKey, imageKey: evidence.imageKey, thumbKey: evidence.thumbKey })
    .from(evidence)
    .where(and(eq(evidence.schoolId, actor.schoolId), ownWriteUpIds.length ? or(inArray(evidence.writeUpId, ownWriteUpIds), eq(evidence.uploadedById, person.id)) : eq(evidence.uploadedById, person.id)))
    .all();
  // Stored photos go first: if storage does not answer, nothing has changed and the admin can try again.
  await fromStorage(() => deleteObjects(photos.flatMap((p) => [p.uploadKey, p.imageKey ?? "", p.thumbKey ?? ""])));

  return db.transaction((tx) => {
    const counts = {
      writeUps: ownWriteUpIds.length,
      photos: photos.length,
      classPlaces: tx.delete(classStudents).where(eq(classStudents.studentId, person.id)).run().changes,
      familyLinks: tx.delete(parentLinks).where(or(eq(parentLinks.studentId, person.id), eq(parentLinks.parentId, person.id))).run().changes,
      emails: tx.delete(mailMessages).where(and(eq(mailMessages.schoolId, actor.schoolId), eq(mailMessages.to, person.email))).run().changes,
    };
    if (photos.length) tx.delete(evidence).where(inArray(evidence.id, photos.map((p) => p.id))).run();
    // Write-ups take their marks, check attempts, moderation items and second marks with them (ON DELETE CASCADE).
    if (ownWriteUpIds.length) tx.delete(writeUps).where(inArray(writeUps.id, ownWriteUpIds)).run();
    tx.delete(invitations).where(eq(invitations.userId, person.id)).run();
    // Group lists in lab sessions keep no trace of them.
    for (const s of tx.select({ id: labSessions.id, groups: labSessions.groups }).from(labSessions).where(eq(labSessions.schoolId, actor.schoolId)).all()) {
      if (!s.groups.some((g) => g.studentIds.includes(person.id))) continue;
      const groups = s.groups.map((g) => ({ ...g, studentIds: g.studentIds.filter((id) => id !== person.id) })).filter((g) => g.studentIds.length > 0);
      tx.update(labSessions).set({ groups }).where(eq(labSessions.id, s.id)).run();
    }
    // Earlier audit entries about the person keep what happened and when, not their name or e-mail.
    tx.update(auditLog)
      .set({ before: { erased: true }, after: { erased: true } })
      .where(and(eq(auditLog.schoolId, actor.schoolId), eq(auditLog.entityType, "user"), eq(auditLog.entityId, person.id)))
      .run();
    tx.delete(users).where(eq(users.id, person.id)).run();
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "user.erase", entityType: "user", entityId: person.id, after: counts });
    return { erased: true as const, id: person.id, ...counts };
  });
}

import "server-only";
import { and, asc, eq, inArray, lt, or, sql } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { ACCEPTED_TYPES, MAX_PHOTO_BYTES, PhotoRejected, processPhoto } from "@/lib/images/process-photo";
import { deleteObjects, evidenceKeys, getObjectBytes, headObject, presignDownload, presignUpload, putObject } from "@/lib/storage";
import { getDb, type DbOrTx } from "../client";
import { evidence, practicals, type Evidence } from "../schema";
import { recordAudit } from "./audit";
import { isEditableNow, writeUpReadAccess } from "./write-ups";

export const MAX_PHOTOS_PER_ITEM = 20;

type Target = { writeUpId: string } | { practicalId: string };

/** Storage that does not answer becomes a clear, retryable 503, never a broken record. */
async function storage<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    if (e instanceof AppError || e instanceof PhotoRejected) throw e;
    console.error("[meniscus] object storage error", e);
    throw new AppError("unavailable", "Photo storage is not answering just now. Your photo is still on this device: try again in a moment.", { detail: { reason: "storage-unavailable", retry: true } });
  }
}

function practicalOf(db: DbOrTx, actor: Actor, practicalId: string) {
  const p = db.select({ id: practicals.id }).from(practicals).where(and(eq(practicals.id, practicalId), eq(practicals.schoolId, actor.schoolId))).get();
  if (!p) throw notFound("That practical");
  return p;
}

/** Can this person add photos to the target? Students to their own editable write-up; teachers and admins to practicals. */
function requireUploader(db: DbOrTx, actor: Actor, target: Target) {
  if ("writeUpId" in target) {
    const r = writeUpReadAccess(db, actor, target.writeUpId);
    if (!r) throw notFound("That write-up");
    if (r.access !== "owner") throw forbidden("Only the student adds photos to their write-up.");
    if (!isEditableNow(r.writeUp, r.session)) throw new AppError("conflict", "This write-up is handed in or closed, so photos can no longer be added.", { detail: { reason: "locked" } });
    return;
  }
  practicalOf(db, actor, target.practicalId);
  if (!hasRole(actor, "teacher", "admin")) throw forbidden("Only teachers and admins add photos to practicals.");
}

function requireReader(db: DbOrTx, actor: Actor, target: Target) {
  if ("writeUpId" in target) {
    if (!writeUpReadAccess(db, actor, target.writeUpId)) throw notFound("That write-up");
    return;
  }
  practicalOf(db, actor, target.practicalId);
  // Practical photos are for anyone who may read the practical: staff, and students whose class uses it.
  if (!hasRole(actor, "teacher", "admin", "moderator", "student")) throw forbidden("You cannot see this practical's photos.");
}

/**
 * Starts an upload: checks the person may add a photo, the declared type and size, and returns a
 * presigned URL the browser PUTs the file to directly. Nothing is shown until it is confirmed.
 */
export async function createUpload({ actor, target, filename, contentType, size, caption }: { actor: Actor; target: Target; filename: string; contentType: string; size: number; caption: string }) {
  const db = getDb();
  requireUploader(db, actor, target);
  if (contentType === "image/heic" || contentType === "image/heif") throw new AppError("unsupported_media_type", "HEIC photos cannot be read yet. On an iPhone choose Settings › Camera › Formats › Most Compatible, or share the photo as JPEG.");
  if (!(ACCEPTED_TYPES as readonly string[]).includes(contentType)) throw new AppError("unsupported_media_type", "Only photos can be added: JPEG, PNG or WebP.");
  if (size > MAX_PHOTO_BYTES) throw new AppError("payload_too_large", `The photo is too large (${(size / 1048576).toFixed(1)} MB). The limit is ${MAX_PHOTO_BYTES / 1048576} MB.`);
  const where = "writeUpId" in target ? eq(evidence.writeUpId, target.writeUpId) : eq(evidence.practicalId, target.practicalId);
  const count = db.select({ n: sql<number>`count(*)` }).from(evidence).where(and(where, inArray(evidence.status, ["pending", "ready"]))).get()!.n;
  if (count >= MAX_PHOTOS_PER_ITEM) throw new AppError("conflict", `There are already ${MAX_PHOTOS_PER_ITEM} photos here. Delete one before adding another.`);
  const id = crypto.randomUUID();
  const keys = evidenceKeys(actor.schoolId, target, id);
  db.insert(evidence)
    .values({ id, schoolId: actor.schoolId, writeUpId: "writeUpId" in target ? target.writeUpId : null, practicalId: "practicalId" in target ? target.practicalId : null, uploadedById: actor.userId, caption, uploadKey: keys.upload, declaredType: contentType, declaredSize: size, originalName: filename.replace(/[\\/]/g, "_").slice(0, 200) })
    .run();
  const uploadUrl = await storage(() => presignUpload(keys.upload, contentType));
  return { id, uploadUrl, method: "PUT" as const, headers: { "content-type": contentType } };
}

function loadOwnPending(db: DbOrTx, actor: Actor, evidenceId: string): Evidence {
  const e = db.select().from(evidence).where(and(eq(evidence.id, evidenceId), eq(evidence.schoolId, actor.schoolId))).get();
  if (!e || e.uploadedById !== actor.userId) throw notFound("That photo");
  return e;
}

/**
 * Finishes an upload: the server reads the object back, checks it by content and size,
 * re-encodes it without metadata, stores the image and a thumbnail, and deletes the original.
 * Anything that is not a usable photo is deleted and refused with the reason.
 */
export async function confirmUpload({ actor, evidenceId, now = new Date() }: { actor: Actor; evidenceId: string; now?: Date }) {
  const db = getDb();
  const e = loadOwnPending(db, actor, evidenceId);
  if (e.status === "ready") return publicShape(e);
  if (e.status === "rejected") throw new AppError("conflict", e.rejectReason ?? "This upload was refused.");
  requireUploader(db, actor, e.writeUpId ? { writeUpId: e.writeUpId } : { practicalId: e.practicalId! });
  const head = await storage(() => headObject(e.uploadKey));
  if (!head) throw new AppError("conflict", "The photo did not finish uploading. Try again.", { detail: { reason: "not-uploaded", retry: true } });
  const reject = async (reason: string, code: "payload_too_large" | "unsupported_media_type" | "bad_request") => {
    await storage(() => deleteObjects([e.uploadKey]));
    db.update(evidence).set({ status: "rejected", rejectReason: reason }).where(eq(evidence.id, e.id)).run();
    throw new AppError(code, reason);
  };
  if (head.size > MAX_PHOTO_BYTES) await reject(`The photo is too large (${(head.size / 1048576).toFixed(1)} MB). The limit is ${MAX_PHOTO_BYTES / 1048576} MB.`, "payload_too_large");
  const bytes = await storage(() => getObjectBytes(e.uploadKey));
  let processed: Awaited<ReturnType<typeof processPhoto>>;
  try {
    processed = await processPhoto(bytes);
  } catch (err) {
    if (err instanceof PhotoRejected) return reject(err.message, /too large/.test(err.message) ? "payload_too_large" : /damaged|incomplete/.test(err.message) ? "bad_request" : "unsupported_media_type");
    throw err;
  }
  const keys = evidenceKeys(actor.schoolId, e.writeUpId ? { writeUpId: e.writeUpId } : { practicalId: e.practicalId }, e.id);
  await storage(async () => {
    await putObject(keys.image, processed.image, "image/jpeg");
    await putObject(keys.thumb, processed.thumb, "image/jpeg");
    await deleteObjects([e.uploadKey]);
  });
  db.transaction((tx) => {
    tx.update(evidence)
      .set({ status: "ready", imageKey: keys.image, thumbKey: keys.thumb, size: processed.image.length, width: processed.width, height: processed.height, sha256: processed.sha256, confirmedAt: now })
      .where(eq(evidence.id, e.id))
      .run();
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "evidence.add", entityType: e.writeUpId ? "write-up" : "practical", entityId: e.writeUpId ?? e.practicalId!, after: { evidenceId: e.id, size: processed.image.length, sha256: processed.sha256 } });
  });
  return publicShape(db.select().from(evidence).where(eq(evidence.id, e.id)).get()!);
}

function publicShape(e: Evidence) {
  return { id: e.id, caption: e.caption, status: e.status, width: e.width, height: e.height, size: e.size, sha256: e.sha256, confirmedAt: e.confirmedAt, rejectReason: e.rejectReason };
}

/** Photos of a write-up or practical for someone allowed to see them, with links that expire in minutes. */
export async function listEvidence({ actor, target }: { actor: Actor; target: Target }) {
  const db = getDb();
  requireReader(db, actor, target);
  const where = "writeUpId" in target ? eq(evidence.writeUpId, target.writeUpId) : eq(evidence.practicalId, target.practicalId);
  const rows = db.select().from(evidence).where(and(where, eq(evidence.schoolId, actor.schoolId), eq(evidence.status, "ready"))).orderBy(asc(evidence.createdAt)).all();
  return storage(() =>
    Promise.all(
      rows.map(async (e) => ({ ...publicShape(e), canDelete: e.uploadedById === actor.userId, thumbUrl: await presignDownload(e.thumbKey!), imageUrl: await presignDownload(e.imageKey!) })),
    ),
  );
}

/** Deletes a photo and its stored objects (the student's own, while the write-up is a draft; a teacher's on a practical). */
export async function deleteEvidence({ actor, evidenceId }: { actor: Actor; evidenceId: string }) {
  const db = getDb();
  const e = db.select().from(evidence).where(and(eq(evidence.id, evidenceId), eq(evidence.schoolId, actor.schoolId))).get();
  if (!e) throw notFound("That photo");
  if (e.writeUpId) {
    const r = writeUpReadAccess(db, actor, e.writeUpId);
    if (!r || r.access !== "owner" || e.uploadedById !== actor.userId) throw notFound("That photo");
    if (!isEditableNow(r.writeUp, r.session)) throw new AppError("conflict", "This write-up is handed in or closed, so its photos cannot be deleted.", { detail: { reason: "locked" } });
  } else if (!hasRole(actor, "teacher", "admin")) throw forbidden("Only teachers and admins remove practical photos.");
  await storage(() => deleteObjects([e.uploadKey, e.imageKey ?? "", e.thumbKey ?? ""]));
  db.transaction((tx) => {
    tx.delete(evidence).where(eq(evidence.id, e.id)).run();
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "evidence.delete", entityType: e.writeUpId ? "write-up" : "practical", entityId: e.writeUpId ?? e.practicalId!, before: { evidenceId: e.id, sha256: e.sha256 } });
  });
}

export function updateCaption({ actor, evidenceId, caption }: { actor: Actor; evidenceId: string; caption: string }) {
  const db = getDb();
  const e = db.select().from(evidence).where(and(eq(evidence.id, evidenceId), eq(evidence.schoolId, actor.schoolId))).get();
  if (!e || e.uploadedById !== actor.userId) throw notFound("That photo");
  if (e.writeUpId) {
    const r = writeUpReadAccess(db, actor, e.writeUpId);
    if (!r || !isEditableNow(r.writeUp, r.session)) throw new AppError("conflict", "This write-up is handed in or closed.", { detail: { reason: "locked" } });
  }
  db.update(evidence).set({ caption }).where(eq(evidence.id, e.id)).run();
  return { id: e.id, caption };
}

/**
 * Removes uploads that were never confirmed (older than `olderThanMs`) and refused ones, with
 * their objects. Runs periodically; returns how many were swept.
 */
export async function sweepOrphanUploads({ olderThanMs = 60 * 60 * 1000, now = new Date() }: { olderThanMs?: number; now?: Date } = {}) {
  const db = getDb();
  const cutoff = new Date(now.getTime() - olderThanMs);
  const stale = db.select().from(evidence).where(or(and(eq(evidence.status, "pending"), lt(evidence.createdAt, cutoff)), eq(evidence.status, "rejected"))).all();
  if (!stale.length) return 0;
  await deleteObjects(stale.flatMap((e) => [e.uploadKey, e.imageKey ?? "", e.thumbKey ?? ""]));
  db.delete(evidence).where(inArray(evidence.id, stale.map((e) => e.id))).run();
  return stale.length;
}

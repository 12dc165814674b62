import Database from "better-sqlite3";
import { drizzle } from "drizzle-orm/better-sqlite3";
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { getHandle, setDatabase } from "@/db/client";
import * as schema from "@/db/schema";
import { confirmUpload, createUpload } from "@/db/queries/evidence";
import { scheduleLabSession } from "@/db/queries/lab-sessions";
import { returnWriteUp, saveMark } from "@/db/queries/marking";
import { drawSample, saveModerationMark } from "@/db/queries/moderation";
import { createPractical, publishVersion, saveDraft } from "@/db/queries/practicals";
import { createRubric } from "@/db/queries/rubrics";
import { acknowledgeSafety, openWriteUp, submitWriteUp } from "@/db/queries/write-ups";
import type { Actor } from "@/lib/auth/actor";
import { hashPassword } from "@/lib/auth/password";
import { hashToken } from "@/lib/tokens";
import { labSessionSchema } from "@/lib/validation/practicals";
import { freshDatabase, linkParentDirect, makeClass, makeSchool, makeUser, testDb } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";

/**
 * One school with work in every state a route can act on, and a second school, for the
 * authorisation matrix and the hostile-input suite. Built once with the real data-access layer,
 * then kept as a database image: every request runs against a fresh copy, so a change one caller
 * made never decides what the next caller sees.
 */

/** Every account's password (invented; argon2id-hashed once and shared, to keep the build quick). */
export const WORLD_PASSWORD = "correct-horse-lab-notebook";

export const DAY = 86_400_000;

/** Two invented tokens (43 characters, like lib/tokens' newToken) stored only as hashes. */
export const INVITATION_TOKEN = "inv1tationTokenForTheAccessMatrixTests000001";
export const RESET_TOKEN = "resetTokenForTheAccessMatrixTestsxxxxxxxx0002";

export type World = Awaited<ReturnType<typeof buildWorld>>;

/** A small JPEG as a phone camera would make it. */
export function photoBytes(): Promise<Buffer> {
  return sharp({ create: { width: 48, height: 32, channels: 3, background: "#3c7a5a" } })
    .jpeg()
    .withExif({ IFD0: { Make: "Test camera", Model: "Lab phone" } })
    .toBuffer();
}

async function putToPresigned(url: string, headers: Record<string, string>, bytes: Buffer) {
  const res = await fetch(url, { method: "PUT", headers, body: new Uint8Array(bytes) });
  if (res.status !== 200) throw new Error(`upload to fake S3 failed: ${res.status}`);
}

export async function buildWorld() {
  freshDatabase();
  const db = testDb();
  const now = Date.now();

  // ---- Home school -------------------------------------------------------------------------
  const schoolId = makeSchool("Larchfield Academy");
  const admin = makeUser(schoolId, ["admin"], { name: "Audrey Admin" });
  const teacher = makeUser(schoolId, ["teacher"], { name: "Tobias Teacher" });
  const teacher2 = makeUser(schoolId, ["teacher"], { name: "Tamsin Teacher" });
  const moderator = makeUser(schoolId, ["moderator"], { name: "Morwenna Moderator" });
  const student = makeUser(schoolId, ["student"], { name: "Sasha Student" });
  const student2 = makeUser(schoolId, ["student"], { name: "Soren Student" });
  const parent = makeUser(schoolId, ["parent"], { name: "Pippa Parent" });
  const parent2 = makeUser(schoolId, ["parent"], { name: "Percy Parent" });
  const pending = makeUser(schoolId, ["teacher"], { name: "Nia Newcomer" });
  // Eleven classmates make a cohort big enough for a moderation sample and an adjustment.
  const classmates = Array.from({ length: 11 }, (_, i) => makeUser(schoolId, ["student"], { name: `Classmate ${String(i + 1).padStart(2, "0")}` }));
  const classId = makeClass(schoolId, { name: "10C Chemistry", teachers: [teacher], students: [student, ...classmates] });
  const class2Id = makeClass(schoolId, { name: "10D Chemistry", teachers: [teacher2], students: [student2] });
  linkParentDirect(parent, student);
  linkParentDirect(parent2, student2);

  const meta = { title: "Gas over time", topic: "Rates", yearGroup: 10, subject: "Chemistry" };
  const created = createPractical({ actor: teacher, input: meta });
  const practicalId = created.practicalId;
  const versionId = created.versionId;
  publishVersion({ actor: teacher, versionId, revision: saveDraft({ actor: teacher, versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } }).revision });

  // A second practical with a complete, unpublished draft (for editing and publishing).
  const draft = createPractical({ actor: teacher, input: { ...meta, title: "Titration draft" } });
  const draftRevision = saveDraft({ actor: teacher, versionId: draft.versionId, input: { ...meta, title: "Titration draft", content: completePracticalContent(), revision: 0 } }).revision;

  const rubricId = createRubric({ actor: teacher, body: { title: "Rates write-up", style: "marks", criteria: completePracticalContent().rubric!.criteria } });

  const session = (cls: string, opens: number, due: number, extra: Record<string, unknown> = {}, by = teacher) =>
    scheduleLabSession({ actor: by, input: labSessionSchema.parse({ classId: cls, practicalVersionId: versionId, opensAt: new Date(opens), dueAt: new Date(due), ...extra }) });

  // Marked work: opened 10 days ago, due 3 days ago (late work still accepted for 7 days).
  const markedSessionId = session(classId, now - 10 * DAY, now - 3 * DAY);
  const during = new Date(now - 5 * DAY);
  const full = (c1: string, c2: string, revision = 0) => ({ revision, criteria: { c1: { levelId: c1 }, c2: { levelId: c2 } }, comments: {}, feedback: "Careful readings." });
  const cohort = [student, ...classmates].map((s) => {
    const id = openWriteUp({ actor: s, labSessionId: markedSessionId, now: during }).writeUp.id;
    acknowledgeSafety({ actor: s, writeUpId: id, now: during });
    submitWriteUp({ actor: s, writeUpId: id, revision: 0, now: during });
    saveMark({ actor: teacher, writeUpId: id, input: full("l1", "l2") });
    return { studentId: s.userId, writeUpId: id };
  });
  const returnedWriteUpId = cohort[0]!.writeUpId; // Sasha's, returned to her and her parent below
  const sample = drawSample({ actor: moderator, input: { labSessionId: markedSessionId, moderatorId: moderator.userId, seed: 11, blind: true, toleranceMarks: 1 } });
  for (const id of sample.ids) {
    saveModerationMark({ actor: moderator, sampleId: sample.sampleId, writeUpId: id, input: { revision: 0, criteria: { c1: { levelId: "l0" }, c2: { levelId: "l1" } }, comment: "Working not shown.", complete: true } });
  }
  const sampledWriteUpId = sample.ids[0]!;
  const unsampledWriteUpIds = cohort.map((c) => c.writeUpId).filter((id) => !sample.ids.includes(id) && id !== returnedWriteUpId);
  const notInSampleWriteUpId = unsampledWriteUpIds[0]!;
  const markedWriteUpId = unsampledWriteUpIds[1]!; // marked, not returned: for "return"
  await returnWriteUp({ actor: teacher, writeUpId: returnedWriteUpId });
  // The catcher stores the "work returned" e-mails (to Sasha and her parent) just after they are accepted.
  for (let i = 0; i < 100 && db.select().from(schema.mailMessages).all().length < 2; i++) await new Promise((r) => setTimeout(r, 20));

  // Open work: a lab session shared in groups, open now.
  const openSessionId = session(classId, now - DAY, now + 7 * DAY, {
    grouping: "groups",
    groups: [{ id: "g1", name: "Bench 1", studentIds: [student.userId, classmates[0]!.userId] }],
  });
  const draftWriteUpId = openWriteUp({ actor: student, labSessionId: openSessionId }).writeUp.id;
  acknowledgeSafety({ actor: student, writeUpId: draftWriteUpId });

  // Handed in, not yet marked.
  const submittedSessionId = session(classId, now - DAY, now + 7 * DAY);
  const submittedWriteUpId = openWriteUp({ actor: student, labSessionId: submittedSessionId }).writeUp.id;
  acknowledgeSafety({ actor: student, writeUpId: submittedWriteUpId });
  submitWriteUp({ actor: student, writeUpId: submittedWriteUpId, revision: 0 });

  // Another class's lab session, and Soren's write-up in it.
  const otherClassSessionId = session(class2Id, now - DAY, now + 7 * DAY, {}, teacher2);
  const otherStudentWriteUpId = openWriteUp({ actor: student2, labSessionId: otherClassSessionId }).writeUp.id;

  // Photos on the open write-up: one ready (processed, in storage), one uploaded but not confirmed.
  const bytes = await photoBytes();
  const up1 = await createUpload({ actor: student, target: { writeUpId: draftWriteUpId }, filename: "bench.jpg", contentType: "image/jpeg", size: bytes.length, caption: "Apparatus" });
  await putToPresigned(up1.uploadUrl, up1.headers, bytes);
  await confirmUpload({ actor: student, evidenceId: up1.id });
  const up2 = await createUpload({ actor: student, target: { writeUpId: draftWriteUpId }, filename: "meniscus.jpg", contentType: "image/jpeg", size: bytes.length, caption: "" });
  await putToPresigned(up2.uploadUrl, up2.headers, bytes);

  // A caught e-mail for the outbox, and single-use links for the public token routes.
  const mailId = db
    .insert(schema.mailMessages)
    .values({ schoolId, from: "no-reply@meniscus.invalid", to: parent.email, subject: "Work returned", text: "Sasha's work was returned.", raw: "raw" })
    .returning({ id: schema.mailMessages.id })
    .get().id;
  const expiresAt = new Date(now + 7 * DAY);
  db.insert(schema.invitations).values({ schoolId, userId: pending.userId, kind: "invitation", tokenHash: hashToken(INVITATION_TOKEN), expiresAt }).run();
  db.insert(schema.invitations).values({ schoolId, userId: teacher2.userId, kind: "password-reset", tokenHash: hashToken(RESET_TOKEN), expiresAt }).run();

  // ---- Another school ------------------------------------------------------------------------
  const elsewhereId = makeSchool("Quarry Hill College");
  const elsewhere = {
    admin: makeUser(elsewhereId, ["admin"], { name: "Ansel Admin" }),
    teacher: makeUser(elsewhereId, ["teacher"], { name: "Thea Teacher" }),
    student: makeUser(elsewhereId, ["student"], { name: "Silas Student" }),
    moderator: makeUser(elsewhereId, ["moderator"], { name: "Mabel Moderator" }),
    parent: makeUser(elsewhereId, ["parent"], { name: "Piers Parent" }),
  };
  makeClass(elsewhereId, { name: "9Z Chemistry", teachers: [elsewhere.teacher], students: [elsewhere.student] });
  linkParentDirect(elsewhere.parent, elsewhere.student);

  // Everyone signs in with the same password (the change-password route needs a current one).
  const hash = await hashPassword(WORLD_PASSWORD);
  db.update(schema.users).set({ passwordHash: hash }).run();
  db.update(schema.users).set({ passwordHash: null }).where(eq(schema.users.id, pending.userId)).run();

  return {
    schoolId,
    elsewhereId,
    people: { admin, teacher, teacher2, moderator, student, student2, parent, parent2, pending, classmates },
    elsewhere,
    classId,
    class2Id,
    practicalId,
    versionId,
    draftPracticalId: draft.practicalId,
    draftVersionId: draft.versionId,
    draftRevision,
    rubricId,
    markedSessionId,
    openSessionId,
    submittedSessionId,
    otherClassSessionId,
    returnedWriteUpId,
    markedWriteUpId,
    sampledWriteUpId,
    notInSampleWriteUpId,
    draftWriteUpId,
    submittedWriteUpId,
    otherStudentWriteUpId,
    sampleId: sample.sampleId,
    readyEvidenceId: up1.id,
    pendingEvidenceId: up2.id,
    mailId,
  };
}

/** Every id of the home school's records, to check that answers to other schools carry none. */
export function homeIds(w: World): string[] {
  const p = w.people;
  return [
    w.schoolId,
    ...[p.admin, p.teacher, p.teacher2, p.moderator, p.student, p.student2, p.parent, p.parent2, p.pending, ...p.classmates].map((a: Actor) => a.userId),
    w.classId,
    w.class2Id,
    w.practicalId,
    w.versionId,
    w.draftPracticalId,
    w.draftVersionId,
    w.rubricId,
    w.markedSessionId,
    w.openSessionId,
    w.submittedSessionId,
    w.otherClassSessionId,
    w.returnedWriteUpId,
    w.draftWriteUpId,
    w.submittedWriteUpId,
    w.sampleId,
    w.readyEvidenceId,
    w.mailId,
  ];
}

/** The current database as an image that `restore` copies back into a fresh connection. */
export function snapshot(): Buffer {
  return getHandle().sqlite.serialize();
}

export function restore(image: Buffer): void {
  const previous = getHandle();
  const sqlite = new Database(image);
  sqlite.pragma("foreign_keys = ON");
  setDatabase({ db: drizzle(sqlite, { schema }), sqlite, file: ":memory:" });
  previous.sqlite.close();
}

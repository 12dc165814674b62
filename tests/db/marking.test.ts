import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { classTeachers, mailMessages } from "@/db/schema";
import { scheduleLabSession } from "@/db/queries/lab-sessions";
import { exportMarksCsv, getMarkingBench, getMarkingItem, returnWriteUp, saveMark } from "@/db/queries/marking";
import { changeSample, decideAdjustment, drawSample, getModerationItem, getSample, saveModerationMark } from "@/db/queries/moderation";
import { createPractical, publishVersion, saveDraft } from "@/db/queries/practicals";
import { acknowledgeSafety, getWriteUp, openWriteUp, submitWriteUp } from "@/db/queries/write-ups";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { labSessionSchema } from "@/lib/validation/practicals";
import { auditEntries, freshDatabase, linkParentDirect, makeClass, makeSchool, makeUser, testDb } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";

async function caught(fn: () => unknown): Promise<AppError> {
  try {
    await fn();
  } catch (e) {
    return e as AppError;
  }
  throw new Error("expected an error");
}

const during = new Date("2026-12-03T10:00:00Z");
let smtp: { close: () => Promise<void> };
beforeAll(async () => {
  smtp = await startFakeSmtp(0);
});
afterAll(() => smtp.close());

type World = { classId: string; schoolId: string; teacher: Actor; other: Actor; moderator: Actor; admin: Actor; students: Actor[]; sessionId: string; writeUpIds: string[] };

/** A class of `n` students who have all handed in, taught by `teacher`. */
function world(n = 12, studentName?: (i: number) => string): World {
  freshDatabase();
  const schoolId = makeSchool();
  const teacher = makeUser(schoolId, ["teacher"]);
  const other = makeUser(schoolId, ["teacher"]);
  const moderator = makeUser(schoolId, ["moderator"]);
  const admin = makeUser(schoolId, ["admin"]);
  const students = Array.from({ length: n }, (_, i) => makeUser(schoolId, ["student"], { name: studentName?.(i) }));
  const classId = makeClass(schoolId, { teachers: [teacher], students });
  const meta = { title: "Gas over time", topic: "Rates", yearGroup: 10, subject: "Chemistry" };
  const { versionId } = createPractical({ actor: teacher, input: meta });
  publishVersion({ actor: teacher, versionId, revision: saveDraft({ actor: teacher, versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } }).revision });
  const sessionId = scheduleLabSession({ actor: teacher, input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: "2026-12-01T09:00:00Z", dueAt: "2026-12-08T16:00:00Z" }) });
  const writeUpIds = students.map((s) => {
    const id = openWriteUp({ actor: s, labSessionId: sessionId, now: during }).writeUp.id;
    acknowledgeSafety({ actor: s, writeUpId: id, now: during });
    submitWriteUp({ actor: s, writeUpId: id, revision: 0, now: during });
    return id;
  });
  return { classId, schoolId, teacher, other, moderator, admin, students, sessionId, writeUpIds };
}

// Rubric from tests/helpers/practicals.ts: c1 levels l0 = 0, l1 = 2; c2 levels l0 = 0, l1 = 1, l2 = 3.
const full = (c1: "l0" | "l1", c2: "l0" | "l1" | "l2") => ({ revision: 0, criteria: { c1: { levelId: c1 }, c2: { levelId: c2 } }, comments: {}, feedback: "Good work." });

describe("marking bench", () => {
  let w: World;
  beforeEach(() => {
    w = world(4);
  });

  it("marks from the chosen level, refuses levels that do not exist, and moves to the bench as marked", async () => {
    const res = saveMark({ actor: w.teacher, writeUpId: w.writeUpIds[0]!, input: full("l1", "l2") });
    expect(res).toMatchObject({ total: 5, maxTotal: 5, complete: true, status: "marked" });
    const bad = await caught(() => saveMark({ actor: w.teacher, writeUpId: w.writeUpIds[1]!, input: { ...full("l1", "l2"), criteria: { c1: { levelId: "nope" } } } }));
    expect(bad.fieldErrors?.["criteria.c1.levelId"]?.[0]).toMatch(/no such level/);
    const bench = getMarkingBench({ actor: w.teacher, labSessionId: w.sessionId });
    expect(bench.rows.find((r) => r.writeUpId === w.writeUpIds[0])).toMatchObject({ status: "marked", total: 5, marks: { c1: 2, c2: 3 } });
    expect(bench.rows.find((r) => r.writeUpId === w.writeUpIds[1])!.status).toBe("submitted");
    expect(auditEntries(w.writeUpIds[0]).map((a) => a.action)).toContain("mark.save");
  });

  it("two teachers marking the same write-up from one revision: the second gets 409 and the first's marks stay", async () => {
    const co = makeUser(w.schoolId, ["teacher"]);
    testDb().insert(classTeachers).values({ classId: w.classId, teacherId: co.userId }).run();
    saveMark({ actor: w.teacher, writeUpId: w.writeUpIds[0]!, input: full("l1", "l2") });
    const err = await caught(() => saveMark({ actor: co, writeUpId: w.writeUpIds[0]!, input: full("l0", "l0") }));
    expect(err.status).toBe(409);
    expect(getMarkingItem({ actor: w.teacher, writeUpId: w.writeUpIds[0]! }).mark!.total).toBe(5);
  });

  it("only the class's teacher marks; moderators and other teachers cannot edit marks", async () => {
    expect((await caught(() => saveMark({ actor: w.other, writeUpId: w.writeUpIds[0]!, input: full("l1", "l2") }))).code).toBe("forbidden");
    expect((await caught(() => saveMark({ actor: w.moderator, writeUpId: w.writeUpIds[0]!, input: full("l1", "l2") }))).code).toBe("forbidden");
    expect((await caught(() => getMarkingBench({ actor: w.other, labSessionId: w.sessionId }))).code).toBe("forbidden");
  });

  it("refuses to return unmarked work, returns marked work once, and tells the student and their parent by e-mail", async () => {
    const parent = makeUser(w.schoolId, ["parent"], { email: "carer@test.example" });
    linkParentDirect(parent, w.students[0]!);
    expect(((await caught(() => returnWriteUp({ actor: w.teacher, writeUpId: w.writeUpIds[0]! }))).detail as { reason: string }).reason).toBe("not-marked");
    expect(getWriteUp({ actor: w.students[0]!, writeUpId: w.writeUpIds[0]! }).mark).toBeNull();
    saveMark({ actor: w.teacher, writeUpId: w.writeUpIds[0]!, input: full("l1", "l1") });
    const res = await returnWriteUp({ actor: w.teacher, writeUpId: w.writeUpIds[0]! });
    expect(res.emailed).toBe(2);
    expect(((await caught(() => returnWriteUp({ actor: w.teacher, writeUpId: w.writeUpIds[0]! }))).detail as { reason: string }).reason).toBe("already-returned");
    const seen = getWriteUp({ actor: w.students[0]!, writeUpId: w.writeUpIds[0]! });
    expect(seen.writeUp.status).toBe("returned");
    expect(seen.mark).toMatchObject({ total: 3, feedback: "Good work." });
    await new Promise((r) => setTimeout(r, 300));
    const mails = testDb().select().from(mailMessages).where(eq(mailMessages.to, "carer@test.example")).all();
    expect(mails[0]!.subject).toMatch(/has been marked/);
    expect(auditEntries(w.writeUpIds[0]).map((a) => a.action)).toContain("write-up.return");
  });

  it("exports marks as CSV with formula-looking names made safe", () => {
    const x = world(2, (i) => (i === 0 ? "=HYPERLINK(\"http://x.example\")" : "Plain Name"));
    saveMark({ actor: x.teacher, writeUpId: x.writeUpIds[0]!, input: full("l1", "l2") });
    const { csv } = exportMarksCsv({ actor: x.teacher, labSessionId: x.sessionId });
    expect(csv).toContain(`"'=HYPERLINK(""http://x.example"")"`);
    expect(csv.split("\n")[0]).toContain("Total (out of 5)");
  });
});

describe("moderation", () => {
  it("draws a reproducible sample without the moderator's own marking, blind until second-marked", async () => {
    const w = world(12);
    w.writeUpIds.forEach((id, i) => saveMark({ actor: w.teacher, writeUpId: id, input: full(i % 2 ? "l1" : "l0", (["l0", "l1", "l2"] as const)[i % 3]!) }));
    const a = drawSample({ actor: w.moderator, input: { labSessionId: w.sessionId, moderatorId: w.moderator.userId, seed: 7, blind: true, toleranceMarks: 1 } });
    const b = drawSample({ actor: w.moderator, input: { labSessionId: w.sessionId, moderatorId: w.moderator.userId, seed: 7, blind: true, toleranceMarks: 1 } });
    expect(a.ids).toEqual(b.ids);
    expect(a.ids.length).toBe(5);
    const sample = getSample({ actor: w.moderator, sampleId: a.sampleId });
    expect(sample.items.every((i) => i.teacherTotal === null)).toBe(true);
    const first = a.ids[0]!;
    expect(getModerationItem({ actor: w.moderator, sampleId: a.sampleId, writeUpId: first }).view.mark).toBeNull();
    const notSampled = w.writeUpIds.find((id) => !a.ids.includes(id))!;
    expect((await caught(() => getModerationItem({ actor: w.moderator, sampleId: a.sampleId, writeUpId: notSampled }))).code).toBe("not_found");
    saveModerationMark({ actor: w.moderator, sampleId: a.sampleId, writeUpId: first, input: { revision: 0, criteria: { c1: { levelId: "l1" }, c2: { levelId: "l2" } }, comment: "", complete: true } });
    expect(getModerationItem({ actor: w.moderator, sampleId: a.sampleId, writeUpId: first }).view.mark).not.toBeNull();
    expect(getSample({ actor: w.moderator, sampleId: a.sampleId }).items.find((i) => i.writeUpId === first)!.teacherTotal).not.toBeNull();
    expect(auditEntries(a.sampleId).map((x) => x.action)).toContain("moderation.draw");
    // A teacher cannot moderate; a moderator never samples work they marked.
    expect((await caught(() => drawSample({ actor: w.teacher, input: { labSessionId: w.sessionId, moderatorId: w.teacher.userId, blind: true, toleranceMarks: 1 } }))).code).toBe("forbidden");
  });

  it("never samples work the moderator marked", () => {
    const w = world(8);
    const hod = makeUser(w.schoolId, ["teacher", "moderator"]);
    testDb().insert(classTeachers).values({ classId: w.classId, teacherId: hod.userId }).run();
    w.writeUpIds.forEach((id, i) => saveMark({ actor: i < 4 ? hod : w.teacher, writeUpId: id, input: full("l1", "l1") }));
    const d = drawSample({ actor: hod, input: { labSessionId: w.sessionId, moderatorId: hod.userId, seed: 3, blind: true, toleranceMarks: 1 } });
    expect(d.cohortSize).toBe(4);
    expect(d.ids.every((id) => w.writeUpIds.indexOf(id) >= 4)).toBe(true);
  });

  it("finds consistent generosity, suggests a cohort adjustment, applies it once with the previous marks kept", async () => {
    const w = world(12);
    // The teacher gives the top level everywhere; the moderator finds each piece one level lower on c2.
    w.writeUpIds.forEach((id) => saveMark({ actor: w.teacher, writeUpId: id, input: full("l1", "l2") }));
    const { sampleId, ids } = drawSample({ actor: w.moderator, input: { labSessionId: w.sessionId, moderatorId: w.moderator.userId, seed: 11, blind: true, toleranceMarks: 1 } });
    for (const id of ids) saveModerationMark({ actor: w.moderator, sampleId, writeUpId: id, input: { revision: 0, criteria: { c1: { levelId: "l0" }, c2: { levelId: "l1" } }, comment: "Calculations not shown.", complete: true } });
    const s = getSample({ actor: w.moderator, sampleId });
    expect(s.agreement!.verdict).toBe("review-needed");
    expect(s.agreement!.totals.meanDifference).toBe(-4);
    expect(s.suggestion!.changes.every((c) => c.before === 5 && c.after === 1)).toBe(true);
    const res = decideAdjustment({ actor: w.moderator, sampleId, decision: "accept", reason: "Consistently generous on processing." });
    expect(res.changed).toBe(12);
    const item = getMarkingItem({ actor: w.teacher, writeUpId: w.writeUpIds[0]! });
    expect(item.mark).toMatchObject({ total: 5, adjustedTotal: 1 });
    expect(((await caught(() => decideAdjustment({ actor: w.moderator, sampleId, decision: "accept", reason: "again" }))).detail as { reason: string }).reason).toBe("already-decided");
    expect(auditEntries(w.writeUpIds[0]).map((a) => a.action)).toContain("mark.adjust");
  });

  it("lets the moderator add or swap work with a reason, only from the cohort", async () => {
    const w = world(12);
    w.writeUpIds.forEach((id) => saveMark({ actor: w.teacher, writeUpId: id, input: full("l1", "l1") }));
    const { sampleId, ids } = drawSample({ actor: w.moderator, input: { labSessionId: w.sessionId, moderatorId: w.moderator.userId, seed: 5, blind: true, toleranceMarks: 1 } });
    const outside = w.writeUpIds.find((id) => !ids.includes(id))!;
    changeSample({ actor: w.moderator, sampleId, change: { action: "swap", removeWriteUpId: ids[0]!, writeUpId: outside, reason: "Swap in a piece from the same bench group." } });
    const items = getSample({ actor: w.moderator, sampleId }).items;
    expect(items.find((i) => i.writeUpId === ids[0])!.removed).toBe(true);
    expect(items.find((i) => i.writeUpId === outside)!.origin).toBe("swapped-in");
    expect((await caught(() => changeSample({ actor: w.moderator, sampleId, change: { action: "add", writeUpId: "not-a-real-id", reason: "test it" } }))).status).toBe(400);
  });
});

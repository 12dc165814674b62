import { beforeEach, describe, expect, it } from "vitest";
import { scheduleLabSession } from "@/db/queries/lab-sessions";
import { createPractical, publishVersion, saveDraft } from "@/db/queries/practicals";
import {
  acknowledgeSafety,
  getWriteUp,
  listSessionWriteUps,
  openWriteUp,
  reopenWriteUp,
  runWriteUpCheck,
  saveGroupTables,
  saveWriteUp,
  submitWriteUp,
} from "@/db/queries/write-ups";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { labSessionSchema } from "@/lib/validation/practicals";
import { writeUpContentSchema, type WriteUpContent } from "@/lib/validation/write-ups";
import { auditEntries, freshDatabase, makeClass, makeSchool, makeUser } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";

function caught(fn: () => unknown): AppError {
  try {
    fn();
  } catch (e) {
    return e as AppError;
  }
  throw new Error("expected an error");
}

const during = new Date("2026-12-03T10:00:00Z");
const afterDue = new Date("2026-12-09T10:00:00Z");
const longAfter = new Date("2027-01-20T10:00:00Z");

// Invented readings; the mean rate from 0 to 30 s is (41 − 0) / 30 = 1.367 cm³/s (hand-worked).
function withData(content: WriteUpContent): WriteUpContent {
  return {
    ...content,
    tables: { t1: { rows: [0, 10, 20, 30, 40].map((t, i) => ({ time: String(t), vol: String([0, 18, 31, 41, 48][i]) })), decisions: {} } },
    answers: { k1: { value: "1.37", unit: "cm³/s", working: null } },
  };
}

describe("write-ups: saving, checking, submitting", () => {
  let teacher: Actor, student: Actor, classmate: Actor, sessionId: string, schoolId: string;

  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    teacher = makeUser(schoolId, ["teacher"]);
    student = makeUser(schoolId, ["student"]);
    classmate = makeUser(schoolId, ["student"]);
    const classId = makeClass(schoolId, { teachers: [teacher], students: [student, classmate] });
    const meta = { title: "Gas over time", topic: "Rates", yearGroup: 10, subject: "Chemistry" };
    const { versionId } = createPractical({ actor: teacher, input: meta });
    const { revision } = saveDraft({ actor: teacher, versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } });
    publishVersion({ actor: teacher, versionId, revision });
    sessionId = scheduleLabSession({
      actor: teacher,
      input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: "2026-12-01T09:00:00Z", dueAt: "2026-12-08T16:00:00Z", lateWork: "accept-flagged", lateDays: 7 }),
    });
  });

  it("two saves from the same revision: one wins, the other gets 409 with the saved version, and nothing is lost", () => {
    const view = openWriteUp({ actor: student, labSessionId: sessionId, now: during });
    const tabA = withData(view.writeUp.content);
    const tabB = { ...view.writeUp.content, answers: { k1: { value: "9", unit: "cm³/s", working: null } } };
    expect(saveWriteUp({ actor: student, writeUpId: view.writeUp.id, revision: 0, content: tabA, now: during }).revision).toBe(1);
    const err = caught(() => saveWriteUp({ actor: student, writeUpId: view.writeUp.id, revision: 0, content: tabB, now: during }));
    expect(err.status).toBe(409);
    const current = (err.detail as { current: { revision: number; content: WriteUpContent } }).current;
    expect(current.revision).toBe(1);
    expect(current.content.answers.k1!.value).toBe("1.37");
    // The student keeps tab B's version by saving it on top of the current revision.
    expect(saveWriteUp({ actor: student, writeUpId: view.writeUp.id, revision: 1, content: tabB, now: during }).revision).toBe(2);
    expect(getWriteUp({ actor: student, writeUpId: view.writeUp.id, now: during }).writeUp.content.answers.k1!.value).toBe("9");
  });

  it("a student can never read or write another student's write-up", () => {
    const mine = openWriteUp({ actor: student, labSessionId: sessionId, now: during }).writeUp.id;
    expect(caught(() => getWriteUp({ actor: classmate, writeUpId: mine })).code).toBe("not_found");
    expect(caught(() => saveWriteUp({ actor: classmate, writeUpId: mine, revision: 0, content: writeUpContentSchema.parse({}), now: during })).code).toBe("not_found");
    expect(caught(() => runWriteUpCheck({ actor: classmate, writeUpId: mine, checkId: "k1", answer: { value: "1", unit: "" }, now: during })).code).toBe("not_found");
    const outsider = makeUser(makeSchool(), ["student"]);
    expect(caught(() => getWriteUp({ actor: outsider, writeUpId: mine })).code).toBe("not_found");
    expect(getWriteUp({ actor: teacher, writeUpId: mine }).access).toBe("staff");
    expect(caught(() => saveWriteUp({ actor: teacher, writeUpId: mine, revision: 0, content: writeUpContentSchema.parse({}), now: during })).code).toBe("forbidden");
  });

  it("checks run on the saved data, hide the expected value, and go stale when the data change", () => {
    const view = openWriteUp({ actor: student, labSessionId: sessionId, now: during });
    const content = withData(view.writeUp.content);
    saveWriteUp({ actor: student, writeUpId: view.writeUp.id, revision: 0, content, now: during });
    const res = runWriteUpCheck({ actor: student, writeUpId: view.writeUp.id, checkId: "k1", answer: { value: "1.37", unit: "cm³/s" }, now: during });
    expect(res.verdict).toBe("agrees");
    expect(JSON.stringify(res)).not.toMatch(/1\.366/);
    expect(getWriteUp({ actor: student, writeUpId: view.writeUp.id, now: during }).checks.k1!.stale).toBe(false);
    const edited = { ...content, tables: { t1: { ...content.tables.t1!, rows: content.tables.t1!.rows.map((r, i) => (i === 3 ? { ...r, vol: "45" } : r)) } } };
    saveWriteUp({ actor: student, writeUpId: view.writeUp.id, revision: 1, content: edited, now: during });
    expect(getWriteUp({ actor: student, writeUpId: view.writeUp.id, now: during }).checks.k1!.stale).toBe(true);
    // The teacher sees the full outcome, with the expected value.
    expect(getWriteUp({ actor: teacher, writeUpId: view.writeUp.id, now: during }).checks.k1!.outcome!.expected!.value).toBeCloseTo(41 / 30, 8);
    expect(listSessionWriteUps({ actor: teacher, labSessionId: sessionId }).rows.find((r) => r.studentId === student.userId)!.checks.k1).toMatchObject({ verdict: "agrees", stale: true });
  });

  it("submit locks the write-up; saves after the lock are refused and nothing changes; the teacher can reopen (logged)", () => {
    const view = openWriteUp({ actor: student, labSessionId: sessionId, now: during });
    const id = view.writeUp.id;
    expect(caught(() => submitWriteUp({ actor: student, writeUpId: id, revision: 0, now: during })).message).toMatch(/safety/);
    acknowledgeSafety({ actor: student, writeUpId: id, now: during });
    expect(submitWriteUp({ actor: student, writeUpId: id, revision: 0, now: during })).toMatchObject({ status: "submitted", late: false });
    const err = caught(() => saveWriteUp({ actor: student, writeUpId: id, revision: 0, content: withData(view.writeUp.content), now: during }));
    expect(err.status).toBe(409);
    expect((err.detail as { reason: string }).reason).toBe("locked");
    expect(getWriteUp({ actor: student, writeUpId: id, now: during }).writeUp.content.tables).toEqual({});
    expect(caught(() => reopenWriteUp({ actor: student, writeUpId: id })).code).toBe("forbidden");
    reopenWriteUp({ actor: teacher, writeUpId: id, now: during });
    expect(getWriteUp({ actor: student, writeUpId: id, now: during }).writeUp.status).toBe("draft");
    expect(auditEntries(id).map((a) => a.action)).toEqual(expect.arrayContaining(["write-up.safety-acknowledged", "write-up.submit", "write-up.reopen"]));
  });

  it("late work follows the lab session's rule: flagged within the late window, refused after it", () => {
    const id = openWriteUp({ actor: student, labSessionId: sessionId, now: during }).writeUp.id;
    acknowledgeSafety({ actor: student, writeUpId: id, now: during });
    expect(submitWriteUp({ actor: student, writeUpId: id, revision: 0, now: afterDue }).late).toBe(true);
    const other = openWriteUp({ actor: classmate, labSessionId: sessionId, now: during }).writeUp.id;
    acknowledgeSafety({ actor: classmate, writeUpId: other, now: during });
    expect((caught(() => submitWriteUp({ actor: classmate, writeUpId: other, revision: 0, now: longAfter })).detail as { reason: string }).reason).toBe("closed");
  });

  it("does not open before the lab session opens", () => {
    expect((caught(() => openWriteUp({ actor: student, labSessionId: sessionId, now: new Date("2026-11-30T10:00:00Z") })).detail as { reason: string }).reason).toBe("not-open");
  });
});

describe("group data", () => {
  it("members share one results table with its own revision; each writes their own analysis", () => {
    freshDatabase();
    const schoolId = makeSchool();
    const teacher = makeUser(schoolId, ["teacher"]);
    const a = makeUser(schoolId, ["student"]);
    const b = makeUser(schoolId, ["student"]);
    const classId = makeClass(schoolId, { teachers: [teacher], students: [a, b] });
    const meta = { title: "Gas", topic: "Rates", yearGroup: 10, subject: "Chemistry" };
    const { versionId } = createPractical({ actor: teacher, input: meta });
    publishVersion({ actor: teacher, versionId, revision: saveDraft({ actor: teacher, versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } }).revision });
    const sessionId = scheduleLabSession({
      actor: teacher,
      input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: "2026-12-01T09:00:00Z", dueAt: "2026-12-08T16:00:00Z", grouping: "groups", groups: [{ id: "g1", name: "Bench 1", studentIds: [a.userId, b.userId] }] }),
    });
    const wa = openWriteUp({ actor: a, labSessionId: sessionId, now: during });
    const wb = openWriteUp({ actor: b, labSessionId: sessionId, now: during });
    expect(wa.group!.members.map((m) => m.id).sort()).toEqual([a.userId, b.userId].sort());
    const tables = { t1: { rows: [{ time: "0", vol: "0" }, { time: "30", vol: "41" }], decisions: {} } };
    expect(saveGroupTables({ actor: a, writeUpId: wa.writeUp.id, revision: 0, tables, now: during }).revision).toBe(1);
    expect(caught(() => saveGroupTables({ actor: b, writeUpId: wb.writeUp.id, revision: 0, tables: {}, now: during })).status).toBe(409);
    expect(getWriteUp({ actor: b, writeUpId: wb.writeUp.id, now: during }).tables).toEqual(tables);
    saveWriteUp({ actor: b, writeUpId: wb.writeUp.id, revision: 0, content: { ...wb.writeUp.content, answers: { k1: { value: "1.37", unit: "cm³/s", working: null } } }, now: during });
    expect(runWriteUpCheck({ actor: b, writeUpId: wb.writeUp.id, checkId: "k1", answer: { value: "1.37", unit: "cm³/s" }, now: during }).verdict).toBe("agrees");
    expect(getWriteUp({ actor: a, writeUpId: wa.writeUp.id, now: during }).writeUp.content.answers).toEqual({});
  });
});

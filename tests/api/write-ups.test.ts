import { beforeEach, describe, expect, it, vi } from "vitest";
import * as checkRoute from "@/app/api/write-ups/[id]/checks/[checkId]/route";
import * as groupTablesRoute from "@/app/api/write-ups/[id]/group-tables/route";
import * as reopenRoute from "@/app/api/write-ups/[id]/reopen/route";
import * as writeUpRoute from "@/app/api/write-ups/[id]/route";
import * as safetyRoute from "@/app/api/write-ups/[id]/safety/route";
import * as submitRoute from "@/app/api/write-ups/[id]/submit/route";
import * as openRoute from "@/app/api/lab-sessions/[id]/write-up/route";
import * as sessionListRoute from "@/app/api/lab-sessions/[id]/write-ups/route";
import { scheduleLabSession } from "@/db/queries/lab-sessions";
import { createPractical, publishVersion, saveDraft } from "@/db/queries/practicals";
import { openWriteUp } from "@/db/queries/write-ups";
import type { Actor } from "@/lib/auth/actor";
import { labSessionSchema, type PracticalContent } from "@/lib/validation/practicals";
import { freshDatabase, makeClass, makeSchool, makeUser } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";
import { signInAs } from "../helpers/session";
import { apiRequest, call } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

const DAY = 86_400_000;

// Invented readings: volume of gas every 10 s. The mean rate from 0 to 30 s is
// (41 − 0) / 30 = 1.3667 cm³/s (worked by hand).
const READINGS = [0, 18, 31, 41, 48, 53, 56, 58];
const filledTable = (vol: (v: number, i: number) => string = (v) => String(v)) => ({ rows: READINGS.map((v, i) => ({ time: String(i * 10), vol: vol(v, i) })), decisions: {} });
const doc = (text: string) => ({ type: "doc", content: [{ type: "paragraph", content: [{ type: "text", text }] }] });

/** The helper practical with one check hiding the expected value until marking and one showing the verdict only. */
function practicalContent(): PracticalContent {
  const c = completePracticalContent();
  return { ...c, checks: c.checks.map((k) => (k.id === "k1" ? { ...k, show: "expected-after-marking" as const } : { ...k, show: "verdict" as const })) };
}

function publish(teacher: Actor) {
  const meta = { title: "Gas over time", topic: "Rates", yearGroup: 10, subject: "Chemistry" };
  const { versionId } = createPractical({ actor: teacher, input: meta });
  const { revision } = saveDraft({ actor: teacher, versionId, input: { ...meta, content: practicalContent(), revision: 0 } });
  publishVersion({ actor: teacher, versionId, revision });
  return versionId;
}

describe("write-up route handlers", () => {
  let teacher: Actor, student: Actor, classmate: Actor, outsider: Actor, sessionId: string, classId: string, versionId: string;

  beforeEach(() => {
    freshDatabase();
    const schoolId = makeSchool();
    teacher = makeUser(schoolId, ["teacher"]);
    student = makeUser(schoolId, ["student"], { name: "Wren Okonkwo-Hale" });
    classmate = makeUser(schoolId, ["student"]);
    outsider = makeUser(makeSchool(), ["student"]);
    classId = makeClass(schoolId, { teachers: [teacher], students: [student, classmate] });
    versionId = publish(teacher);
    const now = Date.now();
    sessionId = scheduleLabSession({
      actor: teacher,
      input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: new Date(now - DAY), dueAt: new Date(now + 7 * DAY), lateWork: "accept-flagged", lateDays: 7 }),
    });
  });

  const open = async (who: Actor, labSessionId = sessionId) => {
    signInAs(who);
    return call(openRoute.POST, apiRequest(`/api/lab-sessions/${labSessionId}/write-up`, "POST"), { id: labSessionId });
  };
  const get = (id: string) => call(writeUpRoute.GET, apiRequest(`/api/write-ups/${id}`), { id });
  const put = (id: string, body: unknown) => call(writeUpRoute.PUT, apiRequest(`/api/write-ups/${id}`, "PUT", body), { id });
  const putGroup = (id: string, body: unknown) => call(groupTablesRoute.PUT, apiRequest(`/api/write-ups/${id}/group-tables`, "PUT", body), { id });
  const safety = (id: string) => call(safetyRoute.POST, apiRequest(`/api/write-ups/${id}/safety`, "POST"), { id });
  const check = (id: string, checkId: string, answer: unknown) => call(checkRoute.POST, apiRequest(`/api/write-ups/${id}/checks/${checkId}`, "POST", { answer }), { id, checkId });
  const submit = (id: string, revision: number) => call(submitRoute.POST, apiRequest(`/api/write-ups/${id}/submit`, "POST", { revision }), { id });
  const reopen = (id: string) => call(reopenRoute.POST, apiRequest(`/api/write-ups/${id}/reopen`, "POST"), { id });

  it("opens the student's write-up, and the same one again on the next visit", async () => {
    const first = await open(student);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ access: "owner", canEdit: true, canSubmit: false, writeUp: { status: "draft", revision: 0, studentName: "Wren Okonkwo-Hale" } });
    expect((await open(student)).body.writeUp.id).toBe(first.body.writeUp.id);
    signInAs(teacher);
    expect((await call(openRoute.POST, apiRequest(`/api/lab-sessions/${sessionId}/write-up`, "POST"), { id: sessionId })).status).toBe(403);
  });

  it("two saves from one revision: one is stored, the other gets 409 with the saved version, and nothing is lost", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    const tabA = { ...view.writeUp.content, sections: { ...view.writeUp.content.sections, plan: doc("Tab A: read the syringe every 10 s.") }, tables: { t1: filledTable() } };
    const tabB = { ...view.writeUp.content, sections: { ...view.writeUp.content.sections, conclusion: doc("Tab B: the rate falls as the acid is used up.") } };
    const first = await put(id, { revision: 0, content: tabA });
    expect(first.status).toBe(200);
    expect(first.body.revision).toBe(1);
    expect(typeof first.body.updatedAt).toBe("string");

    const second = await put(id, { revision: 0, content: tabB });
    expect(second.status).toBe(409);
    expect(second.body.error.reason).toBe("stale");
    expect(second.body.error.current.revision).toBe(1);
    expect(second.body.error.current.content.sections.plan).toEqual(doc("Tab A: read the syringe every 10 s."));
    expect(second.body.error.current.content.tables.t1.rows).toHaveLength(READINGS.length);
    // Tab A's save is intact after the refusal.
    expect((await get(id)).body.writeUp.content.tables.t1.rows[3]).toEqual({ time: "30", vol: "41" });

    // "Keep mine" on tab B: saved on top of the current revision, by the student's choice.
    const kept = await put(id, { revision: second.body.error.current.revision, content: { ...second.body.error.current.content, sections: { ...second.body.error.current.content.sections, conclusion: tabB.sections.conclusion } } });
    expect(kept.status).toBe(200);
    expect(kept.body.revision).toBe(2);
    const after = (await get(id)).body.writeUp;
    expect(after.content.sections.plan).toEqual(tabA.sections.plan);
    expect(after.content.sections.conclusion).toEqual(tabB.sections.conclusion);
  });

  it("a save after handing in gets 409 locked, and nothing is stored", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    expect((await put(id, { revision: 0, content: { ...view.writeUp.content, tables: { t1: filledTable() } } })).status).toBe(200);
    const early = await submit(id, 1);
    expect(early.status).toBe(400);
    expect(early.body.error.message).toMatch(/safety/);
    expect((await safety(id)).status).toBe(200);
    const handedIn = await submit(id, 1);
    expect(handedIn.status).toBe(200);
    expect(handedIn.body).toMatchObject({ status: "submitted", late: false });

    const before = (await get(id)).body.writeUp;
    const late = await put(id, { revision: 1, content: { ...view.writeUp.content, sections: { ...view.writeUp.content.sections, evaluation: doc("Changed after handing in") } } });
    expect(late.status).toBe(409);
    expect(late.body.error.reason).toBe("locked");
    expect(late.body.error.message).toMatch(/locked/);
    expect((await check(id, "k1", { value: "1.37", unit: "cm³/s" })).body.error.reason).toBe("locked");
    const after = (await get(id)).body.writeUp;
    expect(after.revision).toBe(before.revision);
    expect(after.content).toEqual(before.content);
    expect(after).toMatchObject({ status: "submitted" });

    // The class's teacher reopens it; the student can save again, on the new revision.
    signInAs(teacher);
    expect((await reopen(id)).status).toBe(200);
    signInAs(student);
    const reopened = (await get(id)).body;
    expect(reopened).toMatchObject({ canEdit: true, writeUp: { status: "draft" } });
    expect((await put(id, { revision: reopened.writeUp.revision, content: reopened.writeUp.content })).status).toBe(200);
  });

  it("a student can never read or write another student's write-up through any route", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    const content = { ...view.writeUp.content, sections: { ...view.writeUp.content.sections, plan: doc("Not mine to write") } };
    for (const who of [classmate, outsider]) {
      signInAs(who);
      const answers = [
        await get(id),
        await put(id, { revision: 0, content }),
        await putGroup(id, { revision: 0, tables: {} }),
        await safety(id),
        await check(id, "k1", { value: "1", unit: "cm³/s" }),
        await submit(id, 0),
      ];
      expect(answers.map((a) => a.status)).toEqual([404, 404, 404, 404, 404, 404]);
      for (const a of answers) expect(a.text).not.toContain("Wren");
      // Reopening and the class list are for staff: refused by role before any write-up is looked up.
      expect((await reopen(id)).status).toBe(403);
      expect((await call(sessionListRoute.GET, apiRequest(`/api/lab-sessions/${sessionId}/write-ups`), { id: sessionId })).status).toBe(403);
    }
    signInAs(outsider);
    expect((await call(openRoute.POST, apiRequest(`/api/lab-sessions/${sessionId}/write-up`, "POST"), { id: sessionId })).status).toBe(404);
    signInAs(student);
    const mine = (await get(id)).body;
    expect(mine.writeUp.revision).toBe(0);
    expect(mine.writeUp.safetyAcknowledgedAt).toBeNull();
    expect(mine.checks).toEqual({});
  });

  it("the check answer never carries the expected value while it is hidden, nor the teacher's reasons", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    // A wrong answer, so the engine has a reason and a likely slip to tell the teacher.
    const content = { ...view.writeUp.content, tables: { t1: filledTable() }, answers: { k1: { value: "82", unit: "cm³/s", working: null } } };
    expect((await put(id, { revision: 0, content })).status).toBe(200);
    const res = await check(id, "k1", { value: "82", unit: "cm³/s" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ checkId: "k1", verdict: "disagrees", expected: null, stale: false });
    expect(res.body.hint).toEqual(expect.any(String));
    for (const secret of ["1.366", "1.367", "1.37", "41/30", "reason", "deviation", "likelySlip", "outcome"]) expect(res.text).not.toContain(secret);

    // "Verdict only": not even the hint.
    const k2 = await check(id, "k2", { value: "0.9", unit: "cm³/s", tangent: { x1: 0, y1: 12, x2: 40, y2: 48 } });
    expect(k2.status).toBe(200);
    expect(k2.body.hint).toBeNull();

    // Reading the write-up back: still nothing hidden, for the student; everything, for the teacher.
    const studentView = await get(id);
    expect(studentView.text).not.toMatch(/1\.36[67]|"outcome"|"reason"/);
    signInAs(teacher);
    const staffView = await get(id);
    expect(staffView.body.access).toBe("staff");
    expect(staffView.body.checks.k1.outcome.expected.value).toBeCloseTo(41 / 30, 8);
  });

  it("refuses rich text with script nodes, unknown node types or unsafe links (400), and stores nothing", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    const base = view.writeUp.content;
    const hostile = [
      { type: "doc", content: [{ type: "script", text: "alert(1)" }] },
      { type: "doc", content: [{ type: "paragraph", content: [{ type: "iframe", attrs: { src: "https://example.org" } }] }] },
      { type: "doc", content: [{ type: "paragraph", content: [{ type: "text", text: "click", marks: [{ type: "link", attrs: { href: "javascript:alert(1)" } }] }] }] },
      "<p onclick=alert(1)>hello</p>",
    ];
    for (const plan of hostile) {
      const res = await put(id, { revision: 0, content: { ...base, sections: { ...base.sections, plan } } });
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/does not allow|editor's format|Links must start/);
    }
    const working = await put(id, { revision: 0, content: { ...base, answers: { k1: { value: "1", unit: "", working: { type: "doc", content: [{ type: "img", attrs: { src: "x" } }] } } } } });
    expect(working.status).toBe(400);
    expect((await get(id)).body.writeUp.revision).toBe(0);

    // Text that looks like markup is only text: stored as typed, never as markup.
    const inert = await put(id, { revision: 0, content: { ...base, sections: { ...base.sections, plan: doc("<script>alert(1)</script>") } } });
    expect(inert.status).toBe(200);
    expect((await get(id)).body.writeUp.content.sections.plan).toEqual(doc("<script>alert(1)</script>"));
  });

  it("refuses a table of 61 rows (400) for the student's own and the group's tables", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    const rows = Array.from({ length: 61 }, (_, i) => ({ time: String(i * 10), vol: "1" }));
    const res = await put(id, { revision: 0, content: { ...view.writeUp.content, tables: { t1: { rows, decisions: {} } } } });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/at most 60 rows/);
    const group = await putGroup(id, { revision: 0, tables: { t1: { rows, decisions: {} } } });
    expect(group.status).toBe(400);
    const sixty = await put(id, { revision: 0, content: { ...view.writeUp.content, tables: { t1: { rows: rows.slice(0, 60), decisions: {} } } } });
    expect(sixty.status).toBe(200);
  });

  it("keeps text typed in number cells as typed; the check says it cannot check yet instead of failing", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    // Words where numbers belong in every reading up to 30 s: nothing the check can read.
    const table = filledTable((v, i) => (i === 0 ? "none yet" : i <= 3 ? `about ${v}` : String(v)));
    expect((await put(id, { revision: 0, content: { ...view.writeUp.content, tables: { t1: table }, answers: { k1: { value: "1.37", unit: "cm³/s", working: null } } } })).status).toBe(200);
    const stored = (await get(id)).body.writeUp.content.tables.t1.rows;
    expect(stored[0]).toEqual({ time: "0", vol: "none yet" });
    expect(stored[3]).toEqual({ time: "30", vol: "about 41" });
    const res = await check(id, "k1", { value: "1.37", unit: "cm³/s" });
    expect(res.status).toBe(200);
    expect(res.body.verdict).toBe("cannot-check");
    expect(res.body.hint).toEqual(expect.any(String));
    // A malformed answer is a clear 400, not a failure.
    const bad = await check(id, "k1", { value: "x".repeat(41), unit: "" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/at most 40/);
  });

  it("a check goes stale when the data change, and fresh again when it is run again", async () => {
    const { body: view } = await open(student);
    const id = view.writeUp.id;
    const content = { ...view.writeUp.content, tables: { t1: filledTable() }, answers: { k1: { value: "1.37", unit: "cm³/s", working: null } } };
    await put(id, { revision: 0, content });
    expect((await check(id, "k1", { value: "1.37", unit: "cm³/s" })).body.verdict).toBe("agrees");
    await put(id, { revision: 1, content: { ...content, tables: { t1: filledTable((v, i) => (i === 3 ? "44" : String(v))) } } });
    expect((await get(id)).body.checks.k1.stale).toBe(true);
    await check(id, "k1", { value: "1.37", unit: "cm³/s" });
    expect((await get(id)).body.checks.k1.stale).toBe(false);
  });

  it("late work: handed in within the late window is marked late; after it, saving says the session has closed", async () => {
    const now = Date.now();
    const lateSession = scheduleLabSession({
      actor: teacher,
      input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: new Date(now - 5 * DAY), dueAt: new Date(now - DAY), lateWork: "accept-flagged", lateDays: 3 }),
    });
    const { body: view } = await open(student, lateSession);
    expect(view.labSession.state).toBe("late");
    await safety(view.writeUp.id);
    expect((await submit(view.writeUp.id, 0)).body).toMatchObject({ status: "submitted", late: true });

    const closedSession = scheduleLabSession({
      actor: teacher,
      input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: new Date(now - 20 * DAY), dueAt: new Date(now - 15 * DAY), lateWork: "accept-flagged", lateDays: 3 }),
    });
    // Started while the session was open, then left until after the late window.
    const started = openWriteUp({ actor: classmate, labSessionId: closedSession, now: new Date(now - 16 * DAY) });
    signInAs(classmate);
    const res = await put(started.writeUp.id, { revision: 0, content: started.writeUp.content });
    expect(res.status).toBe(409);
    expect(res.body.error.reason).toBe("closed");
    expect((await get(started.writeUp.id)).body.canEdit).toBe(false);
  });

  it("group tables: two members saving from one revision get 409 with the group's saved tables", async () => {
    const now = Date.now();
    const groupSession = scheduleLabSession({
      actor: teacher,
      input: labSessionSchema.parse({
        classId,
        practicalVersionId: versionId,
        opensAt: new Date(now - DAY),
        dueAt: new Date(now + DAY),
        grouping: "groups",
        groups: [{ id: "g1", name: "Bench 4", studentIds: [student.userId, classmate.userId] }],
      }),
    });
    const a = (await open(student, groupSession)).body;
    const b = (await open(classmate, groupSession)).body;
    expect(a.group).toMatchObject({ name: "Bench 4", revision: 0 });
    signInAs(student);
    expect((await putGroup(a.writeUp.id, { revision: 0, tables: { t1: filledTable() } })).body.revision).toBe(1);
    signInAs(classmate);
    const clash = await putGroup(b.writeUp.id, { revision: 0, tables: { t1: { rows: [{ time: "0", vol: "2" }], decisions: {} } } });
    expect(clash.status).toBe(409);
    expect(clash.body.error).toMatchObject({ reason: "stale", current: { revision: 1, tables: { t1: { rows: expect.arrayContaining([{ time: "30", vol: "41" }]) } } } });
    expect((await get(b.writeUp.id)).body.tables.t1.rows).toHaveLength(READINGS.length);
  });

  it("the class's teacher sees every student's write-up state; reopening needs a handed-in write-up", async () => {
    const { body: view } = await open(student);
    signInAs(teacher);
    const list = await call(sessionListRoute.GET, apiRequest(`/api/lab-sessions/${sessionId}/write-ups`), { id: sessionId });
    expect(list.status).toBe(200);
    expect(list.body).toHaveLength(2);
    expect(list.body.find((r: { studentId: string }) => r.studentId === student.userId)).toMatchObject({ writeUpId: view.writeUp.id, status: "draft" });
    expect(list.body.find((r: { studentId: string }) => r.studentId === classmate.userId)).toMatchObject({ writeUpId: null, status: "not-started" });
    const notYet = await reopen(view.writeUp.id);
    expect(notYet.status).toBe(409);
    expect(notYet.body.error.message).toMatch(/already open/);
  });
});

import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { and, eq, inArray } from "drizzle-orm";
import Papa from "papaparse";
import { PDFParse } from "pdf-parse";
import * as childrenRoute from "@/app/api/me/children/route";
import * as classProgressRoute from "@/app/api/class-progress/[id]/route";
import * as sendReportsRoute from "@/app/api/class-progress/[id]/send-reports/route";
import * as progressRoute from "@/app/api/students/[id]/progress/route";
import * as pdfRoute from "@/app/api/students/[id]/report-pdf/route";
import { loadActor } from "@/db/queries/users";
import { classStudents, labSessions, marks, parentLinks, practicalVersions, userRoles, users, writeUps } from "@/db/schema";
import { seedDemoSchool, type SeedResult } from "@/db/seed/index";
import type { Actor } from "@/lib/auth/actor";
import { auditEntries, freshDatabase, makeSchool, makeUser, testDb } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call, rowCount } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

// The handlers use the clock; fixing it (and only it) keeps the term and the lab-session states the
// same whatever day the suite runs. The demo school is seeded relative to the same moment.
const NOW = new Date("2026-12-01T10:00:00Z");
const GUESSED_ID = "3f1c9b2e-7a41-4d5e-9c0b-2f6e8a1d4b77";
const NOT_HANDED_BACK = "Feedback written but not handed back yet: keep it from the family.";

let seed: SeedResult;
const id = (key: string) => seed.userIds.get(key)!;
const actor = (key: string): Actor => loadActor(id(key))!;

const progress = (studentId: string) => call(progressRoute.GET, apiRequest(`/api/students/${studentId}/progress`), { id: studentId });
async function pdf(studentId: string) {
  const res = await pdfRoute.GET(apiRequest(`/api/students/${studentId}/report-pdf`), { params: Promise.resolve({ id: studentId }) });
  return { status: res.status, type: res.headers.get("content-type"), disposition: res.headers.get("content-disposition"), bytes: new Uint8Array(await res.arrayBuffer()) };
}
const classProgress = (classId: string, query = "") => classProgressRoute.GET(apiRequest(`/api/class-progress/${classId}${query}`), { params: Promise.resolve({ id: classId }) });
const sendReports = (classId: string, headers: Record<string, string> = {}) => call(sendReportsRoute.POST, apiRequest(`/api/class-progress/${classId}/send-reports`, "POST", undefined, headers), { id: classId });

/** Every student of the demo school. */
function studentIds(): string[] {
  return testDb()
    .select({ id: users.id })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "student")))
    .where(eq(users.schoolId, seed.schoolId))
    .all()
    .map((r) => r.id);
}

beforeAll(async () => {
  vi.useFakeTimers({ toFake: ["Date"] });
  vi.setSystemTime(NOW);
  const { db } = freshDatabase();
  seed = await seedDemoSchool(db, { now: NOW });
  // Ellis's open magnesium write-up is marked, but the teacher has not handed it back.
  const draft = db
    .select({ id: writeUps.id })
    .from(writeUps)
    .where(and(eq(writeUps.studentId, id("student")), eq(writeUps.labSessionId, seed.labSessionIds.get("10C-mg")!)))
    .get()!;
  db.update(writeUps).set({ status: "marked" }).where(eq(writeUps.id, draft.id)).run();
  db.insert(marks)
    .values({ schoolId: seed.schoolId, writeUpId: draft.id, markerId: id("teacher"), criteria: {}, feedback: NOT_HANDED_BACK, total: 7, maxTotal: 8, markedAt: NOW, returnedAt: null })
    .run();
}, 120_000);
afterAll(() => {
  vi.useRealTimers();
});

describe("a parent reaches only their own children", () => {
  it("lists exactly the linked children, without calculation checks", async () => {
    signInAs(actor("parent"));
    const res = await call(childrenRoute.GET, apiRequest("/api/me/children"));
    expect(res.status).toBe(200);
    const linked = testDb().select({ id: parentLinks.studentId }).from(parentLinks).where(eq(parentLinks.parentId, id("parent"))).all().map((r) => r.id);
    expect(res.body.children.map((c: { student: { id: string } }) => c.student.id).sort()).toEqual([...linked].sort());
    expect(res.body.children.map((c: { student: { name: string } }) => c.student.name).sort()).toEqual(["Ellis Marchetti", "Noor Marchetti"]);
    for (const c of res.body.children) expect(c.checkHistory).toBeNull();
  });

  it("gets 404 for every other student in the school, by progress and by PDF, and for guessed ids", async () => {
    signInAs(actor("parent"));
    const mine = new Set([id("student"), id("sibling")]);
    const others = studentIds().filter((s) => !mine.has(s));
    expect(others.length).toBeGreaterThan(50);
    for (const s of others) {
      const res = await progress(s);
      expect(res.status, `progress of ${s}`).toBe(404);
      expect(res.text).not.toMatch(/returned|feedback/);
    }
    for (const s of others.slice(0, 12)) expect((await pdf(s)).status, `PDF of ${s}`).toBe(404);
    for (const guess of [GUESSED_ID, "1", "../students", id("teacher"), id("admin")]) {
      expect((await progress(guess)).status, `progress of ${guess}`).toBe(404);
      expect((await pdf(guess)).status, `PDF of ${guess}`).toBe(404);
    }
  }, 60_000);

  it("gets 404 for a student of another school even with the student's real id", async () => {
    const outsider = makeUser(makeSchool(), ["parent"]);
    signInAs(outsider);
    expect((await progress(id("student"))).status).toBe(404);
    expect((await pdf(id("student"))).status).toBe(404);
  });

  it("is refused class progress and sending reports", async () => {
    signInAs(actor("parent"));
    expect((await classProgress(seed.classIds.get("10C")!)).status).toBe(403);
    expect((await sendReports(seed.classIds.get("10C")!)).status).toBe(403);
  });
});

describe("a student sees only their own report", () => {
  it("opens their own progress with their calculation-check history", async () => {
    signInAs(actor("student"));
    const res = await progress(id("student"));
    expect(res.status).toBe(200);
    expect(res.body.student.name).toBe("Ellis Marchetti");
    expect(res.body.checkHistory.kinds.length).toBeGreaterThan(0);
  });

  it("gets 404 for a classmate's, a sibling's and a guessed report, as data and as PDF", async () => {
    signInAs(actor("student"));
    const classmate = testDb()
      .select({ id: classStudents.studentId })
      .from(classStudents)
      .where(eq(classStudents.classId, seed.classIds.get("10C")!))
      .all()
      .find((r) => r.id !== id("student"))!.id;
    for (const other of [classmate, id("sibling"), GUESSED_ID]) {
      expect((await progress(other)).status).toBe(404);
      expect((await pdf(other)).status).toBe(404);
    }
  });
});

describe("only marked work that has been handed back appears", () => {
  it("leaves out work that is marked but not handed back, and every listed piece is returned", async () => {
    signInAs(actor("parent"));
    const res = await progress(id("student"));
    expect(res.status).toBe(200);
    expect(res.text).not.toContain(NOT_HANDED_BACK);
    const listed: string[] = res.body.returned.map((w: { writeUpId: string }) => w.writeUpId);
    expect(listed.length).toBeGreaterThan(0);
    const statuses = testDb().select({ status: writeUps.status }).from(writeUps).where(inArray(writeUps.id, listed)).all();
    expect(statuses.map((s) => s.status)).toEqual(listed.map(() => "returned"));
  });
});

describe("the term report PDF", () => {
  it("downloads as application/pdf with the student's name and figures worked out from their marks, and nothing unreturned", async () => {
    signInAs(actor("parent"));
    const res = await pdf(id("student"));
    expect(res.status).toBe(200);
    expect(res.type).toBe("application/pdf");
    expect(res.disposition).toMatch(/^attachment; filename="progress-report-Ellis-Marchetti-autumn-term-2026\.pdf"$/);
    expect(Buffer.from(res.bytes.subarray(0, 5)).toString()).toBe("%PDF-");
    const text = (await new PDFParse({ data: res.bytes }).getText()).text;
    expect(text).toContain("Ellis Marchetti");
    expect(text).not.toContain(NOT_HANDED_BACK);

    // The figures, worked out here from the stored marks and the rubric, not from the report code.
    const returned = testDb()
      .select({ criteria: marks.criteria, total: marks.total, adjusted: marks.adjustedTotal, maxTotal: marks.maxTotal, content: practicalVersions.content, title: practicalVersions.title })
      .from(marks)
      .innerJoin(writeUps, eq(writeUps.id, marks.writeUpId))
      .innerJoin(practicalVersions, eq(practicalVersions.id, writeUps.practicalVersionId))
      .where(and(eq(writeUps.studentId, id("student")), eq(writeUps.status, "returned")))
      .all();
    expect(returned).toHaveLength(1);
    const w = returned[0]!;
    const rubric = w.content.rubric!.criteria;
    const sum = rubric.reduce((s, c) => s + (w.criteria[c.id]?.marks ?? 0), 0);
    expect(sum).toBe(w.total);
    expect(text).toContain(`${w.title}: ${w.adjusted ?? w.total} out of ${w.maxTotal}`);
    for (const c of rubric) {
      const max = Math.max(...c.levels.map((l) => l.marks));
      const got = w.criteria[c.id]!.marks;
      const level = c.levels.find((l) => l.id === w.criteria[c.id]!.levelId)!.label;
      expect(text).toContain(`${c.title}: ${level} (${got}/${max})`);
      // One practical so far, so each skill's average is this practical's share of its marks.
      expect(text).toContain(`${Math.round((100 * got) / max)} % on average`);
    }
  }, 60_000);

  it("is there for the student and their teacher, not for another teacher", async () => {
    signInAs(actor("student"));
    expect((await pdf(id("student"))).status).toBe(200);
    signInAs(actor("teacher"));
    expect((await pdf(id("student"))).status).toBe(200);
    signInAs(actor("physics"));
    expect((await pdf(id("student"))).status).toBe(404);
  }, 60_000);
});

describe("class progress", () => {
  it("exports CSV with formula-like cells escaped", async () => {
    const classId = seed.classIds.get("10C")!;
    const pupils = testDb().select({ id: classStudents.studentId }).from(classStudents).where(eq(classStudents.classId, classId)).all();
    const hostile = ["=HYPERLINK(\"https://example.invalid\",\"x\")", "+SUM(A1:A9)", "-2+3", "@cmd"];
    hostile.forEach((name, i) => testDb().update(users).set({ name }).where(eq(users.id, pupils[i + 1]!.id)).run());
    // A title that looks like a formula reaches the "not handed in" column too.
    testDb().update(practicalVersions).set({ title: "=1+1 chips" }).where(eq(practicalVersions.id, seed.practicalVersionIds.get("chips")!)).run();
    try {
      signInAs(actor("teacher"));
      const res = await classProgress(classId, "?format=csv");
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
      expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="progress-10C-Chemistry\.csv"$/);
      const parsed = Papa.parse<string[]>((await res.text()).replace(/^\uFEFF/, ""), { skipEmptyLines: true });
      const [header, ...rows] = parsed.data;
      expect(header).toEqual(["Student", "Handed in", "Due", "Not handed in", "Average mark (%)", "Calculations to practise", "Most common slip"]);
      expect(rows).toHaveLength(pupils.length);
      for (const name of hostile) expect(rows.map((r) => r[0])).toContain(`'${name}`);
      for (const r of rows) for (const cell of r) expect(cell, `cell ${cell}`).not.toMatch(/^[=+\-@]/);
      expect(rows.some((r) => r[3] === "'=1+1 chips")).toBe(true);
    } finally {
      pupils.slice(1, 5).forEach((p, i) => testDb().update(users).set({ name: `Renamed pupil ${i}` }).where(eq(users.id, p.id)).run());
      testDb().update(practicalVersions).set({ title: "Marble chips and powder: mass lost over time" }).where(eq(practicalVersions.id, seed.practicalVersionIds.get("chips")!)).run();
    }
  });

  it("shows the class to its teacher and refuses another teacher (403) and a student (403)", async () => {
    const classId = seed.classIds.get("10C")!;
    signInAs(actor("teacher"));
    const res = await classProgress(classId);
    expect(res.status).toBe(200);
    const body = await res.json();
    const pastDue = testDb().select({ id: labSessions.id, dueAt: labSessions.dueAt }).from(labSessions).where(eq(labSessions.classId, classId)).all().filter((s) => s.dueAt < NOW);
    expect(body.rows.length).toBe(testDb().select({ id: classStudents.studentId }).from(classStudents).where(eq(classStudents.classId, classId)).all().length);
    expect(body.sessions.map((s: { id: string }) => s.id).sort()).toEqual(pastDue.map((s) => s.id).sort());
    signInAs(actor("physics"));
    expect((await classProgress(classId)).status).toBe(403);
    expect((await classProgress(classId, "?format=csv")).status).toBe(403);
    signInAs(actor("student"));
    expect((await classProgress(classId)).status).toBe(403);
  });

  it("refuses sending term reports to a teacher of another class (403), to another school (404) and from another site (403), sending nothing", async () => {
    const classId = seed.classIds.get("10C")!;
    signInAs(actor("physics"));
    const other = await sendReports(classId);
    expect(other.status).toBe(403);
    expect(other.body.error.message).toMatch(/not one of yours/);
    signInAs(makeUser(makeSchool(), ["admin"]));
    expect((await sendReports(classId)).status).toBe(404);
    signInAs(actor("teacher"));
    expect((await sendReports(classId, { origin: "https://elsewhere.example" })).status).toBe(403);
    expect((await sendReports(GUESSED_ID)).status).toBe(404);
    expect(rowCount("mail_messages")).toBe(0);
    expect(auditEntries(classId).filter((a) => a.action === "progress.email-reports")).toEqual([]);
  });
});

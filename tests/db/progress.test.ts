import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { PDFParse } from "pdf-parse";
import { mailMessages, writeUps } from "@/db/schema";
import { loadActor } from "@/db/queries/users";
import { classProgressCsv, emailTermReports, getClassProgress, getStudentProgress, listChildrenProgress, termReportFor } from "@/db/queries/progress";
import { seedDemoSchool, type SeedResult } from "@/db/seed/index";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { freshDatabase, makeSchool, makeUser, testDb } from "../helpers/db";

const now = new Date("2026-12-01T10:00:00Z");
let seed: SeedResult;
let smtp: { close: () => Promise<void> };
const actor = (key: string): Actor => loadActor(seed.userIds.get(key)!)!;

function caught(fn: () => unknown): AppError {
  try {
    fn();
  } catch (e) {
    return e as AppError;
  }
  throw new Error("expected an error");
}

beforeAll(async () => {
  const { db } = freshDatabase();
  seed = await seedDemoSchool(db, { now });
  smtp = await startFakeSmtp(0);
}, 60_000);
afterAll(() => smtp.close());

describe("progress reports", () => {
  it("a parent sees only their own children, and only returned work", () => {
    const children = listChildrenProgress({ actor: actor("parent"), now });
    expect(children.map((c) => c.student.name).sort()).toEqual(["Ellis Marchetti", "Noor Marchetti"]);
    const ellis = children.find((c) => c.student.name === "Ellis Marchetti")!;
    const statuses = testDb().select({ id: writeUps.id, status: writeUps.status }).from(writeUps).all();
    for (const w of ellis.returned) expect(statuses.find((s) => s.id === w.writeUpId)!.status).toBe("returned");
    expect(ellis.returned.length).toBe(1);
    expect(ellis.checkHistory).toBeNull();
  });

  it("refuses every other child, by guessed id, with 404", () => {
    const parent = actor("parent");
    const otherStudent = [...seed.userIds.entries()].find(([k]) => k === "s3")![1];
    expect(caught(() => getStudentProgress({ actor: parent, studentId: otherStudent, now })).code).toBe("not_found");
    expect(caught(() => getStudentProgress({ actor: parent, studentId: "00000000-0000-0000-0000-000000000000", now })).code).toBe("not_found");
    const outsider = makeUser(makeSchool(), ["parent"]);
    expect(caught(() => getStudentProgress({ actor: outsider, studentId: seed.userIds.get("student")!, now })).code).toBe("not_found");
  });

  it("gives the student their calculation-check history", () => {
    const p = getStudentProgress({ actor: actor("student"), studentId: seed.userIds.get("student")!, now });
    expect(p.checkHistory!.kinds.length).toBeGreaterThan(0);
    expect(p.coming.some((c) => c.state === "open")).toBe(true);
  });

  it("shows a class's progress to its teacher, with a CSV, and not to other teachers", () => {
    const p = getClassProgress({ actor: actor("teacher"), classId: seed.classIds.get("10C")!, now });
    expect(p.rows.length).toBe(24);
    expect(p.rows.some((r) => r.notHandedIn.length > 0)).toBe(true);
    expect(classProgressCsv({ actor: actor("teacher"), classId: seed.classIds.get("10C")!, now }).csv.split("\n")[0]).toContain("Not handed in");
    expect(caught(() => getClassProgress({ actor: actor("physics"), classId: seed.classIds.get("10C")!, now })).code).toBe("forbidden");
  });

  it("makes a valid PDF whose text has the student's name and figures", async () => {
    await termReportFor({ actor: actor("parent"), studentId: seed.userIds.get("student")!, now });
    const { pdf, filename } = await termReportFor({ actor: actor("parent"), studentId: seed.userIds.get("student")!, now });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(filename).toMatch(/\.pdf$/);
    const text = (await new PDFParse({ data: new Uint8Array(pdf) }).getText()).text;
    expect(text).toContain("Ellis Marchetti");
    const p = getStudentProgress({ actor: actor("parent"), studentId: seed.userIds.get("student")!, now });
    const w = p.returned[0]!;
    expect(text).toContain(`${w.title}: ${w.total} out of ${w.maxTotal}`);
  }, 30_000);

  it("e-mails each family the term report with the PDF attached, skipping parents who turned e-mails off", async () => {
    const res = await emailTermReports({ actor: actor("teacher"), classId: seed.classIds.get("10C")!, now });
    expect(res.sent).toBeGreaterThan(0);
    await new Promise((r) => setTimeout(r, 500));
    const mail = testDb().select().from(mailMessages).where(eq(mailMessages.to, "parent@cobalt-lane.example")).all().find((m) => /practical report/.test(m.subject))!;
    expect(mail.attachments[0]).toMatchObject({ contentType: "application/pdf" });
    expect(mail.attachments[0]!.filename).toMatch(/ellis-marchetti/i);
  }, 60_000);
});

import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { and, eq } from "drizzle-orm";
import { previewToken } from "@/db/queries/invitations";
import { classStudents, parentLinks, userRoles, users } from "@/db/schema";
import { setFakeSmtpPort, fakeSmtpPort } from "@/lib/dev/fake-smtp-state";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import type { Actor } from "@/lib/auth/actor";
import * as roster from "@/app/api/classes/[id]/roster/route";
import { auditEntries, freshDatabase, linkParentDirect, makeClass, makeSchool, makeUser, testDb } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call, caughtMail, expectNoSecrets, linkIn, writeCounts } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

let smtp: { close: () => Promise<void> };
beforeAll(async () => {
  smtp = await startFakeSmtp(0);
});
afterAll(async () => {
  await smtp.close();
});

const HEADER = "name,email,year group,parent name,parent email,relationship";

describe("POST /api/classes/[id]/roster", () => {
  let schoolId: string;
  let admin: Actor;
  let classId: string;
  const post = (body: unknown) => call(roster.POST, apiRequest(`/api/classes/${classId}/roster`, "POST", body), { id: classId });

  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"]);
    classId = makeClass(schoolId, { name: "10C Chemistry" });
    signInAs(admin);
  });

  /** Commits the file, expects the whole file refused with the preview, and that nothing changed. */
  async function expectRefused(csv: string) {
    const before = writeCounts();
    const res = await post({ csv, commit: true, sendInvitations: true });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/Nothing was imported|column|Line|file/i);
    expect(res.body.error.preview).toBeDefined();
    expect(writeCounts()).toEqual(before);
    return res.body.error.preview as { fileErrors: string[]; rows: { line: number; errors: string[] }[] };
  }

  it("previews row by row without writing anything", async () => {
    const existing = makeUser(schoolId, ["student"], { name: "Noor Castellane", email: "noor@test.example" });
    const inClass = makeUser(schoolId, ["student"], { name: "Jasper Ulverston", email: "jasper@test.example" });
    const parent = makeUser(schoolId, ["parent"], { name: "Inka Castellane", email: "inka@test.example" });
    linkParentDirect(parent, existing);
    testDb().insert(classStudents).values({ classId, studentId: inClass.userId }).run();
    const csv = [
      HEADER,
      "Cosmo Brackenridge,cosmo@test.example,10,Paloma Brackenridge,paloma@test.example,Mother",
      "Noor Castellane,NOOR@test.example,10,Inka Castellane,inka@test.example,Mother",
      "Jasper Ulverston,jasper@test.example,10,Inka Castellane,inka@test.example,Aunt",
    ].join("\n");
    const before = writeCounts();
    const res = await post({ csv, commit: false });
    expect(res.status).toBe(200);
    expect(writeCounts()).toEqual(before);
    const { rows, summary, fileErrors } = res.body.preview;
    expect(fileErrors).toEqual([]);
    expect(rows.map((r: { student: string; parent: string }) => [r.student, r.parent])).toEqual([
      ["new", "new"],
      ["existing", "already-linked"],
      ["already-in-class", "existing"],
    ]);
    expect(summary).toMatchObject({ rows: 3, withErrors: 0, newStudents: 1, existingStudents: 2, newParents: 1 });
  });

  it("refuses a malformed CSV (an unclosed quote)", async () => {
    const preview = await expectRefused(`${HEADER}\n"Ellis Marchetti,ellis@test.example,10\nKit Ashdown,kit@test.example,10`);
    expect(preview.fileErrors.join(" ")).toMatch(/quote/i);
  });

  it("refuses a row with the wrong number of columns", async () => {
    const preview = await expectRefused(`name,email,year group\nKit Ashdown,kit@test.example,10\nWren Haverford,wren@test.example,10,extra,more`);
    expect(preview.fileErrors.join(" ")).toMatch(/Line 3/);
  });

  it("refuses a file without the e-mail column", async () => {
    const preview = await expectRefused("name,year group\nKit Ashdown,10");
    expect(preview.fileErrors[0]).toMatch(/no “email” column/);
  });

  it("refuses a file with only a header line", async () => {
    const preview = await expectRefused(`${HEADER}\n`);
    expect(preview.fileErrors[0]).toMatch(/no students/);
  });

  it("refuses the whole file when one e-mail appears twice in it", async () => {
    const preview = await expectRefused(`${HEADER}\nKit Ashdown,kit@test.example,10,,,\nWren Haverford,wren@test.example,10,,,\nKit Ashdown Again,KIT@test.example,10,,,`);
    expect(preview.rows[2]!.errors.join(" ")).toMatch(/also on line 2/);
    expect(preview.rows[0]!.errors).toEqual([]);
  });

  it("refuses an e-mail that belongs to an account in another school", async () => {
    makeUser(makeSchool(), ["student"], { email: "elsewhere@test.example" });
    const preview = await expectRefused(`${HEADER}\nKit Ashdown,kit@test.example,10,,,\nIlse Zeller,elsewhere@test.example,10,,,`);
    expect(preview.rows[1]!.errors.join(" ")).toMatch(/another account/);
  });

  it("refuses a student e-mail that belongs to a staff account", async () => {
    makeUser(schoolId, ["teacher"], { email: "staff@test.example" });
    const preview = await expectRefused(`${HEADER}\nKit Ashdown,kit@test.example,10,,,\nStaff Member,staff@test.example,10,,,`);
    expect(preview.rows[1]!.errors.join(" ")).toMatch(/staff or parent account/);
  });

  it("refuses a parent e-mail that belongs to a staff account", async () => {
    makeUser(schoolId, ["teacher"], { email: "staff@test.example" });
    const preview = await expectRefused(`${HEADER}\nKit Ashdown,kit@test.example,10,Tariq Ashdown,staff@test.example,Father`);
    expect(preview.rows[0]!.errors.join(" ")).toMatch(/not a parent/);
  });

  it("refuses over-long fields", async () => {
    const preview = await expectRefused(`${HEADER}\n${"N".repeat(121)},kit@test.example,10,,,\nWren Haverford,wren@test.example,10,Runa Haverford,runa@test.example,${"R".repeat(41)}`);
    expect(preview.rows[0]!.errors.join(" ")).toMatch(/Name: A name can be at most 120/);
    expect(preview.rows[1]!.errors.join(" ")).toMatch(/Relationship: Keep the relationship short/);
  });

  it("refuses an unknown year group", async () => {
    const preview = await expectRefused(`${HEADER}\nKit Ashdown,kit@test.example,14,,,\nWren Haverford,wren@test.example,Year Ten,,,`);
    expect(preview.rows[0]!.errors.join(" ")).toMatch(/Year group must be a whole number from 1 to 13/);
    expect(preview.rows[1]!.errors.join(" ")).toMatch(/Year group/);
  });

  it("refuses a parent given with an e-mail but no name", async () => {
    const preview = await expectRefused(`${HEADER}\nKit Ashdown,kit@test.example,10,,parent@test.example,`);
    expect(preview.rows[0]!.errors.join(" ")).toMatch(/give the parent's name/);
  });

  it("refuses a file over the size limit with 413, and an empty one with 400", async () => {
    const big = `${HEADER}\n${"Kit Ashdown,kit@test.example,10,,,\n".repeat(16_000)}`;
    const before = writeCounts();
    const res = await post({ csv: big, commit: true });
    expect(res.status).toBe(413);
    expect(writeCounts()).toEqual(before);
    const empty = await post({ csv: "", commit: false });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fieldErrors.csv[0]).toMatch(/empty/);
    const wrongType = await post({ csv: 42 });
    expect(wrongType.status).toBe(400);
    expect(wrongType.body.error.fieldErrors.csv).toBeDefined();
  });

  it("imports a good roster: creates students and parents, links them, enrols, and invites the new people", async () => {
    const existing = makeUser(schoolId, ["student"], { name: "Noor Castellane", email: "noor@test.example", passwordHash: "$argon2id$v=19$fake" });
    const csv = [
      HEADER,
      "Cosmo Brackenridge,cosmo@test.example,10,Paloma Brackenridge,paloma@test.example,Mother",
      "Ottilie Brackenridge,ottilie@test.example,10,Paloma Brackenridge,paloma@test.example,Mother",
      "Noor Castellane,noor@test.example,10,Anselm Castellane,anselm@test.example,Guardian",
      "Hamish Yilmaz-Grant,hamish@test.example,,,,",
    ].join("\r\n");
    const res = await post({ csv, commit: true, sendInvitations: true });
    expect(res.status).toBe(200);
    expectNoSecrets(res.text);
    expect(res.body.imported.rows).toBe(4);
    expect(res.body.imported.enrolled).toBe(4);
    const created = res.body.imported.created as { name: string; email: string; roles: string[] }[];
    expect(created.map((p) => p.email).sort()).toEqual(["anselm@test.example", "cosmo@test.example", "hamish@test.example", "ottilie@test.example", "paloma@test.example"]);
    expect(created.find((p) => p.email === "paloma@test.example")!.roles).toEqual(["parent"]);
    expect(res.body.invitations).toEqual({ requested: true, sent: 5, failed: [] });

    const db = testDb();
    const idOf = (email: string) => db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()!.id;
    const enrolled = db.select({ id: classStudents.studentId }).from(classStudents).where(eq(classStudents.classId, classId)).all().map((r) => r.id);
    expect(enrolled.sort()).toEqual([idOf("cosmo@test.example"), idOf("ottilie@test.example"), existing.userId, idOf("hamish@test.example")].sort());
    const paloma = idOf("paloma@test.example");
    const links = db.select().from(parentLinks).where(eq(parentLinks.parentId, paloma)).all();
    expect(links.map((l) => [l.studentId, l.relationship]).sort()).toEqual([[idOf("cosmo@test.example"), "Mother"], [idOf("ottilie@test.example"), "Mother"]].sort());
    expect(db.select().from(parentLinks).where(and(eq(parentLinks.parentId, idOf("anselm@test.example")), eq(parentLinks.studentId, existing.userId))).get()?.relationship).toBe("Guardian");
    expect(db.select().from(userRoles).where(eq(userRoles.userId, idOf("hamish@test.example"))).all().map((r) => r.role)).toEqual(["student"]);
    expect(db.select({ y: users.yearGroup }).from(users).where(eq(users.id, idOf("cosmo@test.example"))).get()!.y).toBe(10);

    const mail = caughtMail();
    expect(mail.map((m) => m.to).sort()).toEqual(created.map((p) => p.email).sort());
    for (const m of mail) {
      const token = new URL(linkIn(m.text)).searchParams.get("token")!;
      expect(previewToken({ token, kind: "invitation" })).toMatchObject({ ok: true, email: m.to });
      expect(res.text).not.toContain(token);
    }
    expect(auditEntries(classId).map((a) => a.action)).toContain("roster.import");
  });

  it("imports without invitations when asked not to send them", async () => {
    const res = await post({ csv: `${HEADER}\nKit Ashdown,kit@test.example,10,,,`, commit: true, sendInvitations: false });
    expect(res.status).toBe(200);
    expect(res.body.invitations).toEqual({ requested: false, sent: 0, failed: [] });
    expect(caughtMail()).toHaveLength(0);
  });

  it("keeps the import when the mail server is down, and names the people who were not invited", async () => {
    const working = fakeSmtpPort();
    const closed = await startFakeSmtp(0);
    await closed.close();
    setFakeSmtpPort(closed.port);
    const quiet = vi.spyOn(console, "error").mockImplementation(() => {});
    try {
      const res = await post({ csv: `${HEADER}\nKit Ashdown,kit@test.example,10,,,\nWren Haverford,wren@test.example,10,,,`, commit: true, sendInvitations: true });
      expect(res.status).toBe(200);
      expect(res.body.imported.created).toHaveLength(2);
      expect(res.body.invitations.sent).toBe(0);
      expect(res.body.invitations.failed.map((f: { email: string }) => f.email).sort()).toEqual(["kit@test.example", "wren@test.example"]);
      expect(res.body.invitations.failed[0].message).toMatch(/could not be sent/);
      expect(testDb().select().from(classStudents).where(eq(classStudents.classId, classId)).all()).toHaveLength(2);
    } finally {
      quiet.mockRestore();
      setFakeSmtpPort(working);
    }
  });

  it("importing the same file twice adds nobody new the second time", async () => {
    const csv = `${HEADER}\nKit Ashdown,kit@test.example,10,Runa Ashdown,runa@test.example,Mother`;
    expect((await post({ csv, commit: true, sendInvitations: false })).status).toBe(200);
    const before = writeCounts();
    const again = await post({ csv, commit: true, sendInvitations: true });
    expect(again.status).toBe(200);
    expect(again.body.imported).toMatchObject({ rows: 1, enrolled: 0, created: [] });
    expect(again.body.invitations.sent).toBe(0);
    expect(writeCounts().users).toBe(before.users);
    expect(writeCounts().parent_links).toBe(before.parent_links);
  });
});

import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { previewToken } from "@/db/queries/invitations";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import type { Actor } from "@/lib/auth/actor";
import * as audit from "@/app/api/audit/route";
import * as classItem from "@/app/api/classes/[id]/route";
import * as classList from "@/app/api/classes/route";
import * as outbox from "@/app/api/outbox/route";
import * as picker from "@/app/api/people-picker/route";
import * as invitation from "@/app/api/users/[id]/invitation/route";
import * as person from "@/app/api/users/[id]/route";
import * as people from "@/app/api/users/route";
import { freshDatabase, makeClass, makeSchool, makeUser, linkParentDirect } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call, caughtMail, expectNoSecrets, linkIn, rowCount } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

let smtp: { close: () => Promise<void> };
beforeAll(async () => {
  smtp = await startFakeSmtp(0);
});
afterAll(async () => {
  await smtp.close();
});

describe("/api/users", () => {
  let schoolId: string;
  let admin: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"], { name: "Ada Admin", passwordHash: "$argon2id$v=19$fake" });
    signInAs(admin);
  });

  it("lists people with their status, filtered by role, status and search", async () => {
    const setUp = makeUser(schoolId, ["student"], { name: "Wren Haverford", passwordHash: "$argon2id$v=19$fake" });
    const notInvited = makeUser(schoolId, ["student"], { name: "Kit Ashdown" });
    const teacher = makeUser(schoolId, ["teacher"], { name: "Tariq Mabry" });
    await call(invitation.POST, apiRequest(`/api/users/${teacher.userId}/invitation`, "POST"), { id: teacher.userId });
    const gone = makeUser(schoolId, ["parent"], { name: "Runa Zeller" });
    await call(person.PATCH, apiRequest(`/api/users/${gone.userId}`, "PATCH", { active: false }), { id: gone.userId });

    const all = await call(people.GET, apiRequest("/api/users"));
    expect(all.status).toBe(200);
    expectNoSecrets(all.text);
    const status = Object.fromEntries(all.body.people.map((p: { name: string; status: string }) => [p.name, p.status]));
    expect(status).toEqual({ "Ada Admin": "active", "Wren Haverford": "active", "Kit Ashdown": "not-invited", "Tariq Mabry": "invited", "Runa Zeller": "deactivated" });

    const names = async (qs: string) => (await call(people.GET, apiRequest(`/api/users?${qs}`))).body.people.map((p: { name: string }) => p.name);
    expect(await names("role=student")).toEqual(["Kit Ashdown", "Wren Haverford"]);
    expect(await names("status=not-set-up")).toEqual(["Kit Ashdown", "Tariq Mabry"]);
    expect(await names("status=invited")).toEqual(["Tariq Mabry"]);
    expect(await names("status=deactivated")).toEqual(["Runa Zeller"]);
    expect(await names("role=student&status=active")).toEqual(["Wren Haverford"]);
    expect(await names("q=haver")).toEqual(["Wren Haverford"]);
    expect(await names("q=100%25")).toEqual([]);
    expect(await names("role=&status=&q=")).toHaveLength(5);
    expect(setUp.userId).toBeTruthy();
    expect(notInvited.userId).toBeTruthy();
  });

  it("refuses an unknown role or status filter with a 400 that names the parameter", async () => {
    const role = await call(people.GET, apiRequest("/api/users?role=headteacher"));
    expect(role.status).toBe(400);
    expect(role.body.error.fieldErrors.role[0]).toMatch(/not a role/);
    const status = await call(people.GET, apiRequest("/api/users?status=asleep"));
    expect(status.status).toBe(400);
    expect(status.body.error.fieldErrors.status[0]).toMatch(/Status must be one of/);
  });

  it("adds a person and e-mails an invitation whose link is in the mail but never in the answer", async () => {
    const res = await call(people.POST, apiRequest("/api/users", "POST", { name: "Solveig Penhaligon", email: "  S.Penhaligon@Test.Example ", roles: ["teacher", "moderator"], sendInvitation: true }));
    expect(res.status).toBe(201);
    expectNoSecrets(res.text);
    expect(res.body.invitation.sent).toBe(true);
    const mail = caughtMail();
    expect(mail).toHaveLength(1);
    expect(mail[0]!.to).toBe("s.penhaligon@test.example");
    expect(mail[0]!.schoolId).toBe(schoolId);
    const token = new URL(linkIn(mail[0]!.text)).searchParams.get("token")!;
    expect(res.text).not.toContain(token);
    expect(previewToken({ token, kind: "invitation" })).toMatchObject({ ok: true, name: "Solveig Penhaligon" });

    const got = await call(person.GET, apiRequest(`/api/users/${res.body.id}`), { id: res.body.id });
    expect(got.status).toBe(200);
    expectNoSecrets(got.text);
    expect(got.body.person).toMatchObject({ email: "s.penhaligon@test.example", active: true, invitation: { state: "invited" } });
    expect([...got.body.person.roles].sort()).toEqual(["moderator", "teacher"]);
  });

  it("adds a person without an invitation when asked", async () => {
    const res = await call(people.POST, apiRequest("/api/users", "POST", { name: "Kofi Ingleby", email: "kofi@test.example", roles: ["student"], yearGroup: 9, sendInvitation: false }));
    expect(res.status).toBe(201);
    expect(res.body.invitation).toBeNull();
    expect(caughtMail()).toHaveLength(0);
    const got = await call(person.GET, apiRequest(`/api/users/${res.body.id}`), { id: res.body.id });
    expect(got.body.person).toMatchObject({ yearGroup: 9, invitation: { state: "not-invited" } });
  });

  it("returns a message for each field that needs attention, and writes nothing", async () => {
    const before = rowCount("users");
    const res = await call(people.POST, apiRequest("/api/users", "POST", { name: "  ", email: "not-an-address", roles: [], yearGroup: 14 }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toMatchObject({
      name: ["Enter a name."],
      email: [expect.stringMatching(/valid e-mail/)],
      roles: ["Choose at least one role."],
      yearGroup: [expect.stringMatching(/1 to 13/)],
    });
    const tooLong = await call(people.POST, apiRequest("/api/users", "POST", { name: "x".repeat(121), email: "a@test.example", roles: ["wizard"] }));
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.fieldErrors.name[0]).toMatch(/at most 120/);
    expect(tooLong.body.error.fieldErrors["roles.0"][0]).toMatch(/not a role/);
    expect(rowCount("users")).toBe(before);
  });

  it("refuses an e-mail address someone already uses, in any school, with 409 at the e-mail field", async () => {
    makeUser(makeSchool(), ["teacher"], { email: "taken@test.example" });
    const res = await call(people.POST, apiRequest("/api/users", "POST", { name: "Someone New", email: "TAKEN@test.example", roles: ["teacher"] }));
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.email[0]).toMatch(/already uses/);
  });

  it("refuses a body over the size limit with 413", async () => {
    const res = await call(people.POST, apiRequest("/api/users", "POST", { name: "x".repeat(1_100_000), email: "a@test.example", roles: ["student"] }));
    expect(res.status).toBe(413);
  });

  it("shows a person's classes and family links", async () => {
    const teacher = makeUser(schoolId, ["teacher"], { name: "Idris Fenwick-Osei" });
    const student = makeUser(schoolId, ["student"], { name: "Elowen Quiller" });
    const parent = makeUser(schoolId, ["parent"], { name: "Marisol Quiller" });
    linkParentDirect(parent, student);
    makeClass(schoolId, { name: "10C Chemistry", teachers: [teacher], students: [student] });
    const s = (await call(person.GET, apiRequest(`/api/users/${student.userId}`), { id: student.userId })).body.person;
    expect(s.studiesIn.map((c: { name: string }) => c.name)).toEqual(["10C Chemistry"]);
    expect(s.guardians).toEqual([expect.objectContaining({ id: parent.userId, name: "Marisol Quiller", relationship: "Parent" })]);
    const t = (await call(person.GET, apiRequest(`/api/users/${teacher.userId}`), { id: teacher.userId })).body.person;
    expect(t.teaches.map((c: { name: string }) => c.name)).toEqual(["10C Chemistry"]);
    const p = (await call(person.GET, apiRequest(`/api/users/${parent.userId}`), { id: parent.userId })).body.person;
    expect(p.children).toEqual([expect.objectContaining({ id: student.userId, relationship: "Parent" })]);
  });

  it("edits details and roles, and answers with the person as saved", async () => {
    const p = makeUser(schoolId, ["teacher"], { name: "Linnea Galloway" });
    const res = await call(person.PATCH, apiRequest(`/api/users/${p.userId}`, "PATCH", { name: "Linnea Galloway-Roe", roles: ["teacher", "moderator"] }), { id: p.userId });
    expect(res.status).toBe(200);
    expect(res.body.person.name).toBe("Linnea Galloway-Roe");
    expect([...res.body.person.roles].sort()).toEqual(["moderator", "teacher"]);
    const bad = await call(person.PATCH, apiRequest(`/api/users/${p.userId}`, "PATCH", { email: "nope", roles: [] }), { id: p.userId });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fieldErrors).sort()).toEqual(["email", "roles"]);
    const clash = await call(person.PATCH, apiRequest(`/api/users/${p.userId}`, "PATCH", { email: admin.email }), { id: p.userId });
    expect(clash.status).toBe(409);
    expect(clash.body.error.fieldErrors.email[0]).toMatch(/already uses/);
  });

  it("deactivates and reactivates a person, but not the admin's own account", async () => {
    const p = makeUser(schoolId, ["student"]);
    const off = await call(person.PATCH, apiRequest(`/api/users/${p.userId}`, "PATCH", { active: false }), { id: p.userId });
    expect(off.body.person.active).toBe(false);
    const invite = await call(invitation.POST, apiRequest(`/api/users/${p.userId}/invitation`, "POST"), { id: p.userId });
    expect(invite.status).toBe(400);
    expect(invite.body.error.message).toMatch(/deactivated/);
    const on = await call(person.PATCH, apiRequest(`/api/users/${p.userId}`, "PATCH", { active: true }), { id: p.userId });
    expect(on.body.person.active).toBe(true);
    const self = await call(person.PATCH, apiRequest(`/api/users/${admin.userId}`, "PATCH", { active: false }), { id: admin.userId });
    expect(self.status).toBe(400);
    expect(self.body.error.message).toMatch(/own account/);
  });

  it("never puts a password hash, token hash or token in any answer", async () => {
    const teacher = makeUser(schoolId, ["teacher"], { name: "Perpetua Oyelaran", passwordHash: "$argon2id$v=19$m=19456,t=2,p=1$leak" });
    const student = makeUser(schoolId, ["student"], { name: "Quillon Drummond" });
    const classId = makeClass(schoolId, { teachers: [teacher], students: [student] });
    await call(invitation.POST, apiRequest(`/api/users/${student.userId}/invitation`, "POST"), { id: student.userId });
    const answers = [
      await call(people.GET, apiRequest("/api/users")),
      await call(person.GET, apiRequest(`/api/users/${teacher.userId}`), { id: teacher.userId }),
      await call(person.GET, apiRequest(`/api/users/${student.userId}`), { id: student.userId }),
      await call(person.PATCH, apiRequest(`/api/users/${teacher.userId}`, "PATCH", { name: "Perpetua Oyelaran-Fenn" }), { id: teacher.userId }),
      await call(classList.GET, apiRequest("/api/classes")),
      await call(classItem.GET, apiRequest(`/api/classes/${classId}`), { id: classId }),
      await call(picker.GET, apiRequest("/api/people-picker?role=teacher")),
      await call(audit.GET, apiRequest("/api/audit")),
      await call(outbox.GET, apiRequest("/api/outbox")),
    ];
    for (const a of answers) {
      expect(a.status).toBe(200);
      expectNoSecrets(a.text);
      expect(a.text).not.toContain("$argon2");
    }
  });

  it("answers 404 for an id that does not exist", async () => {
    const res = await call(person.GET, apiRequest("/api/users/no-such-person"), { id: "no-such-person" });
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/not found/);
  });
});

describe("/api/users/[id]/invitation", () => {
  let schoolId: string;
  let admin: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"]);
    signInAs(admin);
  });

  it("sending again replaces the earlier link, which then stops working", async () => {
    const p = makeUser(schoolId, ["parent"], { name: "Amara Drummond-Iqbal", email: "amara@test.example" });
    const first = await call(invitation.POST, apiRequest(`/api/users/${p.userId}/invitation`, "POST"), { id: p.userId });
    expect(first.status).toBe(200);
    expectNoSecrets(first.text);
    expect(first.body).toMatchObject({ sent: true, expiresAt: expect.any(String) });
    const second = await call(invitation.POST, apiRequest(`/api/users/${p.userId}/invitation`, "POST"), { id: p.userId });
    expect(second.status).toBe(200);
    expectNoSecrets(second.text);
    const [m1, m2] = caughtMail();
    const oldToken = new URL(linkIn(m1!.text)).searchParams.get("token")!;
    const newToken = new URL(linkIn(m2!.text)).searchParams.get("token")!;
    expect(oldToken).not.toBe(newToken);
    expect(previewToken({ token: oldToken, kind: "invitation" })).toMatchObject({ ok: false, reason: "replaced" });
    expect(previewToken({ token: newToken, kind: "invitation" })).toMatchObject({ ok: true });
  });

  it("refuses someone who has already set up their account with 409", async () => {
    const p = makeUser(schoolId, ["teacher"], { passwordHash: "$argon2id$v=19$fake" });
    const res = await call(invitation.POST, apiRequest(`/api/users/${p.userId}/invitation`, "POST"), { id: p.userId });
    expect(res.status).toBe(409);
    expect(caughtMail()).toHaveLength(0);
  });

  it("reports a mail failure as 503 with a message, without a link", async () => {
    const { setFakeSmtpPort, fakeSmtpPort } = await import("@/lib/dev/fake-smtp-state");
    const working = fakeSmtpPort();
    const closed = await startFakeSmtp(0);
    await closed.close();
    setFakeSmtpPort(closed.port);
    const quiet = vi.spyOn(console, "error").mockImplementation(() => {});
    try {
      const p = makeUser(schoolId, ["teacher"]);
      const res = await call(invitation.POST, apiRequest(`/api/users/${p.userId}/invitation`, "POST"), { id: p.userId });
      expect(res.status).toBe(503);
      expect(res.body.error.message).toMatch(/could not be sent/);
      expectNoSecrets(res.text);
    } finally {
      quiet.mockRestore();
      setFakeSmtpPort(working);
    }
  });
});

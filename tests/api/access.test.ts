import { beforeEach, describe, expect, it, vi } from "vitest";
import { mailMessages } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import * as audit from "@/app/api/audit/route";
import * as classItem from "@/app/api/classes/[id]/route";
import * as roster from "@/app/api/classes/[id]/roster/route";
import * as enrolment from "@/app/api/classes/[id]/students/[studentId]/route";
import * as students from "@/app/api/classes/[id]/students/route";
import * as classList from "@/app/api/classes/route";
import * as family from "@/app/api/family-links/route";
import * as outboxItem from "@/app/api/outbox/[id]/route";
import * as outbox from "@/app/api/outbox/route";
import * as picker from "@/app/api/people-picker/route";
import * as invitation from "@/app/api/users/[id]/invitation/route";
import * as person from "@/app/api/users/[id]/route";
import * as people from "@/app/api/users/route";
import { freshDatabase, linkParentDirect, makeClass, makeSchool, makeUser, testDb } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call } from "./helpers";

// The factory imports the helper itself: vi.mock is hoisted above this file's imports.
vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

type School = { admin: Actor; teacher: Actor; student: Actor; parent: Actor; moderator: Actor; classId: string; mailId: string };

function makeWholeSchool(): School {
  const schoolId = makeSchool();
  const admin = makeUser(schoolId, ["admin"]);
  const teacher = makeUser(schoolId, ["teacher"]);
  const student = makeUser(schoolId, ["student"]);
  const parent = makeUser(schoolId, ["parent"]);
  const moderator = makeUser(schoolId, ["moderator"]);
  linkParentDirect(parent, student);
  const classId = makeClass(schoolId, { teachers: [teacher], students: [student] });
  const mailId = testDb()
    .insert(mailMessages)
    .values({ schoolId, from: "no-reply@meniscus.invalid", to: student.email, subject: "Hello", text: "Hello", raw: "Hello" })
    .returning({ id: mailMessages.id })
    .get().id;
  return { admin, teacher, student, parent, moderator, classId, mailId };
}

/** Every admin route, aimed at the records of school `s`, with a body that passes validation. */
function adminRoutes(s: School) {
  return [
    { name: "GET /api/users", run: () => call(people.GET, apiRequest("/api/users")) },
    { name: "POST /api/users", run: () => call(people.POST, apiRequest("/api/users", "POST", { name: "New Person", email: "new.person@test.example", roles: ["teacher"], sendInvitation: false })) },
    { name: "GET /api/users/[id]", run: () => call(person.GET, apiRequest(`/api/users/${s.student.userId}`), { id: s.student.userId }) },
    { name: "PATCH /api/users/[id]", run: () => call(person.PATCH, apiRequest(`/api/users/${s.student.userId}`, "PATCH", { name: "Renamed" }), { id: s.student.userId }) },
    { name: "POST /api/users/[id]/invitation", run: () => call(invitation.POST, apiRequest(`/api/users/${s.student.userId}/invitation`, "POST"), { id: s.student.userId }) },
    { name: "POST /api/classes", run: () => call(classList.POST, apiRequest("/api/classes", "POST", { name: "9Z Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27" })) },
    { name: "PATCH /api/classes/[id]", run: () => call(classItem.PATCH, apiRequest(`/api/classes/${s.classId}`, "PATCH", { subject: "Physics" }), { id: s.classId }) },
    { name: "POST /api/classes/[id]/students", run: () => call(students.POST, apiRequest(`/api/classes/${s.classId}/students`, "POST", { studentIds: [s.student.userId] }), { id: s.classId }) },
    {
      name: "DELETE /api/classes/[id]/students/[studentId]",
      run: () => call(enrolment.DELETE, apiRequest(`/api/classes/${s.classId}/students/${s.student.userId}`, "DELETE"), { id: s.classId, studentId: s.student.userId }),
    },
    { name: "POST /api/classes/[id]/roster", run: () => call(roster.POST, apiRequest(`/api/classes/${s.classId}/roster`, "POST", { csv: "name,email\nKit Ashdown,kit@test.example", commit: false }), { id: s.classId }) },
    { name: "POST /api/family-links", run: () => call(family.POST, apiRequest("/api/family-links", "POST", { parentId: s.parent.userId, studentId: s.student.userId, relationship: "Aunt" })) },
    { name: "DELETE /api/family-links", run: () => call(family.DELETE, apiRequest("/api/family-links", "DELETE", { parentId: s.parent.userId, studentId: s.student.userId })) },
    { name: "GET /api/outbox", run: () => call(outbox.GET, apiRequest("/api/outbox")) },
    { name: "GET /api/outbox/[id]", run: () => call(outboxItem.GET, apiRequest(`/api/outbox/${s.mailId}`), { id: s.mailId }) },
    { name: "GET /api/audit", run: () => call(audit.GET, apiRequest("/api/audit")) },
    { name: "GET /api/people-picker", run: () => call(picker.GET, apiRequest("/api/people-picker?role=student")) },
  ];
}

describe("who may call the admin routes", () => {
  let home: School;
  let other: School;
  beforeEach(() => {
    freshDatabase();
    home = makeWholeSchool();
    other = makeWholeSchool();
  });

  it("refuses every route to a signed-out visitor with 401 and a JSON message", async () => {
    signInAs(null);
    const routes = [
      ...adminRoutes(home),
      { name: "GET /api/classes", run: () => call(classList.GET, apiRequest("/api/classes")) },
      { name: "GET /api/classes/[id]", run: () => call(classItem.GET, apiRequest(`/api/classes/${home.classId}`), { id: home.classId }) },
    ];
    for (const r of routes) {
      const res = await r.run();
      expect(res.status, r.name).toBe(401);
      expect(res.body.error.message, r.name).toMatch(/sign in/i);
    }
  });

  it.each(["teacher", "student", "parent", "moderator"] as const)("refuses every admin route to a %s with 403", async (role) => {
    signInAs(home[role]);
    for (const r of adminRoutes(home)) {
      const res = await r.run();
      expect(res.status, r.name).toBe(403);
      expect(res.body.error.code, r.name).toBe("forbidden");
    }
  });

  it("answers 404 when an admin names another school's records in the address", async () => {
    signInAs(home.admin);
    const byName = new Map(adminRoutes(other).map((r) => [r.name, r]));
    const urlScoped = [
      "GET /api/users/[id]",
      "PATCH /api/users/[id]",
      "POST /api/users/[id]/invitation",
      "PATCH /api/classes/[id]",
      "POST /api/classes/[id]/students",
      "DELETE /api/classes/[id]/students/[studentId]",
      "POST /api/classes/[id]/roster",
      "GET /api/outbox/[id]",
      "DELETE /api/family-links",
    ];
    for (const name of urlScoped) {
      const res = await byName.get(name)!.run();
      expect(res.status, name).toBe(404);
      expect(res.body.error.message, name).toMatch(/not found/i);
    }
    const get = await call(classItem.GET, apiRequest(`/api/classes/${other.classId}`), { id: other.classId });
    expect(get.status).toBe(404);
  });

  it("refuses to link people of another school (400, naming the field) and lists nothing of theirs", async () => {
    signInAs(home.admin);
    const link = await call(family.POST, apiRequest("/api/family-links", "POST", { parentId: other.parent.userId, studentId: home.student.userId }));
    expect(link.status).toBe(400);
    expect(link.body.error.fieldErrors.parentId[0]).toMatch(/this school/);
    const enrol = await call(students.POST, apiRequest(`/api/classes/${home.classId}/students`, "POST", { studentIds: [other.student.userId] }), { id: home.classId });
    expect(enrol.status).toBe(400);
    expect(enrol.body.error.fieldErrors.studentIds[0]).toMatch(/this school/);
    const list = await call(people.GET, apiRequest("/api/users"));
    const ids = list.body.people.map((p: { id: string }) => p.id);
    expect(ids).toContain(home.student.userId);
    expect(ids).not.toContain(other.student.userId);
    const mail = await call(outbox.GET, apiRequest("/api/outbox"));
    expect(mail.body.messages.map((m: { id: string }) => m.id)).toEqual([home.mailId]);
    const trail = await call(audit.GET, apiRequest(`/api/audit?entityId=${other.student.userId}`));
    expect(trail.status).toBe(200);
    expect(trail.body.entries).toEqual([]);
    const pick = await call(picker.GET, apiRequest("/api/people-picker?role=student"));
    expect(pick.body.people.map((p: { id: string }) => p.id)).toEqual([home.student.userId]);
  });

  it("lets every role list the classes it belongs to, and no others", async () => {
    const expected: [Actor, string[]][] = [
      [home.admin, [home.classId]],
      [home.teacher, [home.classId]],
      [home.student, [home.classId]],
      [home.parent, [home.classId]],
      [home.moderator, []],
    ];
    for (const [actor, ids] of expected) {
      signInAs(actor);
      const res = await call(classList.GET, apiRequest("/api/classes"));
      expect(res.status, actor.roles.join()).toBe(200);
      expect(res.body.classes.map((c: { id: string }) => c.id)).toEqual(ids);
    }
  });

  it("shows a class to its teacher with the roster, to its student without it, and refuses anyone else", async () => {
    signInAs(home.teacher);
    const asTeacher = await call(classItem.GET, apiRequest(`/api/classes/${home.classId}`), { id: home.classId });
    expect(asTeacher.status).toBe(200);
    expect(asTeacher.body.class.students).toHaveLength(1);
    signInAs(home.student);
    const asStudent = await call(classItem.GET, apiRequest(`/api/classes/${home.classId}`), { id: home.classId });
    expect(asStudent.status).toBe(200);
    expect(asStudent.body.class.students).toBeNull();
    signInAs(home.moderator);
    const asModerator = await call(classItem.GET, apiRequest(`/api/classes/${home.classId}`), { id: home.classId });
    expect(asModerator.status).toBe(403);
  });

  it("refuses a deactivated admin as signed out", async () => {
    const other2 = makeUser(home.admin.schoolId, ["admin"]);
    signInAs(other2);
    expect((await call(person.PATCH, apiRequest(`/api/users/${home.admin.userId}`, "PATCH", { active: false }), { id: home.admin.userId })).status).toBe(200);
    signInAs(home.admin);
    expect((await call(people.GET, apiRequest("/api/users"))).status).toBe(401);
  });

  it("refuses changes sent from another site, and bodies that are not JSON", async () => {
    signInAs(home.admin);
    const crossSite = await call(people.POST, apiRequest("/api/users", "POST", { name: "X Y", email: "xy@test.example", roles: ["teacher"] }, { "sec-fetch-site": "cross-site" }));
    expect(crossSite.status).toBe(403);
    const otherOrigin = await call(people.POST, apiRequest("/api/users", "POST", { name: "X Y", email: "xy@test.example", roles: ["teacher"] }, { origin: "https://elsewhere.example" }));
    expect(otherOrigin.status).toBe(403);
    const form = await call(people.POST, apiRequest("/api/users", "POST", "name=X", { "content-type": "application/x-www-form-urlencoded" }));
    expect(form.status).toBe(415);
    const broken = await call(people.POST, apiRequest("/api/users", "POST", "{not json"));
    expect(broken.status).toBe(400);
    expect(broken.body.error.message).toMatch(/not valid JSON/);
  });
});

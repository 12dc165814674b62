import { beforeEach, describe, expect, it, vi } from "vitest";
import type { Actor } from "@/lib/auth/actor";
import * as classItem from "@/app/api/classes/[id]/route";
import * as enrolment from "@/app/api/classes/[id]/students/[studentId]/route";
import * as students from "@/app/api/classes/[id]/students/route";
import * as classList from "@/app/api/classes/route";
import * as picker from "@/app/api/people-picker/route";
import * as person from "@/app/api/users/[id]/route";
import { auditEntries, freshDatabase, makeClass, makeSchool, makeUser } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call, expectNoSecrets } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

describe("/api/classes", () => {
  let schoolId: string;
  let admin: Actor;
  let teacher: Actor;
  let colleague: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"]);
    teacher = makeUser(schoolId, ["teacher"], { name: "Imani Rasmussen-Daly" });
    colleague = makeUser(schoolId, ["teacher"], { name: "Bastian Kettlewell" });
    signInAs(admin);
  });

  const create = (body: unknown) => call(classList.POST, apiRequest("/api/classes", "POST", body));
  const patch = (id: string, body: unknown) => call(classItem.PATCH, apiRequest(`/api/classes/${id}`, "PATCH", body), { id });
  const get = (id: string) => call(classItem.GET, apiRequest(`/api/classes/${id}`), { id });

  it("creates a class with its teachers", async () => {
    const res = await create({ name: "9B Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27", teacherIds: [teacher.userId] });
    expect(res.status).toBe(201);
    const detail = await get(res.body.id);
    expect(detail.body.class).toMatchObject({ name: "9B Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27", archived: false, teachers: [{ id: teacher.userId }] });
  });

  it("explains each field that is wrong", async () => {
    const res = await create({ name: "", subject: "", yearGroup: 0, academicYear: "2026-28", teacherIds: [] });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toMatchObject({
      name: [expect.stringMatching(/Give the class a name/)],
      subject: ["Enter the subject."],
      yearGroup: [expect.stringMatching(/1 to 13/)],
      academicYear: [expect.stringMatching(/second year must follow/)],
    });
    const format = await create({ name: "9B", subject: "Biology", yearGroup: 9, academicYear: "26/27" });
    expect(format.body.error.fieldErrors.academicYear[0]).toMatch(/like 2026-27/);
  });

  it("refuses a second class with the same name in the same year (409), and a non-teacher as teacher (400)", async () => {
    await create({ name: "9B Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27" });
    const dup = await create({ name: "9B Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27" });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fieldErrors.name[0]).toMatch(/already a class/);
    const student = makeUser(schoolId, ["student"]);
    const notTeacher = await create({ name: "9C Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27", teacherIds: [student.userId] });
    expect(notTeacher.status).toBe(400);
    expect(notTeacher.body.error.fieldErrors.teacherIds[0]).toMatch(/teachers from this school/);
  });

  it("keeps the teachers when a change leaves them out, and replaces them when it names them", async () => {
    const id = makeClass(schoolId, { name: "10C Chemistry", teachers: [teacher] });
    const renamed = await patch(id, { name: "10C Chemistry (set 1)" });
    expect(renamed.status).toBe(200);
    expect(renamed.body.class.teachers.map((t: { id: string }) => t.id)).toEqual([teacher.userId]);
    const swapped = await patch(id, { teacherIds: [colleague.userId, teacher.userId] });
    expect(swapped.body.class.teachers.map((t: { name: string }) => t.name)).toEqual(["Bastian Kettlewell", "Imani Rasmussen-Daly"]);
    const bad = await patch(id, { yearGroup: "ten" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.yearGroup).toBeDefined();
  });

  it("archives a class: it leaves the list unless archived ones are asked for", async () => {
    const id = makeClass(schoolId, { name: "11P Physics" });
    const res = await patch(id, { archived: true });
    expect(res.body.class.archived).toBe(true);
    expect(auditEntries(id).map((a) => a.action)).toContain("class.archive");
    const list = await call(classList.GET, apiRequest("/api/classes"));
    expect(list.body.classes).toEqual([]);
    const withArchived = await call(classList.GET, apiRequest("/api/classes?archived=include"));
    expect(withArchived.body.classes.map((c: { id: string }) => c.id)).toEqual([id]);
    const bad = await call(classList.GET, apiRequest("/api/classes?archived=maybe"));
    expect(bad.status).toBe(400);
    const restored = await patch(id, { archived: false });
    expect(restored.body.class.archived).toBe(false);
  });

  it("adds existing students and removes one, without touching their accounts", async () => {
    const id = makeClass(schoolId, { name: "10C Chemistry" });
    const a = makeUser(schoolId, ["student"], { name: "Cassius Oyelaran" });
    const b = makeUser(schoolId, ["student"], { name: "Yara Thornbury" });
    const add = await call(students.POST, apiRequest(`/api/classes/${id}/students`, "POST", { studentIds: [a.userId, b.userId] }), { id });
    expect(add.body).toEqual({ added: 2, alreadyInClass: 0 });
    const again = await call(students.POST, apiRequest(`/api/classes/${id}/students`, "POST", { studentIds: [a.userId] }), { id });
    expect(again.body).toEqual({ added: 0, alreadyInClass: 1 });
    const detail = await get(id);
    expectNoSecrets(detail.text);
    expect(detail.body.class.students.map((s: { name: string }) => s.name)).toEqual(["Cassius Oyelaran", "Yara Thornbury"]);

    const remove = await call(enrolment.DELETE, apiRequest(`/api/classes/${id}/students/${a.userId}`, "DELETE"), { id, studentId: a.userId });
    expect(remove.status).toBe(200);
    expect((await get(id)).body.class.students.map((s: { name: string }) => s.name)).toEqual(["Yara Thornbury"]);
    const twice = await call(enrolment.DELETE, apiRequest(`/api/classes/${id}/students/${a.userId}`, "DELETE"), { id, studentId: a.userId });
    expect(twice.status).toBe(404);
  });

  it("refuses an empty list of students, and a teacher as a student", async () => {
    const id = makeClass(schoolId);
    const none = await call(students.POST, apiRequest(`/api/classes/${id}/students`, "POST", { studentIds: [] }), { id });
    expect(none.status).toBe(400);
    expect(none.body.error.fieldErrors.studentIds[0]).toMatch(/at least one/);
    const wrong = await call(students.POST, apiRequest(`/api/classes/${id}/students`, "POST", { studentIds: [teacher.userId] }), { id });
    expect(wrong.status).toBe(400);
  });

  it("offers active people of one role in the picker, searched by name or e-mail", async () => {
    const gone = makeUser(schoolId, ["teacher"], { name: "Anouk Wetherall" });
    expect((await call(person.PATCH, apiRequest(`/api/users/${gone.userId}`, "PATCH", { active: false }), { id: gone.userId })).status).toBe(200);
    const res = await call(picker.GET, apiRequest("/api/people-picker?role=teacher&q=KETTLE"));
    expect(res.body).toMatchObject({ total: 1, people: [{ id: colleague.userId, name: "Bastian Kettlewell" }] });
    const all = await call(picker.GET, apiRequest("/api/people-picker?role=teacher"));
    expect(all.body.people.map((p: { name: string }) => p.name)).toEqual(["Bastian Kettlewell", "Imani Rasmussen-Daly"]);
    const bad = await call(picker.GET, apiRequest("/api/people-picker?role=pilot"));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.role[0]).toMatch(/not a role/);
  });
});

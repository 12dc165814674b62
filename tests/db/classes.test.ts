import { beforeEach, describe, expect, it } from "vitest";
import { createClass, enrolStudents, getClassDetail, listClasses, removeStudent, updateClass } from "@/db/queries/classes";
import { auditEntries, freshDatabase, makeClass, makeUser } from "../helpers/db";
import { expectRefused } from "../helpers/errors";
import { twoSchools, type TwoSchools } from "../helpers/schools";

const names = (list: { name: string }[]) => list.map((c) => c.name).sort();

describe("listClasses: who sees which classes", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
  });

  it("shows an admin every class of their own school and none of another school's", () => {
    expect(names(listClasses({ actor: s.admin }))).toEqual(["9X Chemistry", "9Y Chemistry"]);
    expect(names(listClasses({ actor: s.elsewhere.admin }))).toEqual(["9Z Chemistry"]);
  });

  it("shows a teacher only the classes they teach, with the count of students", () => {
    const list = listClasses({ actor: s.teacher });
    expect(names(list)).toEqual(["9X Chemistry"]);
    expect(list[0]!.studentCount).toBe(1);
    expect(list[0]!.teachers).toEqual([{ id: s.teacher.userId, name: "Tobias Teacher" }]);
    expect(names(listClasses({ actor: s.otherTeacher }))).toEqual(["9Y Chemistry"]);
  });

  it("shows a student only the classes they are in", () => {
    expect(names(listClasses({ actor: s.student }))).toEqual(["9X Chemistry"]);
    expect(names(listClasses({ actor: s.otherStudent }))).toEqual(["9Y Chemistry"]);
  });

  it("shows a parent their children's classes only", () => {
    expect(names(listClasses({ actor: s.parent }))).toEqual(["9X Chemistry"]);
    const unlinked = makeUser(s.schoolId, ["parent"]);
    expect(listClasses({ actor: unlinked })).toEqual([]);
  });

  it("shows a moderator who does not teach no classes", () => {
    expect(listClasses({ actor: s.moderator })).toEqual([]);
  });

  it("never shows another school's classes, even to someone enrolled there by a bad row", () => {
    // A class_students row pointing across schools must not leak the other school's class.
    makeClass(s.elsewhere.schoolId, { name: "9W Physics", students: [s.student] });
    expect(names(listClasses({ actor: s.student }))).toEqual(["9X Chemistry"]);
  });

  it("hides archived classes unless asked for them", () => {
    updateClass({ actor: s.admin, classId: s.otherClass, input: { archived: true } });
    expect(names(listClasses({ actor: s.admin }))).toEqual(["9X Chemistry"]);
    expect(names(listClasses({ actor: s.admin, includeArchived: true }))).toEqual(["9X Chemistry", "9Y Chemistry"]);
    expect(auditEntries(s.otherClass).map((a) => a.action)).toContain("class.archive");
  });
});

describe("getClassDetail: the roster is for staff", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
  });

  it("gives an admin the roster with e-mails and guardians, and the right to manage", () => {
    const detail = getClassDetail({ actor: s.admin, classId: s.taughtClass });
    expect(detail.canManage).toBe(true);
    expect(detail.students).toEqual([
      { id: s.student.userId, name: "Sasha Student", email: s.student.email, yearGroup: 10, active: true, guardians: [{ name: "Pippa Parent", relationship: "Parent" }] },
    ]);
  });

  it("gives the class's teacher the roster with e-mails but not the right to manage", () => {
    const detail = getClassDetail({ actor: s.teacher, classId: s.taughtClass });
    expect(detail.canManage).toBe(false);
    expect(detail.students?.map((st) => st.email)).toEqual([s.student.email]);
  });

  it("gives a student in the class the class and its teachers, but no roster", () => {
    const detail = getClassDetail({ actor: s.student, classId: s.taughtClass });
    expect(detail.name).toBe("9X Chemistry");
    expect(detail.teachers.map((t) => t.name)).toEqual(["Tobias Teacher"]);
    expect(detail.students).toBeNull();
    expect(JSON.stringify(detail)).not.toContain(s.student.email);
  });

  it("refuses (403) people of the school who are not in the class", () => {
    for (const actor of [s.otherTeacher, s.otherStudent, s.moderator, s.parent]) {
      const err = expectRefused(() => getClassDetail({ actor, classId: s.taughtClass }), "forbidden");
      expect(err.status).toBe(403);
    }
  });

  it("answers 404 to anyone from another school, admins included, so ids reveal nothing", () => {
    for (const actor of [s.elsewhere.admin, s.elsewhere.teacher, s.elsewhere.student]) {
      expect(expectRefused(() => getClassDetail({ actor, classId: s.taughtClass }), "not_found").status).toBe(404);
    }
    expectRefused(() => getClassDetail({ actor: s.admin, classId: "no-such-class" }), "not_found");
  });
});

describe("managing classes is for admins of the school", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
  });

  const input = { name: "10Q Biology", subject: "Biology", yearGroup: 10, academicYear: "2026-27", teacherIds: [] as string[] };

  it("refuses every other role", () => {
    for (const actor of [s.teacher, s.student, s.moderator, s.parent]) {
      expectRefused(() => createClass({ actor, input }), "forbidden");
      expectRefused(() => updateClass({ actor, classId: s.taughtClass, input: { name: "Renamed" } }), "forbidden");
      expectRefused(() => enrolStudents({ actor, classId: s.taughtClass, studentIds: [s.otherStudent.userId] }), "forbidden");
      expectRefused(() => removeStudent({ actor, classId: s.taughtClass, studentId: s.student.userId }), "forbidden");
    }
    expect(names(listClasses({ actor: s.admin }))).toEqual(["9X Chemistry", "9Y Chemistry"]);
  });

  it("refuses another school's teachers, students and classes", () => {
    expectRefused(() => createClass({ actor: s.admin, input: { ...input, teacherIds: [s.elsewhere.teacher.userId] } }), "bad_request");
    expectRefused(() => enrolStudents({ actor: s.admin, classId: s.taughtClass, studentIds: [s.elsewhere.student.userId] }), "bad_request");
    expectRefused(() => enrolStudents({ actor: s.elsewhere.admin, classId: s.taughtClass, studentIds: [s.elsewhere.student.userId] }), "not_found");
    expectRefused(() => updateClass({ actor: s.elsewhere.admin, classId: s.taughtClass, input: { name: "Taken over" } }), "not_found");
    expect(names(listClasses({ actor: s.admin }))).toEqual(["9X Chemistry", "9Y Chemistry"]);
  });

  it("refuses a second class with the same name in the same year (409)", () => {
    expectRefused(() => createClass({ actor: s.admin, input: { ...input, name: "9X Chemistry" } }), "conflict");
  });

  it("enrols only the students not already in the class, with an audit entry", () => {
    expect(enrolStudents({ actor: s.admin, classId: s.taughtClass, studentIds: [s.student.userId, s.otherStudent.userId, s.otherStudent.userId] })).toBe(1);
    expect(getClassDetail({ actor: s.admin, classId: s.taughtClass }).students?.map((st) => st.name)).toEqual(["Sasha Student", "Soren Student"]);
    expect(auditEntries(s.taughtClass).filter((a) => a.action === "class.enrol")).toHaveLength(1);
  });
});

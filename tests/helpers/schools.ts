import type { Actor } from "@/lib/auth/actor";
import { linkParentDirect, makeClass, makeSchool, makeUser } from "./db";

/**
 * Two schools for permission tests. In the home school: an admin, two teachers each teaching one
 * class, a student in each class, a parent of the first student, and a moderator. In the other
 * school: an admin, a teacher, a student, a parent and a class of their own. Call after
 * freshDatabase().
 */
export function twoSchools() {
  const schoolId = makeSchool("Larchfield Academy");
  const admin = makeUser(schoolId, ["admin"], { name: "Audrey Admin" });
  const teacher = makeUser(schoolId, ["teacher"], { name: "Tobias Teacher" });
  const otherTeacher = makeUser(schoolId, ["teacher"], { name: "Tamsin Teacher" });
  const moderator = makeUser(schoolId, ["moderator"], { name: "Morwenna Moderator" });
  const student = makeUser(schoolId, ["student"], { name: "Sasha Student" });
  const otherStudent = makeUser(schoolId, ["student"], { name: "Soren Student" });
  const parent = makeUser(schoolId, ["parent"], { name: "Pippa Parent" });
  const taughtClass = makeClass(schoolId, { name: "9X Chemistry", teachers: [teacher], students: [student] });
  const otherClass = makeClass(schoolId, { name: "9Y Chemistry", teachers: [otherTeacher], students: [otherStudent] });
  linkParentDirect(parent, student);

  const elsewhereId = makeSchool("Quarry Hill College");
  const elsewhere = {
    schoolId: elsewhereId,
    admin: makeUser(elsewhereId, ["admin"], { name: "Ansel Admin" }),
    teacher: makeUser(elsewhereId, ["teacher"], { name: "Thea Teacher" }),
    student: makeUser(elsewhereId, ["student"], { name: "Silas Student" }),
    parent: makeUser(elsewhereId, ["parent"], { name: "Piers Parent" }),
  };
  const elsewhereClass = makeClass(elsewhereId, { name: "9Z Chemistry", teachers: [elsewhere.teacher], students: [elsewhere.student] });
  linkParentDirect(elsewhere.parent, elsewhere.student);

  return { schoolId, admin, teacher, otherTeacher, moderator, student, otherStudent, parent, taughtClass, otherClass, elsewhere, elsewhereClass };
}

export type TwoSchools = ReturnType<typeof twoSchools>;

/** Every role in the home school plus the other school's admin, for "only X may" loops. */
export function everyone(s: TwoSchools): Record<string, Actor> {
  return {
    admin: s.admin,
    teacher: s.teacher,
    student: s.student,
    moderator: s.moderator,
    parent: s.parent,
    "admin of another school": s.elsewhere.admin,
  };
}

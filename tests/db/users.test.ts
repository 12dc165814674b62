import { beforeEach, describe, expect, it } from "vitest";
import { createUser, findUserForSignIn, getOwnAccount, getUserDetail, listPeopleWithRole, listUsers, loadActor, updateUser } from "@/db/queries/users";
import { AppError } from "@/lib/errors";
import { auditEntries, freshDatabase, makeSchool, makeUser } from "../helpers/db";
import { expectRefused } from "../helpers/errors";
import { twoSchools, type TwoSchools } from "../helpers/schools";

describe("people (data-access layer)", () => {
  let schoolId: string;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
  });

  it("lets an admin create a person with several roles and records it in the audit log", () => {
    const admin = makeUser(schoolId, ["admin"]);
    const id = createUser({ actor: admin, input: { name: "Ada Quill", email: "ada@test.example", roles: ["teacher", "moderator"] } });
    expect([...(loadActor(id)?.roles ?? [])].sort()).toEqual(["moderator", "teacher"]);
    const audit = auditEntries(id);
    expect(audit).toHaveLength(1);
    expect(audit[0]!.action).toBe("user.create");
  });

  it("refuses a duplicate e-mail with a 409 and a field message, writing nothing", () => {
    const admin = makeUser(schoolId, ["admin"]);
    makeUser(schoolId, ["student"], { email: "taken@test.example" });
    const before = listUsers({ actor: admin }).length;
    const err = (() => {
      try {
        createUser({ actor: admin, input: { name: "X", email: "taken@test.example", roles: ["student"] } });
      } catch (e) {
        return e as AppError;
      }
    })();
    expect(err).toBeInstanceOf(AppError);
    expect(err!.status).toBe(409);
    expect(err!.fieldErrors?.email?.[0]).toMatch(/already uses/);
    expect(listUsers({ actor: admin })).toHaveLength(before);
  });

  it("refuses everyone but an admin", () => {
    for (const role of ["teacher", "student", "moderator", "parent"] as const) {
      const actor = makeUser(schoolId, [role]);
      expect(() => listUsers({ actor })).toThrowError(expect.objectContaining({ code: "forbidden" }));
      expect(() => createUser({ actor, input: { name: "X", email: `x-${role}@test.example`, roles: ["student"] } })).toThrowError(expect.objectContaining({ code: "forbidden" }));
    }
  });

  it("never shows or changes people from another school", () => {
    const admin = makeUser(schoolId, ["admin"]);
    const otherSchool = makeSchool();
    const outsider = makeUser(otherSchool, ["student"]);
    expect(listUsers({ actor: admin }).some((u) => u.id === outsider.userId)).toBe(false);
    expect(() => updateUser({ actor: admin, userId: outsider.userId, input: { name: "Changed" } })).toThrowError(expect.objectContaining({ code: "not_found" }));
  });

  it("deactivating a person signs them out at once (loadActor returns null)", () => {
    const admin = makeUser(schoolId, ["admin"]);
    const student = makeUser(schoolId, ["student"]);
    updateUser({ actor: admin, userId: student.userId, input: { active: false } });
    expect(loadActor(student.userId)).toBeNull();
    expect(auditEntries(student.userId).map((a) => a.action)).toContain("user.deactivate");
  });

  it("stops an admin from locking themselves out", () => {
    const admin = makeUser(schoolId, ["admin"]);
    expect(() => updateUser({ actor: admin, userId: admin.userId, input: { active: false } })).toThrowError(/own account/);
    expect(() => updateUser({ actor: admin, userId: admin.userId, input: { roles: ["teacher"] } })).toThrowError(/own admin role/);
  });
});

describe("people: every role, and the other school", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
  });

  it("lets only an admin read, list or change people", () => {
    for (const actor of [s.teacher, s.student, s.moderator, s.parent]) {
      expectRefused(() => getUserDetail({ actor, userId: s.student.userId }), "forbidden");
      expectRefused(() => listPeopleWithRole({ actor, role: "student" }), "forbidden");
      expectRefused(() => updateUser({ actor, userId: actor.userId, input: { roles: ["admin"] } }), "forbidden");
      expectRefused(() => updateUser({ actor, userId: s.student.userId, input: { name: "Changed" } }), "forbidden");
    }
    expect(loadActor(s.teacher.userId)?.roles).toEqual(["teacher"]);
    expect(getUserDetail({ actor: s.admin, userId: s.student.userId }).name).toBe("Sasha Student");
  });

  it("shows an admin a person's classes and family, but not another school's person", () => {
    const detail = getUserDetail({ actor: s.admin, userId: s.student.userId });
    expect(detail.studiesIn.map((c) => c.name)).toEqual(["9X Chemistry"]);
    expect(detail.guardians.map((g) => g.name)).toEqual(["Pippa Parent"]);
    expect(getUserDetail({ actor: s.admin, userId: s.parent.userId }).children.map((c) => c.name)).toEqual(["Sasha Student"]);
    expectRefused(() => getUserDetail({ actor: s.elsewhere.admin, userId: s.student.userId }), "not_found");
  });

  it("lists people for pickers from the admin's own school only", () => {
    expect(listPeopleWithRole({ actor: s.admin, role: "student" }).map((p) => p.name)).toEqual(["Sasha Student", "Soren Student"]);
    expect(listPeopleWithRole({ actor: s.elsewhere.admin, role: "student" }).map((p) => p.name)).toEqual(["Silas Student"]);
  });

  it("lets everyone read their own account, and only their own", () => {
    for (const actor of [s.admin, s.teacher, s.student, s.moderator, s.parent]) {
      const own = getOwnAccount(actor);
      expect(own.email).toBe(actor.email);
      expect(own.roles).toEqual(actor.roles);
    }
  });

  it("treats a deactivated account as signed out, and finds it for sign-in whatever the e-mail's case", () => {
    const quiet = makeUser(s.schoolId, ["teacher"], { active: false });
    expect(loadActor(quiet.userId)).toBeNull();
    expect(findUserForSignIn(quiet.email.toUpperCase())?.active).toBe(false);
  });
});

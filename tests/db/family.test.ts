import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { classes } from "@/db/schema";
import { isParentOf, linkParent, listChildren, unlinkParent } from "@/db/queries/family";
import { auditEntries, countRows, freshDatabase, makeClass, makeUser, testDb } from "../helpers/db";
import { expectRefused } from "../helpers/errors";
import { twoSchools, type TwoSchools } from "../helpers/schools";

describe("family links", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
  });

  it("lets an admin link a parent to a student, with an audit entry", () => {
    linkParent({ actor: s.admin, parentId: s.parent.userId, studentId: s.otherStudent.userId, relationship: "Guardian" });
    expect(listChildren({ actor: s.parent }).map((c) => [c.name, c.relationship])).toEqual([
      ["Sasha Student", "Parent"],
      ["Soren Student", "Guardian"],
    ]);
    const audit = auditEntries(s.otherStudent.userId);
    expect(audit.map((a) => a.action)).toEqual(["family.link"]);
    expect(audit[0]!.actorId).toBe(s.admin.userId);
  });

  it("refuses linking and unlinking to everyone but an admin", () => {
    const before = countRows("parent_links");
    for (const actor of [s.teacher, s.student, s.moderator, s.parent]) {
      expectRefused(() => linkParent({ actor, parentId: s.parent.userId, studentId: s.otherStudent.userId, relationship: "Parent" }), "forbidden");
      expectRefused(() => unlinkParent({ actor, parentId: s.parent.userId, studentId: s.student.userId }), "forbidden");
    }
    expect(countRows("parent_links")).toBe(before);
  });

  it("refuses links across schools, in either direction and from either admin", () => {
    const before = countRows("parent_links");
    expectRefused(() => linkParent({ actor: s.admin, parentId: s.elsewhere.parent.userId, studentId: s.student.userId, relationship: "Parent" }), "bad_request");
    expectRefused(() => linkParent({ actor: s.admin, parentId: s.parent.userId, studentId: s.elsewhere.student.userId, relationship: "Parent" }), "bad_request");
    expectRefused(() => linkParent({ actor: s.elsewhere.admin, parentId: s.parent.userId, studentId: s.student.userId, relationship: "Parent" }), "bad_request");
    expectRefused(() => unlinkParent({ actor: s.elsewhere.admin, parentId: s.parent.userId, studentId: s.student.userId }), "not_found");
    expect(countRows("parent_links")).toBe(before);
    expect(isParentOf(testDb(), s.parent, s.student.userId)).toBe(true);
  });

  it("refuses links to people who do not hold the parent or student role", () => {
    expectRefused(() => linkParent({ actor: s.admin, parentId: s.teacher.userId, studentId: s.student.userId, relationship: "Parent" }), "bad_request");
    expectRefused(() => linkParent({ actor: s.admin, parentId: s.parent.userId, studentId: s.teacher.userId, relationship: "Parent" }), "bad_request");
    const both = makeUser(s.schoolId, ["parent", "student"]);
    expectRefused(() => linkParent({ actor: s.admin, parentId: both.userId, studentId: both.userId, relationship: "Parent" }), "bad_request");
  });

  it("refuses a second link between the same two people (409)", () => {
    expectRefused(() => linkParent({ actor: s.admin, parentId: s.parent.userId, studentId: s.student.userId, relationship: "Mother" }), "conflict");
  });

  it("lets an admin unlink, after which the parent no longer sees the child", () => {
    unlinkParent({ actor: s.admin, parentId: s.parent.userId, studentId: s.student.userId });
    expect(listChildren({ actor: s.parent })).toEqual([]);
    expect(isParentOf(testDb(), s.parent, s.student.userId)).toBe(false);
    expect(auditEntries(s.student.userId).map((a) => a.action)).toEqual(["family.unlink"]);
    expectRefused(() => unlinkParent({ actor: s.admin, parentId: s.parent.userId, studentId: s.student.userId }), "not_found");
  });
});

describe("listChildren", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
  });

  it("lists only the parent's own children, with their current classes", () => {
    const children = listChildren({ actor: s.parent });
    expect(children).toEqual([
      { id: s.student.userId, name: "Sasha Student", yearGroup: 10, relationship: "Parent", classes: [{ id: s.taughtClass, name: "9X Chemistry", subject: "Chemistry" }] },
    ]);
    expect(listChildren({ actor: s.elsewhere.parent }).map((c) => c.name)).toEqual(["Silas Student"]);
  });

  it("gives a parent with no linked children an empty list", () => {
    expect(listChildren({ actor: makeUser(s.schoolId, ["parent"]) })).toEqual([]);
  });

  it("leaves out archived classes", () => {
    const archived = makeClass(s.schoolId, { name: "8X Science", students: [s.student] });
    testDb().update(classes).set({ archived: true }).where(eq(classes.id, archived)).run();
    expect(listChildren({ actor: s.parent })[0]!.classes.map((c) => c.name)).toEqual(["9X Chemistry"]);
  });

  it("refuses anyone who is not a parent", () => {
    for (const actor of [s.admin, s.teacher, s.student, s.moderator]) expectRefused(() => listChildren({ actor }), "forbidden");
  });
});

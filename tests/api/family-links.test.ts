import { beforeEach, describe, expect, it, vi } from "vitest";
import type { Actor } from "@/lib/auth/actor";
import * as family from "@/app/api/family-links/route";
import * as person from "@/app/api/users/[id]/route";
import { auditEntries, freshDatabase, makeSchool, makeUser } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call, rowCount } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

describe("/api/family-links", () => {
  let schoolId: string;
  let parent: Actor;
  let student: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    signInAs(makeUser(schoolId, ["admin"]));
    parent = makeUser(schoolId, ["parent"], { name: "Keziah Ingleby" });
    student = makeUser(schoolId, ["student"], { name: "Florian Ingleby" });
  });

  const link = (body: unknown) => call(family.POST, apiRequest("/api/family-links", "POST", body));
  const unlink = (body: unknown) => call(family.DELETE, apiRequest("/api/family-links", "DELETE", body));

  it("links a parent to a student with the relationship, seen from both sides", async () => {
    const res = await link({ parentId: parent.userId, studentId: student.userId, relationship: "Grandmother" });
    expect(res.status).toBe(201);
    const s = await call(person.GET, apiRequest(`/api/users/${student.userId}`), { id: student.userId });
    expect(s.body.person.guardians).toEqual([expect.objectContaining({ id: parent.userId, relationship: "Grandmother" })]);
    const p = await call(person.GET, apiRequest(`/api/users/${parent.userId}`), { id: parent.userId });
    expect(p.body.person.children).toEqual([expect.objectContaining({ id: student.userId, relationship: "Grandmother" })]);
    expect(auditEntries(student.userId).map((a) => a.action)).toEqual(["family.link"]);
  });

  it("uses Parent when no relationship is given, and refuses linking the same pair twice (409)", async () => {
    expect((await link({ parentId: parent.userId, studentId: student.userId })).status).toBe(201);
    const again = await link({ parentId: parent.userId, studentId: student.userId, relationship: "Father" });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already linked/);
    expect(rowCount("parent_links")).toBe(1);
  });

  it("refuses people in the wrong role, naming the field", async () => {
    const teacher = makeUser(schoolId, ["teacher"]);
    const asParent = await link({ parentId: teacher.userId, studentId: student.userId });
    expect(asParent.status).toBe(400);
    expect(asParent.body.error.fieldErrors.parentId[0]).toMatch(/parent or guardian/);
    const asStudent = await link({ parentId: parent.userId, studentId: teacher.userId });
    expect(asStudent.status).toBe(400);
    expect(asStudent.body.error.fieldErrors.studentId[0]).toMatch(/student/);
    const longRelationship = await link({ parentId: parent.userId, studentId: student.userId, relationship: "x".repeat(41) });
    expect(longRelationship.status).toBe(400);
    expect(longRelationship.body.error.fieldErrors.relationship[0]).toMatch(/Keep the relationship short/);
    const missing = await link({ studentId: student.userId });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fieldErrors.parentId).toBeDefined();
    expect(rowCount("parent_links")).toBe(0);
  });

  it("unlinks, keeping both accounts, and answers 404 for a link that does not exist", async () => {
    await link({ parentId: parent.userId, studentId: student.userId });
    const users = rowCount("users");
    const res = await unlink({ parentId: parent.userId, studentId: student.userId });
    expect(res.status).toBe(200);
    expect(rowCount("parent_links")).toBe(0);
    expect(rowCount("users")).toBe(users);
    const again = await unlink({ parentId: parent.userId, studentId: student.userId });
    expect(again.status).toBe(404);
  });
});

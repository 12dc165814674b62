import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { auditLog, mailMessages } from "@/db/schema";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import type { Actor } from "@/lib/auth/actor";
import * as audit from "@/app/api/audit/route";
import * as classItem from "@/app/api/classes/[id]/route";
import * as outboxItem from "@/app/api/outbox/[id]/route";
import * as outbox from "@/app/api/outbox/route";
import * as invitation from "@/app/api/users/[id]/invitation/route";
import * as person from "@/app/api/users/[id]/route";
import { freshDatabase, makeClass, makeSchool, makeUser, testDb } from "../helpers/db";
import { signInAs } from "../helpers/session";
import { apiRequest, call, expectNoSecrets } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

let smtp: { close: () => Promise<void> };
beforeAll(async () => {
  smtp = await startFakeSmtp(0);
});
afterAll(async () => {
  await smtp.close();
});

describe("/api/outbox", () => {
  let schoolId: string;
  let admin: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"]);
    signInAs(admin);
  });

  it("lists caught invitations newest first, filters by recipient, and shows the text body only", async () => {
    const a = makeUser(schoolId, ["teacher"], { email: "ines.valdivia@test.example" });
    const b = makeUser(schoolId, ["parent"], { email: "rohan.mabry@test.example" });
    await call(invitation.POST, apiRequest(`/api/users/${a.userId}/invitation`, "POST"), { id: a.userId });
    await call(invitation.POST, apiRequest(`/api/users/${b.userId}/invitation`, "POST"), { id: b.userId });
    const list = await call(outbox.GET, apiRequest("/api/outbox"));
    expect(list.status).toBe(200);
    expect(list.body.messages.map((m: { to: string }) => m.to).sort()).toEqual(["ines.valdivia@test.example", "rohan.mabry@test.example"]);
    expect(list.body.messages[0]).toMatchObject({ subject: expect.stringMatching(/Meniscus account/), attachments: [] });
    const filtered = await call(outbox.GET, apiRequest("/api/outbox?to=INES"));
    expect(filtered.body.messages).toHaveLength(1);

    const id = filtered.body.messages[0].id;
    const one = await call(outboxItem.GET, apiRequest(`/api/outbox/${id}`), { id });
    expect(one.status).toBe(200);
    expect(one.body.message.text).toMatch(/\/invitation\?token=/);
    expect(one.body.message).not.toHaveProperty("html");
    expect(one.body.message).not.toHaveProperty("raw");
  });

  it("puts the newest message first", async () => {
    const db = testDb();
    for (const [subject, at] of [["Older", 1_000], ["Newest", 3_000], ["Middle", 2_000]] as const) {
      db.insert(mailMessages).values({ schoolId, from: "x@meniscus.invalid", to: "kit@test.example", subject, text: "t", raw: "t", receivedAt: new Date(Date.UTC(2026, 11, 1) + at) }).run();
    }
    const list = await call(outbox.GET, apiRequest("/api/outbox"));
    expect(list.body.messages.map((m: { subject: string }) => m.subject)).toEqual(["Newest", "Middle", "Older"]);
  });

  it("answers 404 for a message id that does not exist, and 400 for an over-long filter", async () => {
    expect((await call(outboxItem.GET, apiRequest("/api/outbox/nothing"), { id: "nothing" })).status).toBe(404);
    const long = await call(outbox.GET, apiRequest(`/api/outbox?to=${"a".repeat(300)}`));
    expect(long.status).toBe(400);
    expect(long.body.error.fieldErrors.to[0]).toMatch(/at most 254/);
  });

  it("shows only the admin's own school's messages: neither another school's nor unscoped ones", async () => {
    const db = testDb();
    db.insert(mailMessages).values({ schoolId: null, from: "x@meniscus.invalid", to: "someone@test.example", subject: "No school", text: "t", raw: "t" }).run();
    db.insert(mailMessages).values({ schoolId: makeSchool(), from: "x@meniscus.invalid", to: "other@test.example", subject: "Other school", text: "t", raw: "t" }).run();
    db.insert(mailMessages).values({ schoolId, from: "x@meniscus.invalid", to: "mine@test.example", subject: "Ours", text: "t", raw: "t" }).run();
    const list = await call(outbox.GET, apiRequest("/api/outbox"));
    expect(list.body.messages.map((m: { subject: string }) => m.subject)).toEqual(["Ours"]);
  });
});

describe("/api/audit", () => {
  let schoolId: string;
  let admin: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"], { name: "Dana Admin" });
    signInAs(admin);
  });

  it("lists changes newest first with who did them and names for the ids they mention", async () => {
    const teacher = makeUser(schoolId, ["teacher"], { name: "Suki Esterhuizen" });
    const student = makeUser(schoolId, ["student"], { name: "Lorcan Penhaligon" });
    const classId = makeClass(schoolId, { name: "12A Chemistry" });
    await call(person.PATCH, apiRequest(`/api/users/${student.userId}`, "PATCH", { name: "Lorcan Penhaligon-Fay" }), { id: student.userId });
    await call(classItem.PATCH, apiRequest(`/api/classes/${classId}`, "PATCH", { teacherIds: [teacher.userId] }), { id: classId });

    const res = await call(audit.GET, apiRequest("/api/audit"));
    expect(res.status).toBe(200);
    expectNoSecrets(res.text);
    const [newest, older] = res.body.entries;
    expect(newest).toMatchObject({ action: "class.update", entityType: "class", entityId: classId, actorName: "Dana Admin" });
    expect(newest.after.teacherIds).toEqual([teacher.userId]);
    expect(older).toMatchObject({ action: "user.update", entityId: student.userId, before: { name: "Lorcan Penhaligon" }, after: { name: "Lorcan Penhaligon-Fay" } });
    expect(res.body.names).toMatchObject({ [classId]: "12A Chemistry", [teacher.userId]: "Suki Esterhuizen", [student.userId]: "Lorcan Penhaligon-Fay" });
    expect(res.body.entityTypes).toEqual(["class", "user"]);
    expect(res.body.hasMore).toBe(false);
  });

  it("filters by kind of record and by record, and pages with a limit", async () => {
    const a = makeUser(schoolId, ["student"]);
    const b = makeUser(schoolId, ["student"]);
    const classId = makeClass(schoolId);
    await call(person.PATCH, apiRequest(`/api/users/${a.userId}`, "PATCH", { yearGroup: 11 }), { id: a.userId });
    await call(person.PATCH, apiRequest(`/api/users/${b.userId}`, "PATCH", { yearGroup: 12 }), { id: b.userId });
    await call(classItem.PATCH, apiRequest(`/api/classes/${classId}`, "PATCH", { subject: "Physics" }), { id: classId });
    const users = await call(audit.GET, apiRequest("/api/audit?entityType=user"));
    expect(users.body.entries.map((e: { entityType: string }) => e.entityType)).toEqual(["user", "user"]);
    const justA = await call(audit.GET, apiRequest(`/api/audit?entityId=${a.userId}`));
    expect(justA.body.entries).toHaveLength(1);
    const firstPage = await call(audit.GET, apiRequest("/api/audit?limit=2"));
    expect(firstPage.body.entries).toHaveLength(2);
    expect(firstPage.body.hasMore).toBe(true);
  });

  it("refuses a malformed filter with 400, and never shows another school's entries", async () => {
    const bad = await call(audit.GET, apiRequest("/api/audit?entityType=Robert'); DROP TABLE users;--"));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.entityType[0]).toMatch(/not known/);
    const tooMany = await call(audit.GET, apiRequest("/api/audit?limit=5000"));
    expect(tooMany.status).toBe(400);
    const otherSchool = makeSchool();
    testDb().insert(auditLog).values({ schoolId: otherSchool, actorId: null, action: "user.create", entityType: "user", entityId: "x" }).run();
    const res = await call(audit.GET, apiRequest("/api/audit"));
    expect(res.body.entries).toEqual([]);
  });
});

import { beforeEach, describe, expect, it } from "vitest";
import { listAudit, recordAudit } from "@/db/queries/audit";
import { getOutboxMessage, listOutbox, storeReceivedMail } from "@/db/queries/outbox";
import { freshDatabase, testDb } from "../helpers/db";
import { expectRefused } from "../helpers/errors";
import { twoSchools, type TwoSchools } from "../helpers/schools";

function mail(schoolId: string | null, to: string, subject: string, receivedAt: Date) {
  storeReceivedMail({ schoolId, from: "Meniscus <no-reply@meniscus.invalid>", to, subject, text: `About ${subject}`, raw: `Subject: ${subject}\r\n\r\n`, receivedAt });
}

describe("the outbox of the built-in mail catcher", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
    mail(s.schoolId, "sasha@test.example", "Your account at Larchfield", new Date("2026-09-01T08:00:00Z"));
    mail(s.schoolId, "pippa@test.example", "Work returned", new Date("2026-09-02T08:00:00Z"));
    mail(s.elsewhere.schoolId, "silas@test.example", "Your account at Quarry Hill", new Date("2026-09-03T08:00:00Z"));
  });

  it("shows an admin their own school's messages, newest first, and never another school's", () => {
    expect(listOutbox({ actor: s.admin }).map((m) => m.subject)).toEqual(["Work returned", "Your account at Larchfield"]);
    expect(listOutbox({ actor: s.elsewhere.admin }).map((m) => m.subject)).toEqual(["Your account at Quarry Hill"]);
  });

  it("filters by recipient, case-insensitively", () => {
    expect(listOutbox({ actor: s.admin, to: " PIPPA@" }).map((m) => m.to)).toEqual(["pippa@test.example"]);
    expect(listOutbox({ actor: s.admin, to: "silas" })).toEqual([]);
  });

  it("opens one of the school's messages, and answers 404 for another school's", () => {
    const [theirs] = listOutbox({ actor: s.elsewhere.admin });
    const [ours] = listOutbox({ actor: s.admin });
    expect(getOutboxMessage({ actor: s.admin, id: ours!.id }).text).toBe("About Work returned");
    expectRefused(() => getOutboxMessage({ actor: s.admin, id: theirs!.id }), "not_found");
  });

  it("refuses everyone but an admin", () => {
    const [ours] = listOutbox({ actor: s.admin });
    for (const actor of [s.teacher, s.student, s.moderator, s.parent]) {
      expectRefused(() => listOutbox({ actor }), "forbidden");
      expectRefused(() => getOutboxMessage({ actor, id: ours!.id }), "forbidden");
    }
  });
});

describe("the audit trail", () => {
  let s: TwoSchools;
  beforeEach(() => {
    freshDatabase();
    s = twoSchools();
    const db = testDb();
    recordAudit(db, { schoolId: s.schoolId, actorId: s.admin.userId, action: "user.update", entityType: "user", entityId: s.student.userId, before: { name: "Sasha" }, after: { name: "Sasha Student" } });
    recordAudit(db, { schoolId: s.schoolId, actorId: null, action: "class.create", entityType: "class", entityId: s.taughtClass });
    recordAudit(db, { schoolId: s.elsewhere.schoolId, actorId: s.elsewhere.admin.userId, action: "user.update", entityType: "user", entityId: s.elsewhere.student.userId });
  });

  it("shows an admin their own school's entries, newest first, with who and what changed", () => {
    const entries = listAudit({ actor: s.admin });
    expect(entries.map((e) => e.action)).toEqual(["class.create", "user.update"]);
    expect(entries[1]).toMatchObject({ actorName: "Audrey Admin", before: { name: "Sasha" }, after: { name: "Sasha Student" } });
    expect(entries[0]!.actorName).toBeNull();
    expect(listAudit({ actor: s.elsewhere.admin }).map((e) => e.entityId)).toEqual([s.elsewhere.student.userId]);
  });

  it("filters by entity, still within the school", () => {
    expect(listAudit({ actor: s.admin, entityType: "user", entityId: s.student.userId })).toHaveLength(1);
    expect(listAudit({ actor: s.admin, entityType: "user", entityId: s.elsewhere.student.userId })).toEqual([]);
  });

  it("refuses everyone but an admin", () => {
    for (const actor of [s.teacher, s.student, s.moderator, s.parent]) expectRefused(() => listAudit({ actor }), "forbidden");
  });
});

import { beforeEach, describe, expect, it, vi } from "vitest";
import * as sessionItem from "@/app/api/lab-sessions/[id]/route";
import * as sessionList from "@/app/api/lab-sessions/route";
import { createPractical, publishVersion, saveDraft } from "@/db/queries/practicals";
import type { Actor } from "@/lib/auth/actor";
import { auditEntries, freshDatabase, makeClass, makeSchool, makeUser } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";
import { signInAs } from "../helpers/session";
import { apiRequest, call } from "./helpers";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

const DAY = 86_400_000;
const meta = { title: "Catalase and hydrogen peroxide", topic: "Enzymes and rates", yearGroup: 10, subject: "Chemistry" };

describe("/api/lab-sessions", () => {
  let schoolId: string;
  let admin: Actor;
  let teacher: Actor;
  let colleague: Actor;
  let students: Actor[];
  let outsider: Actor;
  let ownClass: string;
  let otherClass: string;
  let publishedVersion: string;
  let draftVersion: string;

  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    admin = makeUser(schoolId, ["admin"]);
    teacher = makeUser(schoolId, ["teacher"], { name: "Wren Abernathy" });
    colleague = makeUser(schoolId, ["teacher"], { name: "Osric Pellow" });
    students = ["Ada", "Bram", "Cleo", "Dov", "Esme"].map((n) => makeUser(schoolId, ["student"], { name: `${n} Quill` }));
    outsider = makeUser(schoolId, ["student"], { name: "Fenn Oakes" });
    ownClass = makeClass(schoolId, { name: "10X Chemistry", teachers: [teacher], students });
    otherClass = makeClass(schoolId, { name: "10Y Chemistry", teachers: [colleague], students: [outsider] });
    const pub = createPractical({ actor: teacher, input: meta });
    const { revision } = saveDraft({ actor: teacher, versionId: pub.versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } });
    publishVersion({ actor: teacher, versionId: pub.versionId, revision });
    publishedVersion = pub.versionId;
    draftVersion = createPractical({ actor: teacher, input: { ...meta, title: "Unfinished practical" } }).versionId;
    signInAs(teacher);
  });

  const body = (over: Record<string, unknown> = {}) => ({
    classId: ownClass,
    practicalVersionId: publishedVersion,
    opensAt: new Date(Date.now() + DAY).toISOString(),
    dueAt: new Date(Date.now() + 8 * DAY).toISOString(),
    grouping: "individual",
    lateWork: "accept-flagged",
    lateDays: 7,
    notes: "Bring your lab book.",
    ...over,
  });
  const schedule = (b: unknown) => call(sessionList.POST, apiRequest("/api/lab-sessions", "POST", b));
  const list = () => call(sessionList.GET, apiRequest("/api/lab-sessions"));
  const get = (id: string) => call(sessionItem.GET, apiRequest(`/api/lab-sessions/${id}`), { id });
  const put = (id: string, b: unknown) => call(sessionItem.PUT, apiRequest(`/api/lab-sessions/${id}`, "PUT", b), { id });
  const cancel = (id: string) => call(sessionItem.DELETE, apiRequest(`/api/lab-sessions/${id}`, "DELETE"), { id });

  it("a teacher schedules a published practical for their own class, and it is recorded", async () => {
    const res = await schedule(body());
    expect(res.status).toBe(201);
    const detail = await get(res.body.id);
    expect(detail.status).toBe(200);
    expect(detail.body).toMatchObject({ classId: ownClass, className: "10X Chemistry", title: meta.title, state: "upcoming", notes: "Bring your lab book.", canManage: true });
    expect(auditEntries(res.body.id).map((a) => a.action)).toEqual(["lab-session.schedule"]);
  });

  it("refuses a teacher who does not teach the class (403, with the class field named)", async () => {
    const res = await schedule(body({ classId: otherClass }));
    expect(res.status).toBe(403);
    expect(res.body.error.fieldErrors.classId[0]).toMatch(/your own classes/);
    signInAs(colleague);
    expect((await schedule(body({ classId: otherClass }))).status).toBe(201);
  });

  it("lets an admin schedule for any class, and refuses students", async () => {
    signInAs(admin);
    expect((await schedule(body({ classId: otherClass }))).status).toBe(201);
    signInAs(students[0]!);
    expect((await schedule(body())).status).toBe(403);
  });

  it("refuses a due date before the opening date, with the message at dueAt", async () => {
    const res = await schedule(body({ opensAt: new Date(Date.now() + 5 * DAY).toISOString(), dueAt: new Date(Date.now() + 2 * DAY).toISOString() }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.dueAt).toEqual(["The due date must be after the opening date."]);
  });

  it("refuses missing dates with a message at each date", async () => {
    const res = await schedule(body({ opensAt: undefined, dueAt: "not a date" }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.opensAt[0]).toMatch(/opens/);
    expect(res.body.error.fieldErrors.dueAt[0]).toMatch(/due/);
  });

  it("refuses an unpublished version, naming the practical field", async () => {
    const res = await schedule(body({ practicalVersionId: draftVersion }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.practicalVersionId[0]).toMatch(/Publish/);
    expect((await list()).body.labSessions).toHaveLength(0);
  });

  it("checks groups: only students of the class, each in one group, at least one group", async () => {
    const [a, b, c] = students;
    const outside = await schedule(body({ grouping: "groups", groups: [{ id: "g1", name: "Group 1", studentIds: [a!.userId, outsider.userId] }] }));
    expect(outside.status).toBe(400);
    expect(outside.body.error.fieldErrors["groups.0.studentIds"][0]).toMatch(/in this class/);
    const twice = await schedule(
      body({
        grouping: "groups",
        groups: [
          { id: "g1", name: "Group 1", studentIds: [a!.userId, b!.userId] },
          { id: "g2", name: "Group 2", studentIds: [b!.userId, c!.userId] },
        ],
      }),
    );
    expect(twice.status).toBe(400);
    expect(twice.body.error.fieldErrors["groups.1.studentIds"][0]).toMatch(/only be in one group/);
    const none = await schedule(body({ grouping: "groups", groups: [] }));
    expect(none.body.error.fieldErrors.groups[0]).toMatch(/at least one group/);
    const ok = await schedule(body({ grouping: "groups", groups: [{ id: "g1", name: "Bench A", studentIds: [a!.userId, b!.userId] }] }));
    expect(ok.status).toBe(201);
  });

  it("a student sees only their own classes' lab sessions, and only their own group", async () => {
    const [a, b, c, d] = students;
    const mine = await schedule(
      body({
        grouping: "groups",
        groups: [
          { id: "g1", name: "Bench A", studentIds: [a!.userId, b!.userId] },
          { id: "g2", name: "Bench B", studentIds: [c!.userId, d!.userId] },
        ],
      }),
    );
    signInAs(colleague);
    const theirs = await schedule(body({ classId: otherClass }));
    signInAs(a!);
    const seen = await list();
    expect(seen.body.labSessions.map((s: { id: string }) => s.id)).toEqual([mine.body.id]);
    const detail = await get(mine.body.id);
    expect(detail.body.canManage).toBe(false);
    expect(detail.body.groups).toEqual([{ id: "g1", name: "Bench A", studentIds: [a!.userId, b!.userId] }]);
    expect((await get(theirs.body.id)).status).toBe(403);
    signInAs(outsider);
    expect((await list()).body.labSessions.map((s: { id: string }) => s.id)).toEqual([theirs.body.id]);
  });

  it("changes dates and rules with PUT, but not the class or the practical", async () => {
    const id = (await schedule(body())).body.id;
    const due = new Date(Date.now() + 10 * DAY).toISOString();
    const res = await put(id, body({ dueAt: due, lateWork: "refuse", lateDays: 0 }));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ lateWork: "refuse", dueAt: due });
    const moved = await put(id, body({ classId: otherClass }));
    expect(moved.status).toBe(400);
    expect(moved.body.error.message).toMatch(/cannot change/);
    signInAs(colleague);
    expect((await put(id, body())).status).toBe(403);
  });

  it("cancelling hides the lab session from students but keeps it for the teacher", async () => {
    const id = (await schedule(body())).body.id;
    signInAs(students[0]!);
    expect((await list()).body.labSessions).toHaveLength(1);
    expect((await cancel(id)).status).toBe(403);
    signInAs(teacher);
    expect((await cancel(id)).status).toBe(200);
    expect((await get(id)).body.state).toBe("cancelled");
    expect((await list()).body.labSessions.map((s: { id: string; cancelledAt: string | null }) => [s.id, s.cancelledAt !== null])).toEqual([[id, true]]);
    signInAs(students[0]!);
    expect((await list()).body.labSessions).toHaveLength(0);
    expect((await get(id)).status).toBe(404);
  });
});

import { beforeEach, describe, expect, it } from "vitest";
import { getLabSession, labSessionState, listLabSessions, scheduleLabSession } from "@/db/queries/lab-sessions";
import {
  createPractical,
  duplicatePractical,
  getPracticalDetail,
  getPracticalVersion,
  listPracticals,
  publishVersion,
  saveDraft,
  startNewDraft,
} from "@/db/queries/practicals";
import { createRubric, updateRubric } from "@/db/queries/rubrics";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { labSessionSchema, practicalContentSchema } from "@/lib/validation/practicals";
import { auditEntries, freshDatabase, makeClass, makeSchool, makeUser } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";

function catchErr(fn: () => unknown): AppError {
  try {
    fn();
  } catch (e) {
    return e as AppError;
  }
  throw new Error("expected an error");
}

describe("practicals: authoring, versions and scheduling", () => {
  let schoolId: string;
  let teacher: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool();
    teacher = makeUser(schoolId, ["teacher"]);
  });

  const meta = { title: "Gas from acid and metal", topic: "Rates of reaction", yearGroup: 10, subject: "Chemistry" };

  function publishedPractical(author = teacher) {
    const { practicalId, versionId } = createPractical({ actor: author, input: meta });
    const { revision } = saveDraft({ actor: author, versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } });
    publishVersion({ actor: author, versionId, revision });
    return { practicalId, versionId };
  }

  it("only teachers and admins author; moderators read; students and parents are refused", () => {
    const admin = makeUser(schoolId, ["admin"]);
    expect(createPractical({ actor: admin, input: meta }).versionId).toBeTruthy();
    for (const role of ["student", "parent", "moderator"] as const) {
      expect(catchErr(() => createPractical({ actor: makeUser(schoolId, [role]), input: meta })).code).toBe("forbidden");
    }
    expect(listPracticals({ actor: makeUser(schoolId, ["moderator"]) })).toHaveLength(1);
    expect(catchErr(() => listPracticals({ actor: makeUser(schoolId, ["student"]) })).code).toBe("forbidden");
  });

  it("a second save from the same revision is refused with 409 and the current content, losing nothing", () => {
    const { versionId } = createPractical({ actor: teacher, input: meta });
    const first = saveDraft({ actor: teacher, versionId, input: { ...meta, title: "Tab one", content: completePracticalContent(), revision: 0 } });
    expect(first.revision).toBe(1);
    const err = catchErr(() => saveDraft({ actor: teacher, versionId, input: { ...meta, title: "Tab two", content: completePracticalContent(), revision: 0 } }));
    expect(err.status).toBe(409);
    expect((err.detail as { current: { title: string } }).current.title).toBe("Tab one");
    expect(getPracticalVersion({ actor: teacher, versionId }).title).toBe("Tab one");
  });

  it("refuses to publish without a safety section, naming the field", () => {
    const { versionId } = createPractical({ actor: teacher, input: meta });
    const content = completePracticalContent();
    content.safety.hazards = [];
    const { revision } = saveDraft({ actor: teacher, versionId, input: { ...meta, content, revision: 0 } });
    const err = catchErr(() => publishVersion({ actor: teacher, versionId, revision }));
    expect(err.status).toBe(400);
    expect(err.fieldErrors?.["content.safety.hazards"]?.[0]).toMatch(/safety section/);
  });

  it("a published version never changes; editing makes a new draft, and write-ups keep their version", () => {
    const { practicalId, versionId } = publishedPractical();
    const err = catchErr(() => saveDraft({ actor: teacher, versionId, input: { ...meta, content: completePracticalContent(), revision: 1 } }));
    expect(err.status).toBe(409);
    const { versionId: v2, created } = startNewDraft({ actor: teacher, practicalId });
    expect(created).toBe(true);
    expect(v2).not.toBe(versionId);
    expect(startNewDraft({ actor: teacher, practicalId })).toEqual({ versionId: v2, created: false });
    saveDraft({ actor: teacher, versionId: v2, input: { ...meta, title: "Changed in v2", content: completePracticalContent(), revision: 0 } });
    expect(getPracticalVersion({ actor: teacher, versionId }).title).toBe(meta.title);
    expect(getPracticalDetail({ actor: teacher, practicalId }).versions.map((v) => [v.version, v.status])).toEqual([
      [2, "draft"],
      [1, "published"],
    ]);
    expect(auditEntries(practicalId).map((a) => a.action)).toEqual(expect.arrayContaining(["practical.create", "practical.publish", "practical.new-draft"]));
  });

  it("duplicates a practical into a new draft", () => {
    const { practicalId } = publishedPractical();
    const copy = duplicatePractical({ actor: teacher, practicalId });
    const v = getPracticalVersion({ actor: teacher, versionId: copy.versionId });
    expect(v.title).toBe(`Copy of ${meta.title}`);
    expect(v.status).toBe("draft");
    expect(v.content.checks).toHaveLength(2);
  });

  it("searches and filters the library by text, topic and year group, and never shows another school's", () => {
    publishedPractical();
    createPractical({ actor: teacher, input: { title: "Resistance of a wire", topic: "Electricity", yearGroup: 11, subject: "Physics" } });
    const otherTeacher = makeUser(makeSchool(), ["teacher"]);
    createPractical({ actor: otherTeacher, input: { ...meta, title: "Other school's practical" } });
    expect(listPracticals({ actor: teacher }).map((p) => p.title).sort()).toEqual(["Gas from acid and metal", "Resistance of a wire"]);
    expect(listPracticals({ actor: teacher, search: "wire" }).map((p) => p.title)).toEqual(["Resistance of a wire"]);
    expect(listPracticals({ actor: teacher, topic: "Rates of reaction" })).toHaveLength(1);
    expect(listPracticals({ actor: teacher, yearGroup: 11 })).toHaveLength(1);
    expect(listPracticals({ actor: teacher, search: "100%_" })).toHaveLength(0);
  });

  it("a teacher schedules only for their own classes, and only published versions", () => {
    const student = makeUser(schoolId, ["student"]);
    const own = makeClass(schoolId, { teachers: [teacher], students: [student] });
    const notMine = makeClass(schoolId, { teachers: [makeUser(schoolId, ["teacher"])] });
    const { versionId } = publishedPractical();
    const input = labSessionSchema.parse({ classId: own, practicalVersionId: versionId, opensAt: "2026-12-01T09:00:00Z", dueAt: "2026-12-08T16:00:00Z" });
    const id = scheduleLabSession({ actor: teacher, input });
    expect(listLabSessions({ actor: student, now: new Date("2026-12-02T10:00:00Z") }).map((s) => [s.id, s.state])).toEqual([[id, "open"]]);
    expect(getLabSession({ actor: student, labSessionId: id }).canManage).toBe(false);
    expect(catchErr(() => scheduleLabSession({ actor: teacher, input: { ...input, classId: notMine } })).code).toBe("forbidden");
    const draft = createPractical({ actor: teacher, input: meta }).versionId;
    expect(catchErr(() => scheduleLabSession({ actor: teacher, input: { ...input, practicalVersionId: draft } })).fieldErrors?.practicalVersionId?.[0]).toMatch(/Publish/);
    const outsider = makeUser(schoolId, ["student"]);
    expect(catchErr(() => getLabSession({ actor: outsider, labSessionId: id })).code).toBe("forbidden");
  });

  it("refuses groups with students from outside the class", () => {
    const inClass = makeUser(schoolId, ["student"]);
    const elsewhere = makeUser(schoolId, ["student"]);
    const cls = makeClass(schoolId, { teachers: [teacher], students: [inClass] });
    const { versionId } = publishedPractical();
    const input = labSessionSchema.parse({
      classId: cls,
      practicalVersionId: versionId,
      opensAt: "2026-12-01T09:00:00Z",
      dueAt: "2026-12-08T16:00:00Z",
      grouping: "groups",
      groups: [{ id: "g1", name: "Bench 1", studentIds: [inClass.userId, elsewhere.userId] }],
    });
    expect(catchErr(() => scheduleLabSession({ actor: teacher, input })).fieldErrors?.["groups.0.studentIds"]?.[0]).toMatch(/in this class/);
  });

  it("derives the state of a lab session from its dates and late-work rule", () => {
    const s = { opensAt: new Date("2026-12-01T09:00Z"), dueAt: new Date("2026-12-08T16:00Z"), lateWork: "accept-flagged", lateDays: 2, cancelledAt: null };
    expect(labSessionState(s, new Date("2026-11-30T09:00Z"))).toBe("upcoming");
    expect(labSessionState(s, new Date("2026-12-08T15:59Z"))).toBe("open");
    expect(labSessionState(s, new Date("2026-12-09T09:00Z"))).toBe("late");
    expect(labSessionState(s, new Date("2026-12-11T09:00Z"))).toBe("closed");
    expect(labSessionState({ ...s, lateWork: "refuse" }, new Date("2026-12-09T09:00Z"))).toBe("closed");
  });

  it("saves rubrics for reuse with a revision check", () => {
    const body = completePracticalContent().rubric!;
    const id = createRubric({ actor: teacher, body });
    expect(updateRubric({ actor: teacher, rubricId: id, body: { ...body, title: "Renamed" }, revision: 0 }).revision).toBe(1);
    expect(catchErr(() => updateRubric({ actor: teacher, rubricId: id, body, revision: 0 })).status).toBe(409);
  });
});

describe("practical content validation (bad input refused at the field)", () => {
  it("refuses a check bound to a missing column", () => {
    const c = completePracticalContent();
    const broken = { ...c, checks: [{ ...c.checks[0]!, y: "no-such-column" }] };
    const res = practicalContentSchema.safeParse(broken);
    expect(res.success).toBe(false);
    expect(res.error!.issues.find((i) => i.path.join(".") === "checks.0.y")?.message).toMatch(/not in “Volume of gas against time”/);
  });

  it("refuses a rubric with no criteria, and levels out of order", () => {
    const c = completePracticalContent();
    expect(practicalContentSchema.safeParse({ ...c, rubric: { ...c.rubric!, criteria: [] } }).error!.issues[0]!.message).toMatch(/at least one criterion/);
    const levels = [{ id: "a", label: "High", marks: 3 }, { id: "b", label: "Low", marks: 1 }];
    const res = practicalContentSchema.safeParse({ ...c, rubric: { ...c.rubric!, criteria: [{ id: "x", title: "X", levels }] } });
    expect(res.error!.issues.some((i) => /lowest to highest/.test(i.message))).toBe(true);
  });

  it("refuses impossible concentrations and volumes", () => {
    const c = completePracticalContent();
    const bad = { ...c, prep: { ...c.prep, reagents: [{ ...c.prep.reagents[0]!, concentration: 40 }, { ...c.prep.reagents[0]!, id: "r2", amountPerGroup: 20000 }] } };
    const messages = practicalContentSchema.safeParse(bad).error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
    expect(messages.some((m) => m.startsWith("prep.reagents.0.concentration") && /not a possible concentration/.test(m))).toBe(true);
    expect(messages.some((m) => m.startsWith("prep.reagents.1.amountPerGroup"))).toBe(true);
  });

  it("refuses dates in the wrong order", () => {
    const res = labSessionSchema.safeParse({ classId: "c", practicalVersionId: "v", opensAt: "2026-12-08T09:00:00Z", dueAt: "2026-12-01T09:00:00Z" });
    expect(res.error!.issues[0]).toMatchObject({ path: ["dueAt"], message: "The due date must be after the opening date." });
  });

  it("refuses rich text carrying scripts, unknown nodes or javascript: links", () => {
    const c = completePracticalContent();
    const withScript = { ...c, method: { type: "doc", content: [{ type: "script", text: "alert(1)" }] } };
    expect(practicalContentSchema.safeParse(withScript).success).toBe(false);
    const badLink = { ...c, method: { type: "doc", content: [{ type: "paragraph", content: [{ type: "text", text: "x", marks: [{ type: "link", attrs: { href: "javascript:alert(1)" } }] }] }] } };
    expect(practicalContentSchema.safeParse(badLink).success).toBe(false);
  });
});

import { describe, expect, it } from "vitest";
import { listLabSessions } from "@/db/queries/lab-sessions";
import { listPracticals } from "@/db/queries/practicals";
import { loadActor } from "@/db/queries/users";
import { hasAnySchool, seedDemoSchool } from "@/db/seed/index";
import { publishProblems } from "@/lib/validation/practicals";
import { DEMO_PRACTICALS } from "@/db/seed/practicals";
import { checkAttempts, moderationMarks, writeUps } from "@/db/schema";
import { freshDatabase } from "../helpers/db";

describe("the demo school", () => {
  it("seeds once into an empty database, with every role signed-in-able and publishable practicals", async () => {
    const { db } = freshDatabase();
    expect(hasAnySchool(db)).toBe(false);
    const now = new Date("2026-12-01T10:00:00Z");
    const res = await seedDemoSchool(db, { now });
    expect(hasAnySchool(db)).toBe(true);
    for (const key of ["admin", "teacher", "student", "moderator", "parent", "hod"]) expect(loadActor(res.userIds.get(key)!)).not.toBeNull();
    const teacher = loadActor(res.userIds.get("teacher")!)!;
    expect(listPracticals({ actor: teacher }).length).toBe(DEMO_PRACTICALS.length);
    for (const dp of DEMO_PRACTICALS) expect(publishProblems({ title: dp.title }, dp.content)).toEqual({});
    const student = loadActor(res.userIds.get("student")!)!;
    const states = listLabSessions({ actor: student, now }).map((s) => s.state).sort();
    expect(states).toEqual(["closed", "open", "upcoming"]);
    // Generated data with deliberate slips: every verdict, and named slips, appear in the demo.
    const attempts = db.select().from(checkAttempts).all();
    expect(new Set(attempts.map((a) => a.verdict))).toEqual(new Set(["agrees", "close", "disagrees", "cannot-check"]));
    expect(attempts.some((a) => a.slipCode === "minutes-for-seconds")).toBe(true);
    expect(attempts.some((a) => a.slipCode === "tangent-not-touching")).toBe(true);
    // Marked and returned work exists for the demo student (so the parent has something to see),
    // and the moderation sample is part-way through second marking.
    const own = db.select().from(writeUps).all().filter((w) => w.studentId === res.userIds.get("student"));
    expect(own.map((w) => w.status).sort()).toEqual(["draft", "returned"]);
    expect(db.select().from(moderationMarks).all()).toHaveLength(2);
    // The demo teacher has work handed in and waiting to be marked, handed in before now.
    const waiting = db.select().from(writeUps).all().filter((w) => w.labSessionId === res.labSessionIds.get("10C-mg") && w.status === "submitted");
    expect(waiting.length).toBeGreaterThan(0);
    for (const w of waiting) expect(w.submittedAt!.getTime()).toBeLessThanOrEqual(now.getTime());
  });
});

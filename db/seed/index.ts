import { eq } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/password";
import type { Db } from "../client";
import { auditLog, checkAttempts, classes, classStudents, classTeachers, invitations, labSessions, marks, moderationItems, moderationMarks, moderationSamples, parentLinks, practicals, practicalVersions, rubrics, schools, userRoles, users, writeUps } from "../schema";
import { seedDemoEvidence } from "./evidence";
import { DEMO_PRACTICALS } from "./practicals";
import { seedMarkFor } from "./marks";
import { writeUpFor, type Scenario } from "./write-ups";
import { drawModerationSample, defaultSampleRule } from "@/lib/marking";
import { rubricMaxOf } from "./rubric-max";
import { hashToken, newToken } from "@/lib/tokens";
import { ACADEMIC_YEAR, CLASSES, DEMO_DOMAIN, DEMO_PASSWORD, DEMO_SCHOOL, PARENTS, STAFF, demoStudents, type DemoPerson } from "./people";

export type SeedResult = {
  schoolId: string;
  userIds: Map<string, string>;
  classIds: Map<string, string>;
  practicalVersionIds: Map<string, string>;
  labSessionIds: Map<string, string>;
  /** Demo photos stored (0 when photo storage was not there: the seed goes on without them). */
  photos: number;
};

/** True when the database already holds a school (the demo is seeded once, on first start). */
export function hasAnySchool(db: Db): boolean {
  return !!db.select({ id: schools.id }).from(schools).limit(1).get();
}

/**
 * Creates the demo school with its staff, classes, students and parents. Runs in one
 * transaction: a half-seeded school never exists. Then a few demo photos go to object storage
 * (db/seed/evidence.ts); if storage is not there, the school is seeded without them.
 */
export async function seedDemoSchool(db: Db, { now = new Date(), photos = true }: { now?: Date; photos?: boolean } = {}): Promise<SeedResult> {
  // Every demo account shares one password, so one hash serves them all and first start is quick.
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const seeded = seedTransaction(db, passwordHash, now);
  return { ...seeded, photos: photos ? await seedDemoEvidence(db, seeded) : 0 };
}

function seedTransaction(db: Db, passwordHash: string, now: Date): Omit<SeedResult, "photos"> {
  return db.transaction((tx) => {
    const schoolId = tx.insert(schools).values({ name: DEMO_SCHOOL.name, slug: DEMO_SCHOOL.slug }).returning({ id: schools.id }).get().id;
    const userIds = new Map<string, string>();
    const addPerson = (p: DemoPerson) => {
      const id = tx
        .insert(users)
        .values({ schoolId, name: p.name, email: p.email, yearGroup: p.yearGroup ?? null, passwordHash: p.pending ? null : passwordHash, createdAt: now, updatedAt: now })
        .returning({ id: users.id })
        .get().id;
      tx.insert(userRoles).values(p.roles.map((role) => ({ userId: id, role }))).run();
      if (p.pending === "invited") {
        tx.insert(invitations)
          .values({ schoolId, userId: id, kind: "invitation", tokenHash: hashToken(newToken()), expiresAt: new Date(now.getTime() + 5 * 86400_000), createdAt: now })
          .run();
      }
      userIds.set(p.key, id);
      return id;
    };
    for (const s of STAFF) addPerson(s);

    const classIds = new Map<string, string>();
    for (const c of CLASSES) {
      const id = tx.insert(classes).values({ schoolId, name: c.name, subject: c.subject, yearGroup: c.yearGroup, academicYear: ACADEMIC_YEAR }).returning({ id: classes.id }).get().id;
      classIds.set(c.key, id);
      tx.insert(classTeachers).values(c.teachers.map((t) => ({ classId: id, teacherId: userIds.get(t)! }))).run();
    }

    const students = demoStudents();
    students.forEach(({ classKey, person }, i) => {
      const id = addPerson(person);
      tx.insert(classStudents).values({ classId: classIds.get(classKey)!, studentId: id }).run();
      // Some students have a guardian on record (not yet signed up), as a real roster would.
      if (i > 1 && i % 4 === 0) {
        const surname = person.name.split(" ").slice(1).join(" ");
        const guardian: DemoPerson = {
          key: `g${i}`,
          name: `${["Alex", "Sam", "Jo", "Robin", "Charlie", "Frankie"][i % 6]} ${surname}`,
          email: `guardian.${person.email.split("@")[0]}@${DEMO_DOMAIN}`,
          roles: ["parent"],
          pending: "not-invited",
        };
        const gid = addPerson(guardian);
        tx.insert(parentLinks).values({ parentId: gid, studentId: id, relationship: i % 8 === 0 ? "Guardian" : "Parent" }).run();
      }
    });

    for (const { person, children, relationship } of PARENTS) {
      const id = addPerson(person);
      for (const child of children) tx.insert(parentLinks).values({ parentId: id, studentId: userIds.get(child)!, relationship }).run();
    }

    // The department library: every demo practical published as version 1; one has a draft v2.
    const practicalVersionIds = new Map<string, string>();
    const practicalIds = new Map<string, string>();
    const day = 86_400_000;
    DEMO_PRACTICALS.forEach((dp, i) => {
      const author = userIds.get(dp.subject === "Physics" ? "physics" : i % 2 ? "hod" : "teacher")!;
      const created = new Date(now.getTime() - (40 - i) * day);
      const practicalId = tx
        .insert(practicals)
        .values({ schoolId, title: dp.title, topic: dp.topic, subject: dp.subject, yearGroup: dp.yearGroup, createdById: author, createdAt: created, updatedAt: created })
        .returning({ id: practicals.id })
        .get().id;
      const versionId = tx
        .insert(practicalVersions)
        .values({ practicalId, schoolId, version: 1, status: "published", title: dp.title, topic: dp.topic, subject: dp.subject, yearGroup: dp.yearGroup, content: dp.content, revision: 3, createdById: author, publishedAt: created, publishedById: author, createdAt: created, updatedAt: created })
        .returning({ id: practicalVersions.id })
        .get().id;
      practicalIds.set(dp.key, practicalId);
      practicalVersionIds.set(dp.key, versionId);
      if (dp.key === "chips") {
        tx.insert(practicalVersions)
          .values({ practicalId, schoolId, version: 2, status: "draft", title: dp.title, topic: dp.topic, subject: dp.subject, yearGroup: dp.yearGroup, content: { ...dp.content, aim: `${dp.content.aim} Extension: try a third size of chip.` }, revision: 1, createdById: author })
          .run();
      }
    });
    const rubricSource = DEMO_PRACTICALS[0]!.content.rubric!;
    tx.insert(rubrics).values({ schoolId, title: rubricSource.title, body: { title: rubricSource.title, style: rubricSource.style, criteria: rubricSource.criteria }, createdById: userIds.get("hod")! }).run();

    const labSessionIds = new Map<string, string>();
    const schedule = (key: string, practical: string, classKey: string, teacherKey: string, opensInDays: number, lengthDays: number) => {
      const opensAt = new Date(now.getTime() + opensInDays * day);
      const id = tx
        .insert(labSessions)
        .values({
          schoolId,
          classId: classIds.get(classKey)!,
          practicalId: practicalIds.get(practical)!,
          practicalVersionId: practicalVersionIds.get(practical)!,
          opensAt,
          dueAt: new Date(opensAt.getTime() + lengthDays * day),
          lateWork: "accept-flagged",
          lateDays: 7,
          notes: "Bring your lab book and wear your own goggles if you have them.",
          createdById: userIds.get(teacherKey)!,
        })
        .returning({ id: labSessions.id })
        .get().id;
      labSessionIds.set(key, id);
    };
    schedule("10C-mg", "mg-acid", "10C", "teacher", -3, 7);
    schedule("10D-mg", "mg-acid", "10D", "hod", -20, 7);
    schedule("12A-thio", "thiosulfate", "12A", "hod", -2, 7);
    schedule("10C-peroxide", "peroxide", "10C", "teacher", 5, 7);
    schedule("11P-resistance", "resistance", "11P", "physics", -1, 7);
    schedule("10C-chips", "chips", "10C", "teacher", -35, 7);
    schedule("12A-peroxide", "peroxide", "12A", "hod", -28, 7);

    // Write-ups with generated readings and a few deliberate slips.
    const practicalByKey = new Map(DEMO_PRACTICALS.map((dp) => [dp.key, dp]));
    const submitted: { sessionKey: string; writeUpId: string; index: number; checkResults: ReturnType<typeof writeUpFor>["checkResults"]; submittedAt: Date }[] = [];
    const fillSession = (sessionKey: string, practicalKey: string, classKey: string, scenarioFor: (i: number, personKey: string) => Scenario, opensAt: Date, dueAt: Date) => {
      const dp = practicalByKey.get(practicalKey)!;
      students
        .filter((st) => st.classKey === classKey)
        .forEach(({ person }, i) => {
          const scenario = scenarioFor(i, person.key);
          if (scenario === "not-started") return;
          const studentId = userIds.get(person.key)!;
          const generated = writeUpFor(practicalKey, dp.content, i, scenario);
          const started = new Date(opensAt.getTime() + (1 + (i % 5)) * 3_600_000);
          const planned = scenario === "submitted" ? new Date(dueAt.getTime() - (1 + (i % 3)) * 86_400_000) : scenario === "late" ? new Date(dueAt.getTime() + (1 + (i % 2)) * 86_400_000) : null;
          // Work handed in early for a session still open: never later than now.
          const submittedAt = planned && planned > now ? new Date(Math.max(started.getTime() + 3_600_000, now.getTime() - (1 + (i % 5)) * 3_600_000)) : planned;
          const writeUpId = tx
            .insert(writeUps)
            .values({
              schoolId,
              labSessionId: labSessionIds.get(sessionKey)!,
              studentId,
              practicalVersionId: practicalVersionIds.get(practicalKey)!,
              status: scenario === "draft" ? "draft" : "submitted",
              revision: 4 + (i % 7),
              content: generated.content,
              checkResults: generated.checkResults,
              safetyAcknowledgedAt: started,
              submittedAt,
              late: scenario === "late",
              createdAt: started,
              updatedAt: submittedAt ?? started,
            })
            .returning({ id: writeUps.id })
            .get().id;
          for (const a of generated.attempts) tx.insert(checkAttempts).values({ schoolId, writeUpId, studentId, ...a, at: submittedAt ?? started }).run();
          if (submittedAt) submitted.push({ sessionKey, writeUpId, index: i, checkResults: generated.checkResults, submittedAt });
        });
    };
    const sessionDates = (key: string) => tx.select({ opensAt: labSessions.opensAt, dueAt: labSessions.dueAt }).from(labSessions).where(eq(labSessions.id, labSessionIds.get(key)!)).get()!;
    const d10D = sessionDates("10D-mg");
    fillSession("10D-mg", "mg-acid", "10D", (i) => (i === 5 || i === 17 ? "not-started" : i % 7 === 3 ? "late" : "submitted"), d10D.opensAt, d10D.dueAt);
    const d10C = sessionDates("10C-mg");
    // 10C's open session: most are still drafting, a few handed in early (so the teacher has work waiting to mark), some not started.
    fillSession("10C-mg", "mg-acid", "10C", (i, key) => (key === "student" || i % 2 === 1 ? "draft" : i % 4 === 2 ? "submitted" : "not-started"), d10C.opensAt, d10C.dueAt);
    const d12A = sessionDates("12A-thio");
    fillSession("12A-thio", "thiosulfate", "12A", (i, key) => (key === "sibling" || i % 3 !== 2 ? "draft" : "not-started"), d12A.opensAt, d12A.dueAt);

    const d10Cc = sessionDates("10C-chips");
    fillSession("10C-chips", "chips", "10C", (i) => (i === 9 ? "not-started" : i % 8 === 4 ? "late" : "submitted"), d10Cc.opensAt, d10Cc.dueAt);
    const d12Ap = sessionDates("12A-peroxide");
    fillSession("12A-peroxide", "peroxide", "12A", (i) => (i === 6 ? "not-started" : "submitted"), d12Ap.opensAt, d12Ap.dueAt);

    // Marking: the two earlier lab sessions are marked and returned; 10D's is marked (generously)
    // and mostly returned, with a moderation sample part-way through second marking.
    const markers: Record<string, { marker: string; practical: string; returnAll: boolean; generous: boolean }> = {
      "10C-chips": { marker: "teacher", practical: "chips", returnAll: true, generous: false },
      "12A-peroxide": { marker: "hod", practical: "peroxide", returnAll: true, generous: false },
      "10D-mg": { marker: "hod", practical: "mg-acid", returnAll: false, generous: true },
    };
    const cohort10D: { id: string; total: number; markerId: string; criteria: Record<string, { levelId: string; marks: number }> }[] = [];
    for (const item of submitted) {
      const plan = markers[item.sessionKey];
      if (!plan) continue;
      const content = practicalByKey.get(plan.practical)!.content;
      const m = seedMarkFor(content, item.checkResults, item.index, plan.generous);
      const markedAt = new Date(item.submittedAt.getTime() + 2 * day);
      const returned = plan.returnAll || item.index % 4 !== 0;
      tx.insert(marks)
        .values({ schoolId, writeUpId: item.writeUpId, markerId: userIds.get(plan.marker)!, criteria: m.criteria, comments: m.comments, feedback: m.feedback, total: m.total, maxTotal: rubricMaxOf(content), revision: 1, markedAt, returnedAt: returned ? markedAt : null, createdAt: markedAt, updatedAt: markedAt })
        .run();
      tx.update(writeUps).set({ status: returned ? "returned" : "marked" }).where(eq(writeUps.id, item.writeUpId)).run();
      if (item.sessionKey === "10D-mg") cohort10D.push({ id: item.writeUpId, total: m.total, markerId: userIds.get(plan.marker)!, criteria: m.criteria });
    }
    const seed = 20261201;
    const draw = drawModerationSample(cohort10D, defaultSampleRule, seed);
    const sampleId = tx
      .insert(moderationSamples)
      .values({ schoolId, labSessionId: labSessionIds.get("10D-mg")!, moderatorId: userIds.get("moderator")!, rule: defaultSampleRule, seed, blind: true, toleranceMarks: 1, drawnById: userIds.get("admin")!, createdAt: new Date(now.getTime() - 2 * day) })
      .returning({ id: moderationSamples.id })
      .get().id;
    const mgRubric = practicalByKey.get("mg-acid")!.content.rubric!;
    draw.ids.forEach((id, i) => {
      tx.insert(moderationItems).values({ sampleId, writeUpId: id, origin: "drawn", note: draw.reasons[id] ?? "" }).run();
      if (i >= 2) return;
      // The moderator has second-marked two pieces: one level lower where the teacher was generous.
      const teacher = cohort10D.find((c) => c.id === id)!;
      const criteria = Object.fromEntries(
        mgRubric.criteria.map((c) => {
          const t = c.levels.findIndex((l) => l.id === teacher.criteria[c.id]!.levelId);
          const lvl = c.levels[Math.max(0, c.id === "analyse" || c.id === "process" ? t - 1 : t)]!;
          return [c.id, { levelId: lvl.id, marks: lvl.marks }];
        }),
      );
      tx.insert(moderationMarks).values({ sampleId, writeUpId: id, moderatorId: userIds.get("moderator")!, criteria, total: Object.values(criteria).reduce((s, c) => s + c.marks, 0), comment: "Processing is not quite at this level: the units slip.", revision: 1, completedAt: now }).run();
    });

    tx.insert(auditLog).values({ schoolId, actorId: null, action: "school.seed", entityType: "school", entityId: schoolId, after: { people: userIds.size, classes: classIds.size, domain: DEMO_DOMAIN }, at: now }).run();
    return { schoolId, userIds, classIds, practicalVersionIds, labSessionIds };
  });
}

/** Looks up a demo person's id by e-mail (used by later seed steps and tests). */
export function demoUserId(db: Db, email: string): string | undefined {
  return db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()?.id;
}

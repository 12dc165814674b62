// A large invented school for the load benchmark: by default 2,000 students in 80 classes, 40
// practicals and 20,000 write-ups, written in one transaction through the same schema and seed
// helpers as the demo school. Names are generated; every account shares one password hash.
import type { Db } from "@/db/client";
import { checkAttempts, classes, classStudents, classTeachers, labSessions, marks, parentLinks, practicals, practicalVersions, schools, userRoles, users, writeUps } from "@/db/schema";
import { seedMarkFor } from "@/db/seed/marks";
import { DEMO_PRACTICALS } from "@/db/seed/practicals";
import { rubricMaxOf } from "@/db/seed/rubric-max";
import { writeUpFor, type Scenario } from "@/db/seed/write-ups";
import { hashPassword } from "@/lib/auth/password";

export type BenchSizes = { students: number; classes: number; practicals: number; writeUps: number };
export const BENCH_DOMAIN = "bench.cobalt-lane.example";
export const BENCH_PASSWORD = "bench-notebook-password";

export type BenchSchool = {
  schoolId: string;
  /** Students with a draft write-up in an open lab session: [email, writeUpId, practical check ids]. */
  openWriteUps: { email: string; studentId: string; writeUpId: string; labSessionId: string; checkIds: string[] }[];
  /** A teacher and a lab session of theirs whose write-ups are handed in and waiting to be marked. */
  marking: { email: string; labSessionId: string; writeUps: number };
  /** A parent and their children. */
  parent: { email: string; childIds: string[] };
  counts: Record<string, number>;
};

const FIRST = ["Ada", "Bram", "Cleo", "Dev", "Esme", "Finn", "Gita", "Hugo", "Isla", "Jude", "Kofi", "Lena", "Milo", "Nia", "Otto", "Priya", "Quin", "Rosa", "Sami", "Tara", "Uma", "Vik", "Wren", "Xan", "Yara", "Zeb"];
const LAST = ["Ashdown", "Brackley", "Corran", "Dunmore", "Elsworth", "Fairlie", "Garside", "Holloway", "Ingleby", "Jessop", "Kirkland", "Lowther", "Marsden", "Northcott", "Orrell", "Pennick", "Quarry", "Rowntree", "Stainton", "Thwaite"];
const DAY = 86_400_000;

/** Lab sessions per class: enough to hold the requested write-ups. The last one is open now; the two before it wait for marking. */
export function sessionsPerClass(sizes: BenchSizes): number {
  return Math.max(3, Math.ceil(sizes.writeUps / sizes.students));
}

export async function seedBenchSchool(db: Db, sizes: BenchSizes, now = new Date()): Promise<BenchSchool> {
  const passwordHash = await hashPassword(BENCH_PASSWORD);
  const perClass = sessionsPerClass(sizes);
  return db.transaction((tx) => {
    const schoolId = tx.insert(schools).values({ name: "Cobalt Lane School (load bench)", slug: "cobalt-lane-bench" }).returning({ id: schools.id }).get().id;
    const addUser = (name: string, email: string, role: "admin" | "teacher" | "student" | "parent", yearGroup: number | null = null) => {
      const id = tx.insert(users).values({ schoolId, name, email, yearGroup, passwordHash, createdAt: now, updatedAt: now }).returning({ id: users.id }).get().id;
      tx.insert(userRoles).values({ userId: id, role }).run();
      return id;
    };
    addUser("Bench Admin", `admin@${BENCH_DOMAIN}`, "admin");

    // Practicals: the demo library repeated under numbered titles.
    const versions: { practicalId: string; versionId: string; key: string; content: (typeof DEMO_PRACTICALS)[number]["content"]; subject: string }[] = [];
    const teacherCount = Math.max(1, Math.ceil(sizes.classes / 2));
    const teacherIds: string[] = [];
    for (let t = 0; t < teacherCount; t++) teacherIds.push(addUser(`${FIRST[t % FIRST.length]} ${LAST[(t * 7) % LAST.length]}-Teacher${t + 1}`, `teacher${t + 1}@${BENCH_DOMAIN}`, "teacher"));
    for (let p = 0; p < sizes.practicals; p++) {
      const dp = DEMO_PRACTICALS[p % DEMO_PRACTICALS.length]!;
      const title = `${dp.title} (set ${Math.floor(p / DEMO_PRACTICALS.length) + 1})`;
      const author = teacherIds[p % teacherIds.length]!;
      const practicalId = tx.insert(practicals).values({ schoolId, title, topic: dp.topic, subject: dp.subject, yearGroup: dp.yearGroup, createdById: author, createdAt: now, updatedAt: now }).returning({ id: practicals.id }).get().id;
      const versionId = tx
        .insert(practicalVersions)
        .values({ practicalId, schoolId, version: 1, status: "published", title, topic: dp.topic, subject: dp.subject, yearGroup: dp.yearGroup, content: dp.content, revision: 1, createdById: author, publishedAt: now, publishedById: author, createdAt: now, updatedAt: now })
        .returning({ id: practicalVersions.id })
        .get().id;
      versions.push({ practicalId, versionId, key: dp.key, content: dp.content, subject: dp.subject });
    }

    // Generated write-ups are reused across students with the same position and scenario (the
    // generator is deterministic), which keeps seeding to seconds.
    const generated = new Map<string, ReturnType<typeof writeUpFor>>();
    const generate = (key: string, content: (typeof versions)[number]["content"], i: number, scenario: Scenario) => {
      const k = `${key}|${i % 25}|${scenario}`;
      let g = generated.get(k);
      if (!g) generated.set(k, (g = writeUpFor(key, content, i % 25, scenario)));
      return g;
    };

    const studentsPerClass = Math.ceil(sizes.students / sizes.classes);
    const out: BenchSchool = { schoolId, openWriteUps: [], marking: { email: "", labSessionId: "", writeUps: 0 }, parent: { email: "", childIds: [] }, counts: {} };
    let studentNo = 0;
    let writeUpCount = 0;
    let markCount = 0;
    let attemptCount = 0;
    const studentIds: string[] = [];
    for (let c = 0; c < sizes.classes; c++) {
      const yearGroup = 7 + (c % 7);
      const teacherIndex = c % teacherIds.length;
      const teacherId = teacherIds[teacherIndex]!;
      const classId = tx.insert(classes).values({ schoolId, name: `${yearGroup}${String.fromCharCode(65 + Math.floor(c / 7))} Science ${c + 1}`, subject: "Science", yearGroup, academicYear: "2026-27" }).returning({ id: classes.id }).get().id;
      tx.insert(classTeachers).values({ classId, teacherId }).run();
      const members: { id: string; email: string }[] = [];
      for (let s = 0; s < studentsPerClass && studentNo < sizes.students; s++, studentNo++) {
        const name = `${FIRST[studentNo % FIRST.length]} ${LAST[Math.floor(studentNo / FIRST.length) % LAST.length]} ${studentNo + 1}`;
        const email = `student${studentNo + 1}@${BENCH_DOMAIN}`;
        const id = addUser(name, email, "student", yearGroup);
        tx.insert(classStudents).values({ classId, studentId: id }).run();
        members.push({ id, email });
        studentIds.push(id);
      }
      for (let k = 0; k < perClass; k++) {
        const v = versions[(c + k * 3) % versions.length]!;
        const open = k === perClass - 1;
        const toMark = !open && k >= perClass - 3;
        const opensAt = open ? new Date(now.getTime() - DAY) : new Date(now.getTime() - (perClass - k) * 10 * DAY);
        const dueAt = new Date(opensAt.getTime() + 7 * DAY);
        const labSessionId = tx
          .insert(labSessions)
          .values({ schoolId, classId, practicalId: v.practicalId, practicalVersionId: v.versionId, opensAt, dueAt, lateWork: "accept-flagged", lateDays: 7, notes: "", createdById: teacherId })
          .returning({ id: labSessions.id })
          .get().id;
        members.forEach((m, i) => {
          if (writeUpCount >= sizes.writeUps) return;
          const scenario: Scenario = open ? "draft" : i % 11 === 4 ? "late" : "submitted";
          const g = generate(v.key, v.content, i, scenario);
          const submittedAt = open ? null : new Date(dueAt.getTime() + (scenario === "late" ? DAY : -DAY));
          const returned = !open && !toMark;
          const writeUpId = tx
            .insert(writeUps)
            .values({ schoolId, labSessionId, studentId: m.id, practicalVersionId: v.versionId, status: open ? "draft" : returned ? "returned" : "submitted", revision: 3, content: g.content, checkResults: g.checkResults, safetyAcknowledgedAt: opensAt, submittedAt, late: scenario === "late", createdAt: opensAt, updatedAt: submittedAt ?? opensAt })
            .returning({ id: writeUps.id })
            .get().id;
          writeUpCount++;
          for (const a of g.attempts) tx.insert(checkAttempts).values({ schoolId, writeUpId, studentId: m.id, ...a, at: submittedAt ?? opensAt }).run();
          attemptCount += g.attempts.length;
          if (returned) {
            const mk = seedMarkFor(v.content, g.checkResults, i, false);
            const markedAt = new Date(submittedAt!.getTime() + DAY);
            tx.insert(marks).values({ schoolId, writeUpId, markerId: teacherId, criteria: mk.criteria, comments: mk.comments, feedback: mk.feedback, total: mk.total, maxTotal: rubricMaxOf(v.content), revision: 1, markedAt, returnedAt: markedAt, createdAt: markedAt, updatedAt: markedAt }).run();
            markCount++;
          }
          if (open) out.openWriteUps.push({ email: m.email, studentId: m.id, writeUpId, labSessionId, checkIds: v.content.checks.map((ch) => ch.id) });
        });
        if (toMark && c === 0 && k === perClass - 2) out.marking = { email: `teacher${teacherIndex + 1}@${BENCH_DOMAIN}`, labSessionId, writeUps: members.length };
      }
    }

    // Families: one parent or carer for each pair of students in neighbouring classes.
    let parentCount = 0;
    for (let i = 0; i + studentsPerClass < studentIds.length; i += 2 * studentsPerClass) {
      for (let j = i; j < i + studentsPerClass; j++) {
        const children = [studentIds[j]!, studentIds[j + studentsPerClass]!];
        const email = `parent${parentCount + 1}@${BENCH_DOMAIN}`;
        const parentId = addUser(`Carer ${LAST[parentCount % LAST.length]} ${parentCount + 1}`, email, "parent");
        for (const child of children) tx.insert(parentLinks).values({ parentId, studentId: child, relationship: "Parent" }).run();
        if (parentCount === 0) out.parent = { email, childIds: children };
        parentCount++;
      }
    }
    out.counts = { students: studentNo, teachers: teacherIds.length, parents: parentCount, classes: sizes.classes, practicals: versions.length, labSessions: sizes.classes * perClass, writeUps: writeUpCount, marks: markCount, checkAttempts: attemptCount };
    return out;
  });
}

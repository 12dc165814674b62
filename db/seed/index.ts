import { eq } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/password";
import type { Db } from "../client";
import { auditLog, classes, classStudents, classTeachers, invitations, parentLinks, schools, userRoles, users } from "../schema";
import { hashToken, newToken } from "@/lib/tokens";
import { ACADEMIC_YEAR, CLASSES, DEMO_DOMAIN, DEMO_PASSWORD, DEMO_SCHOOL, PARENTS, STAFF, demoStudents, type DemoPerson } from "./people";

export type SeedResult = { schoolId: string; userIds: Map<string, string>; classIds: Map<string, string> };

/** True when the database already holds a school (the demo is seeded once, on first start). */
export function hasAnySchool(db: Db): boolean {
  return !!db.select({ id: schools.id }).from(schools).limit(1).get();
}

/**
 * Creates the demo school with its staff, classes, students and parents. Runs in one
 * transaction: a half-seeded school never exists.
 */
export async function seedDemoSchool(db: Db, { now = new Date() }: { now?: Date } = {}): Promise<SeedResult> {
  // Every demo account shares one password, so one hash serves them all and first start is quick.
  const passwordHash = await hashPassword(DEMO_PASSWORD);
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

    tx.insert(auditLog).values({ schoolId, actorId: null, action: "school.seed", entityType: "school", entityId: schoolId, after: { people: userIds.size, classes: classIds.size, domain: DEMO_DOMAIN }, at: now }).run();
    return { schoolId, userIds, classIds };
  });
}

/** Looks up a demo person's id by e-mail (used by later seed steps and tests). */
export function demoUserId(db: Db, email: string): string | undefined {
  return db.select({ id: users.id }).from(users).where(eq(users.email, email)).get()?.id;
}

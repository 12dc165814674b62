import { eq } from "drizzle-orm";
import { openDatabase, setDatabase } from "@/db/client";
import * as schema from "@/db/schema";
import type { Role } from "@/db/schema/constants";
import type { Actor } from "@/lib/auth/actor";

/** A fresh in-memory database with every migration applied, installed as the process database. */
export function freshDatabase() {
  const handle = openDatabase(":memory:");
  setDatabase(handle);
  return handle;
}

let counter = 0;

/** Inserts a school and returns its id. */
export function makeSchool(name = `Test School ${++counter}`): string {
  const { db } = currentHandle();
  return db.insert(schema.schools).values({ name, slug: `test-${counter}-${Math.random().toString(36).slice(2, 8)}` }).returning({ id: schema.schools.id }).get().id;
}

function currentHandle() {
  const g = globalThis as unknown as { __meniscusDb?: ReturnType<typeof openDatabase> };
  if (!g.__meniscusDb) throw new Error("call freshDatabase() first");
  return g.__meniscusDb;
}

/** Inserts a person holding the roles and returns them as an Actor. */
export function makeUser(
  schoolId: string,
  roles: Role[],
  over: { name?: string; email?: string; passwordHash?: string | null; yearGroup?: number; active?: boolean } = {},
): Actor {
  const { db } = currentHandle();
  const n = ++counter;
  const name = over.name ?? `Person ${n}`;
  const email = over.email ?? `person${n}@test.example`;
  const id = db
    .insert(schema.users)
    .values({ schoolId, name, email, passwordHash: over.passwordHash ?? null, yearGroup: over.yearGroup ?? (roles.includes("student") ? 10 : null), active: over.active ?? true })
    .returning({ id: schema.users.id })
    .get().id;
  db.insert(schema.userRoles).values(roles.map((role) => ({ userId: id, role }))).run();
  return { userId: id, schoolId, roles, name, email };
}

/** Inserts a class with teachers and students. */
export function makeClass(schoolId: string, { name, teachers = [], students = [] }: { name?: string; teachers?: Actor[]; students?: Actor[] } = {}): string {
  const { db } = currentHandle();
  const id = db
    .insert(schema.classes)
    .values({ schoolId, name: name ?? `Class ${++counter}`, subject: "Chemistry", yearGroup: 10, academicYear: "2026-27" })
    .returning({ id: schema.classes.id })
    .get().id;
  for (const t of teachers) db.insert(schema.classTeachers).values({ classId: id, teacherId: t.userId }).run();
  for (const s of students) db.insert(schema.classStudents).values({ classId: id, studentId: s.userId }).run();
  return id;
}

export function linkParentDirect(parent: Actor, student: Actor) {
  currentHandle().db.insert(schema.parentLinks).values({ parentId: parent.userId, studentId: student.userId }).run();
}

export function auditEntries(entityId?: string) {
  const { db } = currentHandle();
  const q = db.select().from(schema.auditLog);
  return (entityId ? q.where(eq(schema.auditLog.entityId, entityId)) : q).all();
}

/** Number of rows in a table of the current test database. */
export function countRows(table: string): number {
  if (!/^[a-z_]+$/.test(table)) throw new Error(`not a table name: ${table}`);
  return (currentHandle().sqlite.prepare(`SELECT count(*) AS n FROM ${table}`).get() as { n: number }).n;
}

export function testDb() {
  return currentHandle().db;
}

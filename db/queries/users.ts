import "server-only";
import { and, asc, eq, inArray, or, sql } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { AppError, forbidden, notFound } from "@/lib/errors";
import type { UserCreateInput, UserUpdateInput } from "@/lib/validation/users";
import { getDb, preparedOnce, type DbOrTx } from "../client";
import { classes, classStudents, classTeachers, invitations, parentLinks, userRoles, users, type Role } from "../schema";
import { recordAudit } from "./audit";

/** Roles of many users in one query, keyed by user id. */
export function rolesByUser(db: DbOrTx, userIds: readonly string[]): Map<string, Role[]> {
  const map = new Map<string, Role[]>();
  if (userIds.length === 0) return map;
  const rows = db.select().from(userRoles).where(inArray(userRoles.userId, [...userIds])).all();
  for (const r of rows) {
    const list = map.get(r.userId) ?? [];
    list.push(r.role);
    map.set(r.userId, list);
  }
  return map;
}

const actorQuery = preparedOnce((db) =>
  db
    .select({ id: users.id, schoolId: users.schoolId, name: users.name, email: users.email, active: users.active })
    .from(users)
    .where(eq(users.id, sql.placeholder("id")))
    .prepare(),
);
const actorRolesQuery = preparedOnce((db) => db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, sql.placeholder("id"))).prepare());

/** The actor for a signed-in user id, or null if the account is gone or deactivated. */
export function loadActor(userId: string): Actor | null {
  const user = actorQuery().get({ id: userId });
  if (!user || !user.active) return null;
  const roles = actorRolesQuery()
    .all({ id: userId })
    .map((r) => r.role);
  return { userId: user.id, schoolId: user.schoolId, name: user.name, email: user.email, roles };
}

/** Sign-in lookup by e-mail (the only query that starts without a school). */
export function findUserForSignIn(email: string) {
  return getDb()
    .select({ id: users.id, passwordHash: users.passwordHash, active: users.active, schoolId: users.schoolId, name: users.name, email: users.email })
    .from(users)
    .where(eq(users.email, email.trim().toLowerCase()))
    .get();
}

export function recordSignIn(userId: string): void {
  getDb().update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, userId)).run();
}

function requireAdmin(actor: Actor) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can manage people.");
}

function emailTaken(db: DbOrTx, email: string, exceptUserId?: string): boolean {
  const row = db.select({ id: users.id }).from(users).where(eq(users.email, email)).get();
  return !!row && row.id !== exceptUserId;
}

export type UserListItem = {
  id: string;
  name: string;
  email: string;
  roles: Role[];
  active: boolean;
  yearGroup: number | null;
  status: "active" | "invited" | "not-invited" | "deactivated";
  lastSignInAt: Date | null;
};

/** Everyone in the actor's school (admins only), optionally filtered by role or a search term. */
export function listUsers({
  actor,
  role,
  search,
}: {
  actor: Actor;
  role?: Role;
  search?: string;
}): UserListItem[] {
  requireAdmin(actor);
  const db = getDb();
  const conditions = [eq(users.schoolId, actor.schoolId)];
  if (search?.trim()) {
    const term = `%${search.trim().replace(/[%_]/g, (c) => `\\${c}`)}%`;
    conditions.push(or(sql`${users.name} LIKE ${term} ESCAPE '\\'`, sql`${users.email} LIKE ${term} ESCAPE '\\'`)!);
  }
  if (role) {
    conditions.push(inArray(users.id, db.select({ id: userRoles.userId }).from(userRoles).where(eq(userRoles.role, role))));
  }
  const rows = db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      active: users.active,
      yearGroup: users.yearGroup,
      hasPassword: sql<number>`${users.passwordHash} IS NOT NULL`,
      lastSignInAt: users.lastSignInAt,
    })
    .from(users)
    .where(and(...conditions))
    .orderBy(asc(users.name))
    .all();
  const roles = rolesByUser(db, rows.map((r) => r.id));
  const invited = new Set(
    rows.length
      ? db
          .select({ userId: invitations.userId })
          .from(invitations)
          .where(and(eq(invitations.schoolId, actor.schoolId), eq(invitations.kind, "invitation")))
          .all()
          .map((r) => r.userId)
      : [],
  );
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    email: r.email,
    roles: roles.get(r.id) ?? [],
    active: r.active,
    yearGroup: r.yearGroup,
    lastSignInAt: r.lastSignInAt,
    status: !r.active ? "deactivated" : r.hasPassword ? "active" : invited.has(r.id) ? "invited" : "not-invited",
  }));
}

/** One person with their classes and family links (admins only). */
export function getUserDetail({ actor, userId }: { actor: Actor; userId: string }) {
  requireAdmin(actor);
  const db = getDb();
  const user = db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      active: users.active,
      yearGroup: users.yearGroup,
      emailNotifications: users.emailNotifications,
      hasPassword: sql<number>`${users.passwordHash} IS NOT NULL`,
      lastSignInAt: users.lastSignInAt,
      createdAt: users.createdAt,
    })
    .from(users)
    .where(and(eq(users.id, userId), eq(users.schoolId, actor.schoolId)))
    .get();
  if (!user) throw notFound("That person");
  const roles = rolesByUser(db, [userId]).get(userId) ?? [];
  const teaches = db
    .select({ id: classes.id, name: classes.name })
    .from(classTeachers)
    .innerJoin(classes, eq(classes.id, classTeachers.classId))
    .where(eq(classTeachers.teacherId, userId))
    .orderBy(asc(classes.name))
    .all();
  const studiesIn = db
    .select({ id: classes.id, name: classes.name })
    .from(classStudents)
    .innerJoin(classes, eq(classes.id, classStudents.classId))
    .where(eq(classStudents.studentId, userId))
    .orderBy(asc(classes.name))
    .all();
  const children = db
    .select({ id: users.id, name: users.name, relationship: parentLinks.relationship })
    .from(parentLinks)
    .innerJoin(users, eq(users.id, parentLinks.studentId))
    .where(eq(parentLinks.parentId, userId))
    .orderBy(asc(users.name))
    .all();
  const guardians = db
    .select({ id: users.id, name: users.name, email: users.email, relationship: parentLinks.relationship })
    .from(parentLinks)
    .innerJoin(users, eq(users.id, parentLinks.parentId))
    .where(eq(parentLinks.studentId, userId))
    .orderBy(asc(users.name))
    .all();
  const lastInvitation = db
    .select({ createdAt: invitations.createdAt, expiresAt: invitations.expiresAt, usedAt: invitations.usedAt })
    .from(invitations)
    .where(and(eq(invitations.userId, userId), eq(invitations.kind, "invitation")))
    .orderBy(sql`${invitations.createdAt} DESC`)
    .get();
  return { ...user, hasPassword: !!user.hasPassword, roles, teaches, studiesIn, children, guardians, lastInvitation: lastInvitation ?? null };
}

/** Adds a person to the school. Returns the new id. */
export function createUser({ actor, input, tx }: { actor: Actor; input: Omit<UserCreateInput, "sendInvitation">; tx?: DbOrTx }): string {
  requireAdmin(actor);
  const run = (db: DbOrTx) => {
    if (emailTaken(db, input.email)) {
      throw new AppError("conflict", "Someone already uses that e-mail address.", { fieldErrors: { email: ["Someone already uses that e-mail address."] } });
    }
    const roles = [...new Set(input.roles)];
    const id = db
      .insert(users)
      .values({
        schoolId: actor.schoolId,
        name: input.name,
        email: input.email,
        yearGroup: roles.includes("student") ? (input.yearGroup ?? null) : null,
      })
      .returning({ id: users.id })
      .get().id;
    db.insert(userRoles).values(roles.map((role) => ({ userId: id, role }))).run();
    recordAudit(db, {
      schoolId: actor.schoolId,
      actorId: actor.userId,
      action: "user.create",
      entityType: "user",
      entityId: id,
      after: { name: input.name, email: input.email, roles, yearGroup: input.yearGroup ?? null },
    });
    return id;
  };
  return tx ? run(tx) : getDb().transaction(run);
}

/** Changes a person's details, roles or active flag (admins only), with an audit entry. */
export function updateUser({ actor, userId, input }: { actor: Actor; userId: string; input: UserUpdateInput }): void {
  requireAdmin(actor);
  getDb().transaction((db) => {
    const before = db
      .select({ name: users.name, email: users.email, active: users.active, yearGroup: users.yearGroup, emailNotifications: users.emailNotifications })
      .from(users)
      .where(and(eq(users.id, userId), eq(users.schoolId, actor.schoolId)))
      .get();
    if (!before) throw notFound("That person");
    const beforeRoles = rolesByUser(db, [userId]).get(userId) ?? [];
    if (userId === actor.userId) {
      if (input.active === false) throw new AppError("bad_request", "You cannot deactivate your own account.");
      if (input.roles && !input.roles.includes("admin")) {
        throw new AppError("bad_request", "You cannot remove your own admin role; ask another admin.", { fieldErrors: { roles: ["You cannot remove your own admin role."] } });
      }
    }
    if (input.email && input.email !== before.email && emailTaken(db, input.email, userId)) {
      throw new AppError("conflict", "Someone already uses that e-mail address.", { fieldErrors: { email: ["Someone already uses that e-mail address."] } });
    }
    const patch: Partial<typeof users.$inferInsert> = { updatedAt: new Date() };
    if (input.name !== undefined) patch.name = input.name;
    if (input.email !== undefined) patch.email = input.email;
    if (input.active !== undefined) patch.active = input.active;
    if (input.yearGroup !== undefined) patch.yearGroup = input.yearGroup;
    if (input.emailNotifications !== undefined) patch.emailNotifications = input.emailNotifications;
    db.update(users).set(patch).where(eq(users.id, userId)).run();
    let afterRoles = beforeRoles;
    if (input.roles) {
      afterRoles = [...new Set(input.roles)];
      db.delete(userRoles).where(eq(userRoles.userId, userId)).run();
      db.insert(userRoles).values(afterRoles.map((role) => ({ userId, role }))).run();
    }
    const action = input.active === false && before.active ? "user.deactivate" : input.active === true && !before.active ? "user.reactivate" : "user.update";
    recordAudit(db, {
      schoolId: actor.schoolId,
      actorId: actor.userId,
      action,
      entityType: "user",
      entityId: userId,
      before: { ...before, roles: beforeRoles },
      after: { ...before, ...Object.fromEntries(Object.entries(patch).filter(([k]) => k !== "updatedAt")), roles: afterRoles },
    });
  });
}

/** The signed-in person's own settings. */
export function getOwnAccount(actor: Actor) {
  const row = getDb()
    .select({ name: users.name, email: users.email, emailNotifications: users.emailNotifications })
    .from(users)
    .where(eq(users.id, actor.userId))
    .get();
  if (!row) throw notFound("Your account");
  return { ...row, roles: actor.roles };
}

export function updateOwnPreferences({ actor, emailNotifications }: { actor: Actor; emailNotifications: boolean }): void {
  getDb().transaction((db) => {
    const before = db.select({ emailNotifications: users.emailNotifications }).from(users).where(eq(users.id, actor.userId)).get();
    db.update(users).set({ emailNotifications, updatedAt: new Date() }).where(eq(users.id, actor.userId)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "user.preferences", entityType: "user", entityId: actor.userId, before, after: { emailNotifications } });
  });
}

export async function changeOwnPassword({ actor, current, password }: { actor: Actor; current: string; password: string }): Promise<void> {
  const db = getDb();
  const row = db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, actor.userId)).get();
  if (!(await verifyPassword(row?.passwordHash, current))) {
    throw new AppError("bad_request", "Your current password is not right.", { fieldErrors: { current: ["Your current password is not right."] } });
  }
  const passwordHash = await hashPassword(password);
  db.transaction((tx) => {
    tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, actor.userId)).run();
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "user.password-change", entityType: "user", entityId: actor.userId });
  });
}

/** Lookup helpers for pickers: people in the school holding a role (admins only). */
export function listPeopleWithRole({ actor, role }: { actor: Actor; role: Role }) {
  requireAdmin(actor);
  return getDb()
    .select({ id: users.id, name: users.name, email: users.email, yearGroup: users.yearGroup })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, role)))
    .where(and(eq(users.schoolId, actor.schoolId), eq(users.active, true)))
    .orderBy(asc(users.name))
    .all();
}


/** Names, e-mails and roles of some people in the actor's school (admins only); others are left out. */
export function describePeople({ actor, userIds }: { actor: Actor; userIds: readonly string[] }): { id: string; name: string; email: string; roles: Role[] }[] {
  requireAdmin(actor);
  if (userIds.length === 0) return [];
  const db = getDb();
  const rows = db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(and(eq(users.schoolId, actor.schoolId), inArray(users.id, [...new Set(userIds)])))
    .orderBy(asc(users.name))
    .all();
  const roles = rolesByUser(db, rows.map((r) => r.id));
  return rows.map((r) => ({ ...r, roles: roles.get(r.id) ?? [] }));
}

import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { forbidden } from "@/lib/errors";
import { getDb, type DbOrTx } from "../client";
import { auditLog, classes, users } from "../schema";

export type AuditInput = {
  schoolId: string;
  actorId: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
};

/** Appends one entry. Call it inside the same transaction as the change it records. */
export function recordAudit(tx: DbOrTx, entry: AuditInput): void {
  tx.insert(auditLog)
    .values({ ...entry, before: entry.before ?? null, after: entry.after ?? null })
    .run();
}

/** The school's audit trail, newest first; admins only. */
export function listAudit({
  actor,
  entityType,
  entityId,
  limit = 200,
}: {
  actor: Actor;
  entityType?: string;
  entityId?: string;
  limit?: number;
}) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can read the audit trail.");
  const conditions = [eq(auditLog.schoolId, actor.schoolId)];
  if (entityType) conditions.push(eq(auditLog.entityType, entityType));
  if (entityId) conditions.push(eq(auditLog.entityId, entityId));
  return getDb()
    .select({
      id: auditLog.id,
      action: auditLog.action,
      entityType: auditLog.entityType,
      entityId: auditLog.entityId,
      before: auditLog.before,
      after: auditLog.after,
      at: auditLog.at,
      actorName: users.name,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(and(...conditions))
    .orderBy(desc(auditLog.id))
    .limit(Math.min(Math.max(limit, 1), 1000))
    .all();
}

/** The kinds of record that appear in the school's audit trail, for its filter (admins only). */
export function listAuditEntityTypes({ actor }: { actor: Actor }): string[] {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can read the audit trail.");
  return getDb()
    .selectDistinct({ entityType: auditLog.entityType })
    .from(auditLog)
    .where(eq(auditLog.schoolId, actor.schoolId))
    .orderBy(asc(auditLog.entityType))
    .all()
    .map((r) => r.entityType);
}

/**
 * Display names for ids that audit entries mention (people and classes of the actor's school), so
 * the trail can say "Added Ellis Marchetti to 10C Chemistry" instead of showing ids. Ids from
 * elsewhere, or of deleted records, are left out.
 */
export function auditNames({ actor, ids }: { actor: Actor; ids: readonly string[] }): Record<string, string> {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can read the audit trail.");
  const wanted = [...new Set(ids)].filter((id) => typeof id === "string" && id.length > 0 && id.length <= 64);
  const out: Record<string, string> = {};
  if (!wanted.length) return out;
  const db = getDb();
  // SQLite limits the number of bound parameters, so look the ids up in slices.
  for (let i = 0; i < wanted.length; i += 500) {
    const slice = wanted.slice(i, i + 500);
    for (const r of db.select({ id: users.id, name: users.name }).from(users).where(and(eq(users.schoolId, actor.schoolId), inArray(users.id, slice))).all()) out[r.id] = r.name;
    for (const r of db.select({ id: classes.id, name: classes.name }).from(classes).where(and(eq(classes.schoolId, actor.schoolId), inArray(classes.id, slice))).all()) out[r.id] = r.name;
  }
  return out;
}

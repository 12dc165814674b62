import "server-only";
import { and, desc, eq } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { forbidden } from "@/lib/errors";
import { getDb, type DbOrTx } from "../client";
import { auditLog, users } from "../schema";

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

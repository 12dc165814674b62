import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import type { RubricBody } from "@/lib/validation/practicals";
import { getDb } from "../client";
import { rubrics, users } from "../schema";
import { recordAudit } from "./audit";

function requireAuthor(actor: Actor) {
  if (!hasRole(actor, "teacher", "admin")) throw forbidden("Only teachers and admins can edit rubrics.");
}

/** The department's saved rubrics (staff can read them). */
export function listRubrics({ actor, includeArchived = false }: { actor: Actor; includeArchived?: boolean }) {
  if (!hasRole(actor, "teacher", "admin", "moderator")) throw forbidden("Only staff can open the rubric library.");
  const conditions = [eq(rubrics.schoolId, actor.schoolId)];
  if (!includeArchived) conditions.push(eq(rubrics.archived, false));
  return getDb()
    .select({ id: rubrics.id, title: rubrics.title, body: rubrics.body, revision: rubrics.revision, archived: rubrics.archived, updatedAt: rubrics.updatedAt, authorName: users.name })
    .from(rubrics)
    .leftJoin(users, eq(users.id, rubrics.createdById))
    .where(and(...conditions))
    .orderBy(asc(rubrics.title))
    .all();
}

export function getRubric({ actor, rubricId }: { actor: Actor; rubricId: string }) {
  if (!hasRole(actor, "teacher", "admin", "moderator")) throw forbidden("Only staff can open the rubric library.");
  const r = getDb()
    .select({ id: rubrics.id, title: rubrics.title, body: rubrics.body, revision: rubrics.revision, archived: rubrics.archived, updatedAt: rubrics.updatedAt })
    .from(rubrics)
    .where(and(eq(rubrics.id, rubricId), eq(rubrics.schoolId, actor.schoolId)))
    .get();
  if (!r) throw notFound("That rubric");
  return r;
}

export function createRubric({ actor, body }: { actor: Actor; body: RubricBody }): string {
  requireAuthor(actor);
  return getDb().transaction((db) => {
    const id = db.insert(rubrics).values({ schoolId: actor.schoolId, title: body.title, body, createdById: actor.userId }).returning({ id: rubrics.id }).get().id;
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "rubric.create", entityType: "rubric", entityId: id, after: { title: body.title, criteria: body.criteria.length } });
    return id;
  });
}

/** Saves a rubric; the revision guards against two people editing it at once. */
export function updateRubric({ actor, rubricId, body, revision, archived }: { actor: Actor; rubricId: string; body?: RubricBody; revision: number; archived?: boolean }) {
  requireAuthor(actor);
  return getDb().transaction((db) => {
    const r = db.select().from(rubrics).where(and(eq(rubrics.id, rubricId), eq(rubrics.schoolId, actor.schoolId))).get();
    if (!r) throw notFound("That rubric");
    if (r.revision !== revision) throw new AppError("conflict", "Someone saved this rubric since you opened it. Reload to see their changes.", { detail: { reason: "stale", current: { revision: r.revision, body: r.body } } });
    const next = r.revision + 1;
    db.update(rubrics)
      .set({ ...(body ? { body, title: body.title } : {}), ...(archived !== undefined ? { archived } : {}), revision: next, updatedAt: new Date() })
      .where(eq(rubrics.id, rubricId))
      .run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: archived === true ? "rubric.archive" : "rubric.update", entityType: "rubric", entityId: rubricId, before: { title: r.title, body: r.body }, after: { title: body?.title ?? r.title, body: body ?? r.body } });
    return { revision: next };
  });
}

import "server-only";
import { and, asc, count, desc, eq, inArray, or, sql } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import {
  practicalContentSchema,
  publishProblems,
  type PracticalContent,
  type PracticalDraftInput,
} from "@/lib/validation/practicals";
import { EMPTY_DOC } from "@/lib/validation/rich-text";
import { getDb, type DbOrTx } from "../client";
import { labSessions, practicals, practicalVersions, users } from "../schema";
import { recordAudit } from "./audit";

/** Teachers and admins write practicals; moderators may read them. */
export function canAuthor(actor: Actor): boolean {
  return hasRole(actor, "teacher", "admin");
}
function requireAuthor(actor: Actor) {
  if (!canAuthor(actor)) throw forbidden("Only teachers and admins can write practicals.");
}
function requireReader(actor: Actor) {
  if (!hasRole(actor, "teacher", "admin", "moderator")) throw forbidden("Only staff can open the practicals library.");
}

export function emptyContent(): PracticalContent {
  return practicalContentSchema.parse({ introduction: EMPTY_DOC, method: EMPTY_DOC });
}

export type PracticalListItem = {
  id: string;
  title: string;
  topic: string;
  subject: string;
  yearGroup: number;
  archived: boolean;
  latestVersion: number;
  latestStatus: "draft" | "published";
  publishedVersion: number | null;
  sessions: number;
  updatedAt: Date;
  authorName: string | null;
};

/** The department library, filtered by a search term, topic and year group. */
export function listPracticals({
  actor,
  search,
  topic,
  yearGroup,
  archived = false,
}: {
  actor: Actor;
  search?: string;
  topic?: string;
  yearGroup?: number;
  archived?: boolean;
}): PracticalListItem[] {
  requireReader(actor);
  const db = getDb();
  const conditions = [eq(practicals.schoolId, actor.schoolId), eq(practicals.archived, archived)];
  if (search?.trim()) {
    const term = `%${search.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    conditions.push(or(sql`${practicals.title} LIKE ${term} ESCAPE '\\'`, sql`${practicals.topic} LIKE ${term} ESCAPE '\\'`)!);
  }
  if (topic) conditions.push(eq(practicals.topic, topic));
  if (yearGroup) conditions.push(eq(practicals.yearGroup, yearGroup));
  const rows = db
    .select({
      id: practicals.id,
      title: practicals.title,
      topic: practicals.topic,
      subject: practicals.subject,
      yearGroup: practicals.yearGroup,
      archived: practicals.archived,
      updatedAt: practicals.updatedAt,
      authorName: users.name,
    })
    .from(practicals)
    .leftJoin(users, eq(users.id, practicals.createdById))
    .where(and(...conditions))
    .orderBy(asc(practicals.topic), asc(practicals.title))
    .all();
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const versions = db
    .select({ practicalId: practicalVersions.practicalId, version: practicalVersions.version, status: practicalVersions.status })
    .from(practicalVersions)
    .where(inArray(practicalVersions.practicalId, ids))
    .all();
  const sessionCounts = new Map(
    db.select({ id: labSessions.practicalId, n: count() }).from(labSessions).where(inArray(labSessions.practicalId, ids)).groupBy(labSessions.practicalId).all().map((r) => [r.id, r.n]),
  );
  return rows.map((r) => {
    const vs = versions.filter((v) => v.practicalId === r.id).sort((a, b) => b.version - a.version);
    const published = vs.find((v) => v.status === "published");
    return {
      ...r,
      latestVersion: vs[0]?.version ?? 1,
      latestStatus: vs[0]?.status ?? "draft",
      publishedVersion: published?.version ?? null,
      sessions: sessionCounts.get(r.id) ?? 0,
    };
  });
}

/** Distinct topics in the library, for the filter. */
export function listTopics({ actor }: { actor: Actor }): string[] {
  requireReader(actor);
  return getDb()
    .selectDistinct({ topic: practicals.topic })
    .from(practicals)
    .where(eq(practicals.schoolId, actor.schoolId))
    .orderBy(asc(practicals.topic))
    .all()
    .map((r) => r.topic);
}

function loadPractical(db: DbOrTx, actor: Actor, practicalId: string) {
  const p = db
    .select()
    .from(practicals)
    .where(and(eq(practicals.id, practicalId), eq(practicals.schoolId, actor.schoolId)))
    .get();
  if (!p) throw notFound("That practical");
  return p;
}

function loadVersion(db: DbOrTx, actor: Actor, versionId: string) {
  const v = db
    .select()
    .from(practicalVersions)
    .where(and(eq(practicalVersions.id, versionId), eq(practicalVersions.schoolId, actor.schoolId)))
    .get();
  if (!v) throw notFound("That version of the practical");
  return v;
}

/** A practical with its versions (newest first) and where it is used. */
export function getPracticalDetail({ actor, practicalId }: { actor: Actor; practicalId: string }) {
  requireReader(actor);
  const db = getDb();
  const p = loadPractical(db, actor, practicalId);
  const versions = db
    .select({
      id: practicalVersions.id,
      version: practicalVersions.version,
      status: practicalVersions.status,
      revision: practicalVersions.revision,
      publishedAt: practicalVersions.publishedAt,
      updatedAt: practicalVersions.updatedAt,
    })
    .from(practicalVersions)
    .where(eq(practicalVersions.practicalId, practicalId))
    .orderBy(desc(practicalVersions.version))
    .all();
  const used = new Map(
    db
      .select({ id: labSessions.practicalVersionId, n: count() })
      .from(labSessions)
      .where(eq(labSessions.practicalId, practicalId))
      .groupBy(labSessions.practicalVersionId)
      .all()
      .map((r) => [r.id, r.n]),
  );
  return {
    id: p.id,
    title: p.title,
    topic: p.topic,
    subject: p.subject,
    yearGroup: p.yearGroup,
    archived: p.archived,
    copiedFromId: p.copiedFromId,
    canEdit: canAuthor(actor),
    versions: versions.map((v) => ({ ...v, sessions: used.get(v.id) ?? 0 })),
  };
}

/** One version with its full content, for staff. */
export function getPracticalVersion({ actor, versionId }: { actor: Actor; versionId: string }) {
  requireReader(actor);
  const v = loadVersion(getDb(), actor, versionId);
  return {
    id: v.id,
    practicalId: v.practicalId,
    version: v.version,
    status: v.status,
    title: v.title,
    topic: v.topic,
    subject: v.subject,
    yearGroup: v.yearGroup,
    content: v.content,
    revision: v.revision,
    publishedAt: v.publishedAt,
    updatedAt: v.updatedAt,
  };
}

/** The newest published version of a practical, if any. */
export function latestPublishedVersionId(db: DbOrTx, practicalId: string): string | null {
  return (
    db
      .select({ id: practicalVersions.id })
      .from(practicalVersions)
      .where(and(eq(practicalVersions.practicalId, practicalId), eq(practicalVersions.status, "published")))
      .orderBy(desc(practicalVersions.version))
      .get()?.id ?? null
  );
}

/** Starts a new practical with an empty first draft. Returns the ids. */
export function createPractical({
  actor,
  input,
  content,
}: {
  actor: Actor;
  input: { title: string; topic: string; yearGroup: number; subject?: string };
  content?: PracticalContent;
}): { practicalId: string; versionId: string } {
  requireAuthor(actor);
  return getDb().transaction((db) => {
    const practicalId = db
      .insert(practicals)
      .values({ schoolId: actor.schoolId, title: input.title, topic: input.topic, subject: input.subject ?? "Chemistry", yearGroup: input.yearGroup, createdById: actor.userId })
      .returning({ id: practicals.id })
      .get().id;
    const versionId = db
      .insert(practicalVersions)
      .values({
        practicalId,
        schoolId: actor.schoolId,
        version: 1,
        status: "draft",
        title: input.title,
        topic: input.topic,
        subject: input.subject ?? "Chemistry",
        yearGroup: input.yearGroup,
        content: content ?? emptyContent(),
        createdById: actor.userId,
      })
      .returning({ id: practicalVersions.id })
      .get().id;
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "practical.create", entityType: "practical", entityId: practicalId, after: input });
    return { practicalId, versionId };
  });
}

/**
 * Saves a draft version. The caller sends the revision it started from; if someone saved in the
 * meantime the save is refused with 409 and the current version, so nothing is overwritten
 * silently. Published versions never change.
 */
export function saveDraft({ actor, versionId, input }: { actor: Actor; versionId: string; input: PracticalDraftInput }) {
  requireAuthor(actor);
  return getDb().transaction((db) => {
    const v = loadVersion(db, actor, versionId);
    if (v.status !== "draft") {
      throw new AppError("conflict", "This version is published and cannot change. Start a new draft to edit it.", { detail: { reason: "published" } });
    }
    if (v.revision !== input.revision) {
      throw new AppError("conflict", "Someone saved this practical since you opened it. Compare the two versions and choose which to keep.", {
        detail: { reason: "stale", current: { revision: v.revision, title: v.title, topic: v.topic, yearGroup: v.yearGroup, subject: v.subject, content: v.content, updatedAt: v.updatedAt } },
      });
    }
    const now = new Date();
    const next = v.revision + 1;
    db.update(practicalVersions)
      .set({ title: input.title, topic: input.topic, yearGroup: input.yearGroup, subject: input.subject, content: input.content, revision: next, updatedAt: now })
      .where(and(eq(practicalVersions.id, versionId), eq(practicalVersions.revision, v.revision)))
      .run();
    db.update(practicals).set({ title: input.title, topic: input.topic, yearGroup: input.yearGroup, subject: input.subject, updatedAt: now }).where(eq(practicals.id, v.practicalId)).run();
    return { revision: next, updatedAt: now };
  });
}

/** Publishes a draft after checking it is complete (safety section, method, table, rubric). */
export function publishVersion({ actor, versionId, revision }: { actor: Actor; versionId: string; revision: number }) {
  requireAuthor(actor);
  return getDb().transaction((db) => {
    const v = loadVersion(db, actor, versionId);
    if (v.status === "published") throw new AppError("conflict", "This version is already published.");
    if (v.revision !== revision) throw new AppError("conflict", "Someone saved this practical since you opened it. Reload before publishing.", { detail: { reason: "stale" } });
    const problems = publishProblems({ title: v.title }, v.content);
    if (Object.keys(problems).length) {
      throw new AppError("bad_request", "This practical is not ready to publish yet.", { fieldErrors: problems });
    }
    const now = new Date();
    db.update(practicalVersions).set({ status: "published", publishedAt: now, publishedById: actor.userId, updatedAt: now }).where(eq(practicalVersions.id, versionId)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "practical.publish", entityType: "practical", entityId: v.practicalId, after: { versionId, version: v.version } });
    return { publishedAt: now };
  });
}

/** Opens a new draft from the newest version (or returns the draft that already exists). */
export function startNewDraft({ actor, practicalId }: { actor: Actor; practicalId: string }): { versionId: string; created: boolean } {
  requireAuthor(actor);
  return getDb().transaction((db) => {
    loadPractical(db, actor, practicalId);
    const latest = db.select().from(practicalVersions).where(eq(practicalVersions.practicalId, practicalId)).orderBy(desc(practicalVersions.version)).get();
    if (!latest) throw notFound("That practical");
    if (latest.status === "draft") return { versionId: latest.id, created: false };
    const versionId = db
      .insert(practicalVersions)
      .values({
        practicalId,
        schoolId: actor.schoolId,
        version: latest.version + 1,
        status: "draft",
        title: latest.title,
        topic: latest.topic,
        subject: latest.subject,
        yearGroup: latest.yearGroup,
        content: latest.content,
        createdById: actor.userId,
      })
      .returning({ id: practicalVersions.id })
      .get().id;
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "practical.new-draft", entityType: "practical", entityId: practicalId, after: { version: latest.version + 1 } });
    return { versionId, created: true };
  });
}

/** Copies a practical (its newest version) into a new practical with a first draft. */
export function duplicatePractical({ actor, practicalId }: { actor: Actor; practicalId: string }) {
  requireAuthor(actor);
  const db = getDb();
  const p = loadPractical(db, actor, practicalId);
  const latest = db.select().from(practicalVersions).where(eq(practicalVersions.practicalId, practicalId)).orderBy(desc(practicalVersions.version)).get();
  if (!latest) throw notFound("That practical");
  const title = `Copy of ${latest.title}`.slice(0, 120);
  const res = createPractical({ actor, input: { title, topic: latest.topic, yearGroup: latest.yearGroup, subject: latest.subject }, content: latest.content });
  db.update(practicals).set({ copiedFromId: p.id }).where(eq(practicals.id, res.practicalId)).run();
  return res;
}

export function setPracticalArchived({ actor, practicalId, archived }: { actor: Actor; practicalId: string; archived: boolean }) {
  requireAuthor(actor);
  getDb().transaction((db) => {
    const p = loadPractical(db, actor, practicalId);
    db.update(practicals).set({ archived, updatedAt: new Date() }).where(eq(practicals.id, practicalId)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: archived ? "practical.archive" : "practical.restore", entityType: "practical", entityId: practicalId, before: { archived: p.archived }, after: { archived } });
  });
}

/** Published versions a teacher can schedule, newest practical title first. */
export function listSchedulableVersions({ actor }: { actor: Actor }) {
  requireAuthor(actor);
  const rows = getDb()
    .select({ id: practicalVersions.id, practicalId: practicalVersions.practicalId, version: practicalVersions.version, title: practicalVersions.title, topic: practicalVersions.topic, yearGroup: practicalVersions.yearGroup })
    .from(practicalVersions)
    .innerJoin(practicals, eq(practicals.id, practicalVersions.practicalId))
    .where(and(eq(practicalVersions.schoolId, actor.schoolId), eq(practicalVersions.status, "published"), eq(practicals.archived, false)))
    .orderBy(asc(practicalVersions.title), desc(practicalVersions.version))
    .all();
  // Only the newest published version of each practical is offered.
  const seen = new Set<string>();
  return rows.filter((r) => (seen.has(r.practicalId) ? false : (seen.add(r.practicalId), true)));
}



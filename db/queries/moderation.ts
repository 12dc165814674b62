import "server-only";
import { randomInt } from "node:crypto";
import { and, asc, desc, eq, inArray, isNotNull, isNull } from "drizzle-orm";
import { alias } from "drizzle-orm/sqlite-core";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { defaultSampleRule, drawModerationSample, markingAgreement, MarkingInputError, suggestMarkAdjustment } from "@/lib/marking";
import type { PracticalContent } from "@/lib/validation/practicals";
import { getDb, type DbOrTx } from "../client";
import {
  classes,
  labSessions,
  markAdjustments,
  marks,
  moderationItems,
  moderationMarks,
  moderationSamples,
  practicals,
  practicalVersions,
  schools,
  userRoles,
  users,
  writeUps,
  type ModerationSample,
  type SampleRule,
} from "../schema";
import { recordAudit } from "./audit";
import { rubricMax } from "./marking";
import { viewWriteUpAsReader } from "./write-ups";

/** The school's sampling rule: the admin's setting, or the common-practice default. */
export function getSampleRule(db: DbOrTx, schoolId: string): SampleRule {
  const settings = db.select({ settings: schools.settings }).from(schools).where(eq(schools.id, schoolId)).get()?.settings ?? {};
  const r = (settings as { moderationRule?: Partial<SampleRule> }).moderationRule ?? {};
  return { ...defaultSampleRule, ...r };
}

/** The sampling rule as moderators and admins see it. */
export function readSampleRule({ actor }: { actor: Actor }): SampleRule {
  requireModeratorOrAdmin(actor);
  return getSampleRule(getDb(), actor.schoolId);
}

export function setSampleRule({ actor, rule }: { actor: Actor; rule: SampleRule }) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can change the sampling rule.");
  getDb().transaction((db) => {
    const row = db.select({ settings: schools.settings }).from(schools).where(eq(schools.id, actor.schoolId)).get()!;
    const before = getSampleRule(db, actor.schoolId);
    db.update(schools).set({ settings: { ...row.settings, moderationRule: rule } }).where(eq(schools.id, actor.schoolId)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "moderation.rule", entityType: "school", entityId: actor.schoolId, before, after: rule });
  });
}

function requireModeratorOrAdmin(actor: Actor) {
  if (!hasRole(actor, "moderator", "admin")) throw forbidden("Only moderators and admins can moderate marking.");
}

type CohortRow = { writeUpId: string; total: number; markerId: string | null; markerName: string | null; studentName: string; className: string; labSessionId: string; criteria: Record<string, { levelId: string; marks: number }>; maxTotal: number };

/** Marked work in a scope: every write-up with a complete mark in the lab session (or every session of the practical). */
function cohortOf(db: DbOrTx, schoolId: string, scope: { labSessionId?: string | null; practicalId?: string | null }): CohortRow[] {
  const sessionIds = scope.labSessionId
    ? [scope.labSessionId]
    : db.select({ id: labSessions.id }).from(labSessions).where(and(eq(labSessions.schoolId, schoolId), eq(labSessions.practicalId, scope.practicalId!))).all().map((r) => r.id);
  if (!sessionIds.length) return [];
  const marker = alias(users, "marker");
  return db
    .select({
      writeUpId: writeUps.id,
      total: marks.total,
      markerId: marks.markerId,
      markerName: marker.name,
      studentName: users.name,
      className: classes.name,
      labSessionId: writeUps.labSessionId,
      criteria: marks.criteria,
      maxTotal: marks.maxTotal,
    })
    .from(writeUps)
    .innerJoin(marks, eq(marks.writeUpId, writeUps.id))
    .innerJoin(users, eq(users.id, writeUps.studentId))
    .innerJoin(labSessions, eq(labSessions.id, writeUps.labSessionId))
    .innerJoin(classes, eq(classes.id, labSessions.classId))
    .leftJoin(marker, eq(marker.id, marks.markerId))
    .where(and(eq(writeUps.schoolId, schoolId), inArray(writeUps.labSessionId, sessionIds), inArray(writeUps.status, ["marked", "returned"])))
    .orderBy(asc(users.name))
    .all();
}

function loadSample(db: DbOrTx, actor: Actor, sampleId: string): ModerationSample {
  const s = db.select().from(moderationSamples).where(and(eq(moderationSamples.id, sampleId), eq(moderationSamples.schoolId, actor.schoolId))).get();
  if (!s) throw notFound("That moderation sample");
  if (!hasRole(actor, "admin") && s.moderatorId !== actor.userId) throw notFound("That moderation sample");
  return s;
}

function rubricOf(db: DbOrTx, sample: ModerationSample): PracticalContent["rubric"] {
  const versionId = sample.labSessionId
    ? db.select({ v: labSessions.practicalVersionId }).from(labSessions).where(eq(labSessions.id, sample.labSessionId)).get()?.v
    : db.select({ v: labSessions.practicalVersionId }).from(labSessions).where(eq(labSessions.practicalId, sample.practicalId!)).orderBy(desc(labSessions.createdAt)).get()?.v;
  if (!versionId) return null;
  return db.select({ c: practicalVersions.content }).from(practicalVersions).where(eq(practicalVersions.id, versionId)).get()?.c.rubric ?? null;
}

/** Lab sessions and practicals that have marked work to sample. */
export function listSampleScopes({ actor }: { actor: Actor }) {
  requireModeratorOrAdmin(actor);
  const db = getDb();
  const rows = db
    .select({ labSessionId: labSessions.id, practicalId: labSessions.practicalId, title: practicalVersions.title, className: classes.name, dueAt: labSessions.dueAt, writeUpId: writeUps.id })
    .from(labSessions)
    .innerJoin(practicalVersions, eq(practicalVersions.id, labSessions.practicalVersionId))
    .innerJoin(classes, eq(classes.id, labSessions.classId))
    .innerJoin(writeUps, and(eq(writeUps.labSessionId, labSessions.id), inArray(writeUps.status, ["marked", "returned"])))
    .where(eq(labSessions.schoolId, actor.schoolId))
    .all();
  const sessions = new Map<string, { labSessionId: string; practicalId: string; title: string; className: string; dueAt: Date; marked: number }>();
  for (const r of rows) {
    const s = sessions.get(r.labSessionId) ?? { labSessionId: r.labSessionId, practicalId: r.practicalId, title: r.title, className: r.className, dueAt: r.dueAt, marked: 0 };
    s.marked += 1;
    sessions.set(r.labSessionId, s);
  }
  const moderators = db
    .select({ id: users.id, name: users.name })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "moderator")))
    .where(and(eq(users.schoolId, actor.schoolId), eq(users.active, true)))
    .orderBy(asc(users.name))
    .all();
  return { sessions: [...sessions.values()].sort((a, b) => b.dueAt.getTime() - a.dueAt.getTime()), moderators, rule: getSampleRule(db, actor.schoolId) };
}

/**
 * Draws a moderation sample by the school's rule with a recorded seed (so the same draw can be
 * repeated), leaving out work the moderator marked themselves.
 */
export function drawSample({
  actor,
  input,
  now = new Date(),
}: {
  actor: Actor;
  input: { labSessionId?: string; practicalId?: string; moderatorId: string; rule?: SampleRule; seed?: number; blind: boolean; toleranceMarks: number };
  now?: Date;
}) {
  requireModeratorOrAdmin(actor);
  return getDb().transaction((db) => {
    if (!hasRole(actor, "admin") && input.moderatorId !== actor.userId) throw new AppError("forbidden", "Moderators draw samples for themselves; an admin can assign one to someone else.", { fieldErrors: { moderatorId: ["Choose yourself."] } });
    const mod = db
      .select({ id: users.id })
      .from(users)
      .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "moderator")))
      .where(and(eq(users.id, input.moderatorId), eq(users.schoolId, actor.schoolId), eq(users.active, true)))
      .get();
    if (!mod) throw new AppError("bad_request", "Choose a moderator from this school.", { fieldErrors: { moderatorId: ["Choose a moderator from this school."] } });
    if (input.labSessionId) {
      if (!db.select({ id: labSessions.id }).from(labSessions).where(and(eq(labSessions.id, input.labSessionId), eq(labSessions.schoolId, actor.schoolId))).get()) throw notFound("That lab session");
    } else if (!db.select({ id: practicals.id }).from(practicals).where(and(eq(practicals.id, input.practicalId!), eq(practicals.schoolId, actor.schoolId))).get()) throw notFound("That practical");
    const cohort = cohortOf(db, actor.schoolId, input).filter((c) => c.markerId !== input.moderatorId);
    if (!cohort.length) throw new AppError("bad_request", "There is no marked work to sample here yet (work the moderator marked is never sampled for them).");
    const rule = input.rule ?? getSampleRule(db, actor.schoolId);
    const seed = input.seed ?? randomInt(0, 2 ** 31 - 1);
    let draw;
    try {
      draw = drawModerationSample(cohort.map((c) => ({ id: c.writeUpId, total: c.total, markerId: c.markerId ?? "unknown" })), rule, seed);
    } catch (e) {
      if (e instanceof MarkingInputError) throw new AppError("bad_request", e.message);
      throw e;
    }
    const sampleId = db
      .insert(moderationSamples)
      .values({ schoolId: actor.schoolId, labSessionId: input.labSessionId ?? null, practicalId: input.labSessionId ? null : input.practicalId!, moderatorId: input.moderatorId, rule, seed, blind: input.blind, toleranceMarks: input.toleranceMarks, drawnById: actor.userId, createdAt: now })
      .returning({ id: moderationSamples.id })
      .get().id;
    for (const id of draw.ids) db.insert(moderationItems).values({ sampleId, writeUpId: id, origin: "drawn", note: draw.reasons[id] ?? "", createdAt: now }).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "moderation.draw", entityType: "moderation-sample", entityId: sampleId, after: { rule, seed, cohort: cohort.length, ids: draw.ids, moderatorId: input.moderatorId } });
    return { sampleId, seed, ids: draw.ids, cohortSize: cohort.length };
  });
}

/** Samples the actor can see: their own as moderator; every sample for an admin. */
export function listSamples({ actor }: { actor: Actor }) {
  requireModeratorOrAdmin(actor);
  const db = getDb();
  const conditions = [eq(moderationSamples.schoolId, actor.schoolId)];
  if (!hasRole(actor, "admin")) conditions.push(eq(moderationSamples.moderatorId, actor.userId));
  const samples = db.select().from(moderationSamples).where(and(...conditions)).orderBy(desc(moderationSamples.createdAt)).all();
  return samples.map((s) => {
    const items = db.select({ writeUpId: moderationItems.writeUpId }).from(moderationItems).where(and(eq(moderationItems.sampleId, s.id), isNull(moderationItems.removedAt))).all();
    const done = items.length
      ? db.select({ id: moderationMarks.writeUpId }).from(moderationMarks).where(and(eq(moderationMarks.sampleId, s.id), inArray(moderationMarks.writeUpId, items.map((i) => i.writeUpId)), isNotNull(moderationMarks.completedAt))).all().length
      : 0;
    return { id: s.id, scope: scopeTitle(db, s), moderatorName: db.select({ name: users.name }).from(users).where(eq(users.id, s.moderatorId)).get()?.name ?? "", status: s.status, items: items.length, secondMarked: done, createdAt: s.createdAt };
  });
}

function scopeTitle(db: DbOrTx, s: ModerationSample): string {
  if (s.labSessionId) {
    const r = db
      .select({ title: practicalVersions.title, cls: classes.name })
      .from(labSessions)
      .innerJoin(practicalVersions, eq(practicalVersions.id, labSessions.practicalVersionId))
      .innerJoin(classes, eq(classes.id, labSessions.classId))
      .where(eq(labSessions.id, s.labSessionId))
      .get();
    return r ? `${r.title} — ${r.cls}` : "Lab session";
  }
  return `${db.select({ t: practicals.title }).from(practicals).where(eq(practicals.id, s.practicalId!)).get()?.t ?? "Practical"} — every class`;
}

function levelIndex(rubric: NonNullable<PracticalContent["rubric"]>, criterionId: string, levelId: string): number | undefined {
  const c = rubric.criteria.find((x) => x.id === criterionId);
  const i = c?.levels.findIndex((l) => l.id === levelId) ?? -1;
  return i >= 0 ? i : undefined;
}

/** A sample with each item's state, teacher marks (hidden while blind), agreement and any adjustment. */
export function getSample({ actor, sampleId }: { actor: Actor; sampleId: string }) {
  requireModeratorOrAdmin(actor);
  const db = getDb();
  const s = loadSample(db, actor, sampleId);
  const rubric = rubricOf(db, s);
  const cohort = cohortOf(db, actor.schoolId, s);
  const byId = new Map(cohort.map((c) => [c.writeUpId, c]));
  const items = db.select().from(moderationItems).where(eq(moderationItems.sampleId, s.id)).orderBy(asc(moderationItems.createdAt)).all();
  const modMarks = db.select().from(moderationMarks).where(eq(moderationMarks.sampleId, s.id)).all();
  const modBy = new Map(modMarks.map((m) => [m.writeUpId, m]));
  const isModerator = s.moderatorId === actor.userId;
  const rows = items.map((it) => {
    const c = byId.get(it.writeUpId);
    const m = modBy.get(it.writeUpId);
    const reveal = !s.blind || !!m?.completedAt || (!isModerator && hasRole(actor, "admin"));
    return {
      writeUpId: it.writeUpId,
      studentName: c?.studentName ?? "",
      className: c?.className ?? "",
      markerName: c?.markerName ?? null,
      origin: it.origin,
      note: it.note,
      removed: !!it.removedAt,
      removedReason: it.removedReason,
      moderation: m ? { total: m.total, completed: !!m.completedAt } : null,
      teacherTotal: reveal ? (c?.total ?? null) : null,
      difference: reveal && m?.completedAt && c ? m.total - c.total : null,
    };
  });
  const active = rows.filter((r) => !r.removed);
  const pairs = active
    .filter((r) => r.moderation?.completed)
    .map((r) => {
      const c = byId.get(r.writeUpId)!;
      const m = modBy.get(r.writeUpId)!;
      const lv = (crit: Record<string, { levelId: string }>) =>
        Object.fromEntries(Object.entries(crit).map(([k, v]) => [k, rubric ? levelIndex(rubric, k, v.levelId) : undefined]).filter(([, v]) => v !== undefined)) as Record<string, number>;
      return { id: r.writeUpId, teacher: { levels: lv(c.criteria), total: c.total }, moderator: { levels: lv(m.criteria), total: m.total } };
    });
  const agreement = pairs.length ? markingAgreement(pairs, (rubric?.criteria ?? []).map((c) => ({ id: c.id, levelCount: c.levels.length })), s.toleranceMarks) : null;
  const maxTotal = rubricMax(rubric);
  let suggestion = null;
  if (agreement && agreement.verdict === "review-needed" && pairs.length >= 2 && Math.abs(agreement.totals.meanDifference) > s.toleranceMarks) {
    const adj = suggestMarkAdjustment(pairs.map((p) => ({ teacher: p.teacher.total, moderator: p.moderator.total })), cohort.map((c) => ({ id: c.writeUpId, total: c.total })), maxTotal);
    suggestion = { slope: adj.slope, intercept: adj.intercept, rSquared: adj.rSquared, points: pairs.map((p) => ({ teacher: p.teacher.total, moderator: p.moderator.total })), changes: adj.changes.map((ch) => ({ ...ch, studentName: byId.get(ch.id)?.studentName ?? "" })) };
  }
  const adjustments = db.select().from(markAdjustments).where(eq(markAdjustments.sampleId, s.id)).orderBy(desc(markAdjustments.createdAt)).all();
  return {
    id: s.id,
    scope: scopeTitle(db, s),
    labSessionId: s.labSessionId,
    practicalId: s.practicalId,
    rule: s.rule,
    seed: s.seed,
    blind: s.blind,
    toleranceMarks: s.toleranceMarks,
    status: s.status,
    isModerator,
    cohortSize: cohort.length,
    maxTotal,
    rubric: rubric ? { criteria: rubric.criteria.map((c) => ({ id: c.id, title: c.title, levels: c.levels.map((l) => ({ id: l.id, label: l.label, marks: l.marks, descriptor: l.descriptor })) })) } : null,
    items: rows,
    agreement,
    suggestion,
    adjustments: adjustments.map((a) => ({ id: a.id, status: a.status, slope: a.slope, intercept: a.intercept, reason: a.reason, decidedAt: a.decidedAt, changes: a.changes.length })),
    candidates: cohort.filter((c) => !items.some((i) => i.writeUpId === c.writeUpId && !i.removedAt) && c.markerId !== s.moderatorId).map((c) => ({ writeUpId: c.writeUpId, studentName: c.studentName, className: c.className })),
  };
}

/** The moderator reads one sampled write-up, with the teacher's marks hidden until they have second-marked it (when blind). */
export function getModerationItem({ actor, sampleId, writeUpId }: { actor: Actor; sampleId: string; writeUpId: string }) {
  requireModeratorOrAdmin(actor);
  const db = getDb();
  const s = loadSample(db, actor, sampleId);
  const item = db.select().from(moderationItems).where(and(eq(moderationItems.sampleId, s.id), eq(moderationItems.writeUpId, writeUpId), isNull(moderationItems.removedAt))).get();
  if (!item) throw notFound("That write-up in this sample");
  const view = viewWriteUpAsReader({ actor, writeUpId });
  const m = db.select().from(moderationMarks).where(and(eq(moderationMarks.sampleId, s.id), eq(moderationMarks.writeUpId, writeUpId))).get();
  const reveal = !s.blind || !!m?.completedAt || (s.moderatorId !== actor.userId && hasRole(actor, "admin"));
  return {
    sample: { id: s.id, blind: s.blind, scope: scopeTitle(db, s) },
    view: { ...view, mark: reveal ? view.mark : null },
    rubric: rubricOf(db, s),
    moderationMark: m ? { criteria: m.criteria, total: m.total, comment: m.comment, revision: m.revision, completedAt: m.completedAt } : null,
    canMark: s.moderatorId === actor.userId && s.status === "open",
    teacherMarksHidden: !reveal,
  };
}

/** Saves a moderator's second marking: a separate record; the teacher's marks are never edited here. */
export function saveModerationMark({ actor, sampleId, writeUpId, input, now = new Date() }: { actor: Actor; sampleId: string; writeUpId: string; input: { revision: number; criteria: Record<string, { levelId: string }>; comment: string; complete: boolean }; now?: Date }) {
  requireModeratorOrAdmin(actor);
  return getDb().transaction((db) => {
    const s = loadSample(db, actor, sampleId);
    if (s.moderatorId !== actor.userId) throw forbidden("Only the moderator this sample was drawn for can second-mark it.");
    if (s.status !== "open") throw new AppError("conflict", "This sample is complete.");
    const item = db.select().from(moderationItems).where(and(eq(moderationItems.sampleId, s.id), eq(moderationItems.writeUpId, writeUpId), isNull(moderationItems.removedAt))).get();
    if (!item) throw notFound("That write-up in this sample");
    const teacherMark = db.select({ markerId: marks.markerId }).from(marks).where(eq(marks.writeUpId, writeUpId)).get();
    if (teacherMark?.markerId === actor.userId) throw forbidden("You marked this work yourself, so you cannot moderate it.");
    const rubric = rubricOf(db, s);
    if (!rubric) throw new AppError("bad_request", "This practical has no rubric.");
    const fieldErrors: Record<string, string[]> = {};
    const criteria: Record<string, { levelId: string; marks: number }> = {};
    for (const [cid, v] of Object.entries(input.criteria)) {
      const c = rubric.criteria.find((x) => x.id === cid);
      const level = c?.levels.find((l) => l.id === v.levelId);
      if (!c || !level) fieldErrors[`criteria.${cid}.levelId`] = ["Choose one of the rubric's levels."];
      else criteria[cid] = { levelId: level.id, marks: level.marks };
    }
    if (input.complete && rubric.criteria.some((c) => !criteria[c.id])) fieldErrors._form = ["Choose a level for every criterion before finishing."];
    if (Object.keys(fieldErrors).length) throw new AppError("bad_request", "Some levels need attention.", { fieldErrors });
    const existing = db.select().from(moderationMarks).where(and(eq(moderationMarks.sampleId, s.id), eq(moderationMarks.writeUpId, writeUpId))).get();
    if ((existing?.revision ?? 0) !== input.revision) throw new AppError("conflict", "These second marks were saved elsewhere since you opened them. Reload to see them.", { detail: { reason: "stale" } });
    const total = Object.values(criteria).reduce((a, c) => a + c.marks, 0);
    const values = { criteria, total, comment: input.comment, revision: (existing?.revision ?? 0) + 1, completedAt: input.complete ? (existing?.completedAt ?? now) : null, updatedAt: now };
    if (existing) db.update(moderationMarks).set(values).where(eq(moderationMarks.id, existing.id)).run();
    else db.insert(moderationMarks).values({ sampleId: s.id, writeUpId, moderatorId: actor.userId, ...values }).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "moderation.mark", entityType: "write-up", entityId: writeUpId, before: existing ? { criteria: existing.criteria, total: existing.total } : null, after: { criteria, total, complete: input.complete, sampleId } });
    return { revision: values.revision, total, completed: !!values.completedAt };
  });
}

/** Adds work to a sample, or swaps one piece for another, with a reason (recorded). */
export function changeSample({ actor, sampleId, change, now = new Date() }: { actor: Actor; sampleId: string; change: { action: "add"; writeUpId: string; reason: string } | { action: "swap"; removeWriteUpId: string; writeUpId: string; reason: string }; now?: Date }) {
  requireModeratorOrAdmin(actor);
  getDb().transaction((db) => {
    const s = loadSample(db, actor, sampleId);
    if (s.status !== "open") throw new AppError("conflict", "This sample is complete.");
    const cohort = cohortOf(db, actor.schoolId, s);
    const candidate = cohort.find((c) => c.writeUpId === change.writeUpId);
    if (!candidate) throw new AppError("bad_request", "Only marked work from this lab session or practical can join the sample.", { fieldErrors: { writeUpId: ["Choose marked work from this cohort."] } });
    if (candidate.markerId === s.moderatorId) throw new AppError("bad_request", "The moderator marked this work, so it cannot be in their sample.", { fieldErrors: { writeUpId: ["Choose work someone else marked."] } });
    const present = db.select().from(moderationItems).where(and(eq(moderationItems.sampleId, s.id), eq(moderationItems.writeUpId, change.writeUpId))).get();
    if (present && !present.removedAt) throw new AppError("conflict", "That work is already in the sample.");
    if (change.action === "swap") {
      const out = db.select().from(moderationItems).where(and(eq(moderationItems.sampleId, s.id), eq(moderationItems.writeUpId, change.removeWriteUpId), isNull(moderationItems.removedAt))).get();
      if (!out) throw notFound("The work to swap out");
      db.update(moderationItems).set({ removedAt: now, removedReason: change.reason }).where(eq(moderationItems.id, out.id)).run();
    }
    if (present) db.update(moderationItems).set({ removedAt: null, removedReason: null, origin: change.action === "add" ? "added" : "swapped-in", note: change.reason }).where(eq(moderationItems.id, present.id)).run();
    else db.insert(moderationItems).values({ sampleId: s.id, writeUpId: change.writeUpId, origin: change.action === "add" ? "added" : "swapped-in", note: change.reason, createdAt: now }).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: `moderation.${change.action}`, entityType: "moderation-sample", entityId: s.id, after: change });
  });
}

/**
 * Accepts or rejects the suggested adjustment for the whole cohort. Accepting applies it to every
 * marked piece of work, keeping the teacher's own marks (the adjusted total is stored beside them)
 * and writing the audit log for each; a decision can be made only once.
 */
export function decideAdjustment({ actor, sampleId, decision, reason, now = new Date() }: { actor: Actor; sampleId: string; decision: "accept" | "reject"; reason: string; now?: Date }) {
  requireModeratorOrAdmin(actor);
  const sample = getSample({ actor, sampleId });
  return getDb().transaction((db) => {
    const s = loadSample(db, actor, sampleId);
    const decided = db.select().from(markAdjustments).where(and(eq(markAdjustments.sampleId, s.id), inArray(markAdjustments.status, ["accepted", "rejected"]))).get();
    if (decided) throw new AppError("conflict", `An adjustment for this sample was already ${decided.status}.`, { detail: { reason: "already-decided" } });
    if (!sample.suggestion) throw new AppError("bad_request", "There is no adjustment to decide: the marks agree, or too little work has been second-marked.");
    const { slope, intercept, changes } = sample.suggestion;
    const id = db
      .insert(markAdjustments)
      .values({ schoolId: actor.schoolId, sampleId: s.id, slope, intercept, status: decision === "accept" ? "accepted" : "rejected", decidedById: actor.userId, decidedAt: now, reason, changes: decision === "accept" ? changes.map(({ id: writeUpId, before, after }) => ({ writeUpId, before, after })) : [], createdAt: now })
      .returning({ id: markAdjustments.id })
      .get().id;
    if (decision === "accept") {
      for (const ch of changes) {
        const m = db.select({ id: marks.id, adjustedTotal: marks.adjustedTotal, total: marks.total }).from(marks).where(eq(marks.writeUpId, ch.id)).get();
        if (!m) continue;
        db.update(marks).set({ adjustedTotal: ch.after, adjustmentId: id, updatedAt: now }).where(eq(marks.id, m.id)).run();
        recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "mark.adjust", entityType: "write-up", entityId: ch.id, before: { total: m.total, adjustedTotal: m.adjustedTotal }, after: { total: m.total, adjustedTotal: ch.after, adjustmentId: id } });
      }
    }
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: `moderation.adjustment-${decision}`, entityType: "moderation-sample", entityId: s.id, after: { slope, intercept, reason, changes: changes.length } });
    return { adjustmentId: id, status: decision === "accept" ? "accepted" : "rejected", changed: decision === "accept" ? changes.length : 0 };
  });
}

export function completeSample({ actor, sampleId, now = new Date() }: { actor: Actor; sampleId: string; now?: Date }) {
  requireModeratorOrAdmin(actor);
  getDb().transaction((db) => {
    const s = loadSample(db, actor, sampleId);
    if (s.status === "completed") throw new AppError("conflict", "This sample is already complete.");
    db.update(moderationSamples).set({ status: "completed", completedAt: now }).where(eq(moderationSamples.id, s.id)).run();
    recordAudit(db, { schoolId: actor.schoolId, actorId: actor.userId, action: "moderation.complete", entityType: "moderation-sample", entityId: s.id });
  });
}

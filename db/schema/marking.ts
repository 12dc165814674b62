import { index, integer, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id, updatedAt } from "./columns";
import { labSessions, practicals } from "./practicals";
import { schools } from "./schools";
import { users } from "./users";
import { writeUps } from "./write-ups";

/** The level chosen for one rubric criterion. */
export type CriterionMark = {
  levelId: string;
  marks: number;
  /** True when the level came from the linked calculation checks and was not changed. */
  fromChecks: boolean;
  /** Why the teacher chose a different level from the one the checks suggested. */
  overrideReason: string | null;
};

/**
 * The teacher's marking of one write-up: a level per criterion, comments on sections and overall
 * feedback. Every change is in the audit log with before and after; the revision stops two
 * teachers overwriting each other's marks.
 */
export const marks = sqliteTable(
  "marks",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    writeUpId: text("write_up_id")
      .notNull()
      .references(() => writeUps.id, { onDelete: "cascade" }),
    markerId: text("marker_id").references(() => users.id, { onDelete: "set null" }),
    criteria: text("criteria", { mode: "json" }).$type<Record<string, CriterionMark>>().notNull().default({}),
    /** Comments keyed by section: "plan", "observations", "table:<id>", "graph:<id>", "check:<id>", "conclusion", "evaluation". */
    comments: text("comments", { mode: "json" }).$type<Record<string, string>>().notNull().default({}),
    feedback: text("feedback").notNull().default(""),
    total: integer("total").notNull().default(0),
    maxTotal: integer("max_total").notNull().default(0),
    /** Set when a moderation adjustment changed this mark; `total` keeps the teacher's own. */
    adjustedTotal: real("adjusted_total"),
    adjustmentId: text("adjustment_id"),
    revision: integer("revision").notNull().default(0),
    markedAt: integer("marked_at", { mode: "timestamp_ms" }),
    returnedAt: integer("returned_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("marks_write_up").on(t.writeUpId), index("marks_school_idx").on(t.schoolId)],
);

/** The rule a moderation sample is drawn by (common practice; an admin can change the school default). */
export type SampleRule = { minCount: number; percent: number; includeExtremes: boolean; everyMarker: boolean };

export const moderationSamples = sqliteTable(
  "moderation_samples",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    /** A sample is drawn from one lab session, or from every lab session of one practical. */
    labSessionId: text("lab_session_id").references(() => labSessions.id, { onDelete: "cascade" }),
    practicalId: text("practical_id").references(() => practicals.id, { onDelete: "cascade" }),
    moderatorId: text("moderator_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    rule: text("rule", { mode: "json" }).$type<SampleRule>().notNull(),
    seed: integer("seed").notNull(),
    /** Teacher marks stay hidden from the moderator until they have second-marked the item. */
    blind: integer("blind", { mode: "boolean" }).notNull().default(true),
    status: text("status", { enum: ["open", "completed"] }).notNull().default("open"),
    /** Tolerance in marks used for "within tolerance" when comparing totals. */
    toleranceMarks: integer("tolerance_marks").notNull().default(1),
    drawnById: text("drawn_by_id").references(() => users.id, { onDelete: "set null" }),
    completedAt: integer("completed_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [index("moderation_samples_school_idx").on(t.schoolId)],
);

export const moderationItems = sqliteTable(
  "moderation_items",
  {
    id: id(),
    sampleId: text("sample_id")
      .notNull()
      .references(() => moderationSamples.id, { onDelete: "cascade" }),
    writeUpId: text("write_up_id")
      .notNull()
      .references(() => writeUps.id, { onDelete: "cascade" }),
    /** How it came into the sample: drawn by the rule, added or swapped in by the moderator. */
    origin: text("origin", { enum: ["drawn", "added", "swapped-in"] }).notNull().default("drawn"),
    note: text("note").notNull().default(""),
    removedAt: integer("removed_at", { mode: "timestamp_ms" }),
    removedReason: text("removed_reason"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("moderation_items_sample_write_up").on(t.sampleId, t.writeUpId)],
);

/** The moderator's second marking: a separate record, never an edit of the teacher's marks. */
export const moderationMarks = sqliteTable(
  "moderation_marks",
  {
    id: id(),
    sampleId: text("sample_id")
      .notNull()
      .references(() => moderationSamples.id, { onDelete: "cascade" }),
    writeUpId: text("write_up_id")
      .notNull()
      .references(() => writeUps.id, { onDelete: "cascade" }),
    moderatorId: text("moderator_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    criteria: text("criteria", { mode: "json" }).$type<Record<string, { levelId: string; marks: number }>>().notNull().default({}),
    total: integer("total").notNull().default(0),
    comment: text("comment").notNull().default(""),
    revision: integer("revision").notNull().default(0),
    completedAt: integer("completed_at", { mode: "timestamp_ms" }),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("moderation_marks_sample_write_up").on(t.sampleId, t.writeUpId)],
);

/** A suggested change to a whole cohort's marks from a moderation sample, and the decision on it. */
export const markAdjustments = sqliteTable("mark_adjustments", {
  id: id(),
  schoolId: text("school_id")
    .notNull()
    .references(() => schools.id, { onDelete: "cascade" }),
  sampleId: text("sample_id")
    .notNull()
    .references(() => moderationSamples.id, { onDelete: "cascade" }),
  /** moderator total ≈ intercept + slope × teacher total, from the sample. */
  slope: real("slope").notNull(),
  intercept: real("intercept").notNull(),
  status: text("status", { enum: ["proposed", "accepted", "rejected"] }).notNull().default("proposed"),
  decidedById: text("decided_by_id").references(() => users.id, { onDelete: "set null" }),
  decidedAt: integer("decided_at", { mode: "timestamp_ms" }),
  reason: text("reason").notNull().default(""),
  /** The write-ups changed and their totals before and after. */
  changes: text("changes", { mode: "json" }).$type<{ writeUpId: string; before: number; after: number }[]>().notNull().default([]),
  createdAt: createdAt(),
});

export type Mark = typeof marks.$inferSelect;
export type ModerationSample = typeof moderationSamples.$inferSelect;

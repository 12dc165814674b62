import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import type { PracticalContent, RubricBody } from "@/lib/validation/practicals";
import { createdAt, id, updatedAt } from "./columns";
import { classes } from "./classes";
import { schools } from "./schools";
import { users } from "./users";

/** A practical in the department library. Its content lives in versions. */
export const practicals = sqliteTable(
  "practicals",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    /** Title, topic and year group of the newest version, kept here for the library list and search. */
    title: text("title").notNull(),
    topic: text("topic").notNull(),
    subject: text("subject").notNull().default("Chemistry"),
    yearGroup: integer("year_group").notNull(),
    archived: integer("archived", { mode: "boolean" }).notNull().default(false),
    createdById: text("created_by_id").references(() => users.id, { onDelete: "set null" }),
    /** Set when this practical was made by duplicating another. */
    copiedFromId: text("copied_from_id"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("practicals_school_idx").on(t.schoolId, t.archived)],
);

export const PRACTICAL_VERSION_STATUSES = ["draft", "published"] as const;

/**
 * One version of a practical. A draft can be edited (with a revision number so two tabs cannot
 * overwrite each other); a published version never changes. Editing a published practical makes
 * a new draft version; write-ups keep the version they were started on.
 */
export const practicalVersions = sqliteTable(
  "practical_versions",
  {
    id: id(),
    practicalId: text("practical_id")
      .notNull()
      .references(() => practicals.id, { onDelete: "cascade" }),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    status: text("status", { enum: PRACTICAL_VERSION_STATUSES }).notNull().default("draft"),
    title: text("title").notNull(),
    topic: text("topic").notNull(),
    subject: text("subject").notNull().default("Chemistry"),
    yearGroup: integer("year_group").notNull(),
    content: text("content", { mode: "json" }).$type<PracticalContent>().notNull(),
    revision: integer("revision").notNull().default(0),
    createdById: text("created_by_id").references(() => users.id, { onDelete: "set null" }),
    publishedAt: integer("published_at", { mode: "timestamp_ms" }),
    publishedById: text("published_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("practical_versions_number").on(t.practicalId, t.version), index("practical_versions_school_idx").on(t.schoolId)],
);

/** A rubric saved in the department's library, reusable across practicals. */
export const rubrics = sqliteTable(
  "rubrics",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    body: text("body", { mode: "json" }).$type<RubricBody>().notNull(),
    revision: integer("revision").notNull().default(0),
    archived: integer("archived", { mode: "boolean" }).notNull().default(false),
    createdById: text("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("rubrics_school_idx").on(t.schoolId)],
);

export type LabGroup = { id: string; name: string; studentIds: string[] };

/** A published practical version scheduled for one class, with open and due dates. */
export const labSessions = sqliteTable(
  "lab_sessions",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    classId: text("class_id")
      .notNull()
      .references(() => classes.id, { onDelete: "cascade" }),
    practicalId: text("practical_id")
      .notNull()
      .references(() => practicals.id, { onDelete: "restrict" }),
    practicalVersionId: text("practical_version_id")
      .notNull()
      .references(() => practicalVersions.id, { onDelete: "restrict" }),
    opensAt: integer("opens_at", { mode: "timestamp_ms" }).notNull(),
    dueAt: integer("due_at", { mode: "timestamp_ms" }).notNull(),
    grouping: text("grouping", { enum: ["individual", "groups"] }).notNull().default("individual"),
    groups: text("groups", { mode: "json" }).$type<LabGroup[]>().notNull().default([]),
    lateWork: text("late_work", { enum: ["accept", "accept-flagged", "refuse"] }).notNull().default("accept-flagged"),
    /** How many days after the due date late work is still accepted. */
    lateDays: integer("late_days").notNull().default(7),
    notes: text("notes").notNull().default(""),
    cancelledAt: integer("cancelled_at", { mode: "timestamp_ms" }),
    createdById: text("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("lab_sessions_class_idx").on(t.classId, t.opensAt), index("lab_sessions_school_idx").on(t.schoolId), index("lab_sessions_version_idx").on(t.practicalVersionId)],
);

export type Practical = typeof practicals.$inferSelect;
export type PracticalVersion = typeof practicalVersions.$inferSelect;
export type Rubric = typeof rubrics.$inferSelect;
export type LabSession = typeof labSessions.$inferSelect;

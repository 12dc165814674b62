import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import type { CheckOutcome } from "@/lib/checks/types";
import type { GroupTables, WriteUpContent } from "@/lib/validation/write-ups";
import { createdAt, id, updatedAt } from "./columns";
import { labSessions, practicalVersions } from "./practicals";
import { schools } from "./schools";
import { users } from "./users";

export const WRITE_UP_STATUSES = ["draft", "submitted", "marked", "returned"] as const;
export type WriteUpStatus = (typeof WRITE_UP_STATUSES)[number];

/** The latest result of each check, kept on the server with the data it was run on. */
export type StoredCheckResults = Record<string, { outcome: CheckOutcome; dataHash: string; answerHash: string; at: number }>;

/**
 * A student's notebook for one lab session. It keeps the practical version it was started on.
 * Every save names the revision it started from; a save from an older revision is refused (409).
 */
export const writeUps = sqliteTable(
  "write_ups",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    labSessionId: text("lab_session_id")
      .notNull()
      .references(() => labSessions.id, { onDelete: "cascade" }),
    studentId: text("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    practicalVersionId: text("practical_version_id")
      .notNull()
      .references(() => practicalVersions.id, { onDelete: "restrict" }),
    status: text("status", { enum: WRITE_UP_STATUSES }).notNull().default("draft"),
    revision: integer("revision").notNull().default(0),
    content: text("content", { mode: "json" }).$type<WriteUpContent>().notNull(),
    checkResults: text("check_results", { mode: "json" }).$type<StoredCheckResults>().notNull().default({}),
    safetyAcknowledgedAt: integer("safety_acknowledged_at", { mode: "timestamp_ms" }),
    submittedAt: integer("submitted_at", { mode: "timestamp_ms" }),
    late: integer("late", { mode: "boolean" }).notNull().default(false),
    reopenedAt: integer("reopened_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("write_ups_session_student").on(t.labSessionId, t.studentId), index("write_ups_student_idx").on(t.studentId), index("write_ups_school_idx").on(t.schoolId)],
);

/** Results tables shared by a group when a lab session shares data within groups. */
export const groupTables = sqliteTable(
  "group_tables",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    labSessionId: text("lab_session_id")
      .notNull()
      .references(() => labSessions.id, { onDelete: "cascade" }),
    groupId: text("group_id").notNull(),
    tables: text("tables", { mode: "json" }).$type<GroupTables>().notNull(),
    revision: integer("revision").notNull().default(0),
    updatedById: text("updated_by_id").references(() => users.id, { onDelete: "set null" }),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("group_tables_session_group").on(t.labSessionId, t.groupId)],
);

/** Every check a student ran, for progress reports: which kinds they get right first time, which slips recur. */
export const checkAttempts = sqliteTable(
  "check_attempts",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    writeUpId: text("write_up_id")
      .notNull()
      .references(() => writeUps.id, { onDelete: "cascade" }),
    studentId: text("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    checkId: text("check_id").notNull(),
    kind: text("kind").notNull(),
    verdict: text("verdict").notNull(),
    slipCode: text("slip_code"),
    at: integer("at", { mode: "timestamp_ms" })
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [index("check_attempts_student").on(t.studentId, t.at), index("check_attempts_write_up").on(t.writeUpId)],
);

export type WriteUp = typeof writeUps.$inferSelect;

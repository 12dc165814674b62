import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { schools } from "./schools";
import { users } from "./users";

/** A teaching group, for example "10C Chemistry". */
export const classes = sqliteTable(
  "classes",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    subject: text("subject").notNull(),
    yearGroup: integer("year_group").notNull(),
    /** For example "2026-27". */
    academicYear: text("academic_year").notNull(),
    archived: integer("archived", { mode: "boolean" }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("classes_school_name_year").on(t.schoolId, t.name, t.academicYear)],
);

export const classTeachers = sqliteTable(
  "class_teachers",
  {
    classId: text("class_id")
      .notNull()
      .references(() => classes.id, { onDelete: "cascade" }),
    teacherId: text("teacher_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.classId, t.teacherId] }), index("class_teachers_teacher_idx").on(t.teacherId)],
);

export const classStudents = sqliteTable(
  "class_students",
  {
    classId: text("class_id")
      .notNull()
      .references(() => classes.id, { onDelete: "cascade" }),
    studentId: text("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.classId, t.studentId] }), index("class_students_student_idx").on(t.studentId)],
);

/** A parent or guardian linked to a student. */
export const parentLinks = sqliteTable(
  "parent_links",
  {
    parentId: text("parent_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    studentId: text("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    /** For example "Mother", "Guardian". */
    relationship: text("relationship").notNull().default("Parent"),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.parentId, t.studentId] }), index("parent_links_student_idx").on(t.studentId)],
);

export type SchoolClass = typeof classes.$inferSelect;
export type NewSchoolClass = typeof classes.$inferInsert;

import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id, updatedAt } from "./columns";
import { ROLES } from "./constants";
import { schools } from "./schools";

export const users = sqliteTable(
  "users",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    /** Stored lower-case; unique across the deployment so sign-in needs no school picker. */
    email: text("email").notNull(),
    name: text("name").notNull(),
    /** argon2id hash; null until the person accepts their invitation. */
    passwordHash: text("password_hash"),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    /** Students only: year group (7–13), shown on rosters. */
    yearGroup: integer("year_group"),
    /** Parents: whether to receive e-mails when work is returned and termly reports. */
    emailNotifications: integer("email_notifications", { mode: "boolean" }).notNull().default(true),
    lastSignInAt: integer("last_sign_in_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("users_email_unique").on(t.email), index("users_school_idx").on(t.schoolId)],
);

export const userRoles = sqliteTable(
  "user_roles",
  {
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: text("role", { enum: ROLES }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] })],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;

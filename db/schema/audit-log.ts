import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { schools } from "./schools";
import { users } from "./users";

/** Append-only record of who did what, when, with the values before and after. */
export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    /** Null for the system (seeding, sweeps) or a signed-out person (invitation acceptance). */
    actorId: text("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    before: text("before", { mode: "json" }).$type<unknown>(),
    after: text("after", { mode: "json" }).$type<unknown>(),
    at: integer("at", { mode: "timestamp_ms" })
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [index("audit_school_at").on(t.schoolId, t.at), index("audit_entity").on(t.entityType, t.entityId)],
);

export type AuditEntry = typeof auditLog.$inferSelect;

import { sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";

/** A school is the tenant: every other row belongs to exactly one school. */
export const schools = sqliteTable("schools", {
  id: id(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  /** School-wide settings as JSON (for example the moderation sampling rule). */
  settings: text("settings", { mode: "json" }).$type<Record<string, unknown>>().notNull().default({}),
  createdAt: createdAt(),
});

export type School = typeof schools.$inferSelect;
export type NewSchool = typeof schools.$inferInsert;

import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { INVITATION_KINDS } from "./constants";
import { schools } from "./schools";
import { users } from "./users";

/**
 * Single-use, expiring links sent by e-mail: invitations to set a first password, and password
 * resets. Only a SHA-256 hash of the token is stored, so a copy of the database cannot be used
 * to sign in.
 */
export const invitations = sqliteTable(
  "invitations",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: INVITATION_KINDS }).notNull(),
    tokenHash: text("token_hash").notNull(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    usedAt: integer("used_at", { mode: "timestamp_ms" }),
    /** Set when a newer link for the same person and purpose replaces this one. */
    revokedAt: integer("revoked_at", { mode: "timestamp_ms" }),
    createdById: text("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_token_hash").on(t.tokenHash), index("invitations_user_idx").on(t.userId)],
);

export type Invitation = typeof invitations.$inferSelect;

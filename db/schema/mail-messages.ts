import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { id } from "./columns";
import { schools } from "./schools";

/**
 * Messages received by the built-in fake mail server (the default when no SMTP server is
 * configured), so that a person trying the demo and the tests can read what was sent.
 */
export const mailMessages = sqliteTable(
  "mail_messages",
  {
    id: id(),
    schoolId: text("school_id").references(() => schools.id, { onDelete: "cascade" }),
    messageId: text("message_id"),
    from: text("from_address").notNull(),
    to: text("to_address").notNull(),
    subject: text("subject").notNull(),
    text: text("text_body").notNull().default(""),
    html: text("html_body"),
    /** Names, types and sizes of attachments; the bytes stay in `raw`. */
    attachments: text("attachments", { mode: "json" })
      .$type<{ filename: string; contentType: string; size: number }[]>()
      .notNull()
      .default([]),
    raw: text("raw").notNull(),
    receivedAt: integer("received_at", { mode: "timestamp_ms" })
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [index("mail_to_idx").on(t.to), index("mail_school_idx").on(t.schoolId, t.receivedAt)],
);

export type MailMessage = typeof mailMessages.$inferSelect;

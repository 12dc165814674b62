import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";
import { practicals } from "./practicals";
import { schools } from "./schools";
import { users } from "./users";
import { writeUps } from "./write-ups";

/**
 * A photo attached to a write-up (students) or a practical (teachers' reference photos). The
 * browser uploads straight to object storage; the server then checks the bytes, re-encodes the
 * image without any metadata and makes a thumbnail before it is shown to anyone.
 */
export const evidence = sqliteTable(
  "evidence",
  {
    id: id(),
    schoolId: text("school_id")
      .notNull()
      .references(() => schools.id, { onDelete: "cascade" }),
    writeUpId: text("write_up_id").references(() => writeUps.id, { onDelete: "cascade" }),
    practicalId: text("practical_id").references(() => practicals.id, { onDelete: "cascade" }),
    uploadedById: text("uploaded_by_id").references(() => users.id, { onDelete: "set null" }),
    caption: text("caption").notNull().default(""),
    status: text("status", { enum: ["pending", "ready", "rejected"] }).notNull().default("pending"),
    /** Where the browser uploads the original; deleted once processed. */
    uploadKey: text("upload_key").notNull(),
    /** The re-encoded image and its thumbnail. */
    imageKey: text("image_key"),
    thumbKey: text("thumb_key"),
    declaredType: text("declared_type").notNull(),
    declaredSize: integer("declared_size").notNull(),
    originalName: text("original_name").notNull().default(""),
    size: integer("size"),
    width: integer("width"),
    height: integer("height"),
    sha256: text("sha256"),
    rejectReason: text("reject_reason"),
    confirmedAt: integer("confirmed_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [index("evidence_write_up_idx").on(t.writeUpId), index("evidence_practical_idx").on(t.practicalId), index("evidence_status_idx").on(t.status, t.createdAt)],
);

export type Evidence = typeof evidence.$inferSelect;

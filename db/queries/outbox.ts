import "server-only";
import { and, desc, eq, like } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { forbidden, notFound } from "@/lib/errors";
import { getDb } from "../client";
import { mailMessages } from "../schema";

export function storeReceivedMail(msg: typeof mailMessages.$inferInsert): void {
  getDb().insert(mailMessages).values(msg).run();
}

/** The outbox of the built-in mail catcher, for an admin of the school. */
export function listOutbox({ actor, to, limit = 100 }: { actor: Actor; to?: string; limit?: number }) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can read the outbox.");
  const conditions = [eq(mailMessages.schoolId, actor.schoolId)];
  if (to?.trim()) conditions.push(like(mailMessages.to, `%${to.trim().toLowerCase()}%`));
  return getDb()
    .select({ id: mailMessages.id, to: mailMessages.to, subject: mailMessages.subject, receivedAt: mailMessages.receivedAt, attachments: mailMessages.attachments })
    .from(mailMessages)
    .where(and(...conditions))
    .orderBy(desc(mailMessages.receivedAt))
    .limit(Math.min(Math.max(limit, 1), 500))
    .all();
}

export function getOutboxMessage({ actor, id }: { actor: Actor; id: string }) {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can read the outbox.");
  const row = getDb()
    .select({
      id: mailMessages.id,
      from: mailMessages.from,
      to: mailMessages.to,
      subject: mailMessages.subject,
      text: mailMessages.text,
      receivedAt: mailMessages.receivedAt,
      attachments: mailMessages.attachments,
    })
    .from(mailMessages)
    .where(and(eq(mailMessages.id, id), eq(mailMessages.schoolId, actor.schoolId)))
    .get();
  if (!row) throw notFound("That message");
  return row;
}

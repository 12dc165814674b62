import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { hashPassword } from "@/lib/auth/password";
import { appUrl } from "@/lib/config";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { sendMail, simpleHtml } from "@/lib/mail";
import { hashToken, newToken } from "@/lib/tokens";
import { getDb, type DbOrTx } from "../client";
import { invitations, schools, users, type InvitationKind } from "../schema";
import { recordAudit } from "./audit";

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/** Creates a fresh single-use link for a person, revoking any earlier unused one of the same kind. */
function issueToken(db: DbOrTx, { schoolId, userId, kind, createdById, now }: { schoolId: string; userId: string; kind: InvitationKind; createdById: string | null; now: Date }) {
  db.update(invitations)
    .set({ revokedAt: now })
    .where(and(eq(invitations.userId, userId), eq(invitations.kind, kind), isNull(invitations.usedAt), isNull(invitations.revokedAt)))
    .run();
  const token = newToken();
  const expiresAt = new Date(now.getTime() + (kind === "invitation" ? INVITATION_TTL_MS : PASSWORD_RESET_TTL_MS));
  db.insert(invitations).values({ schoolId, userId, kind, tokenHash: hashToken(token), expiresAt, createdById, createdAt: now }).run();
  return { token, expiresAt };
}

function formatExpiry(d: Date): string {
  return d.toLocaleString("en-GB", { dateStyle: "long", timeStyle: "short", timeZone: process.env.TZ || "Europe/London" });
}

/**
 * Sends (or re-sends) an invitation to a person who has not yet set a password. Admins only.
 * Returns the link so that callers in tests can follow it; it is never sent to the browser.
 */
export async function sendInvitation({ actor, userId, now = new Date() }: { actor: Actor; userId: string; now?: Date }): Promise<{ link: string; expiresAt: Date }> {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can send invitations.");
  const db = getDb();
  const user = db
    .select({ id: users.id, name: users.name, email: users.email, active: users.active, passwordHash: users.passwordHash, school: schools.name })
    .from(users)
    .innerJoin(schools, eq(schools.id, users.schoolId))
    .where(and(eq(users.id, userId), eq(users.schoolId, actor.schoolId)))
    .get();
  if (!user) throw notFound("That person");
  if (!user.active) throw new AppError("bad_request", "This account is deactivated. Reactivate it before sending an invitation.");
  if (user.passwordHash) throw new AppError("conflict", "This person has already set up their account. They can use “Forgot your password?” on the sign-in page.");
  const { token, expiresAt } = db.transaction((tx) => {
    const issued = issueToken(tx, { schoolId: actor.schoolId, userId, kind: "invitation", createdById: actor.userId, now });
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "invitation.send", entityType: "user", entityId: userId, after: { expiresAt: issued.expiresAt } });
    return issued;
  });
  const link = `${appUrl()}/invitation?token=${encodeURIComponent(token)}`;
  await sendMail({
    to: user.email,
    schoolId: actor.schoolId,
    subject: `Your Meniscus account at ${user.school}`,
    text: [
      `Hello ${user.name},`,
      `${actor.name} has set up a Meniscus account for you at ${user.school}. Meniscus is where your school keeps practical science work: lab write-ups, results, marks and progress reports.`,
      `Choose your password here (the link works once, until ${formatExpiry(expiresAt)}):`,
      link,
      `If you were not expecting this, you can ignore this e-mail.`,
    ].join("\n\n"),
    html: simpleHtml({
      paragraphs: [
        `Hello ${user.name},`,
        `${actor.name} has set up a Meniscus account for you at ${user.school}. Meniscus is where your school keeps practical science work: lab write-ups, results, marks and progress reports.`,
        `Choose your password with the link below. It works once, until ${formatExpiry(expiresAt)}.`,
      ],
      link,
      linkText: "Choose my password",
    }),
  });
  return { link, expiresAt };
}

type TokenState = "valid" | "unknown" | "used" | "expired" | "replaced" | "inactive";

function findToken(db: DbOrTx, token: string, kind: InvitationKind, now: Date) {
  const row = db
    .select({
      id: invitations.id,
      userId: invitations.userId,
      schoolId: invitations.schoolId,
      expiresAt: invitations.expiresAt,
      usedAt: invitations.usedAt,
      revokedAt: invitations.revokedAt,
      name: users.name,
      email: users.email,
      active: users.active,
      school: schools.name,
    })
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.userId))
    .innerJoin(schools, eq(schools.id, invitations.schoolId))
    .where(and(eq(invitations.tokenHash, hashToken(token)), eq(invitations.kind, kind)))
    .get();
  let state: TokenState = "valid";
  if (!row) state = "unknown";
  else if (row.usedAt) state = "used";
  else if (row.revokedAt) state = "replaced";
  else if (row.expiresAt.getTime() <= now.getTime()) state = "expired";
  else if (!row.active) state = "inactive";
  return { row, state };
}

const TOKEN_MESSAGES: Record<Exclude<TokenState, "valid">, { code: "not_found" | "gone"; invitation: string; reset: string }> = {
  unknown: { code: "not_found", invitation: "This invitation link is not recognised. Check you copied the whole link, or ask your school for a new one.", reset: "This reset link is not recognised. Ask for a new one from the sign-in page." },
  used: { code: "gone", invitation: "This invitation has already been used. Sign in with the password you chose, or use “Forgot your password?”.", reset: "This reset link has already been used. Ask for a new one if you still need it." },
  replaced: { code: "gone", invitation: "A newer invitation was sent after this one. Use the link in the most recent e-mail.", reset: "A newer reset link was sent after this one. Use the link in the most recent e-mail." },
  expired: { code: "gone", invitation: "This invitation has expired. Ask your school to send a new one.", reset: "This reset link has expired (they last one hour). Ask for a new one from the sign-in page." },
  inactive: { code: "gone", invitation: "This account has been closed by your school.", reset: "This account has been closed by your school." },
};

function refuse(state: Exclude<TokenState, "valid">, kind: InvitationKind): never {
  const m = TOKEN_MESSAGES[state];
  throw new AppError(m.code, kind === "invitation" ? m.invitation : m.reset, { detail: { reason: state } });
}

/** What the invitation page shows before the person chooses a password. */
export function previewToken({ token, kind, now = new Date() }: { token: string; kind: InvitationKind; now?: Date }) {
  const { row, state } = findToken(getDb(), token, kind, now);
  if (state !== "valid" || !row) return { ok: false as const, reason: state, message: kind === "invitation" ? TOKEN_MESSAGES[state as Exclude<TokenState, "valid">].invitation : TOKEN_MESSAGES[state as Exclude<TokenState, "valid">].reset };
  return { ok: true as const, name: row.name, email: row.email, school: row.school, expiresAt: row.expiresAt };
}

/**
 * Uses an invitation or reset link: sets the password and marks the link used, atomically, so a
 * link can never be used twice even by two requests at once.
 */
export async function redeemToken({ token, kind, password, now = new Date() }: { token: string; kind: InvitationKind; password: string; now?: Date }): Promise<{ email: string }> {
  const db = getDb();
  const first = findToken(db, token, kind, now);
  if (first.state !== "valid") refuse(first.state, kind);
  const passwordHash = await hashPassword(password);
  return db.transaction((tx) => {
    // Look again inside the transaction: the hash above took time.
    const { row, state } = findToken(tx, token, kind, now);
    if (state !== "valid" || !row) refuse(state === "valid" ? "unknown" : state, kind);
    const claimed = tx.update(invitations).set({ usedAt: now }).where(and(eq(invitations.id, row.id), isNull(invitations.usedAt))).run();
    if (claimed.changes !== 1) refuse("used", kind);
    tx.update(users).set({ passwordHash, updatedAt: now }).where(eq(users.id, row.userId)).run();
    recordAudit(tx, { schoolId: row.schoolId, actorId: row.userId, action: kind === "invitation" ? "invitation.accept" : "password.reset", entityType: "user", entityId: row.userId });
    return { email: row.email };
  });
}

/**
 * Sends a password-reset link if the address belongs to an active account. Says nothing either
 * way, so the form cannot be used to find out who has an account.
 */
export async function requestPasswordReset({ email, now = new Date() }: { email: string; now?: Date }): Promise<void> {
  const db = getDb();
  const user = db
    .select({ id: users.id, name: users.name, email: users.email, active: users.active, schoolId: users.schoolId, hasPassword: users.passwordHash })
    .from(users)
    .where(eq(users.email, email))
    .get();
  if (!user || !user.active) return;
  const kind: InvitationKind = user.hasPassword ? "password-reset" : "invitation";
  const { token, expiresAt } = db.transaction((tx) => {
    const issued = issueToken(tx, { schoolId: user.schoolId, userId: user.id, kind, createdById: null, now });
    recordAudit(tx, { schoolId: user.schoolId, actorId: null, action: kind === "invitation" ? "invitation.resend-by-request" : "password.reset-request", entityType: "user", entityId: user.id });
    return issued;
  });
  const link = `${appUrl()}/${kind === "invitation" ? "invitation" : "reset-password"}?token=${encodeURIComponent(token)}`;
  await sendMail({
    to: user.email,
    schoolId: user.schoolId,
    subject: "Reset your Meniscus password",
    text: [
      `Hello ${user.name},`,
      `Someone (we hope you) asked to reset the password for this Meniscus account.`,
      `Choose a new password here (the link works once, until ${formatExpiry(expiresAt)}):`,
      link,
      `If you did not ask for this, you can ignore this e-mail: your password has not changed.`,
    ].join("\n\n"),
    html: simpleHtml({
      paragraphs: [
        `Hello ${user.name},`,
        `Someone (we hope you) asked to reset the password for this Meniscus account.`,
        `Choose a new password with the link below. It works once, until ${formatExpiry(expiresAt)}. If you did not ask for this, you can ignore this e-mail.`,
      ],
      link,
      linkText: "Choose a new password",
    }),
  });
}

export type InvitationAttempt = { userId: string; ok: true; expiresAt: Date } | { userId: string; ok: false; message: string };

/**
 * Sends invitations to several people, a few at a time, and reports each outcome instead of
 * stopping at the first failure: used after a roster import or when adding a person, where the
 * people are already saved and a mail problem must not undo that. Links are never returned.
 */
export async function sendInvitationsTo({ actor, userIds, concurrency = 4 }: { actor: Actor; userIds: readonly string[]; concurrency?: number }): Promise<InvitationAttempt[]> {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can send invitations.");
  const results: InvitationAttempt[] = new Array(userIds.length);
  let next = 0;
  const worker = async () => {
    while (next < userIds.length) {
      const i = next++;
      const userId = userIds[i]!;
      try {
        const { expiresAt } = await sendInvitation({ actor, userId });
        results[i] = { userId, ok: true, expiresAt };
      } catch (e) {
        if (e instanceof AppError) results[i] = { userId, ok: false, message: e.message };
        else {
          console.error("[meniscus] invitation e-mail failed", e);
          results[i] = { userId, ok: false, message: "The e-mail could not be sent just now. Send the invitation again from the person's page." };
        }
      }
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(concurrency, userIds.length)) }, worker));
  return results;
}

import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { INVITATION_TTL_MS, PASSWORD_RESET_TTL_MS, previewToken, redeemToken, requestPasswordReset, sendInvitation } from "@/db/queries/invitations";
import { listUsers, updateUser } from "@/db/queries/users";
import { invitations, mailMessages, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { startFakeSmtp } from "@/lib/dev/fake-smtp";
import type { InvitationKind } from "@/db/schema/constants";
import { auditEntries, countRows, freshDatabase, makeSchool, makeUser, testDb } from "../helpers/db";
import { appErrorFromAsync } from "../helpers/errors";

const APP_URL = "http://meniscus.test:4100";

let smtp: Awaited<ReturnType<typeof startFakeSmtp>>;
const savedAppUrl = process.env.APP_URL;

beforeAll(async () => {
  process.env.APP_URL = APP_URL;
  // The real mail catcher on a free loopback port: mail goes through SMTP and is read back from
  // the mail_messages table of whichever test database is current.
  smtp = await startFakeSmtp(0);
});

afterAll(async () => {
  await smtp.close();
  if (savedAppUrl === undefined) delete process.env.APP_URL;
  else process.env.APP_URL = savedAppUrl;
});

/** Every message the catcher stored for an address, newest first (rowid: same-millisecond ties). */
function mailTo(address: string) {
  return testDb().select().from(mailMessages).where(eq(mailMessages.to, address)).orderBy(sql`rowid DESC`).all();
}

/** The single-use link in a message's text, and its token. */
function linkIn(text: string): { url: URL; token: string } {
  const match = text.match(/https?:\/\/\S+\?token=\S+/);
  expect(match, `no link in:\n${text}`).not.toBeNull();
  const url = new URL(match![0]);
  return { url, token: url.searchParams.get("token")! };
}

function passwordHashOf(userId: string) {
  return testDb().select({ h: users.passwordHash }).from(users).where(eq(users.id, userId)).get()!.h;
}

describe("invitations", () => {
  let schoolId: string;
  let admin: Actor;
  let newcomer: Actor;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool("Larchfield Academy");
    admin = makeUser(schoolId, ["admin"], { name: "Audrey Admin" });
    newcomer = makeUser(schoolId, ["teacher"], { name: "Nell Newcombe", email: "nell@test.example" });
  });

  it("sends a real e-mail whose link lets the person choose a password, once", async () => {
    const sent = await sendInvitation({ actor: admin, userId: newcomer.userId });
    const [message, ...others] = mailTo("nell@test.example");
    expect(others).toEqual([]);
    expect(message!.subject).toBe("Your Meniscus account at Larchfield Academy");
    expect(message!.schoolId).toBe(schoolId);
    expect(message!.text).toContain("Hello Nell Newcombe,");
    expect(message!.text).toContain("Audrey Admin has set up a Meniscus account for you");
    expect(message!.html).toContain("Choose my password");

    const { url, token } = linkIn(message!.text);
    expect(`${url.origin}${url.pathname}`).toBe(`${APP_URL}/invitation`);
    expect(url.toString()).toBe(sent.link);
    expect(Date.now() + INVITATION_TTL_MS - sent.expiresAt.getTime()).toBeLessThan(60_000);
    // Only a hash of the token is stored.
    expect(JSON.stringify(testDb().select().from(invitations).all())).not.toContain(token);

    expect(previewToken({ token, kind: "invitation" })).toMatchObject({ ok: true, name: "Nell Newcombe", email: "nell@test.example", school: "Larchfield Academy" });
    expect(await redeemToken({ token, kind: "invitation", password: "a kettle of burettes" })).toEqual({ email: "nell@test.example" });
    const hash = passwordHashOf(newcomer.userId);
    expect(await verifyPassword(hash, "a kettle of burettes")).toBe(true);
    expect(await verifyPassword(hash, "a kettle of pipettes")).toBe(false);
    expect(auditEntries(newcomer.userId).map((a) => a.action)).toEqual(["invitation.send", "invitation.accept"]);
    expect(listUsers({ actor: admin, search: "nell@" })[0]!.status).toBe("active");

    const reuse = await appErrorFromAsync(() => redeemToken({ token, kind: "invitation", password: "someone else's choice" }));
    expect(reuse.code).toBe("gone");
    expect(reuse.status).toBe(410);
    expect(reuse.message).toMatch(/already been used/);
    expect(await verifyPassword(passwordHashOf(newcomer.userId), "a kettle of burettes")).toBe(true);
    expect(previewToken({ token, kind: "invitation" })).toMatchObject({ ok: false, reason: "used" });
  });

  it("works until the moment it expires, and not after", async () => {
    const now = new Date("2026-09-07T08:00:00Z");
    const { link, expiresAt } = await sendInvitation({ actor: admin, userId: newcomer.userId, now });
    expect(expiresAt.getTime() - now.getTime()).toBe(INVITATION_TTL_MS);
    const token = new URL(link).searchParams.get("token")!;
    expect(previewToken({ token, kind: "invitation", now: new Date(expiresAt.getTime() - 1) }).ok).toBe(true);
    for (const late of [expiresAt, new Date(expiresAt.getTime() + 1), new Date(expiresAt.getTime() + 86_400_000)]) {
      const err = await appErrorFromAsync(() => redeemToken({ token, kind: "invitation", password: "too late for this one", now: late }));
      expect(err.code).toBe("gone");
      expect(err.message).toMatch(/expired/);
    }
    expect(passwordHashOf(newcomer.userId)).toBeNull();
    await redeemToken({ token, kind: "invitation", password: "just in time, really", now: new Date(expiresAt.getTime() - 1) });
    expect(await verifyPassword(passwordHashOf(newcomer.userId), "just in time, really")).toBe(true);
  });

  it("revokes the earlier link when an invitation is sent again", async () => {
    const first = await sendInvitation({ actor: admin, userId: newcomer.userId });
    const second = await sendInvitation({ actor: admin, userId: newcomer.userId });
    expect(mailTo("nell@test.example")).toHaveLength(2);
    const oldToken = new URL(first.link).searchParams.get("token")!;
    const newToken = linkIn(mailTo("nell@test.example")[0]!.text).token;
    expect(new URL(second.link).searchParams.get("token")).toBe(newToken);

    const err = await appErrorFromAsync(() => redeemToken({ token: oldToken, kind: "invitation", password: "from the first e-mail" }));
    expect(err.code).toBe("gone");
    expect(err.detail).toEqual({ reason: "replaced" });
    expect(err.message).toMatch(/newer invitation/);
    await redeemToken({ token: newToken, kind: "invitation", password: "from the second e-mail" });
    expect(await verifyPassword(passwordHashOf(newcomer.userId), "from the second e-mail")).toBe(true);
  });

  it("answers not_found (404) for a token it never issued", async () => {
    const err = await appErrorFromAsync(() => redeemToken({ token: "x".repeat(43), kind: "invitation", password: "guessing is futile" }));
    expect(err.code).toBe("not_found");
    expect(err.status).toBe(404);
    expect(previewToken({ token: "x".repeat(43), kind: "invitation" })).toMatchObject({ ok: false, reason: "unknown" });
  });

  it("lets exactly one of two simultaneous redemptions of one link succeed", async () => {
    const { link } = await sendInvitation({ actor: admin, userId: newcomer.userId });
    const token = new URL(link).searchParams.get("token")!;
    const passwords = ["first racer password", "second racer password"];
    const results = await Promise.allSettled(passwords.map((password) => redeemToken({ token, kind: "invitation", password })));
    const won = results.flatMap((r, i) => (r.status === "fulfilled" ? [passwords[i]!] : []));
    const lost = results.flatMap((r) => (r.status === "rejected" ? [r.reason as { code?: string; message?: string }] : []));
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0]).toMatchObject({ code: "gone", message: expect.stringMatching(/already been used/) });
    expect(await verifyPassword(passwordHashOf(newcomer.userId), won[0]!)).toBe(true);
    expect(auditEntries(newcomer.userId).filter((a) => a.action === "invitation.accept")).toHaveLength(1);
  });

  it("refuses a link for an account closed after it was sent", async () => {
    const { link } = await sendInvitation({ actor: admin, userId: newcomer.userId });
    updateUser({ actor: admin, userId: newcomer.userId, input: { active: false } });
    const err = await appErrorFromAsync(() => redeemToken({ token: new URL(link).searchParams.get("token")!, kind: "invitation", password: "closed account pw" }));
    expect(err.code).toBe("gone");
    expect(passwordHashOf(newcomer.userId)).toBeNull();
  });

  it("lets only an admin of the person's school invite, and only someone not yet set up", async () => {
    for (const role of ["teacher", "student", "moderator", "parent"] as const) {
      const actor = makeUser(schoolId, [role]);
      expect((await appErrorFromAsync(() => sendInvitation({ actor, userId: newcomer.userId }))).code).toBe("forbidden");
    }
    const outsider = makeUser(makeSchool("Quarry Hill College"), ["admin"]);
    expect((await appErrorFromAsync(() => sendInvitation({ actor: outsider, userId: newcomer.userId }))).code).toBe("not_found");
    const settled = makeUser(schoolId, ["student"], { passwordHash: await hashPassword("already chosen one") });
    expect((await appErrorFromAsync(() => sendInvitation({ actor: admin, userId: settled.userId }))).code).toBe("conflict");
    const closed = makeUser(schoolId, ["student"], { active: false });
    expect((await appErrorFromAsync(() => sendInvitation({ actor: admin, userId: closed.userId }))).code).toBe("bad_request");
    expect(countRows("mail_messages")).toBe(0);
    expect(countRows("invitations")).toBe(0);
  });
});

describe("password reset", () => {
  let schoolId: string;
  let member: Actor;
  beforeEach(async () => {
    freshDatabase();
    schoolId = makeSchool("Larchfield Academy");
    member = makeUser(schoolId, ["student"], { name: "Rowan Reed", email: "rowan@test.example", passwordHash: await hashPassword("old password, long one") });
  });

  const tokenOf = (address: string, kind: InvitationKind) => {
    const { url, token } = linkIn(mailTo(address)[0]!.text);
    expect(url.pathname).toBe(kind === "invitation" ? "/invitation" : "/reset-password");
    return token;
  };

  it("sends nothing, and says nothing, for an address with no account", async () => {
    await expect(requestPasswordReset({ email: "nobody@test.example" })).resolves.toBeUndefined();
    expect(countRows("mail_messages")).toBe(0);
    expect(countRows("invitations")).toBe(0);
  });

  it("sends nothing for a deactivated account", async () => {
    const closed = makeUser(schoolId, ["teacher"], { active: false, passwordHash: await hashPassword("old password, long one") });
    await requestPasswordReset({ email: closed.email });
    expect(countRows("mail_messages")).toBe(0);
  });

  it("e-mails a one-hour link that replaces the password, once", async () => {
    const now = new Date("2026-09-07T08:00:00Z");
    await requestPasswordReset({ email: "rowan@test.example", now });
    const [message] = mailTo("rowan@test.example");
    expect(message!.subject).toBe("Reset your Meniscus password");
    const token = tokenOf("rowan@test.example", "password-reset");
    const row = testDb().select().from(invitations).get()!;
    expect(row.expiresAt.getTime() - now.getTime()).toBe(PASSWORD_RESET_TTL_MS);

    // A reset link is not an invitation link.
    expect((await appErrorFromAsync(() => redeemToken({ token, kind: "invitation", password: "wrong door entirely" }))).code).toBe("not_found");
    const late = await appErrorFromAsync(() => redeemToken({ token, kind: "password-reset", password: "an hour too late", now: new Date(now.getTime() + PASSWORD_RESET_TTL_MS) }));
    expect(late.message).toMatch(/expired/);

    await redeemToken({ token, kind: "password-reset", password: "new password, longer", now: new Date(now.getTime() + 60_000) });
    const hash = passwordHashOf(member.userId);
    expect(await verifyPassword(hash, "new password, longer")).toBe(true);
    expect(await verifyPassword(hash, "old password, long one")).toBe(false);
    expect((await appErrorFromAsync(() => redeemToken({ token, kind: "password-reset", password: "again and again", now: new Date(now.getTime() + 120_000) }))).message).toMatch(/already been used/);
    expect(auditEntries(member.userId).map((a) => a.action)).toEqual(["password.reset-request", "password.reset"]);
  });

  it("sends an invitation link instead to someone who never set a password", async () => {
    const pending = makeUser(schoolId, ["parent"], { email: "pending@test.example" });
    await requestPasswordReset({ email: "pending@test.example" });
    const token = tokenOf("pending@test.example", "invitation");
    await redeemToken({ token, kind: "invitation", password: "finally set up now" });
    expect(await verifyPassword(passwordHashOf(pending.userId), "finally set up now")).toBe(true);
  });

  it("revokes an earlier reset link when another is requested", async () => {
    await requestPasswordReset({ email: "rowan@test.example" });
    const first = tokenOf("rowan@test.example", "password-reset");
    await requestPasswordReset({ email: "rowan@test.example" });
    const second = tokenOf("rowan@test.example", "password-reset");
    expect(second).not.toBe(first);
    expect((await appErrorFromAsync(() => redeemToken({ token: first, kind: "password-reset", password: "from the older mail" }))).detail).toEqual({ reason: "replaced" });
    await redeemToken({ token: second, kind: "password-reset", password: "from the newer mail" });
  });
});

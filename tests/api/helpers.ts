import { NextRequest } from "next/server";
import { expect } from "vitest";
import { getHandle } from "@/db/client";
import { jsonRequest } from "../helpers/session";

// Sessions are signed with this key; setting it keeps tests from writing a key file.
process.env.NEXTAUTH_SECRET ??= "test-only-session-key";

/** A same-origin request as the browser sends it, in the NextRequest form handlers receive. */
export function apiRequest(url: string, method = "GET", body?: unknown, headers: Record<string, string> = {}) {
  return new NextRequest(jsonRequest(url, method, body, headers));
}

type Handler<P> = (req: NextRequest, ctx: { params: Promise<P> }) => Promise<Response>;

/** Calls a route handler and returns its status and parsed JSON body. */
export async function call<P = Record<string, string>>(handler: Handler<P>, req: NextRequest, routeParams?: P) {
  const res = await handler(req, { params: Promise.resolve((routeParams ?? {}) as P) });
  const text = await res.text();
  const body = text ? JSON.parse(text) : null;
  return { status: res.status, body, text };
}

/** Rows in a table of the current test database. */
export function rowCount(table: string): number {
  if (!/^[a-z_]+$/.test(table)) throw new Error(`not a table name: ${table}`);
  return (getHandle().sqlite.prepare(`SELECT count(*) AS n FROM ${table}`).get() as { n: number }).n;
}

/** Counts of every table a roster import could write to. */
export function writeCounts() {
  return Object.fromEntries(["users", "user_roles", "class_students", "parent_links", "invitations", "audit_log", "mail_messages"].map((t) => [t, rowCount(t)]));
}

/** Fails if an answer carries anything secret: password or token hashes, or an invitation token. */
export function expectNoSecrets(text: string) {
  expect(text).not.toMatch(/passwordHash|password_hash|tokenHash|token_hash|"token"|token=|\$argon2/i);
}

/** Mail the fake SMTP server stored, newest last. */
export function caughtMail() {
  return getHandle().sqlite.prepare("SELECT to_address AS \"to\", subject, text_body AS text, school_id AS schoolId FROM mail_messages ORDER BY received_at, rowid").all() as {
    to: string;
    subject: string;
    text: string;
    schoolId: string | null;
  }[];
}

/** The invitation link in a caught message's text. */
export function linkIn(text: string): string {
  const m = text.match(/https?:\/\/\S+\/invitation\?token=[\w%-]+/);
  if (!m) throw new Error(`no invitation link in: ${text}`);
  return m[0];
}

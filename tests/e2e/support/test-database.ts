import Database from "better-sqlite3";
import { inject } from "vitest";

/**
 * The test server's SQLite file, opened read-only: the tests read what the mail catcher stored
 * and look up ids, but never write behind the server's back.
 */
function withDatabase<T>(fn: (db: Database.Database) => T): T {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    return fn(db);
  } finally {
    db.close();
  }
}

export type StoredMail = { to: string; subject: string; text: string; schoolId: string | null };

/** The newest message the mail catcher stored for an address, waiting briefly for it to arrive. */
export async function latestMailTo(address: string, { after = 0, timeoutMs = 10_000 } = {}): Promise<StoredMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const row = withDatabase(
      (db) =>
        db
          .prepare("SELECT to_address AS \"to\", subject, text_body AS text, school_id AS schoolId FROM mail_messages WHERE to_address = ? AND rowid > ? ORDER BY rowid DESC LIMIT 1")
          .get(address, after) as StoredMail | undefined,
    );
    if (row) return row;
    if (Date.now() > deadline) throw new Error(`No e-mail to ${address} arrived in ${timeoutMs} ms.`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The highest mail rowid so far, to wait for a message newer than it. */
export function lastMailRowid(): number {
  return withDatabase((db) => (db.prepare("SELECT coalesce(max(rowid), 0) AS n FROM mail_messages").get() as { n: number }).n);
}

export function classIdByName(name: string): string {
  const row = withDatabase((db) => db.prepare("SELECT id FROM classes WHERE name = ?").get(name) as { id: string } | undefined);
  if (!row) throw new Error(`No class named ${name} in the test database.`);
  return row.id;
}

/** The single-use link in a message's text. */
export function linkIn(text: string): URL {
  const match = text.match(/https?:\/\/\S+\?token=\S+/);
  if (!match) throw new Error(`No link in the e-mail:\n${text}`);
  return new URL(match[0]);
}

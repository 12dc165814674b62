import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { backupDatabase, databaseInUse, digestDatabase, digestTable, integrityCheck, restoreDatabase } from "@/db/backup";
import { openDatabase } from "@/db/client";
import { seedDemoSchool } from "@/db/seed/index";

// The backup is checked against the database itself: SQLite's integrity check, and row counts and
// SHA-256 digests of every row computed independently on the source and on the restored copy.
const dir = path.resolve("tests", ".tmp", `backup-${process.pid}-${Date.now()}`);
const source = path.join(dir, "live.db");

/** Another process appending numbered audit entries to the live database as fast as it can. */
function startWriter(file: string): ChildProcess {
  const script = `
    const Database = require("better-sqlite3");
    const db = new Database(${JSON.stringify(file)});
    db.pragma("busy_timeout = 5000");
    const school = db.prepare("SELECT id FROM schools LIMIT 1").pluck().get();
    const insert = db.prepare("INSERT INTO audit_log (school_id, action, entity_type, entity_id, after, at) VALUES (?, 'backup.test-write', 'test', ?, ?, ?)");
    let n = 0;
    process.stdout.write("ready\\n");
    const tick = () => { for (let i = 0; i < 20; i++) { n++; insert.run(school, String(n), JSON.stringify({ n }), Date.now()); } setImmediate(tick); };
    tick();
  `;
  return spawn(process.execPath, ["-e", script], { cwd: process.cwd(), stdio: ["ignore", "pipe", "inherit"] });
}

function digestOf(file: string) {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    return digestDatabase(db);
  } finally {
    db.close();
  }
}

/** Digest of the first `rows` rows of one table (rowid order), to compare with a snapshot taken part-way. */
function prefixDigest(file: string, table: string, rows: number) {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    return digestTable(db, table, rows);
  } finally {
    db.close();
  }
}

beforeAll(async () => {
  fs.mkdirSync(dir, { recursive: true });
  const { db, sqlite } = openDatabase(source);
  await seedDemoSchool(db);
  sqlite.close();
}, 60_000);

afterAll(() => {
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("online backup and restore", () => {
  it("backs up while another process writes, and the restored copy matches the snapshot row for row", async () => {
    const writer = startWriter(source);
    try {
      await new Promise<void>((resolve) => writer.stdout!.once("data", () => resolve()));
      await new Promise((r) => setTimeout(r, 300));
      const before = digestOf(source);
      const backup = path.join(dir, "during-writes.db");
      const { digest: backedUp } = await backupDatabase(source, backup);
      await new Promise((r) => setTimeout(r, 300));
      writer.kill("SIGKILL");
      await new Promise((r) => writer.once("exit", r));

      expect(integrityCheck(backup)).toBe("ok");
      // Writes carried on during the backup, so the live database has moved on past the snapshot.
      const after = digestOf(source);
      expect(after["audit_log"]!.rows).toBeGreaterThan(backedUp["audit_log"]!.rows);
      expect(backedUp["audit_log"]!.rows).toBeGreaterThanOrEqual(before["audit_log"]!.rows);

      const restoredPath = path.join(dir, "fresh", "restored.db");
      const { keptAs, digest: restored } = await restoreDatabase(backup, restoredPath);
      expect(keptAs).toBeNull();
      expect(integrityCheck(restoredPath)).toBe("ok");
      expect(restored).toEqual(backedUp);
      expect(digestOf(restoredPath)).toEqual(backedUp);
      // Every table the writer did not touch is identical to the live database; the audit log is
      // exactly the live log's first rows (a consistent snapshot, not a torn one).
      for (const [table, d] of Object.entries(after)) {
        if (table === "audit_log") continue;
        expect(restored[table], table).toEqual(d);
      }
      expect(prefixDigest(source, "audit_log", restored["audit_log"]!.rows)).toEqual(restored["audit_log"]);
      // The demo school is really there: its people and write-ups, not just empty tables.
      expect(restored["users"]!.rows).toBeGreaterThan(50);
      expect(restored["write_ups"]!.rows).toBeGreaterThan(20);
    } finally {
      if (writer.exitCode === null && writer.signalCode === null) writer.kill("SIGKILL");
    }
  }, 60_000);

  it("refuses to restore over a database that is open elsewhere, and restores online through the backup API", async () => {
    const backup = path.join(dir, "quiet.db");
    const { digest: backedUp } = await backupDatabase(source, backup);
    await expect(backupDatabase(source, backup)).rejects.toThrow(/already exists/);

    // A server-like connection holds the live database open and changes it after the backup.
    const live = new Database(source);
    live.pragma("busy_timeout = 5000");
    live.prepare("UPDATE users SET name = name || ' (changed after the backup)'").run();
    expect(databaseInUse(source)).toBe(true);
    await expect(restoreDatabase(backup, source)).rejects.toThrow(/open in another process/);

    const { keptAs } = await restoreDatabase(backup, source, { online: true });
    // The open connection reads the restored rows at once; the replaced contents were kept.
    expect(live.prepare("SELECT count(*) FROM users WHERE name LIKE '%(changed after the backup)'").pluck().get()).toBe(0);
    expect(digestDatabase(live)).toEqual(backedUp);
    live.close();
    expect(keptAs).not.toBeNull();
    const kept = new Database(keptAs!, { readonly: true });
    expect(kept.prepare("SELECT count(*) FROM users WHERE name NOT LIKE '%(changed after the backup)'").pluck().get()).toBe(0);
    kept.close();
    expect(integrityCheck(source)).toBe("ok");

    // Closed everywhere: the offline restore moves the old file aside and puts the backup in place.
    expect(databaseInUse(source)).toBe(false);
    const again = await restoreDatabase(backup, source, { now: new Date(Date.now() + 1000) });
    expect(again.digest).toEqual(backedUp);
    expect(fs.existsSync(again.keptAs!)).toBe(true);
  }, 60_000);

  it("refuses a file that is not a Meniscus database", async () => {
    const junk = path.join(dir, "junk.db");
    fs.writeFileSync(junk, "not a database at all, just text ".repeat(200));
    await expect(restoreDatabase(junk, path.join(dir, "x.db"))).rejects.toThrow();
    const empty = path.join(dir, "empty.db");
    new Database(empty).exec("CREATE TABLE t (x)");
    await expect(restoreDatabase(empty, path.join(dir, "y.db"))).rejects.toThrow(/not a Meniscus database/);
  });
});

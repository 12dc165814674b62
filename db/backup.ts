// Online backup and restore of the SQLite database with SQLite's own backup API (through
// better-sqlite3). Plain Node: used by scripts/backup.ts, scripts/restore.ts and the tests.
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";

const WHOLE_DATABASE = 0x7fffffff;

export type TableDigest = { rows: number; sha256: string };
export type DatabaseDigest = Record<string, TableDigest>;

/** Row count and a SHA-256 over the rows of one table in rowid order (the first `limit` rows if given). */
export function digestTable(db: Database.Database, table: string, limit?: number): TableDigest {
  const hash = crypto.createHash("sha256");
  let rows = 0;
  const sql = `SELECT * FROM "${table.replaceAll('"', '""')}" ORDER BY rowid${limit === undefined ? "" : ` LIMIT ${Math.max(0, Math.floor(limit))}`}`;
  for (const row of db.prepare(sql).raw().iterate() as IterableIterator<unknown[]>) {
    hash.update(JSON.stringify(row, (_k, v: unknown) => (Buffer.isBuffer(v) ? v.toString("hex") : typeof v === "bigint" ? v.toString() : v)));
    hash.update("\n");
    rows++;
  }
  return { rows, sha256: hash.digest("hex") };
}

/** Row count and digest of every table, to compare two databases. */
export function digestDatabase(db: Database.Database): DatabaseDigest {
  const tables = db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name").pluck().all() as string[];
  return Object.fromEntries(tables.map((table) => [table, digestTable(db, table)]));
}

/** PRAGMA integrity_check of a database file: "ok", or the problems SQLite found. */
export function integrityCheck(file: string): string {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    return (db.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
  } finally {
    db.close();
  }
}

/**
 * True when another connection (a running Meniscus, say) has the database open: SQLite will not
 * give this process an exclusive lock on it.
 */
export function databaseInUse(file: string): boolean {
  if (!fs.existsSync(file)) return false;
  const db = new Database(file, { fileMustExist: true, timeout: 0 });
  try {
    db.pragma("locking_mode = EXCLUSIVE");
    db.exec("BEGIN EXCLUSIVE");
    db.exec("COMMIT");
    return false;
  } catch (e) {
    if ((e as { code?: string }).code === "SQLITE_BUSY" || (e as { code?: string }).code === "SQLITE_LOCKED") return true;
    throw e;
  } finally {
    db.close();
  }
}

function assertMeniscusDatabase(file: string) {
  const check = integrityCheck(file);
  if (check !== "ok") throw new Error(`${file} fails SQLite's integrity check: ${check}`);
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const hasMigrations = db.prepare("SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = '__drizzle_migrations'").get();
    if (!hasMigrations) throw new Error(`${file} is not a Meniscus database (it has no migration history).`);
  } finally {
    db.close();
  }
}

/**
 * Copies a live database to `destination` with the online backup API: safe while Meniscus is
 * running and writing (SQLite restarts the copy if a page changes under it). Writes to a
 * temporary file first and checks it, so a failed backup never leaves a half-written file.
 */
export async function backupDatabase(source: string, destination: string, { force = false } = {}): Promise<{ file: string; digest: DatabaseDigest }> {
  if (!fs.existsSync(source)) throw new Error(`There is no database at ${source}.`);
  if (fs.existsSync(destination) && !force) throw new Error(`${destination} already exists; choose another name or pass --force to replace it.`);
  fs.mkdirSync(path.dirname(path.resolve(destination)), { recursive: true });
  const partial = `${destination}.partial-${process.pid}`;
  fs.rmSync(partial, { force: true });
  const src = new Database(source, { fileMustExist: true });
  src.pragma("busy_timeout = 5000");
  try {
    // All pages in one step: a read transaction sees one consistent snapshot, and in WAL mode it
    // does not hold up the server's writers. (Copying in small steps would restart on every write.)
    await src.backup(partial, { progress: () => WHOLE_DATABASE });
  } catch (e) {
    fs.rmSync(partial, { force: true });
    throw e;
  } finally {
    src.close();
  }
  // A backup is one self-contained file: fold any write-ahead log into it.
  const copy = new Database(partial);
  copy.pragma("journal_mode = DELETE");
  const digest = digestDatabase(copy);
  copy.close();
  assertMeniscusDatabase(partial);
  fs.renameSync(partial, destination);
  return { file: destination, digest };
}

/**
 * Restores `backup` over the database at `target`.
 * - By default it refuses while the database is open elsewhere (stop Meniscus first); the old
 *   file and its write-ahead log are moved aside as `<target>.before-restore-<time>` and the
 *   backup copied into place.
 * - With `online`, it restores through the backup API into the live database instead: SQLite
 *   locks the file for the copy, running servers wait (busy timeout) and then read the restored
 *   data. A backup of the current contents is taken first, beside the target.
 */
export async function restoreDatabase(backup: string, target: string, { online = false, now = new Date() } = {}): Promise<{ keptAs: string | null; digest: DatabaseDigest }> {
  assertMeniscusDatabase(backup);
  const stamp = now.toISOString().replace(/[:.]/g, "-");
  const keptAs = fs.existsSync(target) ? `${target}.before-restore-${stamp}` : null;
  const src = new Database(backup, { readonly: true, fileMustExist: true });
  try {
    if (online) {
      if (keptAs) await backupDatabase(target, keptAs);
      else fs.mkdirSync(path.dirname(path.resolve(target)), { recursive: true });
      await src.backup(target, { progress: () => WHOLE_DATABASE });
    } else {
      if (databaseInUse(target)) {
        throw new Error(`The database at ${target} is open in another process (is Meniscus running?). Stop it first, or restore online with --online.`);
      }
      fs.mkdirSync(path.dirname(path.resolve(target)), { recursive: true });
      const partial = `${target}.restoring-${process.pid}`;
      fs.rmSync(partial, { force: true });
      await src.backup(partial, { progress: () => WHOLE_DATABASE });
      if (keptAs) {
        // Fold the old write-ahead log into the old file, so the kept copy is complete on its own.
        const old = new Database(target);
        old.pragma("wal_checkpoint(TRUNCATE)");
        old.pragma("journal_mode = DELETE");
        old.close();
        fs.renameSync(target, keptAs);
      }
      for (const suffix of ["-wal", "-shm"]) fs.rmSync(`${target}${suffix}`, { force: true });
      fs.renameSync(partial, target);
    }
  } finally {
    src.close();
  }
  const restored = new Database(target, { fileMustExist: true });
  restored.pragma("busy_timeout = 5000");
  restored.pragma("journal_mode = WAL");
  const digest = digestDatabase(restored);
  restored.close();
  return { keptAs, digest };
}

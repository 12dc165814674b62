import "server-only";
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { drizzle, type BetterSQLite3Database } from "drizzle-orm/better-sqlite3";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import * as schema from "./schema";

export type Db = BetterSQLite3Database<typeof schema>;
/** A transaction handle; queries accept either. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;

type Handle = { db: Db; sqlite: Database.Database; file: string };

const globalForDb = globalThis as unknown as { __meniscusDb?: Handle };

/** The database file: DATABASE_PATH, or data/meniscus.db inside the project. */
export function databasePath(): string {
  const fromEnv = process.env.DATABASE_PATH;
  return fromEnv ? fromEnv : path.join(process.cwd(), "data", "meniscus.db");
}

export function migrationsFolder(): string {
  return path.join(process.cwd(), "db", "migrations");
}

/**
 * Opens a database file (or ":memory:"), sets the pragmas Meniscus relies on and applies any
 * pending migrations. Never called at import time: `next build` must not need a database.
 */
export function openDatabase(file: string): Handle {
  if (file !== ":memory:") fs.mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  // WAL with synchronous=NORMAL is durable against application crashes (the case we test by
  // killing the server); FULL also survives power loss on the machine, at a cost per commit.
  sqlite.pragma(`synchronous = ${process.env.DATABASE_SYNCHRONOUS === "FULL" ? "FULL" : "NORMAL"}`);
  // Under scripts/serve.mjs a background thread checkpoints the log every second, so a request
  // never waits for the disk; this connection only steps in if the log passes 20,000 pages (80 MB).
  if (process.env.MENISCUS_WAL_CHECKPOINTER === "1") sqlite.pragma("wal_autocheckpoint = 20000");
  const db = drizzle(sqlite, { schema });
  migrate(db, { migrationsFolder: migrationsFolder() });
  // Maintenance: DATABASE_READONLY=1 serves reading but refuses every write (SQLITE_READONLY,
  // answered as 503 with a plain message), e.g. while a copy of the file is being taken or checked.
  if (process.env.DATABASE_READONLY === "1") sqlite.pragma("query_only = ON");
  else writeTransactionsImmediate(db);
  return { db, sqlite, file };
}

/**
 * Several server workers (scripts/serve.mjs) share the file. A deferred transaction that reads
 * and then writes fails at once with SQLITE_BUSY if another worker wrote in between; one that
 * takes the write lock as it begins (IMMEDIATE) waits its turn instead (busy_timeout). Every
 * `db.transaction(...)` is therefore IMMEDIATE unless it asks otherwise. (Not in read-only
 * mode, where SQLite refuses BEGIN IMMEDIATE and nothing writes anyway.)
 */
function writeTransactionsImmediate(db: Db): void {
  const begin = db.transaction.bind(db);
  db.transaction = ((fn, config) => begin(fn, { behavior: "immediate", ...config })) as Db["transaction"];
}

/** The one shared connection for this process. */
export function getDb(): Db {
  return getHandle().db;
}

export function getHandle(): Handle {
  if (!globalForDb.__meniscusDb) globalForDb.__meniscusDb = openDatabase(databasePath());
  return globalForDb.__meniscusDb;
}

/**
 * A query built and compiled once per database connection, for the paths that every request or
 * every autosave takes (who is signed in, the write-up being saved). Without it Drizzle builds
 * the SQL text and SQLite compiles it on every call, which under load costs more than running
 * the query. `build` receives the connection and returns `query.prepare()` with placeholders.
 */
export function preparedOnce<Q>(build: (db: Db) => Q): () => Q {
  const byConnection = new WeakMap<Db, Q>();
  return () => {
    const db = getDb();
    let query = byConnection.get(db);
    if (!query) byConnection.set(db, (query = build(db)));
    return query;
  };
}

/** Tests: point the process at another database (for example an in-memory one). */
export function setDatabase(handle: Handle | undefined): void {
  globalForDb.__meniscusDb = handle;
}

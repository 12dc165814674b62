// A background thread of scripts/serve.mjs: copies the SQLite write-ahead log back into the
// database file every second (a PASSIVE checkpoint: it never waits for, or blocks, the workers'
// reads and writes). Checkpointing is the only step that waits for the disk (fsync) when
// synchronous=NORMAL; left to the workers, it would run inside whichever request's commit crossed
// the 1,000-page mark and hold up every request queued on that worker for as long as the disk
// takes, up to a few hundred milliseconds on a slow one.
import { parentPort, workerData } from "node:worker_threads";
import Database from "better-sqlite3";

const db = new Database(workerData.file, { fileMustExist: true });
db.pragma("busy_timeout = 1000");
let failing = false;
setInterval(() => {
  try {
    db.pragma("wal_checkpoint(PASSIVE)");
    failing = false;
  } catch (e) {
    // Say so once per run of failures; the workers' own checkpointing (at 80 MB of log) still
    // keeps the log from growing without end.
    if (!failing) parentPort?.postMessage({ error: e instanceof Error ? e.message : String(e) });
    failing = true;
  }
}, workerData.everyMs);

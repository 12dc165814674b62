import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import Database from "better-sqlite3";
import { afterAll, describe, expect, it } from "vitest";

// scripts/serve.mjs copies the write-ahead log into the database file from a background thread
// (scripts/wal-checkpointer.mjs), so that no request waits for the disk. SQLite's WAL documentation
// is the source: a checkpoint moves committed pages from the -wal file into the database file.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "meniscus-checkpointer-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe("the background WAL checkpointer", () => {
  it("moves what the workers wrote from the log into the database file, while they keep the file open", async () => {
    const file = path.join(dir, "school.db");
    const writer = new Database(file);
    writer.pragma("journal_mode = WAL");
    writer.pragma("wal_autocheckpoint = 0"); // as if the workers never checkpointed themselves
    writer.exec("CREATE TABLE notes (body TEXT)");
    const insert = writer.prepare("INSERT INTO notes VALUES (?)");
    writer.transaction(() => {
      for (let i = 0; i < 2000; i++) insert.run(`note ${i} `.repeat(40));
    })();
    const before = fs.statSync(file).size;
    expect(fs.statSync(`${file}-wal`).size).toBeGreaterThan(500_000); // everything is still in the log

    const thread = new Worker(path.resolve("scripts", "wal-checkpointer.mjs"), { workerData: { file, everyMs: 100 } });
    try {
      const deadline = Date.now() + 10_000;
      while (fs.statSync(file).size <= before + 500_000 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      expect(fs.statSync(file).size).toBeGreaterThan(before + 500_000);
    } finally {
      await thread.terminate();
    }
    // The writer's connection, open all along, still reads and writes, and the file is sound.
    insert.run("after the checkpoint");
    expect(writer.prepare("SELECT count(*) FROM notes").pluck().get()).toBe(2001);
    expect(writer.pragma("integrity_check", { simple: true })).toBe("ok");
    writer.close();
  });
});

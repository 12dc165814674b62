import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import { rateLimits } from "@/db/schema";

// `npm start` runs one server worker per CPU core (scripts/serve.mjs), all on one SQLite file.
// Two processes here do what two workers' autosaves do to the same row at the same moment:
// read it, then write it back changed, in a transaction. Every transaction must succeed (each
// waits for the write lock instead of failing with SQLITE_BUSY) and none may overwrite
// another's change. SQLite's documentation on WAL and BEGIN IMMEDIATE is the source.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "meniscus-two-processes-"));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function runLoop(file: string, times: number, startAt: number): Promise<{ errors: number; codes: string[] }> {
  return new Promise((resolve, reject) => {
    const tsx = path.join("node_modules", ".bin", "tsx");
    const child = spawn(tsx, ["--conditions=react-server", path.join("tests", "faults", "support", "counter-loop.ts"), file, String(times), String(startAt)], { stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    let err = "";
    child.stdout.on("data", (d: Buffer) => (out += d.toString()));
    child.stderr.on("data", (d: Buffer) => (err += d.toString()));
    child.on("error", reject);
    child.on("close", (code) => (code === 0 ? resolve(JSON.parse(out) as { errors: number; codes: string[] }) : reject(new Error(`exit ${code}: ${err}`))));
  });
}

describe("two server processes on one database file", () => {
  it("serialises their read-then-write transactions: none fails, none is lost", async () => {
    const file = path.join(dir, "shared.db");
    const { db, sqlite } = openDatabase(file);
    db.insert(rateLimits).values({ key: "shared-counter", points: 0 }).run();
    sqlite.close();

    const times = 3000;
    const startAt = Date.now() + 4000; // both processes have started and opened the file by then
    const results = await Promise.all([runLoop(file, times, startAt), runLoop(file, times, startAt)]);
    expect(results.map((r) => r.codes)).toEqual([[], []]);
    expect(results.map((r) => r.errors)).toEqual([0, 0]);

    const check = openDatabase(file);
    expect(check.db.select().from(rateLimits).get()!.points).toBe(2 * times);
    expect(check.sqlite.pragma("integrity_check", { simple: true })).toBe("ok");
    check.sqlite.close();
  }, 60_000);
});

#!/usr/bin/env node
// Runs the production server (`next start`) as several worker processes sharing one port, so a
// school's requests use every CPU core and not just one. `npm start` and `npm run demo` run this.
//
//   node scripts/serve.mjs [-p 3000] [-H 0.0.0.0]     (arguments go to `next start`)
//   WEB_CONCURRENCY=2   how many workers (default: one per CPU core, at most 4)
//
// Node's cluster module shares the listening socket and hands each new connection to a worker
// in turn. Worker 1 boots first and alone: it migrates the database, seeds the demo school into
// an empty one and runs the built-in mail catcher and local S3 server; the other workers start
// once it is ready. All of them share the one SQLite file (WAL, write transactions IMMEDIATE with
// a busy timeout), and nothing a request depends on is kept only in one worker's memory (sign-in
// rate limits are in the database). A worker that dies is started again; SIGTERM or SIGINT stops
// them all.
import cluster from "node:cluster";
import net from "node:net";
import { Worker } from "node:worker_threads";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));
const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
const log = (msg) => console.log(`[meniscus] ${msg}`);

function workerCount() {
  const asked = Number(process.env.WEB_CONCURRENCY);
  if (Number.isInteger(asked) && asked > 0) return asked;
  return Math.max(1, Math.min(4, os.availableParallelism?.() ?? os.cpus().length));
}

/** A free loopback port, for a built-in server asked for on "any free port" (0). */
function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

// Every worker must reach the same built-in mail catcher and S3 server, which worker 1 runs, so
// "any free port" is chosen here once for all of them.
if (!process.env.SMTP_URL && process.env.MAIL_FAKE_PORT === "0") process.env.MAIL_FAKE_PORT = String(await freePort());
if (!process.env.S3_ENDPOINT && process.env.S3_FAKE_PORT === "0") process.env.S3_FAKE_PORT = String(await freePort());

const count = workerCount();
cluster.setupPrimary({ exec: nextBin, args: ["start", ...process.argv.slice(2)] });

const workers = new Map(); // worker number -> cluster worker
const quickExits = new Map(); // worker number -> exits within a few seconds of starting, in a row
let stopping = false;
let stopCode = 0;
let othersStarted = false;

// The WAL is checkpointed by a background thread here (scripts/wal-checkpointer.mjs), not inside
// the workers' requests; workers only checkpoint themselves if the log passes 80 MB.
const databaseFile = process.env.DATABASE_PATH || path.join(process.cwd(), "data", "meniscus.db");
const checkpointHere = process.env.DATABASE_READONLY !== "1";

function startCheckpointer() {
  const thread = new Worker(new URL("./wal-checkpointer.mjs", import.meta.url), { workerData: { file: databaseFile, everyMs: 1000 } });
  thread.on("message", (msg) => console.error(`[meniscus] WAL checkpoint failed: ${msg.error}`));
  thread.on("error", (e) => console.error(`[meniscus] WAL checkpointer stopped: ${e.message}`));
  thread.unref();
}

function fork(n) {
  const worker = cluster.fork({ MENISCUS_WORKER: String(n), ...(checkpointHere ? { MENISCUS_WAL_CHECKPOINTER: "1" } : {}) });
  const started = Date.now();
  workers.set(n, worker);
  worker.on("message", (msg) => {
    if (n === 1 && msg && msg.meniscus === "booted") startOthers();
  });
  worker.on("exit", (code, signal) => {
    if (workers.get(n) === worker) workers.delete(n);
    if (stopping) {
      if (workers.size === 0) process.exit(stopCode);
      return;
    }
    const quick = Date.now() - started < 5000 ? (quickExits.get(n) ?? 0) + 1 : 0;
    quickExits.set(n, quick);
    if (quick >= 5) {
      console.error(`[meniscus] worker ${n} keeps stopping as it starts (exit ${code ?? signal}); giving up.`);
      stop(1);
      return;
    }
    console.error(`[meniscus] worker ${n} stopped (exit ${code ?? signal}); starting it again.`);
    setTimeout(() => !stopping && fork(n), quick ? 1000 : 0);
  });
}

function startOthers() {
  if (othersStarted) return;
  othersStarted = true;
  // Worker 1 has created and migrated the database by now.
  if (checkpointHere) startCheckpointer();
  for (let n = 2; n <= count; n++) fork(n);
  if (count > 1) log(`${count} workers serving`);
}

function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  stopCode = code;
  if (workers.size === 0) process.exit(code);
  for (const w of workers.values()) w.process.kill("SIGTERM");
  setTimeout(() => {
    for (const w of workers.values()) w.process.kill("SIGKILL");
    process.exit(code);
  }, 10_000).unref();
}

process.on("SIGTERM", () => stop(0));
process.on("SIGINT", () => stop(0));

fork(1);
// Worker 1 says when it has booted; should it never say (a boot error it logged), the others
// start anyway so the site answers.
setTimeout(startOthers, 120_000).unref();

import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { CHROMIUM_PATH } from "./chromium";
import { E2E_DIRS, E2E_DIST_DIR } from "./dirs";

declare module "vitest" {
  export interface ProvidedContext {
    /** Where the production server of this run listens, e.g. http://127.0.0.1:41234. */
    baseURL: string;
    /** Its SQLite file (tests open it read-only to read the mail catcher's messages). */
    databasePath: string;
    /** Absolute folder for screenshots. */
    screenshotDir: string;
  }
}

const NEXT_BIN = path.join("node_modules", "next", "dist", "bin", "next");
const SERVE = path.join("scripts", "serve.mjs");
const log = (msg: string) => console.log(`[e2e] ${msg}`);

/** The environment for next build and next start: this one without vitest's own settings. */
function serverEnv(extra: Record<string, string>): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, NEXT_DIST_DIR: E2E_DIST_DIR, NEXT_TELEMETRY_DISABLED: "1", ...extra };
  // Vitest sets NODE_ENV=test; next build and next start must choose it themselves.
  for (const key of Object.keys(env)) if (key === "NODE_ENV" || key.startsWith("VITEST") || key.startsWith("__VITEST")) Reflect.deleteProperty(env, key);
  return env;
}

/** Only one browser-test run at a time may use the .next-test build and the lock. */
function takeLock(file: string): () => void {
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      fs.writeFileSync(file, String(process.pid), { flag: "wx" });
      return () => fs.rmSync(file, { force: true });
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EEXIST") throw e;
      const pid = Number(fs.readFileSync(file, "utf8"));
      let alive = false;
      try {
        alive = pid > 0 && process.kill(pid, 0);
      } catch {
        alive = false;
      }
      if (alive) throw new Error(`Another browser-test run (process ${pid}) is using ${E2E_DIST_DIR}; wait for it to finish.`);
      fs.rmSync(file, { force: true });
    }
  }
  throw new Error(`Could not take ${file}.`);
}

function run(args: string[], env: NodeJS.ProcessEnv): Promise<{ code: number | null; output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { env, stdio: ["ignore", "pipe", "pipe"] });
    let output = "";
    child.stdout.on("data", (d: Buffer) => (output += d.toString()));
    child.stderr.on("data", (d: Buffer) => (output += d.toString()));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, output }));
  });
}

/**
 * `next build` into .next-test. With a non-default build folder Next rewrites tsconfig.json and
 * next-env.d.ts to point at it; both are put back as they were afterwards.
 */
async function build(env: NodeJS.ProcessEnv) {
  const kept = ["tsconfig.json", "next-env.d.ts"].map((file) => ({ file, text: fs.existsSync(file) ? fs.readFileSync(file, "utf8") : null }));
  const started = Date.now();
  try {
    const { code, output } = await run([NEXT_BIN, "build"], env);
    if (code !== 0) throw new Error(`next build failed (exit ${code}):\n${output.slice(-6000)}`);
  } finally {
    for (const { file, text } of kept) {
      if (text === null) fs.rmSync(file, { force: true });
      else if (fs.readFileSync(file, "utf8") !== text) fs.writeFileSync(file, text);
    }
  }
  log(`built into ${E2E_DIST_DIR} in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

async function waitUntilServing(url: string, server: ChildProcess, logFile: string, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  let last = "";
  while (Date.now() < deadline) {
    if (server.exitCode !== null) break;
    try {
      const res = await fetch(url, { redirect: "manual" });
      if (res.status === 200) return;
      last = `HTTP ${res.status}`;
    } catch (e) {
      last = (e as Error).message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  const serverLog = fs.existsSync(logFile) ? fs.readFileSync(logFile, "utf8").slice(-4000) : "";
  throw new Error(`The test server did not answer ${url} (${server.exitCode !== null ? `it exited with ${server.exitCode}` : last}).\n${serverLog}`);
}

function stop(server: ChildProcess): Promise<void> {
  if (server.exitCode !== null || server.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const force = setTimeout(() => server.kill("SIGKILL"), 5_000);
    server.once("exit", () => {
      clearTimeout(force);
      resolve();
    });
    server.kill("SIGTERM");
  });
}

export default async function setup(project: TestProject) {
  if (!fs.existsSync(CHROMIUM_PATH)) {
    throw new Error(`The browser tests need Chromium at ${CHROMIUM_PATH}: sudo apt-get install chromium (.ci/run does this).`);
  }
  for (const dir of [E2E_DIRS.root, E2E_DIRS.xdgConfig, E2E_DIRS.xdgCache, E2E_DIRS.tmp]) fs.mkdirSync(dir, { recursive: true });
  const releaseLock = takeLock(E2E_DIRS.lock);
  let server: ChildProcess | undefined;
  try {
    // Each run starts clean: the last run's database, server log and screenshots are replaced.
    for (const entry of fs.readdirSync(E2E_DIRS.root)) if (entry.startsWith("run-")) fs.rmSync(path.join(E2E_DIRS.root, entry), { recursive: true, force: true });
    fs.rmSync(E2E_DIRS.screenshots, { recursive: true, force: true });
    fs.mkdirSync(E2E_DIRS.screenshots, { recursive: true });
    const runDir = path.resolve(fs.mkdtempSync(path.join(E2E_DIRS.root, "run-")));

    const dirs = { XDG_CONFIG_HOME: path.resolve(E2E_DIRS.xdgConfig), XDG_CACHE_HOME: path.resolve(E2E_DIRS.xdgCache), TMPDIR: path.resolve(E2E_DIRS.tmp) };
    if (process.env.E2E_SKIP_BUILD === "1") log(`E2E_SKIP_BUILD=1: using the existing ${E2E_DIST_DIR} build`);
    else await build(serverEnv(dirs));
    if (!fs.existsSync(path.join(E2E_DIST_DIR, "BUILD_ID"))) throw new Error(`No production build in ${E2E_DIST_DIR}; run without E2E_SKIP_BUILD=1.`);

    const port = await freePort();
    const baseURL = `http://127.0.0.1:${port}`;
    const databasePath = path.join(runDir, "meniscus.db");
    const logFile = path.join(runDir, "server.log");
    const out = fs.openSync(logFile, "a");
    // Two workers, as `npm start` runs on a two-core machine (scripts/serve.mjs).
    server = spawn(process.execPath, [SERVE, "-p", String(port), "-H", "127.0.0.1"], {
      env: serverEnv({ ...dirs, WEB_CONCURRENCY: "2", PORT: String(port), DATABASE_PATH: databasePath, MAIL_FAKE_PORT: "0", S3_FAKE_PORT: "0", APP_URL: baseURL, NEXTAUTH_URL: baseURL }),
      stdio: ["ignore", out, out],
    });
    fs.closeSync(out);
    await waitUntilServing(`${baseURL}/sign-in`, server, logFile, 90_000);
    log(`serving ${baseURL} (database and server log in ${path.relative(process.cwd(), runDir)})`);

    project.provide("baseURL", baseURL);
    project.provide("databasePath", databasePath);
    project.provide("screenshotDir", path.resolve(E2E_DIRS.screenshots));
  } catch (e) {
    if (server) await stop(server);
    releaseLock();
    throw e;
  }

  const started = server;
  return async () => {
    await stop(started);
    releaseLock();
  };
}

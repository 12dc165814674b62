import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import Database from "better-sqlite3";
import S3rver from "s3rver";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { E2E_DIRS, E2E_DIST_DIR } from "./support/dirs";
import { signInOverHttp } from "../helpers/http-sign-in";

// Faults against real processes: a second production server from the same build, with its own
// database, is killed with SIGKILL in the middle of an autosave load and started again. What was
// acknowledged is compared with what SQLite kept, and SQLite's own integrity check is run.

const SERVE = path.join("scripts", "serve.mjs");
const PASSWORD = "lab-notebook-demo";
const runDir = path.resolve(E2E_DIRS.root, `faults-${process.pid}`);
const dbFile = path.join(runDir, "meniscus.db");
let port = 0;
let base = "";
let server: ChildProcess | undefined;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port: p } = s.address() as net.AddressInfo;
      s.close(() => resolve(p));
    });
  });
}

async function startServer(extra: Record<string, string> = {}): Promise<ChildProcess> {
  const env: NodeJS.ProcessEnv = { ...process.env, NEXT_DIST_DIR: E2E_DIST_DIR, NEXT_TELEMETRY_DISABLED: "1", PORT: String(port), DATABASE_PATH: dbFile, MAIL_FAKE_PORT: "0", S3_FAKE_PORT: "0", APP_URL: base, NEXTAUTH_URL: base, ...extra };
  for (const key of Object.keys(env)) if (key === "NODE_ENV" || key.startsWith("VITEST") || key.startsWith("__VITEST")) Reflect.deleteProperty(env, key);
  const out = fs.openSync(path.join(runDir, "server.log"), "a");
  // Two workers as `npm start` runs them, in a process group of their own so that a kill can take
  // down every process at once, as a crash of the machine's server would.
  const child = spawn(process.execPath, [SERVE, "-p", String(port), "-H", "127.0.0.1"], { env: { WEB_CONCURRENCY: "2", ...env }, stdio: ["ignore", out, out], detached: true });
  fs.closeSync(out);
  const deadline = Date.now() + 90_000;
  while (Date.now() < deadline && child.exitCode === null) {
    try {
      if ((await fetch(`${base}/sign-in`)).status === 200) return child;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`The second server did not start:\n${fs.readFileSync(path.join(runDir, "server.log"), "utf8").slice(-3000)}`);
}

/** SIGKILL to the whole process group (the launcher and its workers at once); SIGTERM to the launcher, which stops its workers. */
function kill(child: ChildProcess, signal: "SIGKILL" | "SIGTERM") {
  if (signal === "SIGKILL") process.kill(-child.pid!, "SIGKILL");
  else child.kill(signal);
}

function exited(child: ChildProcess): Promise<void> {
  return child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise((r) => child.once("exit", () => r()));
}

const signIn = (email: string) => signInOverHttp(base, email, PASSWORD);

type Writer = { email: string; writeUpId: string; labSessionId: string; cookie: string; content: Record<string, unknown>; acked: { revision: number; text: string } | null; inFlight: { revision: number; text: string } | null; revision: number };

const observationsText = (content: unknown): string => {
  const doc = (content as { sections: { observations: { content?: { content?: { text?: string }[] }[] } } }).sections.observations;
  return doc.content?.[0]?.content?.[0]?.text ?? "";
};

function withText(content: Record<string, unknown>, text: string) {
  const sections = { ...(content.sections as Record<string, unknown>), observations: { type: "doc", content: [{ type: "paragraph", content: [{ type: "text", text }] }] } };
  return { ...content, sections };
}

function save(w: Writer, text: string) {
  return fetch(`${base}/api/write-ups/${w.writeUpId}`, { method: "PUT", headers: { "content-type": "application/json", cookie: w.cookie, origin: base }, body: JSON.stringify({ revision: w.revision, content: withText(w.content, text) }) });
}

/** Saves again and again, as the editor's autosave does, until the server stops answering. */
async function autosaveLoop(w: Writer, stop: { now: boolean }) {
  for (let n = 1; !stop.now; n++) {
    const text = `${w.email} save ${n}`;
    w.inFlight = { revision: w.revision + 1, text };
    let res: Response;
    try {
      res = await save(w, text);
    } catch {
      return; // the server is gone; this save was never acknowledged
    }
    if (res.status !== 200) throw new Error(`Save refused with ${res.status}: ${await res.text()}`);
    let revision: number;
    try {
      ({ revision } = (await res.json()) as { revision: number });
    } catch {
      return; // killed while the answer was on its way: not acknowledged, still in flight
    }
    w.acked = { revision, text };
    w.inFlight = null;
    w.revision = revision;
  }
}

const writers: Writer[] = [];

beforeAll(async () => {
  fs.rmSync(runDir, { recursive: true, force: true });
  fs.mkdirSync(runDir, { recursive: true });
  port = await freePort();
  base = `http://127.0.0.1:${port}`;
  server = await startServer();
  // Students of the demo school with a draft write-up in a lab session that is open now.
  const db = new Database(dbFile, { readonly: true });
  const rows = db
    .prepare(
      `SELECT u.email, w.id AS writeUpId, w.lab_session_id AS labSessionId FROM write_ups w JOIN users u ON u.id = w.student_id JOIN lab_sessions s ON s.id = w.lab_session_id
       WHERE w.status = 'draft' AND s.opens_at <= ? AND s.due_at > ? AND u.password_hash IS NOT NULL ORDER BY u.email LIMIT 6`,
    )
    .all(Date.now(), Date.now()) as { email: string; writeUpId: string; labSessionId: string }[];
  db.close();
  expect(rows.length).toBeGreaterThanOrEqual(4);
  for (const r of rows) {
    const cookie = await signIn(r.email);
    const res = await fetch(`${base}/api/write-ups/${r.writeUpId}`, { headers: { cookie } });
    expect(res.status).toBe(200);
    const view = (await res.json()) as { writeUp: { revision: number; content: Record<string, unknown> } };
    writers.push({ ...r, cookie, content: view.writeUp.content, acked: null, inFlight: null, revision: view.writeUp.revision });
  }
}, 180_000);

afterAll(async () => {
  if (server && server.exitCode === null && server.signalCode === null) {
    kill(server, "SIGKILL");
    await exited(server);
  }
});

describe("faults", () => {
  it("keeps every acknowledged save when the server is killed mid-autosave, and the database passes its integrity check", async () => {
    const stop = { now: false };
    const loops = writers.map((w) => autosaveLoop(w, stop));
    await new Promise((r) => setTimeout(r, 1500));
    const killed = server!;
    kill(killed, "SIGKILL");
    await exited(killed);
    stop.now = true;
    await Promise.all(loops);
    const acknowledged = writers.reduce((n, w) => n + (w.acked ? 1 : 0), 0);
    expect(acknowledged).toBe(writers.length);

    // Read the file the killed server left behind, as SQLite recovers it.
    const db = new Database(dbFile);
    expect(db.pragma("integrity_check", { simple: true })).toBe("ok");
    const get = db.prepare("SELECT revision, content FROM write_ups WHERE id = ?");
    for (const w of writers) {
      const row = get.get(w.writeUpId) as { revision: number; content: string };
      const stored = { revision: row.revision, text: observationsText(JSON.parse(row.content)) };
      // The last acknowledged save, or the one in flight at the kill (committed, answer lost): never older.
      const allowed = [w.acked, w.inFlight].filter(Boolean);
      expect(allowed, `${w.email}: stored revision ${stored.revision}`).toContainEqual(stored);
      w.revision = row.revision;
    }
    db.close();

    // Started again on the same file, the server serves the saved work and takes the next save.
    server = await startServer();
    for (const w of writers) {
      const res = await fetch(`${base}/api/write-ups/${w.writeUpId}`, { headers: { cookie: w.cookie } });
      expect(res.status).toBe(200);
      expect(((await res.json()) as { writeUp: { revision: number } }).writeUp.revision).toBe(w.revision);
    }
    const after = await save(writers[0]!, "after the restart");
    expect(after.status).toBe(200);
    writers[0]!.revision = ((await after.json()) as { revision: number }).revision;
  }, 240_000);

  it("answers saves on a read-only database with a clear 503, and still shows the work", async () => {
    const running = server!;
    kill(running, "SIGTERM");
    await exited(running);
    server = await startServer({ DATABASE_READONLY: "1" });
    const w = writers[0]!;
    const res = await save(w, "this cannot be stored");
    expect(res.status).toBe(503);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("unavailable");
    expect(body.error.message).toMatch(/cannot save right now.*read-only/);
    expect(body.error.message).toMatch(/kept in this browser/);
    // Reading still works: the write-up page and the write-up itself, unchanged.
    const page = await fetch(`${base}/lab-sessions/${w.labSessionId}/write-up`, { headers: { cookie: w.cookie } });
    expect(page.status).toBe(200);
    const view = await fetch(`${base}/api/write-ups/${w.writeUpId}`, { headers: { cookie: w.cookie } });
    const stored = ((await view.json()) as { writeUp: { revision: number; content: unknown } }).writeUp;
    expect(stored.revision).toBe(w.revision);
    expect(observationsText(stored.content)).toBe("after the restart");
  }, 180_000);

  it("gives a clear retry, not a broken record, when the S3 server goes away during an upload", async () => {
    const running = server!;
    kill(running, "SIGTERM");
    await exited(running);
    const s3Dir = path.join(runDir, "s3");
    const s3Port = await freePort();
    const bucket = "fault-evidence";
    const startS3 = async () => {
      const s3 = new S3rver({ port: s3Port, address: "127.0.0.1", directory: s3Dir, silent: true, configureBuckets: [{ name: bucket, configs: [] }] });
      await s3.run();
      return s3;
    };
    let s3 = await startS3();
    server = await startServer({ S3_ENDPOINT: `http://127.0.0.1:${s3Port}`, S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER", S3_BUCKET: bucket });
    const w = writers[1]!;
    const photo = await sharp({ create: { width: 40, height: 30, channels: 3, background: "#4a7f9d" } }).jpeg().toBuffer();
    const started = await fetch(`${base}/api/evidence`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie: w.cookie, origin: base },
      body: JSON.stringify({ writeUpId: w.writeUpId, filename: "bench.jpg", contentType: "image/jpeg", size: photo.length, caption: "Apparatus" }),
    });
    expect(started.status).toBe(201);
    const upload = (await started.json()) as { id: string; uploadUrl: string; headers: Record<string, string> };

    await s3.close();
    await expect(fetch(upload.uploadUrl, { method: "PUT", headers: upload.headers, body: new Uint8Array(photo) })).rejects.toThrow();
    const confirm = await fetch(`${base}/api/evidence/${upload.id}/confirm`, { method: "POST", headers: { cookie: w.cookie, origin: base } });
    expect(confirm.status).toBe(503);
    const err = (await confirm.json()) as { error: { message: string } };
    expect(err.error.message).toMatch(/try again/i);
    const list = async () => ((await (await fetch(`${base}/api/evidence?writeUpId=${w.writeUpId}`, { headers: { cookie: w.cookie } })).json()) as { photos: { id: string }[] }).photos;
    // No broken record: the photo is not listed as if it were there.
    s3 = await startS3();
    expect((await list()).some((p) => p.id === upload.id)).toBe(false);
    // Storage is back: the same upload is retried and completes.
    expect((await fetch(upload.uploadUrl, { method: "PUT", headers: upload.headers, body: new Uint8Array(photo) })).status).toBe(200);
    const retried = await fetch(`${base}/api/evidence/${upload.id}/confirm`, { method: "POST", headers: { cookie: w.cookie, origin: base } });
    expect(retried.status).toBe(200);
    expect((await list()).some((p) => p.id === upload.id)).toBe(true);
    await s3.close();
  }, 180_000);
});

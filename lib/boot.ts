import "server-only";
import path from "node:path";
import { databasePath, getDb } from "@/db/client";
import { sweepOrphanUploads } from "@/db/queries/evidence";
import { hasAnySchool, seedDemoSchool } from "@/db/seed/index";
import { forgetExpiredRateLimits } from "./auth/rate-limit";
import { authSecret } from "./auth/secret";
import { startFakeS3 } from "./dev/fake-s3";
import { startFakeSmtp } from "./dev/fake-smtp";
import { ensureBucket, storageSettings } from "./storage";

const g = globalThis as unknown as { __meniscusBooted?: Promise<void> };

/**
 * Whether this process does the once-per-server jobs: the only process, or worker 1 when
 * scripts/serve.mjs runs several (the others start after it has booted).
 */
function isFirstWorker(): boolean {
  const n = process.env.MENISCUS_WORKER;
  return !n || n === "1";
}

/**
 * Runs once when the server starts: opens and migrates the database, seeds the demo school into
 * an empty one, and starts the built-in mail catcher unless real SMTP is configured. In a worker
 * other than the first, only the database is opened (worker 1 has done the rest).
 */
export function boot(): Promise<void> {
  g.__meniscusBooted ??= (async () => {
    try {
      await bootThisProcess();
    } finally {
      // Tell scripts/serve.mjs that the other workers can start.
      if (process.send && process.env.MENISCUS_WORKER === "1") process.send({ meniscus: "booted" });
    }
  })();
  return g.__meniscusBooted;
}

async function bootThisProcess(): Promise<void> {
  authSecret();
  const db = getDb();
  if (!isFirstWorker()) return;
  if (!process.env.SMTP_URL) {
    const port = Number(process.env.MAIL_FAKE_PORT ?? 2525);
    try {
      const { port: bound } = await startFakeSmtp(port);
      console.log(`[meniscus] mail catcher listening on 127.0.0.1:${bound} (read it at /admin/outbox)`);
    } catch (e) {
      console.error(`[meniscus] could not start the mail catcher on port ${port}: ${(e as Error).message}. Set MAIL_FAKE_PORT to a free port, or SMTP_URL.`);
    }
  }
  if (!process.env.S3_ENDPOINT) {
    const port = Number(process.env.S3_FAKE_PORT ?? 4569);
    try {
      const dir = path.join(path.dirname(databasePath()), "s3");
      const { port: bound } = await startFakeS3({ port, directory: dir, bucket: storageSettings().bucket });
      console.log(`[meniscus] local S3 storage listening on 127.0.0.1:${bound}`);
    } catch (e) {
      console.error(`[meniscus] could not start the local S3 storage on port ${port}: ${(e as Error).message}. Set S3_FAKE_PORT to a free port, or S3_ENDPOINT.`);
    }
  }
  try {
    await ensureBucket();
  } catch (e) {
    console.error("[meniscus] photo storage is not reachable; photos cannot be added until it is:", (e as Error).message);
  }
  // Housekeeping: uploads never confirmed are removed after an hour; spent rate-limit counters too.
  setInterval(() => {
    void sweepOrphanUploads().catch((e) => console.error("[meniscus] orphan sweep failed", e));
    try {
      forgetExpiredRateLimits();
    } catch (e) {
      console.error("[meniscus] rate-limit sweep failed", e);
    }
  }, 30 * 60 * 1000).unref();
  if (!hasAnySchool(db) && process.env.MENISCUS_SEED !== "off") {
    const res = await seedDemoSchool(db);
    console.log(`[meniscus] seeded the demo school (${res.userIds.size} people, ${res.classIds.size} classes, ${res.photos} photos)`);
  }
}

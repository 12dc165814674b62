import "server-only";
import { getDb } from "@/db/client";
import { hasAnySchool, seedDemoSchool } from "@/db/seed/index";
import { authSecret } from "./auth/secret";
import { startFakeSmtp } from "./dev/fake-smtp";

const g = globalThis as unknown as { __meniscusBooted?: Promise<void> };

/**
 * Runs once when the server starts: opens and migrates the database, seeds the demo school into
 * an empty one, and starts the built-in mail catcher unless real SMTP is configured.
 */
export function boot(): Promise<void> {
  g.__meniscusBooted ??= (async () => {
    authSecret();
    const db = getDb();
    if (!process.env.SMTP_URL) {
      const port = Number(process.env.MAIL_FAKE_PORT ?? 2525);
      try {
        const { port: bound } = await startFakeSmtp(port);
        console.log(`[meniscus] mail catcher listening on 127.0.0.1:${bound} (read it at /admin/outbox)`);
      } catch (e) {
        console.error(`[meniscus] could not start the mail catcher on port ${port}: ${(e as Error).message}. Set MAIL_FAKE_PORT to a free port, or SMTP_URL.`);
      }
    }
    if (!hasAnySchool(db) && process.env.MENISCUS_SEED !== "off") {
      const res = await seedDemoSchool(db);
      console.log(`[meniscus] seeded the demo school (${res.userIds.size} people, ${res.classIds.size} classes)`);
    }
  })();
  return g.__meniscusBooted;
}

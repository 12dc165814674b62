// `npm run backup -- <file> [--force]`: an online backup of the Meniscus database (safe while the
// server runs) to <file>, checked with SQLite's integrity check. The database is DATABASE_PATH, or
// data/meniscus.db as for the server.
import path from "node:path";
import { backupDatabase } from "../db/backup";

async function main() {
  const args = process.argv.slice(2);
  const file = args.find((a) => !a.startsWith("--"));
  if (!file) {
    console.error("Usage: npm run backup -- <backup file> [--force]");
    process.exit(2);
  }
  const source = process.env.DATABASE_PATH || path.join(process.cwd(), "data", "meniscus.db");
  try {
    const started = Date.now();
    const { digest } = await backupDatabase(source, file, { force: args.includes("--force") });
    const rows = Object.values(digest).reduce((sum, t) => sum + t.rows, 0);
    console.log(`Backed up ${source} to ${file} in ${Date.now() - started} ms: ${Object.keys(digest).length} tables, ${rows} rows, integrity check ok.`);
  } catch (e) {
    console.error(`Backup failed: ${(e as Error).message}`);
    process.exit(1);
  }
}

void main();

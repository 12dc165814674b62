// `npm run restore -- <file> [--online]`: restores a backup made by `npm run backup` over the
// Meniscus database (DATABASE_PATH, or data/meniscus.db). Refuses while the database is open in
// another process unless --online, which copies through SQLite's backup API into the live
// database. Either way the replaced database is kept beside it as <name>.before-restore-<time>.
import path from "node:path";
import { restoreDatabase } from "../db/backup";

async function main() {
  const args = process.argv.slice(2);
  const file = args.find((a) => !a.startsWith("--"));
  if (!file) {
    console.error("Usage: npm run restore -- <backup file> [--online]");
    process.exit(2);
  }
  const target = process.env.DATABASE_PATH || path.join(process.cwd(), "data", "meniscus.db");
  try {
    const { keptAs, digest } = await restoreDatabase(file, target, { online: args.includes("--online") });
    const rows = Object.values(digest).reduce((sum, t) => sum + t.rows, 0);
    console.log(`Restored ${file} into ${target}: ${Object.keys(digest).length} tables, ${rows} rows.${keptAs ? ` The previous database is kept as ${keptAs}.` : ""}`);
  } catch (e) {
    console.error(`Restore failed: ${(e as Error).message}`);
    process.exit(1);
  }
}

void main();

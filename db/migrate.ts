// `npm run db:migrate`: applies pending migrations to the configured database, loudly.
import { databasePath, openDatabase } from "./client";

try {
  const { sqlite } = openDatabase(databasePath());
  sqlite.close();
  console.log(`Migrations applied to ${databasePath()}`);
} catch (e) {
  console.error("Migration failed:", e);
  process.exit(1);
}

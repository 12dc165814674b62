// `npm run db:seed`: seeds the demo school into an empty database. Demo photos go to the storage
// the server would use: S3_ENDPOINT if set, otherwise the built-in S3 server, started here for
// the length of the seed on the same folder the server reads (data/s3 beside the database).
import path from "node:path";
import { openDatabase, databasePath } from "./client";
import { hasAnySchool, seedDemoSchool } from "./seed/index";
import { startFakeS3 } from "../lib/dev/fake-s3";
import { storageSettings } from "../lib/storage";

async function main() {
  const { db, sqlite } = openDatabase(databasePath());
  try {
    if (hasAnySchool(db)) {
      console.log("The database already has a school; nothing to seed. Delete the data folder to start again.");
      return;
    }
    let s3: { close: () => Promise<void> } | null = null;
    if (!process.env.S3_ENDPOINT) {
      try {
        s3 = await startFakeS3({ port: 0, directory: path.join(path.dirname(databasePath()), "s3"), bucket: storageSettings().bucket });
      } catch (e) {
        console.warn(`Could not start the built-in S3 storage (${(e as Error).message}); seeding without demo photos.`);
      }
    }
    try {
      const res = await seedDemoSchool(db);
      console.log(`Seeded the demo school with ${res.userIds.size} people, ${res.classIds.size} classes and ${res.photos} photos.`);
    } finally {
      await s3?.close();
    }
  } finally {
    sqlite.close();
  }
}

main().catch((e) => {
  console.error("Seeding failed:", e);
  process.exit(1);
});

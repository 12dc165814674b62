// `npm run db:seed`: seeds the demo school into an empty database.
import { openDatabase, databasePath } from "./client";
import { hasAnySchool, seedDemoSchool } from "./seed/index";

const { db, sqlite } = openDatabase(databasePath());
if (hasAnySchool(db)) {
  console.log("The database already has a school; nothing to seed. Delete the data folder to start again.");
} else {
  const res = await seedDemoSchool(db);
  console.log(`Seeded the demo school with ${res.userIds.size} people and ${res.classIds.size} classes.`);
}
sqlite.close();
